using SlotOpt.Design;
using SlotOpt.Runs;
using SlotOpt.Selection;
using SlotOpt.Selection.Search;
using static SlotOpt.Tests.Selection.Options;

namespace SlotOpt.Tests.Selection;

/// <summary>
/// The hand problem of <see cref="HandCheckedSelectionTests"/> (invented numbers) made infeasible on
/// purpose. Its designs (cost, loss W): C+P (110, 19), A+P (120, 13), C+Q (125, 16.5), A+Q (135, 10.5),
/// B+P (150, 7), B+Q (165, 4.5).
/// </summary>
public class InfeasibilityDiagnosisTests
{
    public static TheoryData<string> Selectors => ["cp-sat", "brute-force"];

    private static ISelector SelectorNamed(string name) =>
        name == "cp-sat" ? new CpSatSelector() : new BruteForceSelector();

    private static SelectionProblem Problem(SharedLimits limits, string coreProcess = "laser", string plateProcess = "laser") => new(
        [
            Part("core", Option("A", 100, 10, process: coreProcess), Option("B", 130, 4, process: coreProcess), Option("C", 90, 16, process: coreProcess)),
            Part("plate", Option("P", 20, 3, process: plateProcess), Option("Q", 35, 0.5, process: plateProcess)),
        ],
        limits, Objective.LowestOwningCost, ValuePerWatt: 5);

    // Budget 100 is below the cheapest design (C+P, 110); the 20 W cap alone admits C+P. Dropping the
    // budget restores feasibility with C+P at 110.00; dropping the cap leaves nothing at 100 or less.
    [Theory]
    [MemberData(nameof(Selectors))]
    public void A_budget_below_the_cheapest_design_is_named_as_the_binding_limit(string selector)
    {
        var outcome = SelectorNamed(selector).Select(Problem(new SharedLimits { Budget = 100, TotalLossCapW = 20 }));
        Assert.Equal(SelectionStatus.Infeasible, outcome.Status);
        Assert.Null(outcome.Design);
        var diagnosis = outcome.Diagnosis!;
        Assert.Empty(diagnosis.PartsWithoutCandidates);
        Assert.Equal([SharedLimitKind.Budget, SharedLimitKind.TotalLossCap], diagnosis.Relaxations.Select(r => r.Kind));
        var binding = Assert.Single(diagnosis.BindingLimits);
        Assert.Equal(SharedLimitKind.Budget, binding.Kind);
        Assert.Equal(["C", "P"], binding.NearestDesign!.CandidateIds);
        Assert.Equal(11_000L, binding.NearestDesign.BuildCostCents);
        Assert.Equal(SelectionStatus.Infeasible, diagnosis.Relaxations[1].StatusWithoutLimit);
        Assert.Equal(["the budget 100.00 binds: the cheapest design within the other limits costs 110.00"], diagnosis.Explain());
    }

    // Budget 150 and cap 5 W: only B+Q loses 5 W or less, and it costs 165. Either relaxation alone works:
    // without the budget the cheapest is B+Q (165.00); without the cap the lowest loss within 150 is B+P (7 W).
    [Theory]
    [MemberData(nameof(Selectors))]
    public void Budget_and_loss_cap_that_conflict_both_bind(string selector)
    {
        var diagnosis = SelectorNamed(selector).Select(Problem(new SharedLimits { Budget = 150, TotalLossCapW = 5 })).Diagnosis!;
        Assert.Equal([SharedLimitKind.Budget, SharedLimitKind.TotalLossCap], diagnosis.BindingLimits.Select(r => r.Kind));
        Assert.Equal(16_500L, diagnosis.BindingLimits[0].NearestDesign!.BuildCostCents);
        Assert.Equal(7_000L, diagnosis.BindingLimits[1].NearestDesign!.LossMilliwatts);
    }

    // Core parts are laser-cut, plates water-jet cut: any design uses 2 processes, so a limit of 1 binds,
    // and the nearest design reports the 2 it needs.
    [Theory]
    [MemberData(nameof(Selectors))]
    public void A_process_limit_below_what_any_design_needs_binds(string selector)
    {
        var diagnosis = SelectorNamed(selector).Select(Problem(new SharedLimits { MaxDistinctProcesses = 1 }, plateProcess: "waterjet")).Diagnosis!;
        var binding = Assert.Single(diagnosis.BindingLimits);
        Assert.Equal(SharedLimitKind.MaxDistinctProcesses, binding.Kind);
        Assert.Equal(2, binding.NearestDesign!.DistinctProcesses);
    }

    // Two parts of one coil group with no coil value in common (invented): only dropping the group helps.
    [Theory]
    [MemberData(nameof(Selectors))]
    public void A_coil_group_without_a_common_coil_binds(string selector)
    {
        var problem = new SelectionProblem(
            [Part("core", Option("core-35", 50, 2, coil: "M270-35")), Part("yoke", Option("yoke-50", 30, 6, coil: "M400-50"))],
            new SharedLimits { CoilGroups = [["core", "yoke"]] }, Objective.LowestOwningCost, ValuePerWatt: 2);
        var binding = Assert.Single(SelectorNamed(selector).Select(problem).Diagnosis!.BindingLimits);
        Assert.Equal(SharedLimitKind.CoilGroup, binding.Kind);
        Assert.Equal(0, binding.CoilGroupIndex);
        Assert.Equal("coil group 1 (core, yoke)", binding.Description);
    }

    // Every option of the shield broke a manufacturing rule: the part is the cause, no limit is blamed.
    [Theory]
    [MemberData(nameof(Selectors))]
    public void A_part_without_candidates_is_named_directly(string selector)
    {
        var problem = new SelectionProblem([Part("core", Option("A", 100, 10)), Part("shield")],
            new SharedLimits { Budget = 1000 }, Objective.LowestOwningCost, ValuePerWatt: 5);
        var outcome = SelectorNamed(selector).Select(problem);
        Assert.Equal(SelectionStatus.Infeasible, outcome.Status);
        Assert.Equal(["shield"], outcome.Diagnosis!.PartsWithoutCandidates);
        Assert.Empty(outcome.Diagnosis.Relaxations);
        Assert.Equal(["part 'shield' has no candidate left: every option broke a manufacturing rule"], outcome.Diagnosis.Explain());
    }
}
