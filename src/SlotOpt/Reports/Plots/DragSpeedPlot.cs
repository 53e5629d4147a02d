using SlotOpt.Design.SolidParts;
using System.Globalization;
using ScottPlot;
using SlotOpt.Tables;
using SlotOpt.Design;
using SlotOpt.Runs;

namespace SlotOpt.Reports.Plots;

/// <summary>
/// Drag against speed for a plate passed by moving poles: the chosen option, the solid plate of the same
/// sheet and the reference (<see cref="DragSpeedLines"/>, from the run). In the resistance-limited (low-speed)
/// model drag is proportional to speed, F(v) = F(v0) v / v0, so each line comes from the option's drag at the
/// run's speed; it holds while the magnetic Reynolds number mu0 sigma t v / 2 stays below the model's limit.
/// Beyond the speed where it reaches that limit the line is faded.
/// </summary>
public static class DragSpeedPlot
{
    public static string FileStemFor(int partIndex, PlatePart part) => $"drag-speed-{partIndex + 1}-{FileNames.Slug(part.Name)}";

    /// <param name="reynoldsLimit">The low-speed model's limit on the magnetic Reynolds number (<see cref="RunFigures.LowSpeedReynoldsLimit"/>).</param>
    public static Figure Build(int partIndex, PartEvaluation plate, DragSpeedLines speedLines, double reynoldsLimit)
    {
        var part = (PlatePart)plate.Part;
        var v0 = speedLines.RunSpeedMPerS;
        var lines = speedLines.Lines.Select(l => (l.Option, Label: Label(l.Role, plate.ReferenceIsCurrent))).ToList();
        var limitSpeeds = speedLines.Lines.Select(l => l.ReynoldsLimitSpeedMPerS).ToList();
        var vMax = Math.Max(2 * v0, Math.Min(1.25 * limitSpeeds.Max(), 4 * v0));

        var plot = PlotStyle.NewPlot($"{part.Name}: drag against speed (low-speed model)", "speed (m/s)", "drag (N)");
        var marked = new HashSet<double>();
        for (var k = 0; k < lines.Count; k++)
        {
            var (option, label) = lines[k];
            var slope = option.DragN!.Value / v0;
            var vStar = limitSpeeds[k];
            var colour = PlotStyle.Series[k % PlotStyle.Series.Count];
            var vValid = Math.Min(vStar, vMax);
            var valid = plot.Add.ScatterLine(new[] { 0, vValid }, new[] { 0, slope * vValid });
            valid.Color = colour;
            valid.LineWidth = 2.5f;
            var sheet = (PlateChoice)option.Choice;
            valid.LegendText = $"{label}: {Numbers.Sig(sheet.ThicknessM * 1e3)} mm {sheet.Material}, {(sheet.Slots is null ? "solid" : "slotted")}, {Numbers.Newtons(option.DragN.Value)} at {Numbers.Of(v0, "m/s")}";
            if (vStar < vMax)
            {
                var beyond = plot.Add.ScatterLine(new[] { vStar, vMax }, new[] { slope * vStar, slope * vMax });
                beyond.Color = colour.WithAlpha(0.3);   // faded, not dashed: see PlotStyle
                beyond.LineWidth = 2.5f;
            }
            plot.Add.Marker(v0, option.DragN.Value, MarkerShape.FilledCircle, 9, colour);
            if (vStar <= vMax && marked.Add(Math.Round(vStar, 6)))
            {
                var rm = plot.Add.VerticalLine(vStar, 1, colour);
                rm.LegendText = $"Rm = {Numbers.Sig(reynoldsLimit)} at {Numbers.Of(vStar, "m/s")} ({Numbers.Sig(((PlateChoice)option.Choice).ThicknessM * 1e3)} mm {((PlateChoice)option.Choice).Material}): the low-speed model holds below, faded above";
            }
        }
        var run = plot.Add.VerticalLine(v0, 1, PlotStyle.Grey);
        run.LegendText = $"run speed {Numbers.Of(v0, "m/s")}";
        if (part.MaxDragN is { } maxDrag)
        {
            var limit = plot.Add.HorizontalLine(maxDrag, 2, PlotStyle.Black);
            limit.LegendText = $"drag limit {Numbers.Newtons(maxDrag)}";
        }
        var beyondRange = limitSpeeds.Where(v => v > vMax).ToList();
        plot.Axes.SetLimits(0, vMax, 0, Math.Max(lines.Max(l => l.Option.DragN!.Value / v0) * vMax, part.MaxDragN ?? 0) * 1.1);
        var legendPx = PlotStyle.LegendBelow(plot);
        var caption = string.Create(CultureInfo.InvariantCulture,
            $"Drag scaled from each option's drag at the run's {v0:0.##} m/s (dots); the designs are described in full above. The low-speed model (drag proportional to speed) holds while the magnetic Reynolds number μ0σtv/2 stays below {reynoldsLimit}; each line is faded beyond the speed where it reaches it")
            + (beyondRange.Count > 0 ? $" (for some sheets only above {Numbers.Of(beyondRange.Min(), "m/s")}, off the plot)" : "")
            + string.Create(CultureInfo.InvariantCulture, $". The model neglects the eddy currents' own field; above Rm = {reynoldsLimit} it overstates the drag (by about 6-9 % at 0.3, more above), and at high speed real drag passes a maximum and falls. Not a brake rating.");
        return PlotStyle.Render(plot, FileStemFor(partIndex, part), $"Drag against speed: {part.Name}", caption, heightPx: PlotStyle.HeightPx + legendPx);
    }

    private static string Label(DesignRole role, bool referenceIsCurrent) => role switch
    {
        DesignRole.Chosen => "chosen",
        DesignRole.SolidCounterpart => "solid plate, same sheet",
        _ => referenceIsCurrent ? "current design" : "baseline",
    };
}
