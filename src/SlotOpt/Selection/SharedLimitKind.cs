namespace SlotOpt.Selection;

/// <summary>The shared limits an infeasibility diagnosis relaxes one at a time.</summary>
public enum SharedLimitKind
{
    Budget,
    TotalLossCap,
    CoilGroup,
    MaxDistinctProcesses,
}
