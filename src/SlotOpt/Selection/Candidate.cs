namespace SlotOpt.Selection;

/// <summary>
/// One evaluated design option of one part: build cost in the problem's currency, loss in W
/// (already including drag power F*v for moving parts), drag in N (null when no source moves).
/// Attributes the selection reads: "coil" (the value parts of one coil group must share, e.g. the
/// grade and gauge key) and "process" (counted against the distinct-process limit).
/// </summary>
public sealed record Candidate(
    string Id,
    double BuildCost,
    double LossW,
    double? DragN,
    IReadOnlyDictionary<string, string> Attributes)
{
    /// <summary>Attribute whose value all parts of a coil group must share.</summary>
    public const string CoilAttribute = "coil";

    /// <summary>Attribute naming the manufacturing process counted by <see cref="SharedLimits.MaxDistinctProcesses"/>.</summary>
    public const string ProcessAttribute = "process";
}
