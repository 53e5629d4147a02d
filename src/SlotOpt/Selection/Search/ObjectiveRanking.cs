namespace SlotOpt.Selection.Search;

/// <summary>
/// The lexicographic ranking each objective stands for; candidate order breaks what ties remain.
/// The trade-off curve's chosen design is its lowest owning-cost point, found by the owning-cost ranking
/// (that design is on the front: owning cost grows with both cost and loss).
/// </summary>
internal static class ObjectiveRanking
{
    public static IReadOnlyList<Criterion> For(Objective objective) => objective switch
    {
        Objective.LowestOwningCost or Objective.TradeOffCurve => [Criterion.OwningCost, Criterion.Loss],
        Objective.LowestLossWithinBudget => [Criterion.Loss, Criterion.BuildCost],
        Objective.LowestCostWithinLossCap => [Criterion.BuildCost, Criterion.Loss],
        _ => throw new ArgumentOutOfRangeException(nameof(objective), objective, null),
    };
}
