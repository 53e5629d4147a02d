namespace SlotOpt.Design;

/// <summary>What the user wants out of the search.</summary>
public enum DesignGoal
{
    LowestOwningCost,
    LowestLossWithinBudget,
    LowestCostWithinLossCap,
    TradeOffCurve,
}
