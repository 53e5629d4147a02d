using SlotOpt.Numerics;

namespace SlotOpt.Plates.Grid;

/// <summary>
/// One level of the multigrid hierarchy: its operator, the node lattice its unknowns live on
/// (with merged regions carried down from the finer level), the prolongation from the next
/// coarser level and its transpose, and work vectors.
/// </summary>
internal sealed class MultigridLevel
{
    public required CsrMatrix A { get; init; }
    public required int NodesX { get; init; }
    public required int NodesY { get; init; }
    /// <summary>Unknown of each lattice node, -1 where psi is fixed at 0 (the outside).</summary>
    public required int[] NodeUnknown { get; init; }
    public required bool[] IsMerged { get; init; }
    /// <summary>Prolongation from the next coarser level (null on the coarsest) and restriction R = P^T.</summary>
    public CsrMatrix? P { get; set; }
    public CsrMatrix? R { get; set; }
    public double[] X { get; set; } = Array.Empty<double>();
    public double[] B { get; set; } = Array.Empty<double>();
    public double[] Work { get; set; } = Array.Empty<double>();

    public int Unknowns => A.Rows;

    public long Bytes => A.Bytes + (P?.Bytes ?? 0) + (R?.Bytes ?? 0) + 8L * (X.Length + B.Length + Work.Length);
}
