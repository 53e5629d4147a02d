using System.Runtime.CompilerServices;
using System.Runtime.InteropServices;

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
/// stored as 0 (see <see cref="StencilLevel"/>), so no read needs a bounds test (and the reads skip
/// the runtime's: every index lies in [0, nodes + nx + 1], within the stored length).
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
        public Row(in Stencil f, int p)
        {
            int nx = f.Nx;
            C = Unsafe.Add(ref f.Centre, p); W = Unsafe.Add(ref f.West, p); E = Unsafe.Add(ref f.West, p + 1);
            S = Unsafe.Add(ref f.South, p); N = Unsafe.Add(ref f.South, p + nx);
            if (f.NinePoint)
            {
                SW = Unsafe.Add(ref f.SouthWest, p); NE = Unsafe.Add(ref f.SouthWest, p + nx + 1);
                SE = Unsafe.Add(ref f.SouthEast, p); NW = Unsafe.Add(ref f.SouthEast, p + nx - 1);
            }
            else { SW = 0; NE = 0; SE = 0; NW = 0; }
        }
    }

    /// <summary>A level's double stencil arrays as references (the corner ones point at the centre's on a 5-point level, never read).</summary>
    private readonly ref struct Stencil
    {
        public readonly ref double Centre, West, South, SouthWest, SouthEast;
        public readonly int Nx;
        public readonly bool NinePoint;

        public Stencil(StencilLevel f)
        {
            Nx = f.Nx;
            Centre = ref MemoryMarshal.GetArrayDataReference(f.Centre);
            West = ref MemoryMarshal.GetArrayDataReference(f.West);
            South = ref MemoryMarshal.GetArrayDataReference(f.South);
            NinePoint = f.SouthWest is not null;
            SouthWest = ref NinePoint ? ref MemoryMarshal.GetArrayDataReference(f.SouthWest!) : ref Centre;
            SouthEast = ref NinePoint ? ref MemoryMarshal.GetArrayDataReference(f.SouthEast!) : ref Centre;
        }
    }

    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static void BuildProlongation(StencilLevel f, StencilLevel c)
    {
        int ncx = c.Nx, ncy = c.Ny, nc = ncx * ncy, fnx = f.Nx, fny = f.Ny;
        var xLow = new float[nc]; var xHigh = new float[nc]; var yLow = new float[nc]; var yHigh = new float[nc];
        var cSW = new float[nc]; var cSE = new float[nc]; var cNW = new float[nc]; var cNE = new float[nc];
        var stencil = new Stencil(f);
        for (int J = 0; J < ncy; J++)
            for (int I = 0; I < ncx; I++)
            {
                int k = J * ncx + I;
                int i = 2 * I + 1, j = 2 * J;
                if (i < fnx)
                {
                    var a = new Row(stencil, j * fnx + i);
                    double d = a.C + a.S + a.N;
                    xLow[k] = Ratio(a.W + a.SW + a.NW, d);
                    xHigh[k] = I + 1 < ncx ? Ratio(a.E + a.SE + a.NE, d) : 0;
                }
                i = 2 * I; j = 2 * J + 1;
                if (j < fny)
                {
                    var a = new Row(stencil, j * fnx + i);
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
                var a = new Row(stencil, j * fnx + i);
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
    /// with the basis functions of K and its west, south, south-west and south-east neighbours
    /// (each dot product spelled out over the fine nodes the two supports share).
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static void GalerkinOperator(StencilLevel f, StencilLevel c)
    {
        int ncx = c.Nx, ncy = c.Ny, fnx = f.Nx;
        var phiArray = Bases(c);
        ref float phi = ref MemoryMarshal.GetArrayDataReference(phiArray);
        Span<double> patch = stackalloc double[25];   // A phi_K on K's 5 x 5 patch, row by row from the south-west corner
        ref double a = ref MemoryMarshal.GetReference(patch);
        var cc = c.Centre; var cw = c.West; var cs = c.South; var csw = c.SouthWest!; var cse = c.SouthEast!;
        var stencil = new Stencil(f);
        bool nine = stencil.NinePoint;
        for (int J = 0; J < ncy; J++)
            for (int I = 0; I < ncx; I++)
            {
                int k = J * ncx + I;
                int p0 = 2 * J * fnx + 2 * I;
                patch.Clear();
                for (int t = 0; t < 9; t++)
                {
                    double v = Unsafe.Add(ref phi, 9 * k + t);
                    if (v == 0) continue;   // also every support node off the lattice
                    int mi = t % 3 - 1, mj = t / 3 - 1;
                    var row = new Row(stencil, p0 + mj * fnx + mi);
                    int centre = (mj + 2) * 5 + mi + 2;   // the support node's place in the 5 x 5 patch
                    Unsafe.Add(ref a, centre) += row.C * v;
                    Unsafe.Add(ref a, centre - 1) += row.W * v;
                    Unsafe.Add(ref a, centre + 1) += row.E * v;
                    Unsafe.Add(ref a, centre - 5) += row.S * v;
                    Unsafe.Add(ref a, centre + 5) += row.N * v;
                    if (!nine) continue;   // a 5-point level has no corner couplings
                    Unsafe.Add(ref a, centre - 6) += row.SW * v;
                    Unsafe.Add(ref a, centre + 6) += row.NE * v;
                    Unsafe.Add(ref a, centre - 4) += row.SE * v;
                    Unsafe.Add(ref a, centre + 4) += row.NW * v;
                }
                int b = 9 * k;   // phi_K: patch places 6 7 8 / 11 12 13 / 16 17 18
                cc[k] = phiArray[b] * patch[6] + phiArray[b + 1] * patch[7] + phiArray[b + 2] * patch[8] + phiArray[b + 3] * patch[11] + phiArray[b + 4] * patch[12]
                      + phiArray[b + 5] * patch[13] + phiArray[b + 6] * patch[16] + phiArray[b + 7] * patch[17] + phiArray[b + 8] * patch[18];
                if (I > 0)
                {
                    b = 9 * (k - 1);   // the west neighbour's columns 0, 1 over K's patch columns 0, 1 (rows 1 to 3)
                    cw[k] = phiArray[b + 1] * patch[5] + phiArray[b + 2] * patch[6] + phiArray[b + 4] * patch[10] + phiArray[b + 5] * patch[11] + phiArray[b + 7] * patch[15] + phiArray[b + 8] * patch[16];
                }
                if (J > 0)
                {
                    b = 9 * (k - ncx);   // the south neighbour's rows 1, 2 over K's patch rows 0, 1 (columns 1 to 3)
                    cs[k] = phiArray[b + 3] * patch[1] + phiArray[b + 4] * patch[2] + phiArray[b + 5] * patch[3] + phiArray[b + 6] * patch[6] + phiArray[b + 7] * patch[7] + phiArray[b + 8] * patch[8];
                    if (I > 0)
                    {
                        b = 9 * (k - ncx - 1);   // south-west: its north-east 2 x 2 over K's patch corner 0, 1, 5, 6
                        csw[k] = phiArray[b + 4] * patch[0] + phiArray[b + 5] * patch[1] + phiArray[b + 7] * patch[5] + phiArray[b + 8] * patch[6];
                    }
                    if (I + 1 < ncx)
                    {
                        b = 9 * (k - ncx + 1);   // south-east: its north-west 2 x 2 over K's patch corner 3, 4, 8, 9
                        cse[k] = phiArray[b + 3] * patch[3] + phiArray[b + 4] * patch[4] + phiArray[b + 6] * patch[8] + phiArray[b + 7] * patch[9];
                    }
                }
            }
    }

    /// <summary>
    /// Every coarse node's prolongation weights at its 3 x 3 fine neighbourhood, phi[9 k + (dj + 1) 3 + di + 1] for offset (di, dj);
    /// 0 off the lattice (the prolongation arrays hold 0 there, so only the low edges I = 0, J = 0 need a test).
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static float[] Bases(StencilLevel c)
    {
        int ncx = c.Nx, ncy = c.Ny;
        var phi = new float[9 * ncx * ncy];
        var xl = c.XLow!; var xh = c.XHigh!; var yl = c.YLow!; var yh = c.YHigh!;
        var sw = c.CentreSW!; var se = c.CentreSE!; var nw = c.CentreNW!; var ne = c.CentreNE!;
        for (int J = 0; J < ncy; J++)
            for (int I = 0; I < ncx; I++)
            {
                int k = J * ncx + I, b = 9 * k;
                bool west = I > 0, south = J > 0;
                phi[b + 4] = 1;
                phi[b + 5] = xl[k];
                phi[b + 3] = west ? xh[k - 1] : 0;
                phi[b + 7] = yl[k];
                phi[b + 1] = south ? yh[k - ncx] : 0;
                phi[b + 8] = sw[k];
                phi[b + 6] = west ? se[k - 1] : 0;
                phi[b + 2] = south ? nw[k - ncx] : 0;
                phi[b + 0] = west && south ? ne[k - ncx - 1] : 0;
            }
        return phi;
    }
}
