using SlotOpt.Plates.Grid;

namespace SlotOpt.Plates.Sources;

/// <summary>
/// A normal field varying as Re(B̂(x, y) e^{j omega t}), known in the sheet's plane. Integrate writes,
/// for every lattice node, the integral of the complex amplitude of dBz/dt = j omega B̂ over the node's
/// dual cell [x - hx/2, x + hx/2] x [y - hy/2, y + hy/2] (volts), real and imaginary parts.
/// A source that also knows its field below the surface is an <see cref="IDepthAcFieldSource"/>.
/// </summary>
public interface IAcFieldSource
{
    double FrequencyHz { get; }
    void Integrate(CellLattice lattice, double[] nodeRe, double[] nodeIm);
}
