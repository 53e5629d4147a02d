namespace SlotOpt.Selection.Search;

/// <summary>What one ranked search found: a candidate index per part when Status is Optimal or FeasibleAtLimit.</summary>
internal sealed record SearchResult(SelectionStatus Status, int[]? Choice, SolveEffort Effort)
{
    public bool HasDesign => Choice is not null;
}
