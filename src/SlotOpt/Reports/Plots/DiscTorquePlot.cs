using SlotOpt.Tables;
using SlotOpt.Runs;

namespace SlotOpt.Reports.Plots;

/// <summary>
/// A disc turning under fixed magnets: the braking torque at each disc angle over the pitch the plate command averages
/// (<see cref="DiscAngleCurve"/>), with its mean; angle in degrees, torque in N m.
/// </summary>
public static class DiscTorquePlot
{
    public const string FileStem = "torque-angle";

    public static Figure Build(DiscAngleCurve curve, string model)
    {
        var anglesDeg = curve.AnglesRad.Select(a => a * 180 / Math.PI).ToArray();
        var torque = curve.TorqueNm.ToArray();
        var plot = PlotStyle.NewPlot($"Braking torque against disc angle at {Numbers.Of(curve.SpeedRpm, "rpm")}", "disc angle (degrees)", "torque (N m)");
        var line = plot.Add.ScatterLine(anglesDeg, torque);
        line.Color = PlotStyle.Blue;
        line.LineWidth = 2;
        line.MarkerSize = 7;
        line.LegendText = $"torque at each evaluated angle ({model})";
        var mean = plot.Add.HorizontalLine(curve.MeanTorqueNm, 1.5f, PlotStyle.Vermillion);
        mean.LegendText = $"mean torque {Numbers.Of(curve.MeanTorqueNm, "N m")}, over {curve.AveragedOver}";
        var span = Math.Max(anglesDeg.Max() - anglesDeg.Min(), 1e-9);
        plot.Axes.SetLimits(anglesDeg.Min() - 0.02 * span, anglesDeg.Max() + 0.02 * span, Math.Min(0, torque.Min() * 1.1), Math.Max(torque.Max(), curve.MeanTorqueNm) * 1.15);
        var legendPx = PlotStyle.LegendBelow(plot);
        var caption = $"Braking torque at {curve.AnglesRad.Count} disc angles over {curve.AveragedOver}, and its mean (the number the plate command reports). Model: {model}. Not a brake rating: braking and load-holding uses need a certified safety analysis.";
        return PlotStyle.Render(plot, FileStem, "Braking torque against disc angle", caption, heightPx: PlotStyle.HeightPx + legendPx);
    }
}
