using SlotOpt.Tables;
using SlotOpt.Runs;

namespace SlotOpt.Reports.Plots;

/// <summary>
/// The force at each position the plate command averages over, with its mean: drag at each travel position of a source sliding over
/// a plate (<see cref="Travel"/>, <see cref="TravelCurve"/>: a slot pitch, or the source's whole pass; position in mm, drag in N), or the
/// braking torque at each angle of a disc turning under fixed magnets (<see cref="DiscAngle"/>, <see cref="DiscAngleCurve"/>; angle in
/// degrees, torque in N m). One picture; the axis words, units and sentences are data (<see cref="Words"/>).
/// </summary>
public static class PositionCurvePlot
{
    public const string TravelFileStem = "drag-travel";
    public const string DiscAngleFileStem = "torque-angle";

    public static Figure Travel(TravelCurve curve, string model) => Build(
        new Words(TravelFileStem, "Drag along the travel", $"Drag along the travel at {Numbers.Of(curve.SpeedMPerS, "m/s")}", "travel position of the source (mm)",
            "drag", "N", "drag", "position", "travel positions", curve.AveragedOver),
        curve.PositionsM.Select(x => x * 1e3).ToArray(), curve.DragN.ToArray(), curve.MeanDragN, model);

    public static Figure DiscAngle(DiscAngleCurve curve, string model) => Build(
        new Words(DiscAngleFileStem, "Braking torque against disc angle", $"Braking torque against disc angle at {Numbers.Of(curve.SpeedRpm, "rpm")}", "disc angle (degrees)",
            "torque", "N m", "braking torque", "angle", "disc angles", curve.AveragedOver),
        curve.AnglesRad.Select(a => a * 180 / Math.PI).ToArray(), curve.TorqueNm.ToArray(), curve.MeanTorqueNm, model);

    /// <summary>
    /// The words of one kind of curve: file stem, figure and plot titles, the x axis, the quantity (short, for the axis, the legend and the mean;
    /// long, for the caption) and its unit, what one position is called (singular, plural), and the length the mean is taken over.
    /// </summary>
    private sealed record Words(string FileStem, string FigureTitle, string PlotTitle, string XLabel, string Quantity, string Unit, string LongQuantity,
        string Position, string Positions, string AveragedOver);

    private static Figure Build(Words w, double[] positions, double[] values, double mean, string model)
    {
        var plot = PlotStyle.NewPlot(w.PlotTitle, w.XLabel, $"{w.Quantity} ({w.Unit})");
        var line = plot.Add.ScatterLine(positions, values);
        line.Color = PlotStyle.Blue;
        line.LineWidth = 2;
        line.MarkerSize = 7;
        line.LegendText = $"{w.Quantity} at each evaluated {w.Position} ({model})";
        var meanLine = plot.Add.HorizontalLine(mean, 1.5f, PlotStyle.Vermillion);
        meanLine.LegendText = $"mean {w.Quantity} {Numbers.Of(mean, w.Unit)}, over {w.AveragedOver}";
        var span = Math.Max(positions.Max() - positions.Min(), 1e-9);
        plot.Axes.SetLimits(positions.Min() - 0.02 * span, positions.Max() + 0.02 * span, Math.Min(0, values.Min() * 1.1), Math.Max(values.Max(), mean) * 1.15);
        var legendPx = PlotStyle.LegendBelow(plot);
        var caption = $"{char.ToUpperInvariant(w.LongQuantity[0])}{w.LongQuantity[1..]} at {positions.Length} {w.Positions} over {w.AveragedOver}, and its mean (the number the plate command reports). "
            + $"Model: {model}. Not a brake rating: braking and load-holding uses need a certified safety analysis.";
        return PlotStyle.Render(plot, w.FileStem, w.FigureTitle, caption, heightPx: PlotStyle.HeightPx + legendPx);
    }
}
