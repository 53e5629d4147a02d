using System.Globalization;
using SlotOpt.Design;
using SlotOpt.Runs;
using SlotOpt.Tables;

namespace SlotOpt.Reports;

/// <summary>What a baseline breaks: each part's rule or limit (from the engine), and the budget and loss cap, which the engine does not check for baselines.</summary>
public static class BaselineBreaks
{
    public static IReadOnlyList<string> Of(RunResult r, Baseline b)
    {
        var broken = b.Breaks.ToList();
        var cur = r.Problem.Economics.Currency;
        if (r.Problem.Limits.Budget is { } budget && b.BuildCost > budget)
            broken.Add($"build cost {Numbers.Money(b.BuildCost, cur)} is over the budget of {Numbers.Money(budget, cur)}");
        if (r.Problem.Limits.TotalLossCapW is { } cap && b.LossW > cap)
            broken.Add($"loss {Numbers.Watts(b.LossW)} is over the loss cap of {Numbers.Watts(cap)}");
        return broken;
    }

    /// <summary>A legend's few words: "(breaks a part's limit, over budget)", or nothing.</summary>
    public static string Short(RunResult r, Baseline b)
    {
        var words = new List<string>();
        if (b.Breaks.Count > 0) words.Add("breaks a part's limit");
        if (r.Problem.Limits.Budget is { } budget && b.BuildCost > budget) words.Add("over budget");
        if (r.Problem.Limits.TotalLossCapW is { } cap && b.LossW > cap) words.Add("over the loss cap");
        return words.Count == 0 ? "" : $" ({string.Join(", ", words)})";
    }
}
