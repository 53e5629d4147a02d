using SlotOpt.Design.SolidParts;
using ScottPlot;
using SlotOpt.Tables;
using SlotOpt.Design;
using SlotOpt.Plates;
using SlotOpt.Runs;

namespace SlotOpt.Reports.Plots;

/// <summary>
/// A plate part's force against speed, one line a design: the chosen option, the solid sheet of the same kind and the reference, from the
/// numbers the run computed (reports never solve). Drag of a plate passed by moving poles (<see cref="Drag"/>, <see cref="DragSpeedLines"/>)
/// and braking torque of a turning disc (<see cref="Torque"/>, <see cref="TorqueSpeedLines"/>) are the same picture in other words: where a
/// line's model has a validity end (the drag's low-speed model, the magnetic Reynolds number reaching its limit) the line is faded beyond it
/// and the end is marked unless a peak is; where the line changes model (a disc's points each come from the model its validity calls for)
/// the switch is marked. What differs between the two is data (<see cref="Words"/>): the quantity, its unit, the speed's unit and the sentences.
/// </summary>
public static class SpeedLinesPlot
{
    public static string DragFileStem(int partIndex, PlatePart part) => $"drag-speed-{partIndex + 1}-{FileNames.Slug(part.Name)}";

    public static string TorqueFileStem(int partIndex, PlatePart part) => $"torque-speed-{partIndex + 1}-{FileNames.Slug(part.Name)}";

    /// <summary>
    /// Drag against speed for a plate passed by moving poles. In the resistance-limited (low-speed) model drag is proportional to
    /// speed, F(v) = F(v0) v / v0, so each line runs straight from the option's drag at the run's speed; it holds while the magnetic
    /// Reynolds number mu0 sigma t v / 2 stays below the model's limit.
    /// </summary>
    /// <param name="reynoldsLimit">The low-speed model's limit on the magnetic Reynolds number (<see cref="RunFigures.LowSpeedReynoldsLimit"/>).</param>
    public static Figure Drag(int partIndex, PartEvaluation plate, DragSpeedLines speedLines, double reynoldsLimit)
    {
        var part = (PlatePart)plate.Part;
        var v0 = speedLines.RunSpeedMPerS;
        var vMax = Math.Max(2 * v0, Math.Min(1.25 * speedLines.Lines.Max(l => l.ReynoldsLimitSpeedMPerS), 4 * v0));
        var lines = speedLines.Lines.Select(l => new Line(l.Option, l.Role, l.Option.DragN!.Value,
            [new Point(0, 0, null), new Point(vMax, l.Option.DragN!.Value / v0 * vMax, null)], l.ReynoldsLimitSpeedMPerS, null)).ToList();
        var words = new Words("drag", "N", "m/s", "drag limit", "plate", "", "the low-speed model holds below, faded above");
        var offPlot = lines.Where(l => l.ValidityEnd > vMax).Select(l => l.ValidityEnd).ToList();
        var caption = $"Drag scaled from each option's drag at the run's {Numbers.Of(v0, "m/s")} (dots); the designs are described in full above. The low-speed model (drag proportional to speed) holds while the magnetic Reynolds number μ0σtv/2 stays below {Numbers.Sig(reynoldsLimit)}; each line is faded beyond the speed where it reaches it"
            + (offPlot.Count > 0 ? $" (for some sheets only above {Numbers.Of(offPlot.Min(), "m/s")}, off the plot)" : "")
            + $". The model neglects the eddy currents' own field; above Rm = {Numbers.Sig(reynoldsLimit)} it overstates the drag (by about 6-9 % at 0.3, more above), and at high speed real drag passes a maximum and falls. Not a brake rating.";
        var plot = PlotStyle.NewPlot($"{part.Name}: drag against speed (low-speed model)", "speed (m/s)", "drag (N)");
        Draw(plot, words, lines, v0, vMax, plate.ReferenceIsCurrent, reynoldsLimit, part.MaxDragN, minimum: null);
        var legendPx = PlotStyle.LegendBelow(plot);
        return PlotStyle.Render(plot, DragFileStem(partIndex, part), $"Drag against speed: {part.Name}", caption, heightPx: PlotStyle.HeightPx + legendPx);
    }

    /// <summary>
    /// Braking torque against speed for a turning disc, each point from the model its validity calls for at that speed (the run's seam,
    /// <see cref="TurningDiscModel"/>), so no line is faded; the speed where a line switches from the resistance-limited model to the disc's
    /// own field (<see cref="TorqueSpeedLines.Line.ModelSwitchRpm"/>) is marked on it, and an own-field peak where one shows.
    /// </summary>
    public static Figure Torque(int partIndex, PartEvaluation plate, TorqueSpeedLines speedLines)
    {
        var part = (PlatePart)plate.Part;
        var n0 = speedLines.RunRpm;
        var nMax = speedLines.MaxRpm;
        var lines = speedLines.Lines.Select(l => new Line(l.Option, l.Role, l.Option.TorqueNm!.Value,
            l.Points.Select(p => new Point(p.Rpm, p.TorqueNm, p.Model)).ToList(), double.PositiveInfinity, l.PeakRpm) { ModelSwitch = l.ModelSwitchRpm }).ToList();
        var words = new Words("braking torque", "N m", "rpm", "torque limit", "disc", " at the magnets' radius", "the resistance-limited line holds below, faded above; it shows no peak");
        var rmSwitch = ReactionModelChoice.ReynoldsThreshold(ReactionModelChoice.DefaultAccuracy);   // the seam's model choice at its accuracy
        var offPlot = lines.Where(l => l.ModelSwitch > nMax).Select(l => l.ModelSwitch!.Value).ToList();
        var caption = $"Braking torque of each disc against its speed, computed in the run; each point comes from the model its validity figures call for at that speed (within {Numbers.Percent(ReactionModelChoice.DefaultAccuracy)}), named in the legend (dots: the run's {Numbers.Of(n0, "rpm")}). The resistance-limited model neglects the eddy currents' own field: torque rises in proportion to speed and shows no peak. It serves while the magnetic Reynolds number at the magnets' radius, μ0σt(ωr)/2, stays below {Numbers.Sig(rmSwitch)} and the sheet is thin against the field's depth of penetration; a triangle marks the speed where a line switches to the disc's own field"
            + (offPlot.Count > 0 ? $" (for some sheets only above {Numbers.Of(offPlot.Min(), "rpm")}, off the plot)" : "")
            + ". With its own field the torque is lower than the straight line, passes a maximum and falls. Not a brake rating.";
        var plot = PlotStyle.NewPlot($"{part.Name}: braking torque against speed", "disc speed (rpm)", "braking torque (N m)");
        Draw(plot, words, lines, n0, nMax, plate.ReferenceIsCurrent, rmSwitch, part.MaxTorqueNm, part.MinBraking is { } wanted ? new Point(wanted.Speed, wanted.Value, null) : null);
        var legendPx = PlotStyle.LegendBelow(plot);
        return PlotStyle.Render(plot, TorqueFileStem(partIndex, part), $"Braking torque against speed: {part.Name}", caption, heightPx: PlotStyle.HeightPx + legendPx);
    }

    /// <summary>The words of one kind of plot: quantity and unit ("drag", "N"), the speed's unit, the limit's name, the part's shape, where Rm is taken, and what holds below it.</summary>
    private sealed record Words(string Quantity, string Unit, string SpeedUnit, string LimitName, string Shape, string ReynoldsWhere, string HoldsBelow);

    /// <summary>A point of a line (speed and value in the plot's units) and the model that gave it (null where the line names none).</summary>
    private sealed record Point(double Speed, double Value, string? Model);

    /// <summary>One design's line: its option and role, its value at the run's speed, its points, the speed where its model's validity ends and its peak (if its model shows one).</summary>
    private sealed record Line(EvaluatedOption Option, DesignRole Role, double RunValue, IReadOnlyList<Point> Points, double ValidityEnd, double? Peak)
    {
        /// <summary>The speed where the line's points change model (a disc's: resistance-limited below, its own field above); null where they never do.</summary>
        public double? ModelSwitch { get; init; }
    }

    /// <summary>Every line (solid while valid, faded beyond), its dot at the run's speed, its peak or validity end, its model switch; the run's speed, the limit and the wanted minimum.</summary>
    private static void Draw(Plot plot, Words w, IReadOnlyList<Line> lines, double runSpeed, double maxSpeed, bool referenceIsCurrent, double reynoldsLimit, double? limitValue, Point? minimum)
    {
        var marked = new HashSet<double>();
        var top = 0.0;
        for (var k = 0; k < lines.Count; k++)
        {
            var line = lines[k];
            var colour = PlotStyle.Series[k % PlotStyle.Series.Count];
            var sheet = (PlateChoice)line.Option.Choice;
            var sheetWords = $"{Numbers.Sig(sheet.ThicknessM * 1e3)} mm {sheet.Material}";
            var end = line.ValidityEnd;
            var valid = line.Points.Where(p => p.Speed <= end).ToList();
            var beyond = line.Points.Where(p => p.Speed >= end).ToList();
            if (end < maxSpeed && valid.Count > 0 && valid[^1].Speed < end) valid.Add(Interpolated(line.Points, end));
            if (beyond.Count > 0 && beyond[0].Speed > end) beyond.Insert(0, Interpolated(line.Points, end));
            var models = line.Points.Select(p => p.Model).OfType<string>().Distinct().ToList();
            var label = $"{Label(line.Role, w.Shape, referenceIsCurrent)}: {sheetWords}, {(sheet.Slots is null ? "solid" : "slotted")}, {Numbers.Of(line.RunValue, w.Unit)} at {Numbers.Of(runSpeed, w.SpeedUnit)}"
                + (models.Count > 0 ? $" ({string.Join(", ", models)})" : "");
            if (valid.Count > 1)
            {
                var solid = plot.Add.ScatterLine(valid.Select(p => p.Speed).ToArray(), valid.Select(p => p.Value).ToArray());
                solid.Color = colour;
                solid.LineWidth = 2.5f;
                solid.LegendText = label;
            }
            if (beyond.Count > 1)
            {
                var faded = plot.Add.ScatterLine(beyond.Select(p => p.Speed).ToArray(), beyond.Select(p => p.Value).ToArray());
                faded.Color = colour.WithAlpha(0.3);   // faded, not dashed: see PlotStyle
                faded.LineWidth = 2.5f;
                if (valid.Count <= 1) faded.LegendText = label + ", outside its validity";
            }
            plot.Add.Marker(runSpeed, line.RunValue, MarkerShape.FilledCircle, 9, colour);
            top = Math.Max(top, line.Points.Max(p => p.Value));
            if (line.Peak is { } peak)
            {
                var at = Interpolated(line.Points, peak);
                var marker = plot.Add.Marker(peak, at.Value, MarkerShape.OpenDiamond, 12, colour);
                marker.LegendText = $"peak at {Numbers.Of(peak, w.SpeedUnit)} ({at.Model})";
            }
            else if (end <= maxSpeed && marked.Add(Math.Round(end, 6)))
            {
                var rm = plot.Add.VerticalLine(end, 1, colour);
                rm.LegendText = $"Rm = {Numbers.Sig(reynoldsLimit)}{w.ReynoldsWhere} at {Numbers.Of(end, w.SpeedUnit)} ({sheetWords}): {w.HoldsBelow}";
            }
            if (line.ModelSwitch is { } change && change <= maxSpeed)
            {
                var at = Interpolated(line.Points, change);
                var above = line.Points.FirstOrDefault(p => p.Speed > change)?.Model;
                var marker = plot.Add.Marker(change, at.Value, MarkerShape.OpenTriangleUp, 12, colour);
                marker.LegendText = $"{sheetWords}: {at.Model} below {Numbers.Of(change, w.SpeedUnit)}" + (above is null || above == at.Model ? "" : $", {above} above");
            }
        }
        var run = plot.Add.VerticalLine(runSpeed, 1, PlotStyle.Grey);
        run.LegendText = $"run speed {Numbers.Of(runSpeed, w.SpeedUnit)}";
        if (limitValue is { } limit)
        {
            var limitLine = plot.Add.HorizontalLine(limit, 2, PlotStyle.Black);
            limitLine.LegendText = $"{w.LimitName} {Numbers.Of(limit, w.Unit)}";
            top = Math.Max(top, limit);
        }
        if (minimum is { } wanted)
        {
            var marker = plot.Add.Marker(wanted.Speed, wanted.Value, MarkerShape.OpenSquare, 12, PlotStyle.Black);
            marker.LegendText = $"minimum {w.Quantity} {Numbers.Of(wanted.Value, w.Unit)} at {Numbers.Of(wanted.Speed, w.SpeedUnit)}";
            top = Math.Max(top, wanted.Value);
        }
        plot.Axes.SetLimits(0, maxSpeed, 0, top * 1.1);
    }

    /// <summary>The line's value at a speed between its points (straight between neighbours), with the model of the point below.</summary>
    private static Point Interpolated(IReadOnlyList<Point> points, double speed)
    {
        var i = Math.Clamp(points.Count(p => p.Speed <= speed) - 1, 0, points.Count - 2);
        var (a, b) = (points[i], points[i + 1]);
        var f = (speed - a.Speed) / (b.Speed - a.Speed);
        return new Point(speed, a.Value + f * (b.Value - a.Value), a.Model);
    }

    private static string Label(DesignRole role, string shape, bool referenceIsCurrent) => role switch
    {
        DesignRole.Chosen => "chosen",
        DesignRole.SolidCounterpart => $"solid {shape}, same sheet",
        _ => referenceIsCurrent ? "current design" : "baseline",
    };
}
