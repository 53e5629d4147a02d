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

    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static void BuildProlongation(StencilLevel f, StencilLevel c)
    {
        int ncx = c.Nx, ncy = c.Ny, nc = ncx * ncy;
        var xLow = new float[nc]; var xHigh = new float[nc]; var yLow = new float[nc]; var yHigh = new float[nc];
        var cSW = new float[nc]; var cSE = new float[nc]; var cNW = new float[nc]; var cNE = new float[nc];
        for (int J = 0; J < ncy; J++)
            for (int I = 0; I < ncx; I++)
            {
                int k = J * ncx + I;
                int i = 2 * I + 1, j = 2 * J;
                if (i < f.Nx)
                {
                    double d = f.Entry(i, j, 0, 0) + f.Entry(i, j, 0, -1) + f.Entry(i, j, 0, 1);
                    xLow[k] = Ratio(f.Entry(i, j, -1, 0) + f.Entry(i, j, -1, -1) + f.Entry(i, j, -1, 1), d);
                    xHigh[k] = I + 1 < ncx ? Ratio(f.Entry(i, j, 1, 0) + f.Entry(i, j, 1, -1) + f.Entry(i, j, 1, 1), d) : 0;
                }
                i = 2 * I; j = 2 * J + 1;
                if (j < f.Ny)
                {
                    double d = f.Entry(i, j, 0, 0) + f.Entry(i, j, -1, 0) + f.Entry(i, j, 1, 0);
                    yLow[k] = Ratio(f.Entry(i, j, 0, -1) + f.Entry(i, j, -1, -1) + f.Entry(i, j, 1, -1), d);
                    yHigh[k] = J + 1 < ncy ? Ratio(f.Entry(i, j, 0, 1) + f.Entry(i, j, -1, 1) + f.Entry(i, j, 1, 1), d) : 0;
                }
            }
        for (int J = 0; J < ncy; J++)
            for (int I = 0; I < ncx; I++)
            {
                int i = 2 * I + 1, j = 2 * J + 1;
                if (i >= f.Nx || j >= f.Ny) continue;
                int k = J * ncx + I;
                bool east = I + 1 < ncx, north = J + 1 < ncy;
                double d = f.Entry(i, j, 0, 0);
                double aW = f.Entry(i, j, -1, 0), aE = f.Entry(i, j, 1, 0), aS = f.Entry(i, j, 0, -1), aN = f.Entry(i, j, 0, 1);
                // the x/y-line neighbours' weights towards each corner (0 where that line node or corner is off the lattice)
                double wSouthLine = yLow[k], nWestLine = yHigh[k];                               // west neighbour (2I, 2J+1)
                double eSouthLine = east ? yLow[k + 1] : 0, eNorthLine = east ? yHigh[k + 1] : 0; // east neighbour (2I+2, 2J+1)
                double sWestLine = xLow[k], sEastLine = xHigh[k];                                // south neighbour (2I+1, 2J)
                double nWest = north ? xLow[k + ncx] : 0, nEast = north ? xHigh[k + ncx] : 0;    // north neighbour (2I+1, 2J+2)
                cSW[k] = Ratio(f.Entry(i, j, -1, -1) + aW * wSouthLine + aS * sWestLine, d);
                cSE[k] = east ? Ratio(f.Entry(i, j, 1, -1) + aE * eSouthLine + aS * sEastLine, d) : 0;
                cNW[k] = north ? Ratio(f.Entry(i, j, -1, 1) + aW * nWestLine + aN * nWest, d) : 0;
                cNE[k] = east && north ? Ratio(f.Entry(i, j, 1, 1) + aE * eNorthLine + aN * nEast, d) : 0;
            }
        c.XLow = xLow; c.XHigh = xHigh; c.YLow = yLow; c.YHigh = yHigh;
        c.CentreSW = cSW; c.CentreSE = cSE; c.CentreNW = cNW; c.CentreNE = cNE;
    }

    /// <summary>Prolongation weight of coarse node (I, J) at fine node (2I + di, 2J + dj), |di|, |dj| &lt;= 1.</summary>
    private static double Weight(StencilLevel c, int I, int J, int di, int dj)
    {
        int ncx = c.Nx;
        switch (dj * 3 + di)
        {
            case 0: return 1;
            case 1: return c.XLow![J * ncx + I];
            case -1: return I > 0 ? c.XHigh![J * ncx + I - 1] : 0;
            case 3: return c.YLow![J * ncx + I];
            case -3: return J > 0 ? c.YHigh![(J - 1) * ncx + I] : 0;
            case 4: return c.CentreSW![J * ncx + I];
            case 2: return I > 0 ? c.CentreSE![J * ncx + I - 1] : 0;
            case -2: return J > 0 ? c.CentreNW![(J - 1) * ncx + I] : 0;
            case -4: return I > 0 && J > 0 ? c.CentreNE![(J - 1) * ncx + I - 1] : 0;
            default: throw new ArgumentOutOfRangeException(nameof(di));
        }
    }

    /// <summary>
    /// A_c(K, L) = phi_K^T A phi_L with phi_K coarse node K's prolongation (support: the 3 x 3 fine
    /// nodes around it); per coarse node A phi_K is formed on the 5 x 5 patch around it and dotted
    /// with the basis functions of K and its west, south, south-west and south-east neighbours.
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static void GalerkinOperator(StencilLevel f, StencilLevel c)
    {
        int ncx = c.Nx, ncy = c.Ny, fnx = f.Nx, fny = f.Ny;
        // phi[9 k + t]: coarse node k's weight at fine offset t = (dj + 1) 3 + di + 1; 0 off the lattice
        var phi = new double[9 * ncx * ncy];
        for (int J = 0; J < ncy; J++)
            for (int I = 0; I < ncx; I++)
                for (int dj = -1; dj <= 1; dj++)
                    for (int di = -1; di <= 1; di++)
                    {
                        int i = 2 * I + di, j = 2 * J + dj;
                        if (i >= 0 && j >= 0 && i < fnx && j < fny) phi[9 * (J * ncx + I) + (dj + 1) * 3 + di + 1] = Weight(c, I, J, di, dj);
                    }
        var cw = f.West; var cs = f.South; var cc = f.Centre; var csw = f.SouthWest; var cse = f.SouthEast;
        Span<double> aPhi = stackalloc double[25];
        for (int J = 0; J < ncy; J++)
            for (int I = 0; I < ncx; I++)
            {
                int k = J * ncx + I;
                int p0 = 2 * J * fnx + 2 * I;
                aPhi.Clear();
                for (int t = 0; t < 9; t++)
                {
                    double v = phi[9 * k + t];
                    if (v == 0) continue;
                    int mi = t % 3 - 1, mj = t / 3 - 1;
                    int pm = p0 + mj * fnx + mi;
                    int centre = (mj + 2) * 5 + mi + 2;   // the support node's place in the 5 x 5 patch
                    aPhi[centre] += cc[pm] * v;
                    aPhi[centre - 1] += cw[pm] * v;
                    aPhi[centre + 1] += cw[pm + 1] * v;
                    aPhi[centre - 5] += cs[pm] * v;
                    aPhi[centre + 5] += cs[pm + fnx] * v;
                    if (csw is null) continue;
                    aPhi[centre - 6] += csw[pm] * v;
                    aPhi[centre + 6] += csw[pm + fnx + 1] * v;
                    aPhi[centre - 4] += cse![pm] * v;
                    aPhi[centre + 4] += cse[pm + fnx - 1] * v;
                }
                c.Centre[k] = Project(phi, 9 * k, aPhi, 0, 0);
                c.West[k] = I > 0 ? Project(phi, 9 * (k - 1), aPhi, -1, 0) : 0;
                c.South[k] = J > 0 ? Project(phi, 9 * (k - ncx), aPhi, 0, -1) : 0;
                c.SouthWest![k] = I > 0 && J > 0 ? Project(phi, 9 * (k - ncx - 1), aPhi, -1, -1) : 0;
                c.SouthEast![k] = I + 1 < ncx && J > 0 ? Project(phi, 9 * (k - ncx + 1), aPhi, 1, -1) : 0;
            }
    }

    /// <summary>phi_L^T (A phi_K) for L = K + (dI, dJ) whose weights start at phi[at], over the fine nodes in K's 5 x 5 patch.</summary>
    private static double Project(double[] phi, int at, ReadOnlySpan<double> aPhi, int dI, int dJ)
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
                s += phi[at + (dj + 1) * 3 + di + 1] * aPhi[pj * 5 + pi];
            }
        }
        return s;
    }
}
