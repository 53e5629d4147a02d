using System.Numerics;
using SlotOpt.Plates.Grid;

namespace SlotOpt.Plates.Thick;

/// <summary>
/// An AC source on a thick plate solved as a stack of thin layers (<see cref="LayeredReactionOperator"/>).
/// U holds u_l = psi_l / g per layer, stacked, g = sigma t / L the layer's sheet conductance. LossW is the
/// time average (g/2) sum_l Re(u_l^H A u_l); ResistanceLimitedLossW the same stack with no reaction field.
/// LayerError is the estimated relative error from the layer count: |P(L) - P(L/2)| / (3 P(L)) (the
/// layered sum is a midpoint rule in depth, error O(dz^2)); NaN when only one layer count was solved.
/// </summary>
public sealed record ThickPlateAcSolution(
    SheetModel Model, int Layers, Complex[] U, double LayerSheetConductanceS, double FrequencyHz,
    double LossW, double ResistanceLimitedLossW, double LayerError, int Iterations, double RelativeResidual)
{
    public double LossRatio => ResistanceLimitedLossW > 0 ? LossW / ResistanceLimitedLossW : 1;
}
