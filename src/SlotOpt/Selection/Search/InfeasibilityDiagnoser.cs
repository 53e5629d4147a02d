using System.Globalization;
using SlotOpt.Tables;

namespace SlotOpt.Selection.Search;

/// <summary>
/// Builds the <see cref="InfeasibilityDiagnosis"/> of a problem with no feasible design: names the parts
/// without candidates, else drops each shared limit in turn (budget, loss cap, each coil group, process
/// count) and searches the relaxed problem for the design nearest to meeting the dropped limit.
/// </summary>
internal static class InfeasibilityDiagnoser
{
    public static (InfeasibilityDiagnosis Diagnosis, SolveEffort Effort) Diagnose(IDesignSearch search, ScaledProblem scaled, SelectionProblem problem)
    {
        var empty = scaled.Parts.Where(p => p.Count == 0).Select(p => p.Name).ToArray();
        if (empty.Length > 0) return (new InfeasibilityDiagnosis(empty, []), SolveEffort.None);

        var relaxations = new List<LimitRelaxation>();
        var effort = SolveEffort.None;
        void Relax(SharedLimitKind kind, int? group, string description, ScaledProblem relaxed, IReadOnlyList<Criterion> ranking)
        {
            var result = search.Search(relaxed, ranking);
            effort += result.Effort;
            var nearest = result.Choice is null ? null : relaxed.Describe(result.Choice);
            relaxations.Add(new LimitRelaxation(kind, group, description, result.Status, nearest));
        }

        if (scaled.BudgetCents is { } budget)
            Relax(SharedLimitKind.Budget, null, Invariant($"budget {IntegerScale.CentsToMoney(budget):0.00}"),
                scaled with { BudgetCents = null }, [Criterion.BuildCost, Criterion.Loss]);
        if (scaled.LossCapMilliwatts is { } lossCap)
            Relax(SharedLimitKind.TotalLossCap, null, Invariant($"total loss cap {Numbers.Watts(IntegerScale.MilliwattsToWatts(lossCap))}"),
                scaled with { LossCapMilliwatts = null }, [Criterion.Loss, Criterion.BuildCost]);
        for (var g = 0; g < scaled.CoilGroups.Length; g++)
        {
            var names = string.Join(", ", problem.Limits.CoilGroups[g]);
            var others = scaled.CoilGroups.Where((_, i) => i != g).ToArray();
            Relax(SharedLimitKind.CoilGroup, g, $"coil group {g + 1} ({names})",
                scaled with { CoilGroups = others }, ObjectiveRanking.For(problem.Objective));
        }
        if (scaled.MaxDistinctProcesses is { } maxProcesses)
            Relax(SharedLimitKind.MaxDistinctProcesses, null, $"at most {maxProcesses} distinct processes",
                scaled with { MaxDistinctProcesses = null }, [Criterion.DistinctProcesses, Criterion.OwningCost]);

        return (new InfeasibilityDiagnosis([], relaxations), effort);
    }

    private static string Invariant(FormattableString text) => text.ToString(CultureInfo.InvariantCulture);
}
