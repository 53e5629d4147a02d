using System.Numerics;
using SlotOpt.Plates.Grid;

namespace SlotOpt.Plates.OwnField;

/// <summary>
/// An AC source solved with the eddy currents' own field, for one conductor (the coupled problem
/// no longer scales with G = sigma t: each conductor is its own solve). U is psi / G per unknown
/// (complex amplitude, e^{j omega t}); psi = G U. LossW is the time average
/// P = (G / 2) Re(U^H A U) = (1/2) sum |K|^2 / G; ResistanceLimitedLossW is the same source with the
/// reaction field left out (the model of <see cref="ResistanceLimitedSolver.SolveAc"/>), so LossRatio says how much
/// the plate's own field screens it.
/// </summary>
public sealed record ReactionAcSolution(
    SheetModel Model, Complex[] U, double SheetConductanceS, double FrequencyHz,
    double LossW, double ResistanceLimitedLossW, int Iterations, double RelativeResidual, IReadOnlyList<string> Notes)
{
    public double LossRatio => ResistanceLimitedLossW > 0 ? LossW / ResistanceLimitedLossW : 1;
}
