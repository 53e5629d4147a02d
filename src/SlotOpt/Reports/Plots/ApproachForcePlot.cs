using System.Globalization;
using SlotOpt.Tables;
using SlotOpt.Runs;

namespace SlotOpt.Reports.Plots;

/// <summary>
/// Magnets approaching a plate: the damping force against the gap (magnet face to the plate), from the plate command's
/// evaluation (<see cref="ApproachCurve"/>). Linear axes, gap in mm and force in N, each evaluated gap marked; the line
/// between the marks only guides the eye.
/// </summary>
public static class ApproachForcePlot
{
    public const string FileStem = "damping-force-gap";

    public static Figure Build(ApproachCurve curve, string model)
    {
        var gapsMm = curve.Points.Select(p => p.GapM * 1e3).ToArray();
        var forces = curve.Points.Select(p => p.ForceN).ToArray();
        var plot = PlotStyle.NewPlot($"Damping force against gap, approaching at {Numbers.Of(curve.SpeedMPerS, "m/s")}", "gap, magnet face to plate (mm)", "damping force (N)");
        var line = plot.Add.ScatterLine(gapsMm, forces);
        line.Color = PlotStyle.Blue;
        line.LineWidth = 2;
        line.MarkerSize = 9;
        line.MarkerShape = ScottPlot.MarkerShape.FilledCircle;
        line.LegendText = $"damping force ({model}), at each evaluated gap";
        plot.Axes.SetLimits(0, gapsMm.Max() * 1.05, 0, forces.Max() * 1.1);
        var legendPx = PlotStyle.LegendBelow(plot);
        var caption = string.Create(CultureInfo.InvariantCulture,
            $"The force opposing the magnets' approach (normal to the plate) at {curve.Points.Count} gaps, at {Numbers.Of(curve.SpeedMPerS, "m/s")}; the dots are the evaluated gaps, the line between them only guides the eye. ")
            + $"Model: {model}. In the resistance-limited model the force is proportional to the approach speed. Not a rating for a device that stops or holds a load.";
        return PlotStyle.Render(plot, FileStem, "Damping force against gap", caption, heightPx: PlotStyle.HeightPx + legendPx);
    }
}
