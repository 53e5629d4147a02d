namespace SlotOpt.Selection;

/// <summary>
/// The candidates left for one part after its manufacturing rules. An empty list is allowed: the
/// selection then reports this part as the cause of infeasibility.
/// </summary>
public sealed record PartChoices(string PartName, IReadOnlyList<Candidate> Candidates)
{
    /// <summary>This part's own capitalisation rate (currency per W), replacing the problem's; null to use the problem's.</summary>
    public double? ValuePerWatt { get; init; }
}
