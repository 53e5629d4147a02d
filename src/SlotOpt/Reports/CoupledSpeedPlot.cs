using System.Globalization;
using ScottPlot;
using SlotOpt.Design;
using SlotOpt.Runs;

namespace SlotOpt.Reports;

/// <summary>
/// Drag and lift of the chosen plate against speed with the plate's own field (PlateConfirmation's sweep):
/// drag rises, peaks near 1.27 w and falls, lift rises towards the image-force limit (Reitz 1970, Saslow
/// 1992: J. Appl. Phys. 41:2067 and Am. J. Phys. 60(8):693-711), beside the low-speed drag that grows without bound. Speed on a log axis, since the
/// sweep spans two decades of v / w.
/// </summary>
public static class CoupledSpeedPlot
{
    public static string FileStemFor(int partIndex, PlatePart part) => $"drag-lift-speed-{partIndex + 1}-{FileNames.Slug(part.Name)}";

    public static Figure Build(int partIndex, PlatePart part, PlateConfirmation confirmation)
    {
        var sweep = confirmation.SpeedSweep!;
        var logV = LogAxis.Log10(sweep.Select(p => p.SpeedMPerS));
        var plot = PlotStyle.NewPlot($"{part.Name}: drag and lift against speed, with the plate's own field", "speed (m/s, log scale)", "force (N)");
        var drag = plot.Add.ScatterLine(logV, sweep.Select(p => p.DragN).ToArray());
        drag.Color = PlotStyle.Blue;
        drag.LineWidth = 2.5f;
        drag.MarkerSize = 6;
        drag.LegendText = "drag, with the plate's own field";
        var lift = plot.Add.ScatterLine(logV, sweep.Select(p => p.LiftN).ToArray());
        lift.Color = PlotStyle.Vermillion;
        lift.LineWidth = 2.5f;
        lift.MarkerSize = 6;
        lift.LegendText = "lift (repulsion), with the plate's own field";
        var low = plot.Add.ScatterLine(logV, sweep.Select(p => p.ResistanceLimitedDragN).ToArray());
        low.Color = PlotStyle.Grey;
        low.LineWidth = 1.5f;
        low.LegendText = "drag, low-speed model (grows without bound)";
        var v0 = ((PlateExcitation.Moving)part.Excitation).SpeedMPerS;
        var run = plot.Add.VerticalLine(Math.Log10(v0), 1, PlotStyle.Black);
        run.LegendText = string.Create(CultureInfo.InvariantCulture, $"run speed {v0:0.##} m/s");
        LogAxis.Apply(plot.Axes.Bottom, sweep.Select(p => p.SpeedMPerS));
        var top = Math.Max(sweep.Max(p => p.DragN), sweep.Max(p => p.LiftN));
        plot.Axes.SetLimits(logV.Min(), logV.Max(), 0, 1.6 * top);   // the low-speed line runs off the top at high speed
        plot.Legend.Alignment = Alignment.UpperLeft;
        plot.ShowLegend();
        var peak = sweep.MaxBy(p => p.DragN)!;
        var peakText = ReferenceEquals(peak, sweep[^1])
            ? string.Create(CultureInfo.InvariantCulture, $"drag is still rising at {peak.SpeedMPerS:0.#} m/s, the top of the sweep (the slots push its peak to high speed)")
            : string.Create(CultureInfo.InvariantCulture, $"drag peaks at about {peak.DragN:0.##} N near {peak.SpeedMPerS:0.#} m/s and falls beyond, while lift keeps rising");
        var caption = string.Create(CultureInfo.InvariantCulture,
            $"The chosen plate ({confirmation.PartName}) solved with its own field at {sweep.Count} speeds, each averaged over {PlateConfirmation.SweepPositions} travel positions; {peakText}. The grey line is the low-speed (resistance-limited) model the search screened with. Not a brake rating: braking and load-holding uses need a certified safety analysis.");
        return PlotStyle.Render(plot, FileStemFor(partIndex, part), $"Drag and lift against speed: {part.Name}", caption);
    }
}
