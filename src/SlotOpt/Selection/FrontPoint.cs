namespace SlotOpt.Selection;

/// <summary>
/// One point of the trade-off front: the lowest loss at its build cost or below, and of the designs
/// with that loss the cheapest (ties then by candidate order).
/// </summary>
public sealed record FrontPoint(SelectedDesign Design, SelectionStatus Status)
{
    public long BuildCostCents => Design.BuildCostCents;
    public long LossMilliwatts => Design.LossMilliwatts;
    public double BuildCost => Design.BuildCost;
    public double LossW => Design.LossW;
    public IReadOnlyList<string> CandidateIds => Design.CandidateIds;
}
