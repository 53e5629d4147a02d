using SlotOpt.Plates.Grid;
using SlotOpt.Plates.OwnField;

namespace SlotOpt.Plates.Sources;

/// <summary>
/// A field source moving along +x at SpeedMPerS over the plate, for the coupled (reaction-field)
/// solver. IntegrateRate writes, per lattice node, the dual-cell integral of dBz/dt = -v dBz/dx
/// (volts) with the source displaced by offsetXM (the same quantity <see cref="MovingPoles.Integrate"/>
/// gives). IntegrateNormalGradient writes, per stream-function unknown, the integral of dBz/dz of the
/// source at the sheet over the unknown's basis (T m = Wb/m), from which the lift follows:
/// the force on the sheet is F = integral psi grad(Bz) dA (a dipole layer psi z in the field), so the lift on
/// the source is -integral psi dBz/dz dA.
/// </summary>
public interface IMovingSheetSource
{
    double SpeedMPerS { get; }
    void IntegrateRate(CellLattice lattice, double offsetXM, double[] node);
    void IntegrateNormalGradient(ReactionOperator reaction, double offsetXM, double[] perUnknown);
}
