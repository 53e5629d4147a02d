namespace SlotOpt.Selection;

/// <summary>How far a search got. Only <see cref="Optimal"/> is a proven answer.</summary>
public enum SelectionStatus
{
    /// <summary>Proven best under every criterion of the ranking, ties broken as documented.</summary>
    Optimal,

    /// <summary>The deterministic-time budget ran out: the design meets every limit but is not proven best.</summary>
    FeasibleAtLimit,

    /// <summary>Proven: no design meets every limit.</summary>
    Infeasible,

    /// <summary>The deterministic-time budget ran out before any design meeting every limit was found.</summary>
    LimitReachedWithoutDesign,
}
