using SlotOpt.Tables;
using SlotOpt.Runs;

namespace SlotOpt.Reports.Plots;

/// <summary>
/// A source sliding over a plate: the drag at each travel position over the length the plate command averages
/// (<see cref="TravelCurve"/>: a slot pitch, or the source's whole pass), with its mean; position in mm, drag in N.
/// </summary>
public static class TravelDragPlot
{
    public const string FileStem = "drag-travel";

    public static Figure Build(TravelCurve curve, string model)
    {
        var positionsMm = curve.PositionsM.Select(x => x * 1e3).ToArray();
        var drag = curve.DragN.ToArray();
        var plot = PlotStyle.NewPlot($"Drag along the travel at {Numbers.Of(curve.SpeedMPerS, "m/s")}", "travel position of the source (mm)", "drag (N)");
        var line = plot.Add.ScatterLine(positionsMm, drag);
        line.Color = PlotStyle.Blue;
        line.LineWidth = 2;
        line.MarkerSize = 7;
        line.LegendText = $"drag at each evaluated position ({model})";
        var mean = plot.Add.HorizontalLine(curve.MeanDragN, 1.5f, PlotStyle.Vermillion);
        mean.LegendText = $"mean drag {Numbers.Newtons(curve.MeanDragN)}, over {curve.AveragedOver}";
        var span = positionsMm.Max() - positionsMm.Min();
        plot.Axes.SetLimits(positionsMm.Min() - 0.02 * span, positionsMm.Max() + 0.02 * span, Math.Min(0, drag.Min() * 1.1), Math.Max(drag.Max(), curve.MeanDragN) * 1.15);
        var legendPx = PlotStyle.LegendBelow(plot);
        var caption = $"Drag at {curve.PositionsM.Count} travel positions over {curve.AveragedOver}, and its mean (the number the plate command reports). Model: {model}. Not a brake rating: braking and load-holding uses need a certified safety analysis.";
        return PlotStyle.Render(plot, FileStem, "Drag along the travel", caption, heightPx: PlotStyle.HeightPx + legendPx);
    }
}
