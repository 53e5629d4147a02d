namespace SlotOpt.Selection.Search;

/// <summary>The integer totals of one design, the values every criterion and limit is judged on.</summary>
internal readonly record struct DesignTotals(long Cents, long Milliwatts, long OwningMicrocents, int DistinctProcesses)
{
    public long Value(Criterion criterion) => criterion switch
    {
        Criterion.BuildCost => Cents,
        Criterion.Loss => Milliwatts,
        Criterion.OwningCost => OwningMicrocents,
        Criterion.DistinctProcesses => DistinctProcesses,
        _ => throw new ArgumentOutOfRangeException(nameof(criterion), criterion, null),
    };
}
