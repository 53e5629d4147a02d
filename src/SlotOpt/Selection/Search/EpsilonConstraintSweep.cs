namespace SlotOpt.Selection.Search;

/// <summary>
/// The trade-off front by the epsilon-constraint method (Haimes, Lasdon and Wismer, IEEE Trans. Syst.
/// Man Cybern. SMC-1(3):296, 1971): with the build cost capped at c (no cap at first), minimise the
/// loss, then the cost at that loss; the design found is a front point, and c becomes its cost less
/// one cent. In integer units this steps through every non-dominated (cost, loss) pair, dearest first,
/// until no design is left, and a point found by proven solves cannot be dominated: a design as cheap
/// with less loss would have been found at this c, and one with equal loss and less cost would have won
/// the second level.
/// </summary>
internal static class EpsilonConstraintSweep
{
    private static readonly Criterion[] LossThenCost = [Criterion.Loss, Criterion.BuildCost];

    public static (TradeOffFront Front, SolveEffort Effort) Run(IDesignSearch search, ScaledProblem problem, int maxPoints, IProgress<FrontPoint>? progress)
    {
        if (maxPoints < 1) throw new ArgumentOutOfRangeException(nameof(maxPoints), maxPoints, "a front needs room for one point");
        var points = new List<FrontPoint>();
        var status = SelectionStatus.Optimal;
        var effort = SolveEffort.None;
        var capped = false;
        long? costCap = null;
        while (true)
        {
            var result = search.Search(problem, LossThenCost, costCap);
            effort += result.Effort;
            if (result.Status == SelectionStatus.Infeasible) break;
            if (result.Choice is null)
            {
                status = SelectionStatus.LimitReachedWithoutDesign;
                break;
            }
            if (points.Count == maxPoints)
            {
                capped = true;
                break;
            }
            if (result.Status == SelectionStatus.FeasibleAtLimit) status = SelectionStatus.FeasibleAtLimit;
            var point = new FrontPoint(problem.Describe(result.Choice), result.Status);
            points.Add(point);
            progress?.Report(point);
            costCap = point.BuildCostCents - 1;
        }

        if (points.Count == 0 && status == SelectionStatus.Optimal) status = SelectionStatus.Infeasible;
        points.Reverse();
        return (new TradeOffFront(points, status, capped, maxPoints), effort);
    }
}
