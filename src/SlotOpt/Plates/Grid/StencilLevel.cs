using System.Runtime.CompilerServices;
using System.Runtime.InteropServices;

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
/// </summary>
internal sealed class StencilLevel
{
    public int Nx { get; }
    public int Ny { get; }
    public int Nodes => Nx * Ny;
    public int Pad => Nx + 1;
    /// <summary>The diagonal; released (empty) once the level below is built, see <see cref="ReleaseCentre"/>.</summary>
    public double[] Centre { get; private set; }
    /// <summary>1 / Centre, set by <see cref="Complete"/> once the stencil is filled (the smoother multiplies instead of dividing).</summary>
    public double[] InverseCentre { get; private set; } = Array.Empty<double>();
    public double[] West { get; }
    public double[] South { get; }
    public double[]? SouthWest { get; }
    public double[]? SouthEast { get; }
    /// <summary>Iterate, right-hand side and residual (padded).</summary>
    public double[] X { get; }
    public double[] B { get; }
    public double[] R { get; }

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
        X = new double[padded];
        B = new double[padded];
        R = new double[padded];
    }

    public bool IsNinePoint => SouthWest is not null;

    /// <summary>Drops the diagonal once only the smoother (which uses <see cref="InverseCentre"/>) needs the level.</summary>
    public void ReleaseCentre() => Centre = Array.Empty<double>();

    /// <summary>Call once the stencil is filled.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public void Complete()
    {
        InverseCentre = new double[Nodes];
        for (int p = 0; p < Nodes; p++) InverseCentre[p] = 1 / Centre[p];
    }

    public long Bytes
    {
        get
        {
            long b = 8L * (Centre.Length + West.Length * (IsNinePoint ? 4 : 2) + InverseCentre.Length + X.Length + B.Length + R.Length);
            foreach (var p in new[] { XLow, XHigh, YLow, YHigh, CentreSW, CentreSE, CentreNW, CentreNE }) b += 4L * (p?.Length ?? 0);
            return b;
        }
    }

    /// <summary>Matrix entry between node (i, j) and (i + di, j + dj), |di|, |dj| &lt;= 1; 0 off the lattice.</summary>
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

    /// <summary>One backward Gauss–Seidel sweep on A x = b (lexicographic order reversed): the post-smoother, the transpose of the forward pre-smoother.</summary>
    public void SmoothBackward()
    {
        if (IsNinePoint) SmoothNineBackward(); else SmoothFiveBackward();
    }

    /// <summary>
    /// The forward sweep from x = 0, followed row by row (one row behind, while the rows are in cache)
    /// by the residual R = B - A X. The neighbours ahead of the sweep are still 0 when a node is
    /// updated, so only those behind it are read and X need not be cleared first; and since the sweep
    /// solves (D + L) X = B, the residual is R = -U X, the couplings to the neighbours ahead.
    /// </summary>
    public void SmoothFromZeroThenResidual()
    {
        if (IsNinePoint) NineFromZeroThenResidual(); else FiveFromZeroThenResidual();
    }

    // Rows past the last read zeros from the padding of X and of the stencil arrays.
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private void FiveFromZeroThenResidual()
    {
        ref double c = ref MemoryMarshal.GetArrayDataReference(InverseCentre);
        ref double w = ref MemoryMarshal.GetArrayDataReference(West);
        ref double s = ref MemoryMarshal.GetArrayDataReference(South);
        ref double x = ref MemoryMarshal.GetArrayDataReference(X);
        ref double b = ref MemoryMarshal.GetArrayDataReference(B);
        ref double r = ref MemoryMarshal.GetArrayDataReference(R);
        int nx = Nx, ny = Ny, o = Pad;
        for (int j = 0; j <= ny; j++)
        {
            if (j < ny)
                for (int p = j * nx, end = p + nx; p < end; p++)
                {
                    int q = o + p;
                    double rest = Unsafe.Add(ref b, q) - Unsafe.Add(ref s, p) * Unsafe.Add(ref x, q - nx);
                    double inverse = Unsafe.Add(ref c, p);
                    Unsafe.Add(ref x, q) = Math.FusedMultiplyAdd(-Unsafe.Add(ref w, p) * inverse, Unsafe.Add(ref x, q - 1), rest * inverse);
                }
            if (j > 0)
                for (int p = (j - 1) * nx, end = p + nx; p < end; p++)
                {
                    int q = o + p;
                    Unsafe.Add(ref r, q) = -Unsafe.Add(ref w, p + 1) * Unsafe.Add(ref x, q + 1) - Unsafe.Add(ref s, p + nx) * Unsafe.Add(ref x, q + nx);
                }
        }
    }

    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private void NineFromZeroThenResidual()
    {
        ref double c = ref MemoryMarshal.GetArrayDataReference(InverseCentre);
        ref double w = ref MemoryMarshal.GetArrayDataReference(West);
        ref double s = ref MemoryMarshal.GetArrayDataReference(South);
        ref double sw = ref MemoryMarshal.GetArrayDataReference(SouthWest!);
        ref double se = ref MemoryMarshal.GetArrayDataReference(SouthEast!);
        ref double x = ref MemoryMarshal.GetArrayDataReference(X);
        ref double b = ref MemoryMarshal.GetArrayDataReference(B);
        ref double r = ref MemoryMarshal.GetArrayDataReference(R);
        int nx = Nx, ny = Ny, o = Pad;
        for (int j = 0; j <= ny; j++)
        {
            if (j < ny)
                for (int p = j * nx, end = p + nx; p < end; p++)
                {
                    int q = o + p;
                    double rest = Unsafe.Add(ref b, q) - Unsafe.Add(ref s, p) * Unsafe.Add(ref x, q - nx)
                                  - Unsafe.Add(ref sw, p) * Unsafe.Add(ref x, q - nx - 1) - Unsafe.Add(ref se, p) * Unsafe.Add(ref x, q - nx + 1);
                    double inverse = Unsafe.Add(ref c, p);
                    Unsafe.Add(ref x, q) = Math.FusedMultiplyAdd(-Unsafe.Add(ref w, p) * inverse, Unsafe.Add(ref x, q - 1), rest * inverse);
                }
            if (j > 0)
                for (int p = (j - 1) * nx, end = p + nx; p < end; p++)
                {
                    int q = o + p;
                    Unsafe.Add(ref r, q) = -Unsafe.Add(ref w, p + 1) * Unsafe.Add(ref x, q + 1) - Unsafe.Add(ref s, p + nx) * Unsafe.Add(ref x, q + nx)
                        - Unsafe.Add(ref sw, p + nx + 1) * Unsafe.Add(ref x, q + nx + 1) - Unsafe.Add(ref se, p + nx - 1) * Unsafe.Add(ref x, q + nx - 1);
                }
        }
    }

    // The neighbour the sweep has just updated enters last, through one fused multiply-add
    // (x = rest / a_C - (a_W / a_C) x_prev), so the chain from node to node is one instruction long
    // and the independent terms overlap with the previous node's update instead of waiting for it.
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private void SmoothFiveBackward()
    {
        ref double c = ref MemoryMarshal.GetArrayDataReference(InverseCentre);
        ref double w = ref MemoryMarshal.GetArrayDataReference(West);
        ref double s = ref MemoryMarshal.GetArrayDataReference(South);
        ref double x = ref MemoryMarshal.GetArrayDataReference(X);
        ref double b = ref MemoryMarshal.GetArrayDataReference(B);
        int nx = Nx, n = Nodes, o = Pad;
        for (int p = n - 1; p >= 0; p--)
        {
            int q = o + p;
            double rest = Unsafe.Add(ref b, q) - Unsafe.Add(ref w, p) * Unsafe.Add(ref x, q - 1)
                          - Unsafe.Add(ref s, p) * Unsafe.Add(ref x, q - nx) - Unsafe.Add(ref s, p + nx) * Unsafe.Add(ref x, q + nx);
            double inverse = Unsafe.Add(ref c, p);
            Unsafe.Add(ref x, q) = Math.FusedMultiplyAdd(-Unsafe.Add(ref w, p + 1) * inverse, Unsafe.Add(ref x, q + 1), rest * inverse);
        }
    }

    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private void SmoothNineBackward()
    {
        ref double c = ref MemoryMarshal.GetArrayDataReference(InverseCentre);
        ref double w = ref MemoryMarshal.GetArrayDataReference(West);
        ref double s = ref MemoryMarshal.GetArrayDataReference(South);
        ref double sw = ref MemoryMarshal.GetArrayDataReference(SouthWest!);
        ref double se = ref MemoryMarshal.GetArrayDataReference(SouthEast!);
        ref double x = ref MemoryMarshal.GetArrayDataReference(X);
        ref double b = ref MemoryMarshal.GetArrayDataReference(B);
        int nx = Nx, n = Nodes, o = Pad;
        for (int p = n - 1; p >= 0; p--)
        {
            int q = o + p;
            // the rows below and above summed apart, so the additions do not wait on one another
            double below = Unsafe.Add(ref s, p) * Unsafe.Add(ref x, q - nx) + Unsafe.Add(ref sw, p) * Unsafe.Add(ref x, q - nx - 1)
                           + Unsafe.Add(ref se, p) * Unsafe.Add(ref x, q - nx + 1);
            double above = Unsafe.Add(ref s, p + nx) * Unsafe.Add(ref x, q + nx) + Unsafe.Add(ref sw, p + nx + 1) * Unsafe.Add(ref x, q + nx + 1)
                           + Unsafe.Add(ref se, p + nx - 1) * Unsafe.Add(ref x, q + nx - 1);
            double rest = Unsafe.Add(ref b, q) - Unsafe.Add(ref w, p) * Unsafe.Add(ref x, q - 1) - (below + above);
            double inverse = Unsafe.Add(ref c, p);
            Unsafe.Add(ref x, q) = Math.FusedMultiplyAdd(-Unsafe.Add(ref w, p + 1) * inverse, Unsafe.Add(ref x, q + 1), rest * inverse);
        }
    }
}
