namespace SlotOpt.Selection;

/// <summary>
/// The problem solved again with one shared limit dropped and every other limit kept.
/// </summary>
/// <param name="CoilGroupIndex">Zero-based place of the group in <see cref="SharedLimits.CoilGroups"/>; null for other kinds.</param>
/// <param name="Description">The limit in words, e.g. "budget 1200.00" or "coil group 1 (core, yoke)".</param>
/// <param name="StatusWithoutLimit">Status of the relaxed search.</param>
/// <param name="NearestDesign">The design the relaxed search found: for the budget the cheapest design
/// (its cost is the least budget that would do), for the loss cap the lowest-loss design (the least cap
/// that would do), for the process limit the design with the fewest distinct processes (the least limit
/// that would do), for a coil group the best design by the problem's own objective.</param>
public sealed record LimitRelaxation(
    SharedLimitKind Kind,
    int? CoilGroupIndex,
    string Description,
    SelectionStatus StatusWithoutLimit,
    SelectedDesign? NearestDesign)
{
    /// <summary>Dropping this limit alone makes the problem feasible: it is a binding limit.</summary>
    public bool RestoresFeasibility => NearestDesign is not null;
}
