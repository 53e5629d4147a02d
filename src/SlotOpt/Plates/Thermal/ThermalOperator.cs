using System.Runtime.CompilerServices;
using System.Runtime.InteropServices;
using System.Runtime.Intrinsics;

namespace SlotOpt.Plates.Thermal;

/// <summary>
/// The matrix of a <see cref="ThermalNetwork"/> on the node lattice itself: vectors hold one value per lattice node, node p at
/// <see cref="Pad"/> + p of an array of <see cref="LatticeLength"/> (zeros round it), so no product gathers or scatters through the
/// node-to-unknown map. Row p of a node with an unknown is d_p x_p - k t (w_p x_(p-1) + w_(p+1) x_(p+1) + s_p x_(p-NodesX)
/// + s_(p+NodesX) x_(p+NodesX)), the network's unit conduction stencil (w, s) and a diagonal d (conduction plus 2 h A) that the
/// solver sets for each step of its iteration: the conduction stays, only the surface term moves with h and the radiation's
/// linearisation. A node without an unknown (no metal, or held at ambient) is an identity row with no links (d = 1), so a right-hand
/// side that is 0 there keeps the solution 0 there, and the lattice system is the network's system with those rows added.
/// On the unknowns, the same products as <see cref="ThermalNetwork.Matrix"/> summed in the same order (down, left, diagonal, right, up).
/// </summary>
public sealed class ThermalOperator
{
    private readonly ThermalNetwork _network;

    [MethodImpl(MethodImplOptions.AggressiveOptimization)]   // a few calls a run, each with long loops: optimised from the first
    public ThermalOperator(ThermalNetwork network)
    {
        _network = network;
        Pad = network.Lattice.NodesX + 1;
        LatticeLength = network.Lattice.NodeCount + 2 * Pad;
        DiagonalWPerK = new double[network.Lattice.NodeCount];
        for (int n = 0; n < DiagonalWPerK.Length; n++) if (network.NodeUnknown[n] < 0) DiagonalWPerK[n] = 1;
    }

    public ThermalNetwork Network => _network;

    /// <summary>Zeros before node 0 and after the last node (NodesX + 1): every neighbour of a node may be read.</summary>
    public int Pad { get; }

    /// <summary>Length of a vector on the padded lattice.</summary>
    public int LatticeLength { get; }

    /// <summary>The diagonal by node (W/K): conduction plus 2 h A where the node has an unknown (<see cref="ThermalNetwork.DiagonalAt"/>), 1 elsewhere.</summary>
    public double[] DiagonalWPerK { get; }

    /// <summary>Sets the diagonal for surface coefficients h by unknown (W/m^2K).</summary>
    public void SetSurfaceCoefficients(double[] surfaceCoefficientWPerM2K)
    {
        var map = _network.NodeUnknown;
        for (int n = 0; n < map.Length; n++) if (map[n] >= 0) DiagonalWPerK[n] = _network.DiagonalAt(n, surfaceCoefficientWPerM2K[map[n]]);
    }

    /// <summary>y = A x on the padded lattice; returns x . y (conjugate gradients' p . A p, in the same pass).</summary>
    public double Multiply(double[] x, double[] y) => Apply(default, x, y, residual: false).Dot;

    /// <summary>r = b - A x on the padded lattice; returns r . r and max |r| (the multigrid's scaling of r).</summary>
    public (double Squared, double Largest) Residual(double[] b, double[] x, double[] r) => Apply(b, x, r, residual: true);

    /// <summary>Conjugate gradients' next direction and its product in one pass: p = z + beta p, q = A p, with z = zScale times the
    /// multigrid's single-precision output (<see cref="StructuredMultigrid.ApplyOnLattice"/>, same layout); returns p . q. The pass updates
    /// p a row ahead of the product, so every neighbour is new when it is read.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public double MultiplyNextDirection(float[] z, double zScale, double beta, double[] p, double[] q)
    {
        int nx = _network.Lattice.NodesX, pad = Pad, n = DiagonalWPerK.Length;
        if (z.Length != LatticeLength) throw new ArgumentException("one value per node of the padded lattice", nameof(z));
        Check(p); Check(q);
        for (int i = pad; i < pad + Math.Min(nx, n); i++) p[i] = z[i] * zScale + beta * p[i];
        ref double w = ref MemoryMarshal.GetArrayDataReference(_network.UnitWest);
        ref double s = ref MemoryMarshal.GetArrayDataReference(_network.UnitSouth);
        ref double d = ref MemoryMarshal.GetArrayDataReference(DiagonalWPerK);
        ref double v = ref MemoryMarshal.GetArrayDataReference(p);
        ref float zr = ref MemoryMarshal.GetArrayDataReference(z);
        ref double y = ref MemoryMarshal.GetArrayDataReference(q);
        double kt = _network.ConductanceScaleWPerK;
        var rows = new RowBlock(ref w, ref s, ref d, ref v, -kt, nx);
        var sums = Vector256<double>.Zero;
        int ahead = n - nx;   // nodes whose row above is still to be updated
        int k = 0;
        if (nx >= Vector256<double>.Count)   // four rows at a time read v up to i + 4, updated a row earlier
        {
            var scale = Vector256.Create(zScale);
            var step = Vector256.Create(beta);
            for (; k + Vector256<double>.Count <= ahead; k += Vector256<double>.Count)
            {
                int i = pad + k, a = i + nx;
                var z4 = Vector256.WidenLower(Vector256.Create(Vector128.LoadUnsafe(ref zr, (nuint)a), Vector128<float>.Zero));
                (z4 * scale + step * Vector256.LoadUnsafe(ref v, (nuint)a)).StoreUnsafe(ref v, (nuint)a);
                var value = rows.At(k, i);
                value.StoreUnsafe(ref y, (nuint)i);
                sums += Vector256.LoadUnsafe(ref v, (nuint)i) * value;
            }
        }
        double total = 0;
        for (; k < ahead; k++)
        {
            int i = pad + k, a = i + nx;
            Unsafe.Add(ref v, a) = Unsafe.Add(ref zr, a) * zScale + beta * Unsafe.Add(ref v, a);
            double value = Row(ref w, ref s, ref d, ref v, kt, nx, k, i);
            Unsafe.Add(ref y, i) = value;
            total += Unsafe.Add(ref v, i) * value;
        }
        for (; k + Vector256<double>.Count <= n && nx >= Vector256<double>.Count; k += Vector256<double>.Count)
        {
            int i = pad + k;
            var value = rows.At(k, i);
            value.StoreUnsafe(ref y, (nuint)i);
            sums += Vector256.LoadUnsafe(ref v, (nuint)i) * value;
        }
        for (; k < n; k++)
        {
            int i = pad + k;
            double value = Row(ref w, ref s, ref d, ref v, kt, nx, k, i);
            Unsafe.Add(ref y, i) = value;
            total += Unsafe.Add(ref v, i) * value;
        }
        return Vector256.Sum(sums) + total;
    }

    private void Check(double[] v)
    {
        if (v.Length != LatticeLength) throw new ArgumentException("one value per node of the padded lattice");
    }

    /// <summary>Row of node k (at lattice index i) applied to v: the terms in the order of the matrix's row (down, left, diagonal, right, up).</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static double Row(ref double w, ref double s, ref double d, ref double v, double kt, int nx, int k, int i)
    {
        double down = -(kt * Unsafe.Add(ref s, k)) * Unsafe.Add(ref v, i - nx), left = -(kt * Unsafe.Add(ref w, k)) * Unsafe.Add(ref v, i - 1),
            centre = Unsafe.Add(ref d, k) * Unsafe.Add(ref v, i),
            right = -(kt * Unsafe.Add(ref w, k + 1)) * Unsafe.Add(ref v, i + 1), up = -(kt * Unsafe.Add(ref s, k + nx)) * Unsafe.Add(ref v, i + nx);
        return down + left + centre + right + up;
    }

    /// <summary>Four consecutive rows at once, each with the same products and sums as <see cref="Row"/> (-(kt c) = (-kt) c exactly).</summary>
    private readonly ref struct RowBlock(ref double w, ref double s, ref double d, ref double v, double minusKt, int nx)
    {
        private readonly ref double _w = ref w, _s = ref s, _d = ref d, _v = ref v;
        private readonly Vector256<double> _minusKt = Vector256.Create(minusKt);
        private readonly int _nx = nx;

        /// <summary>Rows of nodes k to k + 3 (at lattice indices i to i + 3) applied to v.</summary>
        [MethodImpl(MethodImplOptions.AggressiveInlining)]
        public Vector256<double> At(int k, int i)
        {
            var down = _minusKt * Vector256.LoadUnsafe(ref _s, (nuint)k) * Vector256.LoadUnsafe(ref _v, (nuint)(i - _nx));
            var left = _minusKt * Vector256.LoadUnsafe(ref _w, (nuint)k) * Vector256.LoadUnsafe(ref _v, (nuint)(i - 1));
            var centre = Vector256.LoadUnsafe(ref _d, (nuint)k) * Vector256.LoadUnsafe(ref _v, (nuint)i);
            var right = _minusKt * Vector256.LoadUnsafe(ref _w, (nuint)(k + 1)) * Vector256.LoadUnsafe(ref _v, (nuint)(i + 1));
            var up = _minusKt * Vector256.LoadUnsafe(ref _s, (nuint)(k + _nx)) * Vector256.LoadUnsafe(ref _v, (nuint)(i + _nx));
            return down + left + centre + right + up;
        }
    }

    /// <summary>One pass over the nodes: y = A x (returns x . y) or y = b - A x (returns y . y and max |y|).</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private (double Dot, double Largest) Apply(ReadOnlySpan<double> b, double[] x, double[] y, bool residual)
    {
        Check(x); Check(y);
        if (residual && b.Length != LatticeLength) throw new ArgumentException("one value per node of the padded lattice");
        ref double w = ref MemoryMarshal.GetArrayDataReference(_network.UnitWest);
        ref double s = ref MemoryMarshal.GetArrayDataReference(_network.UnitSouth);
        ref double d = ref MemoryMarshal.GetArrayDataReference(DiagonalWPerK);
        ref double v = ref MemoryMarshal.GetArrayDataReference(x);
        int nx = _network.Lattice.NodesX, pad = Pad, n = DiagonalWPerK.Length;
        double kt = _network.ConductanceScaleWPerK;
        ref double f = ref MemoryMarshal.GetReference(b);
        ref double result = ref MemoryMarshal.GetArrayDataReference(y);
        var rows = new RowBlock(ref w, ref s, ref d, ref v, -kt, nx);
        var sums = Vector256<double>.Zero;
        var largestBlock = Vector256<double>.Zero;
        int k = 0;
        if (nx >= Vector256<double>.Count)
            for (; k + Vector256<double>.Count <= n; k += Vector256<double>.Count)
            {
                int i = pad + k;
                var product = rows.At(k, i);
                if (residual)
                {
                    var value = Vector256.LoadUnsafe(ref f, (nuint)i) - product;
                    value.StoreUnsafe(ref result, (nuint)i);
                    sums += value * value;
                    largestBlock = Vector256.Max(largestBlock, Vector256.Abs(value));
                }
                else
                {
                    product.StoreUnsafe(ref result, (nuint)i);
                    sums += Vector256.LoadUnsafe(ref v, (nuint)i) * product;
                }
            }
        double total = 0, largest = 0;
        for (int e = 0; e < Vector256<double>.Count; e++) largest = Math.Max(largest, largestBlock[e]);
        for (; k < n; k++)
        {
            int i = pad + k;
            double product = Row(ref w, ref s, ref d, ref v, kt, nx, k, i);
            double value = residual ? b[i] - product : product;
            y[i] = value;
            total += (residual ? value : Unsafe.Add(ref v, i)) * value;
            if (residual) largest = Math.Max(largest, Math.Abs(value));
        }
        return (Vector256.Sum(sums) + total, largest);
    }
}
