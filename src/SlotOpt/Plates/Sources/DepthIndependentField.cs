using SlotOpt.Plates.Grid;

namespace SlotOpt.Plates.Sources;

/// <summary>
/// A field known only in the sheet's plane (e.g. a <see cref="FieldMap"/>) used unchanged at every depth,
/// so the thick-plate solver can take it: it leaves out the field's decay with depth.
/// </summary>
public sealed record DepthIndependentField(IAcFieldSource Field) : IDepthAcFieldSource
{
    public double FrequencyHz => Field.FrequencyHz;
    public void Integrate(CellLattice lattice, double depthM, double[] nodeRe, double[] nodeIm) => Field.Integrate(lattice, nodeRe, nodeIm);
}
