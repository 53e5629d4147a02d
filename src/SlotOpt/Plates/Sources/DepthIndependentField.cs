using SlotOpt.Plates.Grid;

namespace SlotOpt.Plates.Sources;

/// <summary>A plane field used unchanged at every depth: exact for a uniform field (<see cref="UniformAcField"/>), an approximation otherwise.</summary>
public sealed record DepthIndependentField(IAcFieldSource Field) : IDepthAcFieldSource
{
    public double FrequencyHz => Field.FrequencyHz;
    public void Integrate(CellLattice lattice, double depthM, double[] nodeRe, double[] nodeIm) => Field.Integrate(lattice, nodeRe, nodeIm);
}
