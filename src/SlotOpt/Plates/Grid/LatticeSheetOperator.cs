using System.Buffers;
using System.Numerics;
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
/// unknown instead of about 64. <see cref="Multiply"/> and <see cref="Residual"/> borrow the lattice vector E x from the
/// shared array pool for the length of one product (none is kept per operator; after a thread's first product the pool hands
/// the same array back, so a solve loop allocates nothing) and write each row of E^T L E x straight into its unknown.
/// Vectors move between the unknowns' numbering and the lattice by <see cref="UnknownRuns"/> alone.
/// </summary>
public sealed class LatticeSheetOperator : ILinearOperator
{
    private readonly StencilLevel _fine;
    private readonly double[] _outsideWeight;
    private readonly int[] _mergedNodes, _mergedStart, _mergedUnknown;
    /// <summary>The merged regions' nodes in node order with the region of each, and each region's new direction (<see cref="NextDirectionAndMultiply"/>).</summary>
    private readonly int[] _mergedNodesInOrder, _regionInOrder;
    private readonly double[] _regionDirection;

    internal LatticeSheetOperator(StencilLevel fine, double[] outsideWeight, int unknowns, int[] nodeUnknown, int[] mergedNodes, int[] mergedStart, int[] mergedUnknown)
    {
        _fine = fine;
        _outsideWeight = outsideWeight;
        Rows = unknowns;
        _mergedNodes = mergedNodes;
        _mergedStart = mergedStart;
        _mergedUnknown = mergedUnknown;
        _regionDirection = new double[mergedUnknown.Length];
        _mergedNodesInOrder = (int[])mergedNodes.Clone();
        _regionInOrder = new int[mergedNodes.Length];
        for (int m = 0; m < mergedUnknown.Length; m++)
            for (int k = mergedStart[m]; k < mergedStart[m + 1]; k++) _regionInOrder[k] = m;
        Array.Sort(_mergedNodesInOrder, _regionInOrder);
        Runs = new UnknownRuns(nodeUnknown, mergedUnknown);
    }

    /// <summary>The unmerged unknowns' nodes as runs (the block copies between the unknowns' numbering and the lattice).</summary>
    internal UnknownRuns Runs { get; }

    public int Rows { get; }

    public long Bytes => 8L * (_outsideWeight.Length + _regionDirection.Length) + 4L * (_mergedNodesInOrder.Length + _regionInOrder.Length) + Runs.Bytes;

    /// <summary>y = A x in the unknowns' numbering: x copied to its nodes (E x), the rows of L formed at a run's nodes as
    /// <see cref="ProductOfRows"/> forms them and written into the run's unknowns, a merged region's rows summed in node order into its unknown (E^T).</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public void Multiply(ReadOnlySpan<double> x, Span<double> y)
    {
        if (y.Length < Rows) throw new ArgumentException($"the product needs {Rows} entries (got {y.Length})", nameof(y));   // the run loops store unchecked
        var xs = BorrowSpread(x);
        try
        {
            ref double d = ref MemoryMarshal.GetArrayDataReference(_outsideWeight);
            ref double w = ref MemoryMarshal.GetArrayDataReference(_fine.West);
            ref double s = ref MemoryMarshal.GetArrayDataReference(_fine.South);
            ref double xr = ref MemoryMarshal.GetArrayDataReference(xs);
            ref double yr = ref MemoryMarshal.GetReference(y);
            int o = _fine.Pad, nx = _fine.Nx, width = Vector<double>.Count;
            for (int run = 0; run < Runs.Count; run++)
            {
                Runs.Run(run, out int k, out int u, out int length);
                int end = k + length;
                for (; k + width <= end; k += width, u += width) RowsAt(ref d, ref w, ref s, ref xr, k, o + k, nx).StoreUnsafe(ref yr, (nuint)u);
                for (; k < end; k++, u++) Unsafe.Add(ref yr, u) = RowAt(ref d, ref w, ref s, ref xr, k, o + k, nx);
            }
            for (int m = 0; m < _mergedUnknown.Length; m++) y[_mergedUnknown[m]] = RegionRowSum(xs, m);
        }
        finally { ArrayPool<double>.Shared.Return(xs); }
    }

    /// <summary>r = b - A x (<see cref="Multiply"/>'s rows, each subtracted from b as it is formed).</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public void Residual(ReadOnlySpan<double> b, ReadOnlySpan<double> x, Span<double> r)
    {
        if (b.Length < Rows || r.Length < Rows) throw new ArgumentException($"the residual needs b and r of {Rows} entries (got {b.Length} and {r.Length})");   // the run loops read and store unchecked
        var xs = BorrowSpread(x);
        try
        {
            ref double d = ref MemoryMarshal.GetArrayDataReference(_outsideWeight);
            ref double w = ref MemoryMarshal.GetArrayDataReference(_fine.West);
            ref double s = ref MemoryMarshal.GetArrayDataReference(_fine.South);
            ref double xr = ref MemoryMarshal.GetArrayDataReference(xs);
            ref double br = ref MemoryMarshal.GetReference(b);
            ref double rr = ref MemoryMarshal.GetReference(r);
            int o = _fine.Pad, nx = _fine.Nx, width = Vector<double>.Count;
            for (int run = 0; run < Runs.Count; run++)
            {
                Runs.Run(run, out int k, out int u, out int length);
                int end = k + length;
                for (; k + width <= end; k += width, u += width)
                    (Vector.LoadUnsafe(ref br, (nuint)u) - RowsAt(ref d, ref w, ref s, ref xr, k, o + k, nx)).StoreUnsafe(ref rr, (nuint)u);
                for (; k < end; k++, u++) Unsafe.Add(ref rr, u) = Unsafe.Add(ref br, u) - RowAt(ref d, ref w, ref s, ref xr, k, o + k, nx);
            }
            for (int m = 0; m < _mergedUnknown.Length; m++) r[_mergedUnknown[m]] = b[_mergedUnknown[m]] - RegionRowSum(xs, m);
        }
        finally { ArrayPool<double>.Shared.Return(xs); }
    }

    /// <summary>E x on the padded lattice (x at every node of its unknown, 0 outside and on the pads) in a lattice vector borrowed from the
    /// shared array pool (at least the lattice's length; the caller returns it).</summary>
    private double[] BorrowSpread(ReadOnlySpan<double> x)
    {
        int o = _fine.Pad;
        var xs = ArrayPool<double>.Shared.Rent(_fine.Nodes + 2 * o);
        Runs.ToLattice(x, xs.AsSpan(0, _fine.Nodes + 2 * o), o);
        for (int m = 0; m < _mergedUnknown.Length; m++)
        {
            double v = x[_mergedUnknown[m]];
            for (int k = _mergedStart[m]; k < _mergedStart[m + 1]; k++) xs[o + _mergedNodes[k]] = v;
        }
        return xs;
    }

    /// <summary>Region m's row of E^T L E x (xs = E x on the padded lattice): its nodes' rows of L, each formed as <see cref="RowAt"/> forms it, summed in node order (its node list is in node order).</summary>
    private double RegionRowSum(double[] xs, int m)
    {
        ref double d = ref MemoryMarshal.GetArrayDataReference(_outsideWeight);
        ref double w = ref MemoryMarshal.GetArrayDataReference(_fine.West);
        ref double s = ref MemoryMarshal.GetArrayDataReference(_fine.South);
        ref double xr = ref MemoryMarshal.GetArrayDataReference(xs);
        int o = _fine.Pad, nx = _fine.Nx, first = _mergedNodes[_mergedStart[m]];
        double sum = RowAt(ref d, ref w, ref s, ref xr, first, o + first, nx);
        for (int k = _mergedStart[m] + 1; k < _mergedStart[m + 1]; k++) sum += RowAt(ref d, ref w, ref s, ref xr, _mergedNodes[k], o + _mergedNodes[k], nx);
        return sum;
    }

    /// <summary>
    /// q = A p with both on the padded lattice in <see cref="LatticeConjugateGradient"/>'s layout (a merged region's value at its first
    /// node, 0 at its other nodes and the outside); returns p . q, summed in the same pass. The operator and the unknowns' layout
    /// make the outside rows 0 (no coupling reaches an outside node, its weight to the outside is 0), so q is 0 there.
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    internal double MultiplyOnLattice(double[] p, double[] q)
    {
        for (int m = 0; m < _mergedUnknown.Length; m++)   // E p: the region's value at all its nodes
        {
            double v = p[_fine.Pad + _mergedNodes[_mergedStart[m]]];
            for (int k = _mergedStart[m] + 1; k < _mergedStart[m + 1]; k++) p[_fine.Pad + _mergedNodes[k]] = v;
        }
        double dot = ProductOfRows(p, q, 0, _fine.Ny);
        FoldRegions(p, q);
        return dot;
    }

    /// <summary>
    /// The conjugate gradients' next direction p = z + beta p fused with q = A p (layout as <see cref="MultiplyOnLattice"/>, z the
    /// preconditioned residual in single precision): p is updated one row ahead of the product, which reads the rows on either side,
    /// so each row of p is read and written once while in cache. A merged region's new value (from its first node) is set at all its
    /// nodes as the update reaches them (E p). Returns p . q.
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    internal double NextDirectionAndMultiply(double[] p, float[] z, double beta, double[] q)
    {
        int o = _fine.Pad, nx = _fine.Nx, ny = _fine.Ny;
        for (int m = 0; m < _mergedUnknown.Length; m++)
        {
            int first = o + _mergedNodes[_mergedStart[m]];
            _regionDirection[m] = z[first] + beta * p[first];
        }
        int next = 0;   // the next merged node, in node order
        NextDirectionRow(p, z, beta, 0, ref next);
        double dot = 0;
        for (int j = 0; j < ny; j++)
        {
            if (j + 1 < ny) NextDirectionRow(p, z, beta, j + 1, ref next);
            dot += ProductOfRows(p, q, j, j + 1);
        }
        FoldRegions(p, q);
        return dot;
    }

    /// <summary>p = z + beta p on lattice row j (Vector&lt;double&gt;.Count nodes at a time, each as the scalar update rounds it), then the merged regions' nodes of that row set to their region's new value.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private void NextDirectionRow(double[] p, float[] z, double beta, int j, ref int next)
    {
        int nx = _fine.Nx, o = _fine.Pad, width = Vector<float>.Count;
        ref double pr = ref MemoryMarshal.GetArrayDataReference(p);
        ref float zr = ref MemoryMarshal.GetArrayDataReference(z);
        int i = o + j * nx, end = i + nx;
        for (; i + width <= end; i += width)
        {
            var single = Vector.LoadUnsafe(ref zr, (nuint)i);
            (Vector.WidenLower(single) + beta * Vector.LoadUnsafe(ref pr, (nuint)i)).StoreUnsafe(ref pr, (nuint)i);
            int upper = i + Vector<double>.Count;
            (Vector.WidenUpper(single) + beta * Vector.LoadUnsafe(ref pr, (nuint)upper)).StoreUnsafe(ref pr, (nuint)upper);
        }
        for (; i < end; i++) Unsafe.Add(ref pr, i) = Unsafe.Add(ref zr, i) + beta * Unsafe.Add(ref pr, i);
        int rowEnd = (j + 1) * nx;
        for (; next < _mergedNodesInOrder.Length && _mergedNodesInOrder[next] < rowEnd; next++)
            p[o + _mergedNodesInOrder[next]] = _regionDirection[_regionInOrder[next]];
    }

    /// <summary>
    /// q = L p on lattice rows [fromRow, toRow) (p spread over merged regions: E p); returns the rows' share of p . q. The rows of L
    /// are formed Vector&lt;double&gt;.Count nodes at a time, each rounded as the scalar expression rounds it; p . q is summed node by
    /// node in order (the same number as a plain loop gives).
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private double ProductOfRows(double[] p, double[] q, int fromRow, int toRow)
    {
        var f = _fine;
        int o = f.Pad, nx = f.Nx, width = Vector<double>.Count;
        ref double d = ref MemoryMarshal.GetArrayDataReference(_outsideWeight);
        ref double w = ref MemoryMarshal.GetArrayDataReference(f.West);
        ref double s = ref MemoryMarshal.GetArrayDataReference(f.South);
        ref double xr = ref MemoryMarshal.GetArrayDataReference(p);
        ref double yr = ref MemoryMarshal.GetArrayDataReference(q);
        Span<double> chunk = stackalloc double[width];
        ref double products = ref MemoryMarshal.GetReference(chunk);
        double dot = 0;   // (E p) . (L E p) = p . (E^T L E p)
        int k = fromRow * nx, end = toRow * nx;
        for (; k + width <= end; k += width)
        {
            int i = o + k;
            var y = RowsAt(ref d, ref w, ref s, ref xr, k, i, nx);
            y.StoreUnsafe(ref yr, (nuint)i);
            (Vector.LoadUnsafe(ref xr, (nuint)i) * y).StoreUnsafe(ref products);
            for (int m = 0; m < width; m++) dot += Unsafe.Add(ref products, m);
        }
        for (; k < end; k++)
        {
            int i = o + k;
            double y = RowAt(ref d, ref w, ref s, ref xr, k, i, nx);
            Unsafe.Add(ref yr, i) = y;
            dot += Unsafe.Add(ref xr, i) * y;
        }
        return dot;
    }

    /// <summary>Rows k .. k + Vector&lt;double&gt;.Count - 1 of L x (x on the padded lattice, node k at i), each rounded as <see cref="RowAt"/> rounds it.</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static Vector<double> RowsAt(ref double d, ref double w, ref double s, ref double xr, int k, int i, int nx)
    {
        var v = Load(ref xr, i);
        return Load(ref d, k) * v
            - Load(ref w, k) * (v - Load(ref xr, i - 1)) - Load(ref w, k + 1) * (v - Load(ref xr, i + 1))
            - Load(ref s, k) * (v - Load(ref xr, i - nx)) - Load(ref s, k + nx) * (v - Load(ref xr, i + nx));

        // Vector<double>.Count doubles from index i
        static Vector<double> Load(ref double a, int i) => Vector.LoadUnsafe(ref a, (nuint)i);
    }

    /// <summary>Row k of L x (x on the padded lattice, node k at i): d_k x_k + sum over the 4 neighbours of w (x_k - x_neighbour), the stored couplings being the matrix entries -w.</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static double RowAt(ref double d, ref double w, ref double s, ref double xr, int k, int i, int nx)
    {
        double v = Unsafe.Add(ref xr, i);
        return Unsafe.Add(ref d, k) * v
            - Unsafe.Add(ref w, k) * (v - Unsafe.Add(ref xr, i - 1)) - Unsafe.Add(ref w, k + 1) * (v - Unsafe.Add(ref xr, i + 1))
            - Unsafe.Add(ref s, k) * (v - Unsafe.Add(ref xr, i - nx)) - Unsafe.Add(ref s, k + nx) * (v - Unsafe.Add(ref xr, i + nx));
    }

    /// <summary>E^T: each merged region's rows summed at its first node; p back to its layout (0 at the region's other nodes).</summary>
    private void FoldRegions(double[] p, double[] q)
    {
        int o = _fine.Pad;
        for (int m = 0; m < _mergedUnknown.Length; m++)
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
    }

    /// <summary>Unknowns times <paramref name="scale"/> to <see cref="MultiplyOnLattice"/>'s layout on the padded lattice (the runs' block copies; a merged
    /// region's value at its first node; 0 at the region's other nodes, the outside and the pads).</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    internal void ToLattice(ReadOnlySpan<double> v, double[] lattice, double scale)
    {
        int o = _fine.Pad;
        Runs.ToLattice(v, lattice, o, scale);
        for (int m = 0; m < _mergedUnknown.Length; m++) lattice[o + _mergedNodes[_mergedStart[m]]] = scale * v[_mergedUnknown[m]];
    }

    /// <summary>Back from <see cref="MultiplyOnLattice"/>'s layout to unknowns, times <paramref name="scale"/> (the runs' block copies; a merged region's value from its first node).</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    internal void FromLattice(double[] lattice, Span<double> v, double scale)
    {
        int o = _fine.Pad;
        Runs.FromLattice(lattice, o, scale, v);
        for (int m = 0; m < _mergedUnknown.Length; m++) v[_mergedUnknown[m]] = scale * lattice[o + _mergedNodes[_mergedStart[m]]];
    }
}
