using SlotOpt.Selection;
using SlotOpt.Selection.Search;

namespace SlotOpt.Tests.Selection;

/// <summary>
/// A run out of deterministic time says so. The problem (invented, seeded) is a 30-part x 30-candidate
/// choice with loss falling as cost rises, and a budget: a multiple-choice knapsack, hard enough that
/// small budgets stop the search. One worker and a fixed seed make deterministic time reproducible, so
/// the statuses below repeat on every machine with the pinned OR-Tools (9.15.6755); another version may
/// need other budgets.
/// </summary>
public class TimeBudgetTests
{
    private static readonly SelectionProblem Knapsack = MakeKnapsack();

    private static SelectionProblem MakeKnapsack()
    {
        var random = new Random(3);
        var parts = Enumerable.Range(0, 30).Select(p => new PartChoices($"part{p}", Enumerable.Range(0, 30).Select(k =>
        {
            var tenths = random.Next(100, 1000);
            return new Candidate($"p{p}c{k}", tenths / 10.0, (1100 - tenths + random.Next(0, 50)) / 10.0, null, new Dictionary<string, string>());
        }).ToArray())).ToArray();
        return new SelectionProblem(parts, new SharedLimits { Budget = 30 * 55 }, Objective.LowestLossWithinBudget, ValuePerWatt: 3);
    }

    private static SelectionOutcome SelectWithin(double deterministicSeconds) =>
        new CpSatSelector(new CpSatSettings { MaxDeterministicTimeSeconds = deterministicSeconds }).Select(Knapsack);

    [Fact]
    public void Out_of_time_before_any_design_is_neither_a_design_nor_infeasible()
    {
        var outcome = SelectWithin(0.01);
        Assert.Equal(SelectionStatus.LimitReachedWithoutDesign, outcome.Status);
        Assert.Null(outcome.Design);
        Assert.Null(outcome.Diagnosis);
        Assert.True(outcome.Effort.DeterministicSeconds >= 0.01);
    }

    // A best-found design meets the budget and cannot beat the proven optimum (more time, same model).
    [Fact]
    public void Out_of_time_with_a_design_reports_it_as_not_proven()
    {
        var limited = SelectWithin(0.03);
        var proven = SelectWithin(10);
        Assert.Equal(SelectionStatus.FeasibleAtLimit, limited.Status);
        Assert.Equal(SelectionStatus.Optimal, proven.Status);
        Assert.True(limited.Design!.BuildCostCents <= 165_000);
        Assert.True(limited.Design.LossMilliwatts >= proven.Design!.LossMilliwatts);
    }
}
