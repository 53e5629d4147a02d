using SlotOpt.Design;
using SlotOpt.Runs;
using SlotOpt.Selection;
using SlotOpt.Selection.Search;
using static SlotOpt.Tests.Selection.Options;

namespace SlotOpt.Tests.Selection;

/// <summary>
/// A two-part problem small enough to solve by hand (invented numbers), asserted exactly in integers
/// for both selectors. Capitalisation 5 currency/W. Owning cost per candidate:
/// core A 100 + 5*10 = 150, B 130 + 5*4 = 150, C 90 + 5*16 = 170; plate P 20 + 5*3 = 35, Q 35 + 5*0.5 = 37.5.
/// The six designs (cost, loss W, owning): C+P (110, 19, 205), A+P (120, 13, 185), C+Q (125, 16.5, 207.5),
/// A+Q (135, 10.5, 187.5), B+P (150, 7, 185), B+Q (165, 4.5, 187.5).
/// </summary>
public class HandCheckedSelectionTests
{
    public static TheoryData<string> Selectors => ["cp-sat", "brute-force"];

    private static ISelector SelectorNamed(string name) =>
        name == "cp-sat" ? new CpSatSelector() : new BruteForceSelector();

    private static SelectionProblem Problem(Objective objective, SharedLimits? limits = null) => new(
        [
            Part("core", Option("A", 100, 10), Option("B", 130, 4), Option("C", 90, 16)),
            Part("plate", Option("P", 20, 3), Option("Q", 35, 0.5)),
        ],
        limits ?? new SharedLimits(), objective, ValuePerWatt: 5);

    // The cap holds with equality: 10.5 W admits A+Q (10.5 W, 135.00); 10.499 W = 10499 mW does not, and the
    // cheapest left is B+P (7 W, 150.00).
    [Theory]
    [InlineData("cp-sat", 10.5, 13_500L)]
    [InlineData("cp-sat", 10.499, 15_000L)]
    [InlineData("brute-force", 10.5, 13_500L)]
    [InlineData("brute-force", 10.499, 15_000L)]
    public void Loss_cap_is_met_with_equality(string selector, double capW, long cents)
    {
        var outcome = SelectorNamed(selector).Select(Problem(Objective.LowestCostWithinLossCap, new SharedLimits { TotalLossCapW = capW }));
        Assert.Equal(cents, outcome.Design!.BuildCostCents);
    }

    // A+P and B+P both own 185.00; the tie goes to the lower loss, B+P (7 W against 13 W).
    // 185.00 = 18_500_000_000 microcents; 150.00 = 15000 cents; 7 W = 7000 mW.
    [Theory]
    [MemberData(nameof(Selectors))]
    public void Lowest_owning_cost_breaks_the_tie_by_loss(string selector)
    {
        var outcome = SelectorNamed(selector).Select(Problem(Objective.LowestOwningCost));
        Assert.Equal(SelectionStatus.Optimal, outcome.Status);
        Assert.Equal(["B", "P"], outcome.Design!.CandidateIds);
        Assert.Equal(15_000L, outcome.Design.BuildCostCents);
        Assert.Equal(7_000L, outcome.Design.LossMilliwatts);
        Assert.Equal(18_500_000_000L, outcome.Design.OwningCostMicrocents);
        Assert.Equal(500_000L, outcome.CentsPerKilowatt);
    }

    // Budget 150.00 admits B+P (7 W), the lowest loss at 150 or less; one cent less and the best is A+Q (10.5 W).
    [Theory]
    [InlineData("cp-sat", 150.00, "B", "P", 7_000L)]
    [InlineData("cp-sat", 149.99, "A", "Q", 10_500L)]
    [InlineData("brute-force", 150.00, "B", "P", 7_000L)]
    [InlineData("brute-force", 149.99, "A", "Q", 10_500L)]
    public void Lowest_loss_within_budget(string selector, double budget, string core, string plate, long milliwatts)
    {
        var outcome = SelectorNamed(selector).Select(Problem(Objective.LowestLossWithinBudget, new SharedLimits { Budget = budget }));
        Assert.Equal(SelectionStatus.Optimal, outcome.Status);
        Assert.Equal([core, plate], outcome.Design!.CandidateIds);
        Assert.Equal(milliwatts, outcome.Design.LossMilliwatts);
    }

    // Loss cap 12 W leaves A+Q (135, 10.5), B+P (150, 7), B+Q (165, 4.5): the cheapest is A+Q, 13500 cents.
    [Theory]
    [MemberData(nameof(Selectors))]
    public void Lowest_cost_within_loss_cap(string selector)
    {
        var outcome = SelectorNamed(selector).Select(Problem(Objective.LowestCostWithinLossCap, new SharedLimits { TotalLossCapW = 12 }));
        Assert.Equal(SelectionStatus.Optimal, outcome.Status);
        Assert.Equal(["A", "Q"], outcome.Design!.CandidateIds);
        Assert.Equal(13_500L, outcome.Design.BuildCostCents);
    }

    // Of the six designs only C+Q (125, 16.5) is dominated (by A+P, 120 and 13 W); the other five are the
    // front, by cost: C+P, A+P, A+Q, B+P, B+Q. The chosen design is the lowest owning cost, B+P.
    [Theory]
    [MemberData(nameof(Selectors))]
    public void Trade_off_curve_is_the_five_non_dominated_designs(string selector)
    {
        var outcome = SelectorNamed(selector).Select(Problem(Objective.TradeOffCurve));
        var front = outcome.Front!;
        Assert.Equal(SelectionStatus.Optimal, front.Status);
        Assert.False(front.IsCapped);
        Assert.Equal(["C+P", "A+P", "A+Q", "B+P", "B+Q"], front.Points.Select(p => string.Join("+", p.CandidateIds)));
        Assert.Equal([11_000L, 12_000L, 13_500L, 15_000L, 16_500L], front.Points.Select(p => p.BuildCostCents));
        Assert.Equal([19_000L, 13_000L, 10_500L, 7_000L, 4_500L], front.Points.Select(p => p.LossMilliwatts));
        Assert.Equal(["B", "P"], outcome.Design!.CandidateIds);
    }

    // With room for 3 points the sweep, which starts from the dearest, keeps A+Q, B+P, B+Q and says it is capped.
    // With room for exactly 5 it is complete and not capped.
    [Theory]
    [InlineData("cp-sat", 3, true)]
    [InlineData("cp-sat", 5, false)]
    [InlineData("brute-force", 3, true)]
    [InlineData("brute-force", 5, false)]
    public void A_capped_front_says_so(string selector, int maxPoints, bool capped)
    {
        var outcome = SelectorNamed(selector).Select(Problem(Objective.TradeOffCurve), new SelectionOptions { MaxFrontPoints = maxPoints });
        Assert.Equal(capped, outcome.Front!.IsCapped);
        Assert.Equal(maxPoints, outcome.Front.Points.Count);
        Assert.Equal("B+Q", string.Join("+", outcome.Front.Points[^1].CandidateIds));
    }

    // The sweep starts from the dearest point, so progress hears the front in reverse: B+Q first, C+P last.
    [Theory]
    [MemberData(nameof(Selectors))]
    public void Front_progress_hears_each_point_dearest_first(string selector)
    {
        var heard = new PointRecorder();
        var outcome = SelectorNamed(selector).Select(Problem(Objective.TradeOffCurve), new SelectionOptions { FrontProgress = heard });
        Assert.Equal(outcome.Front!.Points.Reverse().Select(p => p.CandidateIds), heard.Points.Select(p => p.CandidateIds));
        Assert.Equal(["B", "Q"], heard.Points[0].CandidateIds);
    }

    /// <summary>Records reports synchronously (Progress&lt;T&gt; would post them to the thread pool).</summary>
    private sealed class PointRecorder : IProgress<FrontPoint>
    {
        public List<FrontPoint> Points { get; } = [];
        public void Report(FrontPoint value) => Points.Add(value);
    }

    // Loss is ranked in whole milliwatts: 1.0002 W and 1.0001 W are both 1000 mW, so X and Y tie exactly
    // on owning cost and loss, and candidate order decides: X, although its unrounded loss is higher.
    [Theory]
    [MemberData(nameof(Selectors))]
    public void Losses_equal_to_the_milliwatt_tie_and_candidate_order_decides(string selector)
    {
        var problem = new SelectionProblem([Part("shield", Option("X", 10, 1.0002), Option("Y", 10, 1.0001))],
            new SharedLimits(), Objective.LowestOwningCost, ValuePerWatt: 3);
        var outcome = SelectorNamed(selector).Select(problem);
        Assert.Equal(["X"], outcome.Design!.CandidateIds);
        Assert.Equal(1_000L, outcome.Design.LossMilliwatts);
    }
}
