using SlotOpt.Plates.Grid;

namespace SlotOpt.Plates.Sources;

/// <summary>
/// An AC normal field known at any depth below the plate's top surface (the face toward the sources),
/// for the layered thick-plate solver: Integrate writes, per lattice node, the dual-cell integral of
/// dBz/dt = j omega B̂(x, y, -depth) (volts), real and imaginary parts. For a source above the plate
/// a field pattern of wavenumber k decays as e^{-|k| depth}; a uniform field does not decay.
/// </summary>
public interface IDepthAcFieldSource
{
    double FrequencyHz { get; }
    void Integrate(CellLattice lattice, double depthM, double[] nodeRe, double[] nodeIm);
}
