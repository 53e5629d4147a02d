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
    public double[] Centre { get; }
    public double[] West { get; }
    public double[] South { get; }
    public double[]? SouthWest { get; }
    public double[]? SouthEast { get; }
    /// <summary>Iterate, right-hand side and residual (padded).</summary>
    public double[] X { get; }
    public double[] B { get; }
    public double[] R { get; }

    public double[]? XLow, XHigh, YLow, YHigh, CentreSW, CentreSE, CentreNW, CentreNE;

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

    public long Bytes
    {
        get
        {
            long b = 8L * (Centre.Length * (IsNinePoint ? 5 : 3) + X.Length + B.Length + R.Length);
            foreach (var p in new[] { XLow, XHigh, YLow, YHigh, CentreSW, CentreSE, CentreNW, CentreNE }) b += 8L * (p?.Length ?? 0);
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

    /// <summary>One Gauss–Seidel sweep on A x = b, forward or backward in lexicographic order.</summary>
    public void Smooth(bool forward)
    {
        if (IsNinePoint) SmoothNine(forward); else SmoothFive(forward);
    }

    private void SmoothFive(bool forward)
    {
        var c = Centre; var w = West; var s = South; var x = X; var b = B;
        int nx = Nx, n = Nodes, o = Pad;
        if (forward)
            for (int p = 0; p < n; p++)
            {
                int q = o + p;
                x[q] = (b[q] - w[p] * x[q - 1] - w[p + 1] * x[q + 1] - s[p] * x[q - nx] - s[p + nx] * x[q + nx]) / c[p];
            }
        else
            for (int p = n - 1; p >= 0; p--)
            {
                int q = o + p;
                x[q] = (b[q] - w[p] * x[q - 1] - w[p + 1] * x[q + 1] - s[p] * x[q - nx] - s[p + nx] * x[q + nx]) / c[p];
            }
    }

    private void SmoothNine(bool forward)
    {
        var c = Centre; var w = West; var s = South; var sw = SouthWest!; var se = SouthEast!; var x = X; var b = B;
        int nx = Nx, n = Nodes, o = Pad;
        for (int t = 0; t < n; t++)
        {
            int p = forward ? t : n - 1 - t;
            int q = o + p;
            x[q] = (b[q] - w[p] * x[q - 1] - w[p + 1] * x[q + 1] - s[p] * x[q - nx] - s[p + nx] * x[q + nx]
                    - sw[p] * x[q - nx - 1] - sw[p + nx + 1] * x[q + nx + 1] - se[p] * x[q - nx + 1] - se[p + nx - 1] * x[q + nx - 1]) / c[p];
        }
    }

    /// <summary>R = B - A X.</summary>
    public void Residual()
    {
        var c = Centre; var w = West; var s = South; var x = X; var b = B; var r = R;
        int nx = Nx, n = Nodes, o = Pad;
        if (!IsNinePoint)
        {
            for (int p = 0; p < n; p++)
            {
                int q = o + p;
                r[q] = b[q] - c[p] * x[q] - w[p] * x[q - 1] - w[p + 1] * x[q + 1] - s[p] * x[q - nx] - s[p + nx] * x[q + nx];
            }
            return;
        }
        var sw = SouthWest!; var se = SouthEast!;
        for (int p = 0; p < n; p++)
        {
            int q = o + p;
            r[q] = b[q] - c[p] * x[q] - w[p] * x[q - 1] - w[p + 1] * x[q + 1] - s[p] * x[q - nx] - s[p + nx] * x[q + nx]
                   - sw[p] * x[q - nx - 1] - sw[p + nx + 1] * x[q + nx + 1] - se[p] * x[q - nx + 1] - se[p + nx - 1] * x[q + nx - 1];
        }
    }
}
