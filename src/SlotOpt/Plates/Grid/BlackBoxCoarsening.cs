using System.Runtime.CompilerServices;

namespace SlotOpt.Plates.Grid;

/// <summary>
/// One coarsening step of black-box multigrid (J. E. Dendy, "Black box multigrid", J. Comput.
/// Phys. 48 (1982) 366–386): coarse nodes are the fine nodes with even indices; the prolongation
/// is operator-dependent and the coarse operator is the Galerkin product A_c = P^T A P, a 9-point
/// stencil again. With fine matrix entries a (diagonal a_C, neighbours a_W ... a_NE, off-diagonals
/// negative) the prolongation weights are (Dendy 1982, section 3):
///   fine node between coarse nodes in x:  d = a_C + a_S + a_N  (the stencil collapsed onto the x line),
///       w_low = -(a_W + a_SW + a_NW) / d,  w_high = -(a_E + a_SE + a_NE) / d;
///   between coarse nodes in y: d = a_C + a_W + a_E,  w_low = -(a_S + a_SW + a_SE) / d,  w_high = -(a_N + a_NW + a_NE) / d;
///   at a coarse cell's centre: x_centre = -(sum over its 8 neighbours of a_k P_k) / a_C, the
///       neighbours' prolongation taken from the two rules above (coarse nodes: 1).
/// Where a slot, a hole's edge or a conductivity jump cuts a line the couplings across it are
/// small, so the weight across falls with them and the coarse operator keeps the cut.
/// Entries are read straight from the stencil arrays: a coupling that would leave the lattice is
/// stored as 0 (see <see cref="StencilLevel"/>), so no read needs a bounds test.
/// </summary>
internal static class BlackBoxCoarsening
{
    public static StencilLevel Coarsen(StencilLevel f)
    {
        int ncx = (f.Nx + 1) / 2, ncy = (f.Ny + 1) / 2;
        var c = new StencilLevel(ncx, ncy, ninePoint: true);
        BuildProlongation(f, c);
        GalerkinOperator(f, c);
        return c;
    }

    private static float Ratio(double numerator, double denominator) => denominator > 0 ? (float)(-numerator / denominator) : 0f;

    /// <summary>The 9 entries of node p's row (0 for the corners of a 5-point level and off the lattice).</summary>
    private readonly struct Row
    {
        public readonly double C, W, E, S, N, SW, SE, NW, NE;

        [MethodImpl(MethodImplOptions.AggressiveInlining)]
        public Row(StencilLevel f, int p)
        {
            int nx = f.Nx;
            C = f.Centre[p]; W = f.West[p]; E = f.West[p + 1]; S = f.South[p]; N = f.South[p + nx];
            if (f.SouthWest is { } sw) { SW = sw[p]; NE = sw[p + nx + 1]; SE = f.SouthEast![p]; NW = f.SouthEast[p + nx - 1]; }
            else { SW = 0; NE = 0; SE = 0; NW = 0; }
        }
    }

    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static void BuildProlongation(StencilLevel f, StencilLevel c)
    {
        int ncx = c.Nx, ncy = c.Ny, nc = ncx * ncy, fnx = f.Nx, fny = f.Ny;
        var xLow = new float[nc]; var xHigh = new float[nc]; var yLow = new float[nc]; var yHigh = new float[nc];
        var cSW = new float[nc]; var cSE = new float[nc]; var cNW = new float[nc]; var cNE = new float[nc];
        for (int J = 0; J < ncy; J++)
            for (int I = 0; I < ncx; I++)
            {
                int k = J * ncx + I;
                int i = 2 * I + 1, j = 2 * J;
                if (i < fnx)
                {
                    var a = new Row(f, j * fnx + i);
                    double d = a.C + a.S + a.N;
                    xLow[k] = Ratio(a.W + a.SW + a.NW, d);
                    xHigh[k] = I + 1 < ncx ? Ratio(a.E + a.SE + a.NE, d) : 0;
                }
                i = 2 * I; j = 2 * J + 1;
                if (j < fny)
                {
                    var a = new Row(f, j * fnx + i);
                    double d = a.C + a.W + a.E;
                    yLow[k] = Ratio(a.S + a.SW + a.SE, d);
                    yHigh[k] = J + 1 < ncy ? Ratio(a.N + a.NW + a.NE, d) : 0;
                }
            }
        for (int J = 0; J < ncy; J++)
            for (int I = 0; I < ncx; I++)
            {
                int i = 2 * I + 1, j = 2 * J + 1;
                if (i >= fnx || j >= fny) continue;
                int k = J * ncx + I;
                bool east = I + 1 < ncx, north = J + 1 < ncy;
                var a = new Row(f, j * fnx + i);
                // the x/y-line neighbours' weights towards each corner (0 where that line node or corner is off the lattice)
                double wSouthLine = yLow[k], nWestLine = yHigh[k];                               // west neighbour (2I, 2J+1)
                double eSouthLine = east ? yLow[k + 1] : 0, eNorthLine = east ? yHigh[k + 1] : 0; // east neighbour (2I+2, 2J+1)
                double sWestLine = xLow[k], sEastLine = xHigh[k];                                // south neighbour (2I+1, 2J)
                double nWest = north ? xLow[k + ncx] : 0, nEast = north ? xHigh[k + ncx] : 0;    // north neighbour (2I+1, 2J+2)
                cSW[k] = Ratio(a.SW + a.W * wSouthLine + a.S * sWestLine, a.C);
                cSE[k] = east ? Ratio(a.SE + a.E * eSouthLine + a.S * sEastLine, a.C) : 0;
                cNW[k] = north ? Ratio(a.NW + a.W * nWestLine + a.N * nWest, a.C) : 0;
                cNE[k] = east && north ? Ratio(a.NE + a.E * eNorthLine + a.N * nEast, a.C) : 0;
            }
        c.XLow = xLow; c.XHigh = xHigh; c.YLow = yLow; c.YHigh = yHigh;
        c.CentreSW = cSW; c.CentreSE = cSE; c.CentreNW = cNW; c.CentreNE = cNE;
    }

    /// <summary>
    /// A_c(K, L) = phi_K^T A phi_L with phi_K coarse node K's prolongation (support: the 3 x 3 fine
    /// nodes around it); per coarse node A phi_K is formed on the 5 x 5 patch around it and dotted
    /// with the basis functions of K and its west, south, south-west and south-east neighbours.
    /// The weights of a fine node off the lattice are 0 in the prolongation arrays, so only the
    /// lattice's low edges (I = 0, J = 0) need a test.
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static void GalerkinOperator(StencilLevel f, StencilLevel c)
    {
        int ncx = c.Nx, ncy = c.Ny, fnx = f.Nx;
        Span<double> aPhi = stackalloc double[25];
        Span<double> phi = stackalloc double[9];
        Span<double> other = stackalloc double[9];
        for (int J = 0; J < ncy; J++)
            for (int I = 0; I < ncx; I++)
            {
                int k = J * ncx + I;
                int p0 = 2 * J * fnx + 2 * I;
                Basis(c, I, J, phi);
                aPhi.Clear();
                for (int t = 0; t < 9; t++)
                {
                    double v = phi[t];
                    if (v == 0) continue;
                    int mi = t % 3 - 1, mj = t / 3 - 1;
                    var a = new Row(f, p0 + mj * fnx + mi);
                    int centre = (mj + 2) * 5 + mi + 2;   // the support node's place in the 5 x 5 patch
                    aPhi[centre] += a.C * v;
                    aPhi[centre - 1] += a.W * v;
                    aPhi[centre + 1] += a.E * v;
                    aPhi[centre - 5] += a.S * v;
                    aPhi[centre + 5] += a.N * v;
                    aPhi[centre - 6] += a.SW * v;
                    aPhi[centre + 6] += a.NE * v;
                    aPhi[centre - 4] += a.SE * v;
                    aPhi[centre + 4] += a.NW * v;
                }
                c.Centre[k] = Project(phi, aPhi, 0, 0);
                if (I > 0) { Basis(c, I - 1, J, other); c.West[k] = Project(other, aPhi, -1, 0); }
                if (J > 0)
                {
                    Basis(c, I, J - 1, other); c.South[k] = Project(other, aPhi, 0, -1);
                    if (I > 0) { Basis(c, I - 1, J - 1, other); c.SouthWest![k] = Project(other, aPhi, -1, -1); }
                    if (I + 1 < ncx) { Basis(c, I + 1, J - 1, other); c.SouthEast![k] = Project(other, aPhi, 1, -1); }
                }
            }
    }

    /// <summary>Coarse node (I, J)'s prolongation weights at fine offsets (di, dj) into phi[(dj + 1) 3 + di + 1]; 0 off the lattice.</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static void Basis(StencilLevel c, int I, int J, Span<double> phi)
    {
        int ncx = c.Nx, k = J * ncx + I;
        bool west = I > 0, south = J > 0;
        phi[4] = 1;
        phi[5] = c.XLow![k];
        phi[3] = west ? c.XHigh![k - 1] : 0;
        phi[7] = c.YLow![k];
        phi[1] = south ? c.YHigh![k - ncx] : 0;
        phi[8] = c.CentreSW![k];
        phi[6] = west ? c.CentreSE![k - 1] : 0;
        phi[2] = south ? c.CentreNW![k - ncx] : 0;
        phi[0] = west && south ? c.CentreNE![k - ncx - 1] : 0;
    }

    /// <summary>phi_L^T (A phi_K) for L = K + (dI, dJ) with weights phi, over the fine nodes in K's 5 x 5 patch.</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static double Project(ReadOnlySpan<double> phi, ReadOnlySpan<double> aPhi, int dI, int dJ)
    {
        double s = 0;
        for (int dj = -1; dj <= 1; dj++)
        {
            int pj = 2 * dJ + dj + 2;
            if (pj < 0 || pj > 4) continue;
            for (int di = -1; di <= 1; di++)
            {
                int pi = 2 * dI + di + 2;
                if (pi < 0 || pi > 4) continue;
                s += phi[(dj + 1) * 3 + di + 1] * aPhi[pj * 5 + pi];
            }
        }
        return s;
    }
}
