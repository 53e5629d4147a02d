using SlotOpt.Plates.Grid;

namespace SlotOpt.Plates.Sources;

/// <summary>
/// A field source moving along +x at SpeedMPerS over a stationary plate, for every solver.
/// IntegrateRate writes, per lattice node, the dual-cell (or bilinear-hat) integral of dBz/dt = -v dBz/dx (volts) with
/// the source displaced by offsetXM (a field pattern translating at v: Faraday's law in the plate's frame). IntegrateLiftField writes,
/// per lattice node, what the source knows of its normal field at the sheet, for the lift
/// (the force on the sheet is F = integral psi grad(Bz) dA, a dipole layer psi z in the field, so the
/// lift on the source is -integral psi dBz/dz dA), and says which of the two it wrote
/// (<see cref="LiftField"/>).
/// </summary>
public interface IMovingSheetSource
{
    double SpeedMPerS { get; }
    void IntegrateRate(CellLattice lattice, double offsetXM, double[] node);
    LiftField IntegrateLiftField(CellLattice lattice, double offsetXM, double[] node);
    /// <summary>
    /// Loss (W per S of reference conductance) the grid misses at sharp source edges, added to psi^T A psi; 0 for a smooth source.
    /// perCell, when given, receives each cell's share (for the loss map).
    /// </summary>
    double SubCellEdgeLossPerSiemens(PlateGrid grid, double offsetXM, double[]? perCell = null) => 0;
}

/// <summary>What <see cref="IMovingSheetSource.IntegrateLiftField"/> wrote per lattice node.</summary>
public enum LiftField
{
    /// <summary>The dual-cell integral of dBz/dz at the sheet (T m^2 per metre = Wb/m).</summary>
    NormalGradient,
    /// <summary>
    /// The dual-cell mean of Bz in the sheet's plane (T), for a source whose field is given only there and
    /// lies above the sheet: the coupled solver derives dBz/dz = |k| Bz from it (Bz(k, z) = Bz(k, 0) e^{|k| z} below the sources).
    /// </summary>
    PlaneField,
}
