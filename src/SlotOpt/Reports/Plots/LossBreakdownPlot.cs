using SlotOpt.Design.SolidParts;
using System.Globalization;
using ScottPlot;
using SlotOpt.Tables;
using SlotOpt.Design;
using SlotOpt.Runs;

namespace SlotOpt.Reports.Plots;

/// <summary>
/// The chosen design's loss by origin beside the reference's, per part (and in total for several parts),
/// as stacked bars whose height is the loss counted against the design (<see cref="LossBreakdown.TotalW"/>).
/// </summary>
public static class LossBreakdownPlot
{
    public const string FileStem = "loss-breakdown";

    /// <summary>The stacked components in order: for a moving source the plate's eddy loss is its drag power, so it is stacked once, as drag power.</summary>
    public static IReadOnlyList<(string Name, Color Colour, Func<LossBreakdown, double> Watts)> Components { get; } =
    [
        ("hysteresis", PlotStyle.Blue, l => l.HysteresisW),
        ("classical eddy", PlotStyle.Sky, l => l.ClassicalW),
        ("excess", PlotStyle.Green, l => l.ExcessW),
        ("plate eddy (AC field)", PlotStyle.Orange, l => l.PlateEddyW),
        ("drag power (moving source)", PlotStyle.Vermillion, l => l.DragPowerW),
    ];

    public static Figure? Build(RunResult r)
    {
        if (r.Chosen is null) return null;
        var groups = new List<(string Label, LossBreakdown Chosen, LossBreakdown Reference)>();
        for (var i = 0; i < r.Chosen.Count; i++)
        {
            var moving = IsMoving(r.Parts[i].Part);
            groups.Add((r.Parts[i].Part.Name, Split(r.Chosen[i].Loss, moving), Split(r.Parts[i].Reference.Loss, moving)));
        }
        var referenceWord = r.Parts.Any(p => p.ReferenceIsCurrent) ? "current" : "baseline";

        var plot = PlotStyle.NewPlot($"Loss by origin: chosen design and {referenceWord} design", "design and part", "loss (W)");
        var bars = new List<Bar>();
        var ticks = new List<(double Position, string Label)>();
        var position = 0.0;
        var totalsByBar = new List<(double Position, double Watts)>();
        void Stack(LossBreakdown loss, string label)
        {
            var bottom = 0.0;
            foreach (var (_, colour, watts) in Components)
            {
                var w = watts(loss);
                if (w <= 0) continue;
                bars.Add(new Bar { Position = position, ValueBase = bottom, Value = bottom + w, FillColor = colour, LineWidth = 0, Size = 0.8 });
                bottom += w;
            }
            totalsByBar.Add((position, bottom));
            ticks.Add((position, label));
            position += 1;
        }
        foreach (var g in groups)
        {
            var name = g.Label.Replace(' ', '\n');   // one word a line, so neighbouring labels do not run into each other
            Stack(g.Chosen, $"chosen\n{name}");
            Stack(g.Reference, $"{referenceWord}\n{name}");
            position += 0.6;
        }
        if (groups.Count > 1)
        {
            Stack(Sum(groups.Select(g => g.Chosen)), "chosen\ntotal");
            Stack(Sum(groups.Select(g => g.Reference)), $"{referenceWord}\ntotal");
        }
        plot.Add.Bars(bars);
        var top = totalsByBar.Max(t => t.Watts);
        foreach (var (x, watts) in totalsByBar)
        {
            var text = plot.Add.Text(Numbers.Watts(watts), x, watts + top * 0.015);
            text.LabelFontSize = 12;
            text.LabelFontName = PlotStyle.FontName;
            text.LabelAlignment = Alignment.LowerCenter;
        }
        plot.Axes.Bottom.TickGenerator = new ScottPlot.TickGenerators.NumericManual(ticks.Select(t => t.Position).ToArray(), ticks.Select(t => t.Label).ToArray());
        plot.Axes.Bottom.MajorTickStyle.Length = 0;
        plot.Grid.XAxisStyle.IsVisible = false;
        plot.Axes.SetLimitsY(0, top * 1.12);
        foreach (var (name, colour, _) in Components)
            if (bars.Any(b => b.FillColor == colour))
                plot.Legend.ManualItems.Add(new LegendItem { LabelText = name, FillColor = colour });
        plot.ShowLegend(Edge.Right);   // outside the axes: no bar can hide behind it
        var caption = "Each bar stacks the loss counted against the design; the number above it is the total. "
            + (r.Parts.Any(p => IsMoving(p.Part)) ? "For a plate passed by moving poles the eddy loss is the drag power F v, stacked once. " : "")
            + $"The {referenceWord} design is the one the savings are measured against.";
        return PlotStyle.Render(plot, FileStem, "Loss breakdown", caption, categoricalX: true);
    }

    private static bool IsMoving(Part part) => part is PlatePart { Excitation.IsMoving: true };

    /// <summary>A part's loss with its plate eddy loss in one slot only: drag power for a moving source (where the two are the same watts), plate eddy otherwise; the parts then add up to their totals.</summary>
    private static LossBreakdown Split(LossBreakdown l, bool moving) => moving ? l with { PlateEddyW = 0 } : l with { DragPowerW = 0 };

    private static LossBreakdown Sum(IEnumerable<LossBreakdown> losses) => losses.Aggregate(LossBreakdown.Zero, (a, b) =>
        new LossBreakdown(a.HysteresisW + b.HysteresisW, a.ClassicalW + b.ClassicalW, a.ExcessW + b.ExcessW, a.PlateEddyW + b.PlateEddyW, a.DragPowerW + b.DragPowerW));
}
