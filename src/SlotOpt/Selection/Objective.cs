namespace SlotOpt.Selection;

/// <summary>What the selection minimises; every objective also respects all shared limits.</summary>
public enum Objective
{
    /// <summary>Build cost plus capitalised loss; ties go to the lower loss, then candidate order.</summary>
    LowestOwningCost,

    /// <summary>Lowest total loss; needs a budget. Ties go to the lower build cost, then candidate order.</summary>
    LowestLossWithinBudget,

    /// <summary>Lowest build cost; needs a total loss cap. Ties go to the lower loss, then candidate order.</summary>
    LowestCostWithinLossCap,

    /// <summary>The whole discrete loss-against-cost front; the chosen design is its lowest owning-cost point.</summary>
    TradeOffCurve,
}
