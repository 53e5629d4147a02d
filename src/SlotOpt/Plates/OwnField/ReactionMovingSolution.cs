using SlotOpt.Plates.Grid;

namespace SlotOpt.Plates.OwnField;

/// <summary>
/// Steady state of a source moving along +x over a plate long in x, in the source's frame, with the
/// eddy currents' own field, for one conductor, at each travel offset. Per offset: LossW = G u^T A u,
/// DragN = P / v (steady state: the mechanical power all goes into heat), LiftN = -integral psi dBz/dz dA
/// on the source (positive = repulsion, away from the sheet), and the resistance-limited drag of the
/// same source (<see cref="ResistanceLimitedSolver.SolveMoving"/>'s model) for the ratio. U keeps u = psi / G of the last offset,
/// FirstU that of the first (the warm start for the same offsets at another speed or conductivity).
/// </summary>
public sealed record ReactionMovingSolution(
    SheetModel Model, double SheetConductanceS, double SpeedMPerS, double[] OffsetsXM,
    double[] LossW, double[] DragN, double[] LiftN, double[] ResistanceLimitedDragN,
    int[] Iterations, double MaxRelativeResidual, double[] U, double[] FirstU, IReadOnlyList<string> Notes)
{
    public double MeanDragN => DragN.Average();
    public double MeanLiftN => LiftN.Average();
    public double MeanLossW => LossW.Average();
    public double DragRatio => ResistanceLimitedDragN.Average() is var d && d > 0 ? MeanDragN / d : 1;
}
