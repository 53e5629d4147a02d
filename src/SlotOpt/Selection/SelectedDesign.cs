namespace SlotOpt.Selection;

/// <summary>
/// One design: a candidate per part, in the problem's part order, with its totals in the exact
/// integer units of <see cref="IntegerScale"/> and, for reports, converted back.
/// </summary>
public sealed record SelectedDesign(
    IReadOnlyList<ChosenCandidate> Choices,
    long BuildCostCents,
    long LossMilliwatts,
    long OwningCostMicrocents,
    int DistinctProcesses)
{
    public double BuildCost => IntegerScale.CentsToMoney(BuildCostCents);

    public double LossW => IntegerScale.MilliwattsToWatts(LossMilliwatts);

    /// <summary>Build cost + capitalised loss, as the selection ranked it (rate to the cent per kW).</summary>
    public double OwningCost => IntegerScale.MicrocentsToMoney(OwningCostMicrocents);

    public IReadOnlyList<string> CandidateIds => Choices.Select(c => c.Candidate.Id).ToArray();
}
