namespace SlotOpt.Design;

/// <summary>
/// One design option of one part, evaluated: what it is (in words and as attributes for the search),
/// what it costs to build, what it loses, and why it was rejected if it was.
/// </summary>
public sealed record EvaluatedOption(
    string PartName,
    string Id,
    DesignChoice Choice,
    string Description,
    IReadOnlyDictionary<string, string> Attributes,
    double BuildCost,
    LossBreakdown Loss,
    double? DragN,
    IReadOnlyList<string> Flags,
    RuleBreak? Rejection)
{
    public bool IsFeasible => Rejection is null;
}
