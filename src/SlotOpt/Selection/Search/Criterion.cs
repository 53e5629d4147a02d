namespace SlotOpt.Selection.Search;

/// <summary>A quantity a search minimises, one level of a lexicographic ranking.</summary>
internal enum Criterion
{
    BuildCost,
    Loss,
    OwningCost,
    DistinctProcesses,
}
