namespace SlotOpt.Design;

/// <summary>
/// One design option of one part, evaluated: what it is (in words and as attributes for the search),
/// what it costs to build, what it loses, why it was rejected if it was, and (plates with [parts.thermal]) how hot it runs.
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
    RuleBreak? Rejection,
    OptionTemperature? Temperature = null)
{
    public bool IsFeasible => Rejection is null;
}
