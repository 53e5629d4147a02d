using System.Globalization;
using ScottPlot;
using SlotOpt.Tables;
using SlotOpt.Design;
using SlotOpt.Runs;
using SlotOpt.Selection;

namespace SlotOpt.Reports.Plots;

/// <summary>
/// Loss against build cost: the trade-off front as a staircase (at any cost the lowest loss reachable),
/// the chosen design, the three baselines, the shared limits, and for a one-part problem every
/// option within the rules as a grey cloud. The loss axis is logarithmic when the points span more than a decade.
/// </summary>
public static class TradeOffPlot
{
    public const string FileStem = "trade-off";

    public static Figure? Build(RunResult r)
    {
        var front = r.Outcome.Front;
        if (front is null || front.Points.Count == 0) return null;
        var cur = r.Problem.Economics.Currency;
        var cloud = r.Parts.Count == 1 ? r.Parts[0].Feasible : [];
        var allLosses = front.Points.Select(p => p.LossW).Concat(r.Baselines.Select(b => b.LossW)).Concat(cloud.Select(o => o.Loss.TotalW)).ToList();
        var log = LogAxis.SpansMoreThanADecade(allLosses) && allLosses.All(l => l > 0);
        double Y(double lossW) => log ? Math.Log10(lossW) : lossW;

        var plot = PlotStyle.NewPlot("Loss against build cost", $"build cost ({cur} per unit)", log ? "loss (W, log scale)" : "loss (W)");
        if (cloud.Count > 0)
        {
            var options = plot.Add.ScatterPoints(cloud.Select(o => o.BuildCost).ToArray(), cloud.Select(o => Y(o.Loss.TotalW)).ToArray());
            options.Color = PlotStyle.Grey.WithAlpha(0.45);
            options.MarkerSize = 5;
            options.LegendText = $"options within the rules ({cloud.Count})";
        }
        var staircase = plot.Add.Scatter(front.Points.Select(p => p.BuildCost).ToArray(), front.Points.Select(p => Y(p.LossW)).ToArray());
        staircase.ConnectStyle = ConnectStyle.StepHorizontal;
        staircase.Color = PlotStyle.Blue;
        staircase.LineWidth = 2;
        staircase.MarkerSize = 7;
        staircase.LegendText = $"trade-off front ({front.Points.Count} designs{(front.Status == SelectionStatus.Optimal && !front.IsCapped ? "" : ", incomplete")})";

        // the chosen design filled underneath, the baselines as open shapes of growing size on top: where two are the same design both stay visible
        if (r.HasDesign)
        {
            var chosen = plot.Add.Marker(r.TotalBuildCost, Y(r.TotalLossW), MarkerShape.FilledDiamond, 15, PlotStyle.Green);
            chosen.LegendText = $"chosen: {Numbers.Watts(r.TotalLossW)}, {Numbers.Money(r.TotalBuildCost, cur)}";
        }
        MarkerShape[] shapes = [MarkerShape.OpenSquare, MarkerShape.OpenTriangleUp, MarkerShape.OpenTriangleDown];
        Color[] colours = [PlotStyle.Vermillion, PlotStyle.Orange, PlotStyle.Purple];
        var chosenIds = r.Chosen?.Select(o => o.Id).ToList();
        for (var i = 0; i < r.Baselines.Count; i++)
        {
            var b = r.Baselines[i];
            var ids = b.Options.Select(o => o.Id).ToList();
            var same = r.Baselines.Take(i).Where(e => e.Options.Select(o => o.Id).SequenceEqual(ids)).Select(e => e.Name).ToList();
            if (chosenIds is not null && chosenIds.SequenceEqual(ids)) same.Insert(0, "chosen");
            var marker = plot.Add.Marker(b.BuildCost, Y(b.LossW), shapes[i % shapes.Length], 16 + 5 * i, colours[i % colours.Length]);
            marker.MarkerLineWidth = 2.5f;
            marker.LegendText = $"{b.Name}: {Numbers.Watts(b.LossW)}, {Numbers.Money(b.BuildCost, cur)}{BaselineBreaks.Short(r, b)}{(same.Count > 0 ? $" = {string.Join(" = ", same)}" : "")}";
        }
        if (r.Problem.Limits.Budget is { } budget)
        {
            var line = plot.Add.VerticalLine(budget, 1.5f, PlotStyle.Black);
            line.LegendText = $"budget {Numbers.Money(budget, cur)}";
        }
        if (r.Problem.Limits.TotalLossCapW is { } cap)
        {
            var line = plot.Add.HorizontalLine(Y(cap), 1.5f, PlotStyle.Grey);
            line.LegendText = $"loss cap {Numbers.Watts(cap)}";
        }
        if (log) LogAxis.Apply(plot.Axes.Left, allLosses);
        var legendPx = PlotStyle.LegendBelow(plot);
        var caption = "Each step of the front is the lowest total loss reachable at that build cost or below. "
            + "Markers show the chosen design and the baselines it is compared with; a baseline may break a part's limit or a shared limit"
            + (cloud.Count > 0 ? "; grey dots are every option of the part that passes its rules." : ".")
            + (log ? " The loss axis is logarithmic because the points span more than a decade." : "");
        var heightPx = PlotStyle.HeightPx + legendPx;
        var figure = PlotStyle.Render(plot, FileStem, "Trade-off: loss against build cost", caption, heightPx: heightPx);
        // each point of the front names its design when pointed at in the HTML page (pixels of the render just made)
        var tips = front.Points.Select(p =>
        {
            var px = plot.GetPixel(new Coordinates(p.BuildCost, Y(p.LossW)));
            var designs = p.CandidateIds.Select(r.Option).Select(o => (Option: o, Words: WorkshopWords.Of(o, r.Parts.First(pe => pe.Part.Name == o.PartName).Part)))
                .Select(d => r.Parts.Count == 1 ? d.Words : $"{d.Option.PartName}: {d.Words}");
            var text = $"{(chosenIds is not null && p.CandidateIds.SequenceEqual(chosenIds) ? "chosen design: " : "")}build cost {Numbers.Money(p.BuildCost, cur)}, loss {Numbers.Watts(p.LossW)}, owning cost {Numbers.Money(ReportContent.FrontOwningCost(r, p), cur)}\n"
                + string.Join("\n", designs);
            return ((double)px.X, (double)px.Y, text);
        }).ToList();
        return figure with { Tips = new PointTips(PlotStyle.WidthPx, heightPx, tips) };
    }
}
