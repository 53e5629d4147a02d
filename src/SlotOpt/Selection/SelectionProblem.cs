namespace SlotOpt.Selection;

/// <summary>
/// Pick one candidate per part. <paramref name="ValuePerWatt"/> capitalises loss: owning cost =
/// build cost + ValuePerWatt * loss, in currency per W.
/// </summary>
public sealed record SelectionProblem(
    IReadOnlyList<PartChoices> Parts,
    SharedLimits Limits,
    Objective Objective,
    double ValuePerWatt);
