using SlotOpt.Selection;
using SlotOpt.Selection.Search;

namespace SlotOpt.Tests.Selection;

/// <summary>
/// The CP-SAT front checked against every feasible design, listed by the test's own enumeration
/// (<see cref="FeasibleDesigns"/>), on seeded random problems (invented): the front is exactly the set of
/// non-dominated (cost, loss) pairs, sorted by cost, each point non-dominated and feasible; and the
/// trade-off curve's chosen design is the lowest owning cost of all feasible designs.
/// </summary>
public class TradeOffFrontTests
{
    public static TheoryData<int, LimitMix> Cases()
    {
        var cases = new TheoryData<int, LimitMix>();
        foreach (var mix in new[] { LimitMix.None, LimitMix.Budget, LimitMix.LossCap, LimitMix.CoilGroup, LimitMix.ProcessLimit, LimitMix.All })
            for (var seed = 1; seed <= 4; seed++)
                cases.Add(seed, mix);
        return cases;
    }

    [Theory]
    [MemberData(nameof(Cases))]
    public void Front_is_every_non_dominated_design_sorted_by_cost(int seed, LimitMix mix)
    {
        var problem = RandomSelectionProblems.Make(7000 + seed, mix, Objective.TradeOffCurve);
        var feasible = FeasibleDesigns.Of(problem);
        var nonDominated = feasible
            .Where(d => !feasible.Any(o => o.Cents <= d.Cents && o.Milliwatts <= d.Milliwatts && (o.Cents < d.Cents || o.Milliwatts < d.Milliwatts)))
            .Select(d => (d.Cents, d.Milliwatts)).Distinct().OrderBy(p => p.Cents).ToArray();

        var front = new CpSatSelector().Select(problem).Front!;

        Assert.Equal(feasible.Count == 0 ? SelectionStatus.Infeasible : SelectionStatus.Optimal, front.Status);
        Assert.False(front.IsCapped);
        Assert.Equal(nonDominated, front.Points.Select(p => (p.BuildCostCents, p.LossMilliwatts)).ToArray());
        for (var i = 1; i < front.Points.Count; i++)
        {
            Assert.True(front.Points[i].BuildCostCents > front.Points[i - 1].BuildCostCents, "front not sorted by cost");
            Assert.True(front.Points[i].LossMilliwatts < front.Points[i - 1].LossMilliwatts, "a dearer point without less loss is dominated");
        }
        foreach (var point in front.Points)
            Assert.Contains(feasible, d => d.Chosen.Select(c => c.Id).SequenceEqual(point.CandidateIds)
                                           && d.Cents == point.BuildCostCents && d.Milliwatts == point.LossMilliwatts);
    }

    // Owning cost of each feasible design computed here as 1e6 * cents + rate * mW (rate in cents per kW):
    // the chosen design of the trade-off curve must reach the smallest, and it must be a front point.
    [Theory]
    [MemberData(nameof(Cases))]
    public void Chosen_point_is_the_lowest_owning_cost_of_all_feasible_designs(int seed, LimitMix mix)
    {
        var problem = RandomSelectionProblems.Make(7000 + seed, mix, Objective.TradeOffCurve);
        var rate = IntegerScale.ToCentsPerKilowatt(problem.ValuePerWatt);
        var feasible = FeasibleDesigns.Of(problem);

        var outcome = new CpSatSelector().Select(problem);

        if (feasible.Count == 0)
        {
            Assert.Equal(SelectionStatus.Infeasible, outcome.Status);
            return;
        }
        var lowest = feasible.Min(d => 1_000_000 * d.Cents + rate * d.Milliwatts);
        Assert.Equal(lowest, outcome.Design!.OwningCostMicrocents);
        Assert.Contains(outcome.Front!.Points, p => p.CandidateIds.SequenceEqual(outcome.Design.CandidateIds));
    }
}
