namespace SlotOpt.Design;

/// <summary>Limits across the parts of one product.</summary>
public sealed record SharedLimits(
    double? Budget,
    double? TotalLossCapW,
    IReadOnlyList<IReadOnlyList<string>> CoilGroups,
    int? MaxDistinctProcesses)
{
    public static SharedLimits None => new(null, null, [], null);
}
