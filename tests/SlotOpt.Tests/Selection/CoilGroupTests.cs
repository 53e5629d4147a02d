using SlotOpt.Design;
using SlotOpt.Runs;
using SlotOpt.Selection;
using SlotOpt.Selection.Search;
using static SlotOpt.Tests.Selection.Options;

namespace SlotOpt.Tests.Selection;

/// <summary>
/// Core and yoke cut from one coil must share its grade and gauge (invented numbers, 2 currency/W).
/// Owning cost: core on M270-35 50 + 2*2 = 54, on M400-50 52 + 2*5 = 62; yoke on M270-35 60 + 2*3 = 66,
/// on M400-50 30 + 2*6 = 42. Alone each part goes its own way: core M270-35 + yoke M400-50 = 96.
/// From one coil: both M270-35 = 120, both M400-50 = 104, so the core must move to M400-50.
/// </summary>
public class CoilGroupTests
{
    public static TheoryData<string> Selectors => ["cp-sat", "brute-force"];

    private static ISelector SelectorNamed(string name) =>
        name == "cp-sat" ? new CpSatSelector() : new BruteForceSelector();

    private static SelectionProblem Problem(params IReadOnlyList<string>[] coilGroups) => new(
        [
            Part("core", Option("core-35", 50, 2, coil: "M270-35"), Option("core-50", 52, 5, coil: "M400-50")),
            Part("yoke", Option("yoke-35", 60, 3, coil: "M270-35"), Option("yoke-50", 30, 6, coil: "M400-50")),
        ],
        new SharedLimits { CoilGroups = coilGroups }, Objective.LowestOwningCost, ValuePerWatt: 2);

    [Theory]
    [MemberData(nameof(Selectors))]
    public void Without_a_group_each_part_takes_its_own_best_coil(string selector)
    {
        var outcome = SelectorNamed(selector).Select(Problem());
        Assert.Equal(["core-35", "yoke-50"], outcome.Design!.CandidateIds);
        Assert.Equal(9_600_000_000L, outcome.Design.OwningCostMicrocents);
    }

    [Theory]
    [MemberData(nameof(Selectors))]
    public void One_coil_for_both_moves_the_core_to_the_yokes_grade(string selector)
    {
        var outcome = SelectorNamed(selector).Select(Problem(["core", "yoke"]));
        Assert.Equal(SelectionStatus.Optimal, outcome.Status);
        Assert.Equal(["core-50", "yoke-50"], outcome.Design!.CandidateIds);
        Assert.Equal(10_400_000_000L, outcome.Design.OwningCostMicrocents);
    }
}
