using SlotOpt.Plates.Grid;

namespace SlotOpt.Plates.Sources;

/// <summary>
/// An AC normal field known at any depth below the plate's top surface (the face toward the sources),
/// for the layered thick-plate solver: Integrate writes, per lattice node, the dual-cell integral of
/// dBz/dt = j omega B̂(x, y, -depth) (volts), real and imaginary parts. For a source above the plate
/// a field pattern of wavenumber k decays as e^{-|k| depth}; a uniform field does not decay.
/// In the sheet's plane (the thin-sheet solvers) it is the field at the top surface, depth 0.
/// </summary>
public interface IDepthAcFieldSource : IAcFieldSource
{
    void Integrate(CellLattice lattice, double depthM, double[] nodeRe, double[] nodeIm);

    void IAcFieldSource.Integrate(CellLattice lattice, double[] nodeRe, double[] nodeIm) => Integrate(lattice, 0, nodeRe, nodeIm);
}
