using SlotOpt.Design.SolidParts;
using System.Globalization;
using ScottPlot;
using SlotOpt.Tables;
using SlotOpt.Runs;

namespace SlotOpt.Reports.Plots;

/// <summary>
/// Braking torque against speed for a turning disc: the chosen option, the solid disc of the same sheet and the reference, from the points the
/// run computed (<see cref="TorqueSpeedLines"/>; reports never solve), each labelled with the model that gave it. Where a line's model shows a
/// peak it is marked; the resistance-limited line has none (torque proportional to speed), so the speed where its validity ends (the magnetic
/// Reynolds number at the magnets' radius reaching the limit) is marked instead and the line is faded beyond it, as <see cref="DragSpeedPlot"/> does.
/// </summary>
public static class TorqueSpeedPlot
{
    public static string FileStemFor(int partIndex, PlatePart part) => $"torque-speed-{partIndex + 1}-{FileNames.Slug(part.Name)}";

    public static Figure Build(int partIndex, PartEvaluation plate, TorqueSpeedLines speedLines, double reynoldsLimit)
    {
        var part = (PlatePart)plate.Part;
        var n0 = speedLines.RunRpm;
        var nMax = speedLines.MaxRpm;
        var plot = PlotStyle.NewPlot($"{part.Name}: braking torque against speed", "disc speed (rpm)", "braking torque (N m)");
        var marked = new HashSet<double>();
        var top = 0.0;
        for (var k = 0; k < speedLines.Lines.Count; k++)
        {
            var line = speedLines.Lines[k];
            var colour = PlotStyle.Series[k % PlotStyle.Series.Count];
            var sheet = (PlateChoice)line.Option.Choice;
            var end = line.ValidityEndRpm;
            var valid = line.Points.Where(p => p.Rpm <= end).ToList();
            var beyond = line.Points.Where(p => p.Rpm >= end).ToList();
            if (end < nMax && valid.Count > 0 && valid[^1].Rpm < end) valid.Add(Interpolated(line.Points, end));
            if (beyond.Count > 0 && beyond[0].Rpm > end) beyond.Insert(0, Interpolated(line.Points, end));
            var models = string.Join(", ", line.Points.Select(p => p.Model).Distinct());
            var label = $"{Label(line.Role, plate.ReferenceIsCurrent)}: {Numbers.Sig(sheet.ThicknessM * 1e3)} mm {sheet.Material}, {(sheet.Slots is null ? "solid" : "slotted")}, {Numbers.Of(line.Option.TorqueNm!.Value, "N m")} at {Numbers.Sig(n0)} rpm ({models})";
            if (valid.Count > 1)
            {
                var solid = plot.Add.ScatterLine(valid.Select(p => p.Rpm).ToArray(), valid.Select(p => p.TorqueNm).ToArray());
                solid.Color = colour;
                solid.LineWidth = 2.5f;
                solid.LegendText = label;
            }
            if (beyond.Count > 1)
            {
                var faded = plot.Add.ScatterLine(beyond.Select(p => p.Rpm).ToArray(), beyond.Select(p => p.TorqueNm).ToArray());
                faded.Color = colour.WithAlpha(0.3);   // faded, not dashed: see PlotStyle
                faded.LineWidth = 2.5f;
                if (valid.Count <= 1) faded.LegendText = label + ", outside its validity";
            }
            plot.Add.Marker(n0, line.Option.TorqueNm.Value, MarkerShape.FilledCircle, 9, colour);
            top = Math.Max(top, line.Points.Max(p => p.TorqueNm));
            if (line.PeakRpm is { } peak)
            {
                var at = Interpolated(line.Points, peak);
                var marker = plot.Add.Marker(peak, at.TorqueNm, MarkerShape.OpenDiamond, 12, colour);
                marker.LegendText = $"peak at {Numbers.Sig(peak)} rpm ({at.Model})";
            }
            else if (end <= nMax && marked.Add(Math.Round(end, 6)))
            {
                var rm = plot.Add.VerticalLine(end, 1, colour);
                rm.LegendText = $"Rm = {Numbers.Sig(reynoldsLimit)} at the magnets' radius at {Numbers.Sig(end)} rpm ({Numbers.Sig(sheet.ThicknessM * 1e3)} mm {sheet.Material}): the resistance-limited line holds below, faded above; it shows no peak";
            }
        }
        var run = plot.Add.VerticalLine(n0, 1, PlotStyle.Grey);
        run.LegendText = $"run speed {Numbers.Sig(n0)} rpm";
        if (part.MaxTorqueNm is { } maxTorque)
        {
            var limit = plot.Add.HorizontalLine(maxTorque, 2, PlotStyle.Black);
            limit.LegendText = $"torque limit {Numbers.Of(maxTorque, "N m")}";
            top = Math.Max(top, maxTorque);
        }
        if (part.MinTorque is { } wanted)
        {
            var minimum = plot.Add.Marker(wanted.Rpm, wanted.TorqueNm, MarkerShape.OpenSquare, 12, PlotStyle.Black);
            minimum.LegendText = $"minimum braking torque {Numbers.Of(wanted.TorqueNm, "N m")} at {Numbers.Sig(wanted.Rpm)} rpm";
            top = Math.Max(top, wanted.TorqueNm);
        }
        plot.Axes.SetLimits(0, nMax, 0, top * 1.1);
        var legendPx = PlotStyle.LegendBelow(plot);
        var offPlot = speedLines.Lines.Where(l => l.ValidityEndRpm > nMax).Select(l => l.ValidityEndRpm).ToList();
        var caption = string.Create(CultureInfo.InvariantCulture,
            $"Braking torque of each disc against its speed, computed in the run from the model named in the legend (dots: the run's {n0:0.##} rpm). The resistance-limited model neglects the eddy currents' own field: torque rises in proportion to speed and shows no peak. It holds while the magnetic Reynolds number at the magnets' radius, μ0σt(ωr)/2, stays below {reynoldsLimit}; each line is faded beyond the speed where it reaches it")
            + (offPlot.Count > 0 ? string.Create(CultureInfo.InvariantCulture, $" (for some sheets only above {offPlot.Min():0} rpm, off the plot)") : "")
            + ". Above it the real torque is lower, passes a maximum and falls. Not a brake rating.";
        return PlotStyle.Render(plot, FileStemFor(partIndex, part), $"Braking torque against speed: {part.Name}", caption, heightPx: PlotStyle.HeightPx + legendPx);
    }

    /// <summary>The line's torque at a speed between its points (straight between neighbours), with the model of the point below.</summary>
    private static TorqueSpeedLines.Point Interpolated(IReadOnlyList<TorqueSpeedLines.Point> points, double rpm)
    {
        var i = Math.Clamp(points.Count(p => p.Rpm <= rpm) - 1, 0, points.Count - 2);
        var (a, b) = (points[i], points[i + 1]);
        var f = (rpm - a.Rpm) / (b.Rpm - a.Rpm);
        return new TorqueSpeedLines.Point(rpm, a.TorqueNm + f * (b.TorqueNm - a.TorqueNm), a.Model);
    }

    private static string Label(DesignRole role, bool referenceIsCurrent) => role switch
    {
        DesignRole.Chosen => "chosen",
        DesignRole.SolidCounterpart => "solid disc, same sheet",
        _ => referenceIsCurrent ? "current design" : "baseline",
    };
}
