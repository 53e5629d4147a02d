using SlotOpt.Design;
using SlotOpt.Selection;
using SlotOpt.Selection.Search;
using static SlotOpt.Tests.Selection.Options;

namespace SlotOpt.Tests.Selection;

/// <summary>Malformed problems are user mistakes: one InputException listing every one (invented data).</summary>
public class SelectionProblemValidationTests
{
    [Fact]
    public void Every_mistake_is_listed_at_once()
    {
        var problem = new SelectionProblem(
            [Part("core", Option("A", -1, 10), Option("A", 5, double.NaN)), Part("yoke", Option("Y", 5, 1))],
            new SharedLimits { CoilGroups = [["core", "yokee"]], MaxDistinctProcesses = 0 },
            Objective.LowestLossWithinBudget, ValuePerWatt: 5);
        var error = Assert.Throws<InputException>(() => new CpSatSelector().Select(problem));
        Assert.Contains("part 'core', candidate 'A': build cost -1", error.Message);
        Assert.Contains("candidate 'A': the id appears twice", error.Message);
        Assert.Contains("loss NaN W", error.Message);
        Assert.Contains("objective 'lowest loss within budget' needs a budget", error.Message);
        Assert.Contains("coil group 1 names part 'yokee', which is not in the problem (did you mean yoke?)", error.Message);
        Assert.Contains("at most 0 distinct processes", error.Message);
    }

    [Fact]
    public void Coil_groups_and_process_limits_need_their_attributes()
    {
        var problem = new SelectionProblem([Part("core", Option("A", 1, 1)), Part("yoke", Option("Y", 1, 1))],
            new SharedLimits { CoilGroups = [["core", "yoke"]], MaxDistinctProcesses = 2 },
            Objective.LowestCostWithinLossCap, ValuePerWatt: 5);
        var error = Assert.Throws<InputException>(() => new BruteForceSelector().Select(problem));
        Assert.Contains("part 'core', candidate 'A': no 'coil' attribute, needed by coil group 1", error.Message);
        Assert.Contains("part 'yoke', candidate 'Y': no 'process' attribute", error.Message);
        Assert.Contains("needs a total loss cap", error.Message);
    }
}
