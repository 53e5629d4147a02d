using System.Numerics;
using System.Runtime.CompilerServices;
using System.Runtime.InteropServices;
using SlotOpt.Numerics;

namespace SlotOpt.Plates.Grid;

/// <summary>
/// One level of the structured multigrid: a symmetric 9-point stencil on an nx x ny node lattice
/// (5-point on the finest level, where the corner arrays are null), stored by the couplings each
/// node shares with its west, south, south-west and south-east neighbours (the east, north,
/// north-east and north-west ones are the neighbours' entries), plus the diagonal. Couplings that
/// would leave the lattice are zero, so a node's row reads W[p + 1], S[p + nx], SW[p + nx + 1] and
/// SE[p + nx - 1] without bounds checks. Vectors carry nx + 1 zeros of padding on both sides
/// (node p at index Pad + p). Also holds the prolongation from the next coarser level, by the
/// kind of fine node (Dendy's notation): between two coarse nodes in x (XLow, XHigh), in y
/// (YLow, YHigh), and at a coarse cell's centre (CentreSW, CentreSE, CentreNW, CentreNE), indexed
/// by the coarse node at the low corner.
///
/// Two precisions. The stencil is built in double (Centre, West, ...: the Galerkin products and the
/// prolongation weights are formed from it); once the next coarser level exists,
/// <see cref="ToSinglePrecision"/> keeps a single-precision copy for the smoother (couplings times a
/// power-of-two scale, the inverse diagonal) and drops the double one, except the finest level's
/// couplings, which the sheet operator applies in double. The cycle's vectors X, B, R are single
/// precision; the finest level's right-hand side is the caller's double vector (the conjugate
/// gradients' residual). The kernels compute in single precision too: mixed-precision
/// multigrid, whose rounding error S. F. McCormick, J. Benzaken and R. Tamstorf ("Algebraic error
/// analysis for mixed-precision multigrid solvers", SIAM J. Sci. Comput. 43 (2021) S392, arXiv:2007.06614)
/// bound by the precision times cond(A)^1/2 in energy, harmless in a preconditioner whose outer
/// conjugate gradients keep the residual in double.
/// </summary>
internal sealed class StencilLevel
{
    public int Nx { get; }
    public int Ny { get; }
    public int Nodes => Nx * Ny;
    public int Pad => Nx + 1;
    /// <summary>The double stencil for the setup; released by <see cref="ToSinglePrecision"/> (the finest level keeps West and South).</summary>
    public double[] Centre { get; private set; }
    public double[] West { get; private set; }
    public double[] South { get; private set; }
    public double[]? SouthWest { get; private set; }
    public double[]? SouthEast { get; private set; }
    /// <summary>The smoother's stencil in single precision: scale times the couplings, 1 / (scale times the diagonal).</summary>
    public float[] SingleInverseCentre { get; private set; } = [];
    public float[] SingleWest { get; private set; } = [];
    public float[] SingleSouth { get; private set; } = [];
    public float[] SingleSouthWest { get; private set; } = [];
    public float[] SingleSouthEast { get; private set; } = [];
    /// <summary>Iterate and residual (padded); right-hand side (padded; empty on the finest level, whose right-hand side the caller passes in double).</summary>
    public float[] X { get; }
    public float[] B { get; }
    public float[] R { get; }

    /// <summary>Prolongation weights in single precision (they lie in [0, 1]; the Galerkin product uses these same values, so the cycle stays symmetric).</summary>
    public float[]? XLow, XHigh, YLow, YHigh, CentreSW, CentreSE, CentreNW, CentreNE;

    public StencilLevel(int nx, int ny, bool ninePoint)
    {
        Nx = nx; Ny = ny;
        int stored = nx * ny + nx + 2;           // room for the reads past the last row
        Centre = new double[stored];
        West = new double[stored];
        South = new double[stored];
        if (ninePoint) { SouthWest = new double[stored]; SouthEast = new double[stored]; }
        int padded = nx * ny + 2 * Pad;
        X = new float[padded];
        B = ninePoint ? new float[padded] : [];
        R = new float[padded];
    }

    /// <summary>
    /// The single-precision copy of the stencil for the smoother, scaled by <paramref name="scale"/> (a power of two, so the scaling
    /// itself is exact, chosen to bring the largest diagonal near 1, far from single precision's overflow and denormals);
    /// the double stencil is released, but for the couplings of the finest level when <paramref name="keepDoubleCouplings"/>.
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public void ToSinglePrecision(double scale, bool keepDoubleCouplings)
    {
        int stored = West.Length;
        SingleInverseCentre = new float[Nodes];
        int p = 0, width = Vector<float>.Count;
        ref double centre = ref MemoryMarshal.GetArrayDataReference(Centre);
        ref float inverse = ref MemoryMarshal.GetArrayDataReference(SingleInverseCentre);
        var smallest = new Vector<float>(MathF.ScaleB(1, -126));   // the smallest normal single
        for (; p + width <= Nodes; p += width)
        {
            // 1 / (scale c) in double, rounded to single precision as the scalar form below rounds it
            var v = Vector.Narrow(Vector<double>.One / (scale * Vector.LoadUnsafe(ref centre, (nuint)p)),
                                  Vector<double>.One / (scale * Vector.LoadUnsafe(ref centre, (nuint)(p + Vector<double>.Count))));
            if (!Vector.GreaterThanOrEqualAll(v, smallest) || !Vector.LessThanOrEqualAll(v, new Vector<float>(float.MaxValue))) break;   // the scalar loop names the node
            v.StoreUnsafe(ref inverse, (nuint)p);
        }
        for (; p < Nodes; p++)
        {
            float v = (float)(1 / (scale * Centre[p]));
            if (!float.IsNormal(v) || v < 0) throw new NumericalFailureException($"multigrid level {Nx} x {Ny}: diagonal {Centre[p]:G3} at node {p} is outside single precision's range after scaling by {scale:G3} (coupling contrast too large)");
            SingleInverseCentre[p] = v;
        }
        SingleWest = Single(West, scale, stored);
        SingleSouth = Single(South, scale, stored);
        if (SouthWest is not null) { SingleSouthWest = Single(SouthWest, scale, stored); SingleSouthEast = Single(SouthEast!, scale, stored); }
        Centre = [];
        SouthWest = null; SouthEast = null;
        if (!keepDoubleCouplings) { West = []; South = []; }

        // scale v rounded to single precision, Vector<float>.Count entries at a time (each rounded as the scalar cast rounds it); a local
        // function does not take its method's attribute, and a few calls a plate leave it to tier-0 code and on-stack replacement
        [MethodImpl(MethodImplOptions.AggressiveOptimization)]
        static float[] Single(double[] v, double scale, int stored)
        {
            var s = new float[stored];
            ref double from = ref MemoryMarshal.GetArrayDataReference(v);
            ref float to = ref MemoryMarshal.GetArrayDataReference(s);
            int p = 0, width = Vector<float>.Count;
            for (; p + width <= stored; p += width)
                Vector.Narrow(scale * Vector.LoadUnsafe(ref from, (nuint)p), scale * Vector.LoadUnsafe(ref from, (nuint)(p + Vector<double>.Count))).StoreUnsafe(ref to, (nuint)p);
            for (; p < stored; p++) s[p] = (float)(scale * v[p]);
            return s;
        }
    }

    /// <summary>Releases the double stencil of the coarsest level (its band Cholesky factor replaces it; the cycle never smooths there).</summary>
    public void ReleaseStencil()
    {
        Centre = []; West = []; South = []; SouthWest = null; SouthEast = null;
    }

    public long Bytes
    {
        get
        {
            long b = 8L * (Centre.Length + West.Length + South.Length + (SouthWest?.Length ?? 0) + (SouthEast?.Length ?? 0));
            b += 4L * (SingleInverseCentre.Length + SingleWest.Length + SingleSouth.Length + SingleSouthWest.Length + SingleSouthEast.Length + X.Length + B.Length + R.Length);
            foreach (var p in new[] { XLow, XHigh, YLow, YHigh, CentreSW, CentreSE, CentreNW, CentreNE }) b += 4L * (p?.Length ?? 0);
            return b;
        }
    }

    /// <summary>Matrix entry between node (i, j) and (i + di, j + dj), |di|, |dj| &lt;= 1, from the double stencil; 0 off the lattice.</summary>
    public double Entry(int i, int j, int di, int dj)
    {
        int ii = i + di, jj = j + dj;
        if (ii < 0 || jj < 0 || ii >= Nx || jj >= Ny) return 0;
        int p = j * Nx + i;
        switch (dj * 3 + di)
        {
            case 0: return Centre[p];
            case -1: return West[p];
            case 1: return West[p + 1];
            case -3: return South[p];
            case 3: return South[p + Nx];
            case -4: return SouthWest?[p] ?? 0;
            case 4: return SouthWest?[p + Nx + 1] ?? 0;
            case -2: return SouthEast?[p] ?? 0;
            case 2: return SouthEast?[p + Nx - 1] ?? 0;
            default: throw new ArgumentOutOfRangeException(nameof(di));
        }
    }

    // Each sweep runs in chunks of Vector<float>.Count nodes of a row. A vectorised pre-pass forms, for the chunk, everything that does
    // not depend on the node just updated: t = rest / a_C (rest: the right-hand side minus the couplings to the nodes off the sweep's
    // line, whose values are final or still old) and m = -a_W / a_C (or -a_E / a_C backwards); a scalar recurrence then runs
    // x = m x_prev + t through the chunk in one fused multiply-add a node, the neighbour just updated carried in a register. The pre-pass
    // rounds every product and difference as the plain node-by-node sweep does (same operations, same order, lane by lane), so the
    // sweep's result is the same to the bit as before the split (Gauss-Seidel as in Y. Saad, "Iterative Methods for Sparse Linear
    // Systems", 2nd ed., SIAM 2003, section 4.1; tests/SlotOpt.Tests/Plates/StencilKernelTests.cs compares every kernel with a textbook
    // sweep in double). The nodes of a row past the last whole chunk take the scalar form of the same update.

    /// <summary>
    /// The forward sweep from x = 0 on a 9-point level (right-hand side in B), followed row by row (one row behind, while the rows are
    /// in cache) by the residual R = B - A X. The neighbours ahead of the sweep are still 0 when a node is updated, so only those behind
    /// it are read and X need not be cleared first; and since the sweep solves (D + L) X = B, the residual is R = -U X, the couplings
    /// to the neighbours ahead.
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public void SmoothFromZeroThenResidual()
    {
        ref float c = ref MemoryMarshal.GetArrayDataReference(SingleInverseCentre);
        ref float w = ref MemoryMarshal.GetArrayDataReference(SingleWest);
        ref float s = ref MemoryMarshal.GetArrayDataReference(SingleSouth);
        ref float sw = ref MemoryMarshal.GetArrayDataReference(SingleSouthWest);
        ref float se = ref MemoryMarshal.GetArrayDataReference(SingleSouthEast);
        ref float x = ref MemoryMarshal.GetArrayDataReference(X);
        ref float b = ref MemoryMarshal.GetArrayDataReference(B);
        ref float r = ref MemoryMarshal.GetArrayDataReference(R);
        int nx = Nx, ny = Ny, o = Pad, width = Vector<float>.Count;
        Span<float> chunk = stackalloc float[2 * width];
        ref float factor = ref MemoryMarshal.GetReference(chunk);
        ref float term = ref Unsafe.Add(ref factor, width);
        for (int j = 0; j <= ny; j++)
        {
            if (j < ny)
            {
                float previous = 0;   // the node just updated, carried in a register (its west neighbour is padding or the row's first node)
                int p = j * nx, end = p + nx;
                for (; p + width <= end; p += width)
                {
                    int q = o + p;
                    var rest = Load(ref b, q) - Load(ref s, p) * Load(ref x, q - nx) - Load(ref sw, p) * Load(ref x, q - nx - 1) - Load(ref se, p) * Load(ref x, q - nx + 1);
                    var inverse = Load(ref c, p);
                    Vector.StoreUnsafe(-Load(ref w, p) * inverse, ref factor);
                    Vector.StoreUnsafe(rest * inverse, ref term);
                    previous = ForwardRecurrence(ref factor, ref term, ref Unsafe.Add(ref x, q), previous);
                }
                for (; p < end; p++)
                {
                    int q = o + p;
                    float rest = Unsafe.Add(ref b, q) - Unsafe.Add(ref s, p) * Unsafe.Add(ref x, q - nx)
                                  - Unsafe.Add(ref sw, p) * Unsafe.Add(ref x, q - nx - 1) - Unsafe.Add(ref se, p) * Unsafe.Add(ref x, q - nx + 1);
                    float inverse = Unsafe.Add(ref c, p);
                    previous = MathF.FusedMultiplyAdd(-Unsafe.Add(ref w, p) * inverse, previous, rest * inverse);
                    Unsafe.Add(ref x, q) = previous;
                }
            }
            if (j > 0)
            {
                int p = (j - 1) * nx, end = p + nx;
                for (; p + width <= end; p += width)
                {
                    int q = o + p;
                    Vector.StoreUnsafe(-Load(ref w, p + 1) * Load(ref x, q + 1) - Load(ref s, p + nx) * Load(ref x, q + nx)
                        - Load(ref sw, p + nx + 1) * Load(ref x, q + nx + 1) - Load(ref se, p + nx - 1) * Load(ref x, q + nx - 1), ref Unsafe.Add(ref r, q));
                }
                for (; p < end; p++)
                {
                    int q = o + p;
                    Unsafe.Add(ref r, q) = (-Unsafe.Add(ref w, p + 1) * Unsafe.Add(ref x, q + 1) - Unsafe.Add(ref s, p + nx) * Unsafe.Add(ref x, q + nx)
                        - Unsafe.Add(ref sw, p + nx + 1) * Unsafe.Add(ref x, q + nx + 1) - Unsafe.Add(ref se, p + nx - 1) * Unsafe.Add(ref x, q + nx - 1));
                }
            }
        }
    }

    /// <summary>
    /// <see cref="SmoothFromZeroThenResidual"/> on the 5-point finest level, with the right-hand side <paramref name="rhs"/> in double
    /// (padded like the level's vectors) times <paramref name="rhsScale"/>.
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public void SmoothFiveFromZeroThenResidual(double[] rhs, double rhsScale)
    {
        ref float c = ref MemoryMarshal.GetArrayDataReference(SingleInverseCentre);
        ref float w = ref MemoryMarshal.GetArrayDataReference(SingleWest);
        ref float s = ref MemoryMarshal.GetArrayDataReference(SingleSouth);
        ref float x = ref MemoryMarshal.GetArrayDataReference(X);
        ref double b = ref MemoryMarshal.GetArrayDataReference(rhs);
        ref float r = ref MemoryMarshal.GetArrayDataReference(R);
        int nx = Nx, ny = Ny, o = Pad, width = Vector<float>.Count;
        Span<float> chunk = stackalloc float[2 * width];
        ref float factor = ref MemoryMarshal.GetReference(chunk);
        ref float term = ref Unsafe.Add(ref factor, width);
        for (int j = 0; j <= ny; j++)
        {
            if (j < ny)
            {
                float previous = 0;
                int p = j * nx, end = p + nx;
                for (; p + width <= end; p += width)
                {
                    int q = o + p;
                    var rest = ScaledToSingle(ref b, q, rhsScale) - Load(ref s, p) * Load(ref x, q - nx);
                    var inverse = Load(ref c, p);
                    Vector.StoreUnsafe(-Load(ref w, p) * inverse, ref factor);
                    Vector.StoreUnsafe(rest * inverse, ref term);
                    previous = ForwardRecurrence(ref factor, ref term, ref Unsafe.Add(ref x, q), previous);
                }
                for (; p < end; p++)
                {
                    int q = o + p;
                    float rest = (float)(Unsafe.Add(ref b, q) * rhsScale) - Unsafe.Add(ref s, p) * Unsafe.Add(ref x, q - nx);
                    float inverse = Unsafe.Add(ref c, p);
                    previous = MathF.FusedMultiplyAdd(-Unsafe.Add(ref w, p) * inverse, previous, rest * inverse);
                    Unsafe.Add(ref x, q) = previous;
                }
            }
            if (j > 0)
            {
                int p = (j - 1) * nx, end = p + nx;
                for (; p + width <= end; p += width)
                {
                    int q = o + p;
                    Vector.StoreUnsafe(-Load(ref w, p + 1) * Load(ref x, q + 1) - Load(ref s, p + nx) * Load(ref x, q + nx), ref Unsafe.Add(ref r, q));
                }
                for (; p < end; p++)
                {
                    int q = o + p;
                    Unsafe.Add(ref r, q) = (-Unsafe.Add(ref w, p + 1) * Unsafe.Add(ref x, q + 1) - Unsafe.Add(ref s, p + nx) * Unsafe.Add(ref x, q + nx));
                }
            }
        }
    }

    /// <summary>
    /// One backward Gauss–Seidel sweep on the 5-point finest level, right-hand side as in <see cref="SmoothFiveFromZeroThenResidual"/>: the
    /// post-smoother, the transpose of the forward pre-smoother. Returns the sum over the nodes of rhs times the new X (in double, node by
    /// node in the sweep's order), the conjugate gradients' r.z when X is their z, formed while both are in registers.
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public double SmoothFiveBackward(double[] rhs, double rhsScale)
    {
        ref float c = ref MemoryMarshal.GetArrayDataReference(SingleInverseCentre);
        ref float w = ref MemoryMarshal.GetArrayDataReference(SingleWest);
        ref float s = ref MemoryMarshal.GetArrayDataReference(SingleSouth);
        ref float x = ref MemoryMarshal.GetArrayDataReference(X);
        ref double b = ref MemoryMarshal.GetArrayDataReference(rhs);
        int nx = Nx, o = Pad, width = Vector<float>.Count;
        Span<float> chunk = stackalloc float[2 * width];
        ref float factor = ref MemoryMarshal.GetReference(chunk);
        ref float term = ref Unsafe.Add(ref factor, width);
        double product = 0;
        for (int j = Ny - 1; j >= 0; j--)
        {
            float previous = 0;   // the east neighbour of the row's last node is 0 (no coupling)
            int start = j * nx, p = start + nx;   // p: one past the chunk
            for (; p - width >= start; p -= width)
            {
                int first = p - width, q = o + first;
                var rest = ScaledToSingle(ref b, q, rhsScale) - Load(ref w, first) * Load(ref x, q - 1)
                           - (Load(ref s, first) * Load(ref x, q - nx) + Load(ref s, first + nx) * Load(ref x, q + nx));
                var inverse = Load(ref c, first);
                Vector.StoreUnsafe(-Load(ref w, first + 1) * inverse, ref factor);
                Vector.StoreUnsafe(rest * inverse, ref term);
                // the recurrence, with r.z summed in the sweep's order
                for (int k = width - 1; k >= 0; k--)
                {
                    previous = MathF.FusedMultiplyAdd(Unsafe.Add(ref factor, k), previous, Unsafe.Add(ref term, k));
                    Unsafe.Add(ref x, q + k) = previous;
                    product += Unsafe.Add(ref b, q + k) * previous;
                }
            }
            for (p--; p >= start; p--)
            {
                int q = o + p;
                double given = Unsafe.Add(ref b, q);
                float rest = (float)(given * rhsScale) - Unsafe.Add(ref w, p) * Unsafe.Add(ref x, q - 1)
                              - (Unsafe.Add(ref s, p) * Unsafe.Add(ref x, q - nx) + Unsafe.Add(ref s, p + nx) * Unsafe.Add(ref x, q + nx));
                float inverse = Unsafe.Add(ref c, p);
                previous = MathF.FusedMultiplyAdd(-Unsafe.Add(ref w, p + 1) * inverse, previous, rest * inverse);
                Unsafe.Add(ref x, q) = previous;
                product += given * previous;
            }
        }
        return product;
    }

    /// <summary>One backward Gauss–Seidel sweep on a 9-point level (right-hand side in B).</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public void SmoothBackward()
    {
        ref float c = ref MemoryMarshal.GetArrayDataReference(SingleInverseCentre);
        ref float w = ref MemoryMarshal.GetArrayDataReference(SingleWest);
        ref float s = ref MemoryMarshal.GetArrayDataReference(SingleSouth);
        ref float sw = ref MemoryMarshal.GetArrayDataReference(SingleSouthWest);
        ref float se = ref MemoryMarshal.GetArrayDataReference(SingleSouthEast);
        ref float x = ref MemoryMarshal.GetArrayDataReference(X);
        ref float b = ref MemoryMarshal.GetArrayDataReference(B);
        int nx = Nx, o = Pad, width = Vector<float>.Count;
        Span<float> chunk = stackalloc float[2 * width];
        ref float factor = ref MemoryMarshal.GetReference(chunk);
        ref float term = ref Unsafe.Add(ref factor, width);
        for (int j = Ny - 1; j >= 0; j--)
        {
            float previous = 0;
            int start = j * nx, p = start + nx;   // p: one past the chunk
            for (; p - width >= start; p -= width)
            {
                int first = p - width, q = o + first;
                var below = Load(ref s, first) * Load(ref x, q - nx) + Load(ref sw, first) * Load(ref x, q - nx - 1) + Load(ref se, first) * Load(ref x, q - nx + 1);
                var above = Load(ref s, first + nx) * Load(ref x, q + nx) + Load(ref sw, first + nx + 1) * Load(ref x, q + nx + 1)
                            + Load(ref se, first + nx - 1) * Load(ref x, q + nx - 1);
                var rest = Load(ref b, q) - Load(ref w, first) * Load(ref x, q - 1) - (below + above);
                var inverse = Load(ref c, first);
                Vector.StoreUnsafe(-Load(ref w, first + 1) * inverse, ref factor);
                Vector.StoreUnsafe(rest * inverse, ref term);
                previous = BackwardRecurrence(ref factor, ref term, ref Unsafe.Add(ref x, q), previous);
            }
            for (p--; p >= start; p--)
            {
                int q = o + p;
                // the rows below and above summed apart, so the additions do not wait on one another
                float below = Unsafe.Add(ref s, p) * Unsafe.Add(ref x, q - nx) + Unsafe.Add(ref sw, p) * Unsafe.Add(ref x, q - nx - 1)
                               + Unsafe.Add(ref se, p) * Unsafe.Add(ref x, q - nx + 1);
                float above = Unsafe.Add(ref s, p + nx) * Unsafe.Add(ref x, q + nx) + Unsafe.Add(ref sw, p + nx + 1) * Unsafe.Add(ref x, q + nx + 1)
                               + Unsafe.Add(ref se, p + nx - 1) * Unsafe.Add(ref x, q + nx - 1);
                float rest = Unsafe.Add(ref b, q) - Unsafe.Add(ref w, p) * Unsafe.Add(ref x, q - 1) - (below + above);
                float inverse = Unsafe.Add(ref c, p);
                previous = MathF.FusedMultiplyAdd(-Unsafe.Add(ref w, p + 1) * inverse, previous, rest * inverse);
                Unsafe.Add(ref x, q) = previous;
            }
        }
    }

    /// <summary>One forward Gauss–Seidel sweep on a 9-point level from the current X (right-hand side in B): the post-smoother's first half below <c>StructuredMultigrid.SymmetricSmoothingFrom</c>.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public void SmoothForward()
    {
        ref float c = ref MemoryMarshal.GetArrayDataReference(SingleInverseCentre);
        ref float w = ref MemoryMarshal.GetArrayDataReference(SingleWest);
        ref float s = ref MemoryMarshal.GetArrayDataReference(SingleSouth);
        ref float sw = ref MemoryMarshal.GetArrayDataReference(SingleSouthWest);
        ref float se = ref MemoryMarshal.GetArrayDataReference(SingleSouthEast);
        ref float x = ref MemoryMarshal.GetArrayDataReference(X);
        ref float b = ref MemoryMarshal.GetArrayDataReference(B);
        int nx = Nx, o = Pad, width = Vector<float>.Count;
        Span<float> chunk = stackalloc float[2 * width];
        ref float factor = ref MemoryMarshal.GetReference(chunk);
        ref float term = ref Unsafe.Add(ref factor, width);
        for (int j = 0; j < Ny; j++)
        {
            float previous = 0;
            int p = j * nx, end = p + nx;
            for (; p + width <= end; p += width)
            {
                int q = o + p;
                var below = Load(ref s, p) * Load(ref x, q - nx) + Load(ref sw, p) * Load(ref x, q - nx - 1) + Load(ref se, p) * Load(ref x, q - nx + 1);
                var above = Load(ref s, p + nx) * Load(ref x, q + nx) + Load(ref sw, p + nx + 1) * Load(ref x, q + nx + 1)
                            + Load(ref se, p + nx - 1) * Load(ref x, q + nx - 1);
                var rest = Load(ref b, q) - Load(ref w, p + 1) * Load(ref x, q + 1) - (below + above);
                var inverse = Load(ref c, p);
                Vector.StoreUnsafe(-Load(ref w, p) * inverse, ref factor);
                Vector.StoreUnsafe(rest * inverse, ref term);
                previous = ForwardRecurrence(ref factor, ref term, ref Unsafe.Add(ref x, q), previous);
            }
            for (; p < end; p++)
            {
                int q = o + p;
                float below = Unsafe.Add(ref s, p) * Unsafe.Add(ref x, q - nx) + Unsafe.Add(ref sw, p) * Unsafe.Add(ref x, q - nx - 1)
                               + Unsafe.Add(ref se, p) * Unsafe.Add(ref x, q - nx + 1);
                float above = Unsafe.Add(ref s, p + nx) * Unsafe.Add(ref x, q + nx) + Unsafe.Add(ref sw, p + nx + 1) * Unsafe.Add(ref x, q + nx + 1)
                               + Unsafe.Add(ref se, p + nx - 1) * Unsafe.Add(ref x, q + nx - 1);
                float rest = Unsafe.Add(ref b, q) - Unsafe.Add(ref w, p + 1) * Unsafe.Add(ref x, q + 1) - (below + above);
                float inverse = Unsafe.Add(ref c, p);
                previous = MathF.FusedMultiplyAdd(-Unsafe.Add(ref w, p) * inverse, previous, rest * inverse);
                Unsafe.Add(ref x, q) = previous;
            }
        }
    }

    /// <summary>The residual R = B - A X on a 9-point level (after a pre-smoothing of two sweeps, whose residual no sweep forms on the way).</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public void Residual()
    {
        ref float c = ref MemoryMarshal.GetArrayDataReference(SingleInverseCentre);
        ref float w = ref MemoryMarshal.GetArrayDataReference(SingleWest);
        ref float s = ref MemoryMarshal.GetArrayDataReference(SingleSouth);
        ref float sw = ref MemoryMarshal.GetArrayDataReference(SingleSouthWest);
        ref float se = ref MemoryMarshal.GetArrayDataReference(SingleSouthEast);
        ref float x = ref MemoryMarshal.GetArrayDataReference(X);
        ref float b = ref MemoryMarshal.GetArrayDataReference(B);
        ref float r = ref MemoryMarshal.GetArrayDataReference(R);
        int nx = Nx, o = Pad, width = Vector<float>.Count;
        int p = 0, end = Nx * Ny;
        for (; p + width <= end; p += width)
        {
            int q = o + p;
            var below = Load(ref s, p) * Load(ref x, q - nx) + Load(ref sw, p) * Load(ref x, q - nx - 1) + Load(ref se, p) * Load(ref x, q - nx + 1);
            var above = Load(ref s, p + nx) * Load(ref x, q + nx) + Load(ref sw, p + nx + 1) * Load(ref x, q + nx + 1)
                        + Load(ref se, p + nx - 1) * Load(ref x, q + nx - 1);
            var side = Load(ref w, p) * Load(ref x, q - 1) + Load(ref w, p + 1) * Load(ref x, q + 1);
            Vector.StoreUnsafe(Load(ref b, q) - Load(ref x, q) / Load(ref c, p) - (side + (below + above)), ref Unsafe.Add(ref r, q));
        }
        for (; p < end; p++)
        {
            int q = o + p;
            float below = Unsafe.Add(ref s, p) * Unsafe.Add(ref x, q - nx) + Unsafe.Add(ref sw, p) * Unsafe.Add(ref x, q - nx - 1)
                           + Unsafe.Add(ref se, p) * Unsafe.Add(ref x, q - nx + 1);
            float above = Unsafe.Add(ref s, p + nx) * Unsafe.Add(ref x, q + nx) + Unsafe.Add(ref sw, p + nx + 1) * Unsafe.Add(ref x, q + nx + 1)
                           + Unsafe.Add(ref se, p + nx - 1) * Unsafe.Add(ref x, q + nx - 1);
            float side = Unsafe.Add(ref w, p) * Unsafe.Add(ref x, q - 1) + Unsafe.Add(ref w, p + 1) * Unsafe.Add(ref x, q + 1);
            Unsafe.Add(ref r, q) = Unsafe.Add(ref b, q) - Unsafe.Add(ref x, q) / Unsafe.Add(ref c, p) - (side + (below + above));
        }
    }

    /// <summary>Vector&lt;float&gt;.Count floats from index i.</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static Vector<float> Load(ref float a, int i) => Vector.LoadUnsafe(ref a, (nuint)i);

    /// <summary>Vector&lt;float&gt;.Count doubles from index i times scale, each rounded to single precision as (float)(v * scale) rounds it.</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static Vector<float> ScaledToSingle(ref double a, int i, double scale) =>
        Vector.Narrow(Vector.LoadUnsafe(ref a, (nuint)i) * scale, Vector.LoadUnsafe(ref a, (nuint)(i + Vector<double>.Count)) * scale);

    /// <summary>x_k = factor_k x_(k-1) + term_k for k = 0 .. Vector&lt;float&gt;.Count - 1, x_(-1) = previous; returns the last x.</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static float ForwardRecurrence(ref float factor, ref float term, ref float x, float previous)
    {
        for (int k = 0; k < Vector<float>.Count; k++)
        {
            previous = MathF.FusedMultiplyAdd(Unsafe.Add(ref factor, k), previous, Unsafe.Add(ref term, k));
            Unsafe.Add(ref x, k) = previous;
        }
        return previous;
    }

    /// <summary>x_k = factor_k x_(k+1) + term_k for k = Vector&lt;float&gt;.Count - 1 down to 0, x_(Count) = previous; returns x_0.</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static float BackwardRecurrence(ref float factor, ref float term, ref float x, float previous)
    {
        for (int k = Vector<float>.Count - 1; k >= 0; k--)
        {
            previous = MathF.FusedMultiplyAdd(Unsafe.Add(ref factor, k), previous, Unsafe.Add(ref term, k));
            Unsafe.Add(ref x, k) = previous;
        }
        return previous;
    }
}
