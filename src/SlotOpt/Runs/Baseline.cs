using SlotOpt.Design;

namespace SlotOpt.Runs;

/// <summary>A named whole-product design a result is compared with (one option per part) and its totals.</summary>
public sealed record Baseline(string Name, IReadOnlyList<EvaluatedOption> Options)
{
    public double BuildCost => Options.Sum(o => o.BuildCost);
    public double LossW => Options.Sum(o => o.Loss.TotalW);
    public double OwningCost(Problem problem) => problem.OwningCost(Options);

    /// <summary>Rules or limits this design breaks, one line each.</summary>
    public IReadOnlyList<string> Breaks => Options.Where(o => !o.IsFeasible).Select(o => $"{o.PartName}: {o.Rejection!.Message}").ToList();
}
