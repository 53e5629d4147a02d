using SlotOpt.Plates.ResistanceLimited;

namespace SlotOpt.Plates;

/// <summary>
/// Loss, drag and lift for one geometry, conductor and source from the model
/// <see cref="ReactionModelChoice"/> picked (Choice says which and why). AC: one entry, DragN and
/// LiftN null. Moving: one entry per travel offset; lift positive = repulsion of the source.
/// ResistanceLimitedLossW is the low-speed/low-frequency answer of the same case, for comparison.
/// In the resistance-limited model the lift is the leading-order estimate F_L = F_D v / w
/// (thin-sheet lift/drag = v/w for any source shape, W. M. Saslow, Am. J. Phys. 60(8):693-711, 1992; J. R. Reitz, J. Appl. Phys. 41:2067, 1970).
/// Iterations counts the linear-solver iterations of the model that ran and RelativeResidual is its final
/// true relative residual (the worst over the offsets; resistance-limited moving: that of the offset with the largest loss). ResistanceLimited is that
/// model's unit-conductance solution (AC; moving: the offset with the largest loss) when it ran, for the
/// current-density map; null otherwise.
/// </summary>
public sealed record PlateSolution(
    ModelChoice Choice, double[] OffsetsXM, double[] LossW, double[]? DragN, double[]? LiftN, double[] ResistanceLimitedLossW,
    IReadOnlyList<string> Notes, int Iterations, double RelativeResidual, UnitConductanceSolution? ResistanceLimited)
{
    /// <summary>The grid-error estimate of MeanLossW (and of the mean drag, which scales with it), when one was asked for (<see cref="PlateModels.WithGridError"/>).</summary>
    public DiscretisationError? GridError { get; init; }

    public double MeanLossW => LossW.Average();
    public double? MeanDragN => DragN?.Average();
    public double? MeanLiftN => LiftN?.Average();
}
