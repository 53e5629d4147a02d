using System.Runtime.CompilerServices;
using System.Runtime.InteropServices;
using SlotOpt.Numerics;

namespace SlotOpt.Plates.Grid;

/// <summary>
/// The sheet operator A of <see cref="SheetOperator"/> applied on the node lattice instead of from a
/// stored matrix: A = E^T L E, E copying each unknown to its nodes (outside nodes 0), L the lattice's
/// edge network in the finest multigrid level's stencil, applied edge by edge,
/// (L x)_p = d_p x_p + sum over the 4 neighbours q of w_pq (x_p - x_q), d_p the weight of p's edges to
/// the outside. An edge inside a merged region joins two copies of the same value, so it adds exactly
/// 0 however strongly the multigrid glues it; E^T sums a region's node rows into its Faraday-law row.
/// Same matrix as the CSR assembly (each row summed in another order), without storing it: 16 bytes an
/// unknown instead of about 64 (and a lattice vector of its own once <see cref="Multiply"/> is first called).
/// </summary>
public sealed class LatticeSheetOperator : ILinearOperator
{
    private readonly StencilLevel _fine;
    private readonly double[] _outsideWeight;
    private readonly int[] _nodeUnknown;
    private readonly int[] _mergedNodes, _mergedStart, _mergedUnknown;

    internal LatticeSheetOperator(StencilLevel fine, double[] outsideWeight, int unknowns, int[] nodeUnknown, int[] mergedNodes, int[] mergedStart, int[] mergedUnknown)
    {
        _fine = fine;
        _outsideWeight = outsideWeight;
        Rows = unknowns;
        _nodeUnknown = nodeUnknown;
        _mergedNodes = mergedNodes;
        _mergedStart = mergedStart;
        _mergedUnknown = mergedUnknown;
    }

    /// <summary><see cref="Multiply"/>'s x on the padded lattice, allocated on its first call (the lattice conjugate gradients never make one).</summary>
    private double[]? _latticeX;

    public int Rows { get; }

    public long Bytes => 8L * (_outsideWeight.Length + (_latticeX?.Length ?? 0));

    /// <summary>y = A x in the unknowns' numbering: x copied to its nodes, each node's row of L added to its unknown's entry of y (E^T).</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public void Multiply(ReadOnlySpan<double> x, Span<double> y)
    {
        var f = _fine;
        var map = _nodeUnknown;
        int o = f.Pad, nx = f.Nx, n = f.Nodes;
        var xs = _latticeX ??= new double[n + 2 * o];
        for (int p = 0; p < n; p++) { int u = map[p]; xs[o + p] = u >= 0 ? x[u] : 0; }
        y.Clear();
        ref double d = ref MemoryMarshal.GetArrayDataReference(_outsideWeight);
        ref double w = ref MemoryMarshal.GetArrayDataReference(f.West);
        ref double s = ref MemoryMarshal.GetArrayDataReference(f.South);
        ref double xr = ref MemoryMarshal.GetArrayDataReference(xs);
        ref int mr = ref MemoryMarshal.GetArrayDataReference(map);
        for (int p = 0; p < n; p++)
        {
            int u = Unsafe.Add(ref mr, p);
            if (u < 0) continue;
            int q = o + p;
            double v = Unsafe.Add(ref xr, q);
            // stored couplings are the matrix entries -w; a merged region's rows summed in node order
            y[u] += Unsafe.Add(ref d, p) * v
                - Unsafe.Add(ref w, p) * (v - Unsafe.Add(ref xr, q - 1)) - Unsafe.Add(ref w, p + 1) * (v - Unsafe.Add(ref xr, q + 1))
                - Unsafe.Add(ref s, p) * (v - Unsafe.Add(ref xr, q - nx)) - Unsafe.Add(ref s, p + nx) * (v - Unsafe.Add(ref xr, q + nx));
        }
    }

    /// <summary>
    /// q = A p with both on the padded lattice in <see cref="LatticeConjugateGradient"/>'s layout (a merged region's value at its first
    /// node, 0 at its other nodes and the outside); returns p . q, summed in the same pass. The operator and the unknowns' layout
    /// make the outside rows 0 (no coupling reaches an outside node, its weight to the outside is 0), so q is 0 there.
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    internal double MultiplyOnLattice(double[] p, double[] q)
    {
        var f = _fine;
        int o = f.Pad, nx = f.Nx, n = f.Nodes;
        for (int m = 0; m < _mergedUnknown.Length; m++)   // E p: the region's value at all its nodes
        {
            double v = p[o + _mergedNodes[_mergedStart[m]]];
            for (int k = _mergedStart[m] + 1; k < _mergedStart[m + 1]; k++) p[o + _mergedNodes[k]] = v;
        }
        ref double d = ref MemoryMarshal.GetArrayDataReference(_outsideWeight);
        ref double w = ref MemoryMarshal.GetArrayDataReference(f.West);
        ref double s = ref MemoryMarshal.GetArrayDataReference(f.South);
        ref double xr = ref MemoryMarshal.GetArrayDataReference(p);
        ref double yr = ref MemoryMarshal.GetArrayDataReference(q);
        double dot = 0;   // (E p) . (L E p) = p . (E^T L E p)
        for (int k = 0; k < n; k++)
        {
            int i = o + k;
            double v = Unsafe.Add(ref xr, i);
            double y = Unsafe.Add(ref d, k) * v
                - Unsafe.Add(ref w, k) * (v - Unsafe.Add(ref xr, i - 1)) - Unsafe.Add(ref w, k + 1) * (v - Unsafe.Add(ref xr, i + 1))
                - Unsafe.Add(ref s, k) * (v - Unsafe.Add(ref xr, i - nx)) - Unsafe.Add(ref s, k + nx) * (v - Unsafe.Add(ref xr, i + nx));
            Unsafe.Add(ref yr, i) = y;
            dot += v * y;
        }
        for (int m = 0; m < _mergedUnknown.Length; m++)   // E^T: the region's rows summed at its first node; p back to its layout
        {
            int first = o + _mergedNodes[_mergedStart[m]];
            double sum = q[first];
            for (int k = _mergedStart[m] + 1; k < _mergedStart[m + 1]; k++)
            {
                int i = o + _mergedNodes[k];
                sum += q[i];
                q[i] = 0;
                p[i] = 0;
            }
            q[first] = sum;
        }
        return dot;
    }

    /// <summary>Unknowns times <paramref name="scale"/> to <see cref="MultiplyOnLattice"/>'s layout on the padded lattice.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    internal void ToLattice(ReadOnlySpan<double> v, double[] lattice, double scale)
    {
        var map = _nodeUnknown;
        int o = _fine.Pad;
        Array.Clear(lattice);
        for (int p = 0; p < map.Length; p++) { int u = map[p]; if (u >= 0) lattice[o + p] = scale * v[u]; }
        for (int m = 0; m < _mergedUnknown.Length; m++)
            for (int k = _mergedStart[m] + 1; k < _mergedStart[m + 1]; k++) lattice[o + _mergedNodes[k]] = 0;
    }

    /// <summary>Back from <see cref="MultiplyOnLattice"/>'s layout to unknowns, times <paramref name="scale"/>.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    internal void FromLattice(double[] lattice, Span<double> v, double scale)
    {
        var map = _nodeUnknown;
        int o = _fine.Pad;
        for (int p = 0; p < map.Length; p++) { int u = map[p]; if (u >= 0) v[u] = scale * lattice[o + p]; }
        for (int m = 0; m < _mergedUnknown.Length; m++) v[_mergedUnknown[m]] = scale * lattice[o + _mergedNodes[_mergedStart[m]]];
    }

    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public void Residual(ReadOnlySpan<double> b, ReadOnlySpan<double> x, Span<double> r)
    {
        Multiply(x, r);
        for (int i = 0; i < r.Length; i++) r[i] = b[i] - r[i];
    }
}
