namespace SlotOpt.Selection;

/// <summary>
/// The answer of a selection run. Read <see cref="Design"/> only as far as <see cref="Status"/> allows:
/// Optimal is proven, FeasibleAtLimit is a best-found design; Infeasible comes with a
/// <see cref="Diagnosis"/>; LimitReachedWithoutDesign has neither design nor diagnosis.
/// </summary>
/// <param name="Design">The chosen design (for the trade-off curve, its lowest owning-cost point); null without one.</param>
/// <param name="Front">The trade-off front, for <see cref="Objective.TradeOffCurve"/> or when asked for; null otherwise.</param>
/// <param name="CentsPerKilowatt">The capitalisation rate as ranked, in whole cents per kW (see <see cref="IntegerScale"/>).</param>
/// <param name="Effort">Solver calls and times summed over the run, diagnosis included.</param>
public sealed record SelectionOutcome(
    Objective Objective,
    SelectionStatus Status,
    SelectedDesign? Design,
    TradeOffFront? Front,
    InfeasibilityDiagnosis? Diagnosis,
    long CentsPerKilowatt,
    SolveEffort Effort);
