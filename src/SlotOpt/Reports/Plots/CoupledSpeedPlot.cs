using SlotOpt.Design.SolidParts;
using System.Globalization;
using ScottPlot;
using SlotOpt.Tables;
using SlotOpt.Design;
using SlotOpt.Runs;

namespace SlotOpt.Reports.Plots;

/// <summary>
/// Drag and lift of the chosen plate against speed with the plate's own field (PlateConfirmation's sweep):
/// drag rises, peaks near 1.27 w and falls, lift rises towards the image-force limit (Reitz 1970, Saslow
/// 1992: J. Appl. Phys. 41:2067 and Am. J. Phys. 60(8):693-711), beside the low-speed drag that grows without bound. Speed on a
/// linear axis, so the low-speed drag reads as the straight line it is.
/// </summary>
public static class CoupledSpeedPlot
{
    public static string FileStemFor(int partIndex, PlatePart part) => $"drag-lift-speed-{partIndex + 1}-{FileNames.Slug(part.Name)}";

    public static Figure Build(int partIndex, PlatePart part, PlateConfirmation confirmation)
    {
        var sweep = confirmation.SpeedSweep!;
        var v = sweep.Select(p => p.SpeedMPerS).ToArray();
        var plot = PlotStyle.NewPlot($"{part.Name}: drag and lift against speed, with the plate's own field", "speed (m/s)", "force (N)");
        var drag = plot.Add.ScatterLine(v, sweep.Select(p => p.DragN).ToArray());
        drag.Color = PlotStyle.Blue;
        drag.LineWidth = 2.5f;
        drag.MarkerSize = 6;
        drag.LegendText = "drag, with the plate's own field";
        var lift = plot.Add.ScatterLine(v, sweep.Select(p => p.LiftN).ToArray());
        lift.Color = PlotStyle.Vermillion;
        lift.LineWidth = 2.5f;
        lift.MarkerSize = 6;
        lift.LegendText = "lift (repulsion), with the plate's own field";
        var low = plot.Add.ScatterLine(v, sweep.Select(p => p.ResistanceLimitedDragN).ToArray());
        low.Color = PlotStyle.Grey;
        low.LineWidth = 1.5f;
        low.LegendText = "drag, low-speed model (grows without bound)";
        var v0 = ((PlateExcitation.Moving)part.Excitation).SpeedMPerS;
        var run = plot.Add.VerticalLine(v0, 1, PlotStyle.Black);
        run.LegendText = $"run speed {Numbers.Of(v0, "m/s")}";
        var top = Math.Max(sweep.Max(p => p.DragN), sweep.Max(p => p.LiftN));
        plot.Axes.SetLimits(0, v.Max() * 1.02, 0, 1.15 * top);   // the low-speed line runs off the top at high speed
        var legendPx = PlotStyle.LegendBelow(plot);
        var peak = sweep.MaxBy(p => p.DragN)!;
        var peakText = ReferenceEquals(peak, sweep[^1])
            ? $"drag is still rising at {Numbers.Of(peak.SpeedMPerS, "m/s")}, the top of the sweep (the slots push its peak to high speed)"
            : $"drag peaks at about {Numbers.Newtons(peak.DragN)} near {Numbers.Of(peak.SpeedMPerS, "m/s")} and falls beyond, while lift keeps rising";
        var caption = string.Create(CultureInfo.InvariantCulture,
            $"The chosen plate ({confirmation.PartName}) solved with its own field at {sweep.Count} speeds, each averaged over {PlateConfirmation.SweepPositions} travel positions; {peakText}. The grey line is the low-speed (resistance-limited) model the search screened with. Not a brake rating: braking and load-holding uses need a certified safety analysis.");
        return PlotStyle.Render(plot, FileStemFor(partIndex, part), $"Drag and lift against speed: {part.Name}", caption, heightPx: PlotStyle.HeightPx + legendPx);
    }
}
