using System.Runtime.CompilerServices;
using System.Runtime.InteropServices;
using System.Runtime.Intrinsics;
using System.Runtime.Intrinsics.X86;

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
    /// <summary>The next coarser level with its prolongation.</summary>
    public static StencilLevel Coarsen(StencilLevel f)
    {
        int ncx = (f.Nx + 1) / 2, ncy = (f.Ny + 1) / 2;
        int nc = ncx * ncy;
        var c = new StencilLevel(ncx, ncy, ninePoint: true)
        {
            XLow = new float[nc], XHigh = new float[nc], YLow = new float[nc], YHigh = new float[nc],
            CentreSW = new float[nc], CentreSE = new float[nc], CentreNW = new float[nc], CentreNE = new float[nc],
        };
        ProlongationAndGalerkinOperator(f, c);
        return c;
    }

    /// <summary>1 / d, or 0 for a node with no positive denominator (then every weight through it is 0): one division for the two or four weights that share d.</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static double Inverse(double denominator) => denominator > 0 ? 1 / denominator : 0;

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

    /// <summary>The prolongation weights of the fine nodes on coarse row J's lines: between coarse nodes in x (fine row 2J) and in y (fine row 2J + 1).</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static void LineWeights(in Stencil stencil, StencilLevel c, int fny, int J)
    {
        int ncx = c.Nx, ncy = c.Ny, fnx = stencil.Nx;
        var xLow = c.XLow!; var xHigh = c.XHigh!; var yLow = c.YLow!; var yHigh = c.YHigh!;
        // four coarse nodes a vector step where both their lines and every weight's far node lie on the lattice
        int lastVector = Avx.IsSupported && 2 * J + 1 < fny && J + 1 < ncy ? Math.Min((fnx - 2) / 2, ncx - 2) : -1;
        for (int I = 0; I < ncx; I++)
        {
            int k = J * ncx + I;
            if (I + Vector256<double>.Count - 1 <= lastVector)
            {
                LineWeightsVector(stencil, c, k, 2 * J * fnx + 2 * I + 1, (2 * J + 1) * fnx + 2 * I);
                I += Vector256<double>.Count - 1;
                continue;
            }
            int i = 2 * I + 1, j = 2 * J;
            if (i < fnx)
            {
                var a = new Row(stencil, j * fnx + i);
                double inverse = Inverse(a.C + a.S + a.N);
                xLow[k] = (float)(-(a.W + a.SW + a.NW) * inverse);
                xHigh[k] = I + 1 < ncx ? (float)(-(a.E + a.SE + a.NE) * inverse) : 0;
            }
            i = 2 * I; j = 2 * J + 1;
            if (j < fny)
            {
                var a = new Row(stencil, j * fnx + i);
                double inverse = Inverse(a.C + a.W + a.E);
                yLow[k] = (float)(-(a.S + a.SW + a.SE) * inverse);
                yHigh[k] = J + 1 < ncy ? (float)(-(a.N + a.NW + a.NE) * inverse) : 0;
            }
        }
    }

    /// <summary>The prolongation weights of the fine nodes at the centres of coarse row J's cells (fine row 2J + 1), from the line weights of coarse rows J and J + 1.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static void CentreWeights(in Stencil stencil, StencilLevel c, int fny, int J)
    {
        int ncx = c.Nx, ncy = c.Ny, fnx = stencil.Nx;
        var xLow = c.XLow!; var xHigh = c.XHigh!; var yLow = c.YLow!; var yHigh = c.YHigh!;
        var cSW = c.CentreSW!; var cSE = c.CentreSE!; var cNW = c.CentreNW!; var cNE = c.CentreNE!;
        int j = 2 * J + 1;
        if (j >= fny) return;
        bool north = J + 1 < ncy;
        int lastVector = Avx.IsSupported && north ? Math.Min((fnx - 2) / 2, ncx - 2) : -1;   // as in LineWeights
        for (int I = 0; I < ncx; I++)
        {
            int i = 2 * I + 1;
            if (i >= fnx) continue;
            int k = J * ncx + I;
            if (I + Vector256<double>.Count - 1 <= lastVector)
            {
                CentreWeightsVector(stencil, c, k, j * fnx + i);
                I += Vector256<double>.Count - 1;
                continue;
            }
            bool east = I + 1 < ncx;
            var a = new Row(stencil, j * fnx + i);
            // the x/y-line neighbours' weights towards each corner (0 where that line node or corner is off the lattice)
            double wSouthLine = yLow[k], nWestLine = yHigh[k];                               // west neighbour (2I, 2J+1)
            double eSouthLine = east ? yLow[k + 1] : 0, eNorthLine = east ? yHigh[k + 1] : 0; // east neighbour (2I+2, 2J+1)
            double sWestLine = xLow[k], sEastLine = xHigh[k];                                // south neighbour (2I+1, 2J)
            double nWest = north ? xLow[k + ncx] : 0, nEast = north ? xHigh[k + ncx] : 0;    // north neighbour (2I+1, 2J+2)
            double inverse = Inverse(a.C);
            cSW[k] = (float)(-(a.SW + a.W * wSouthLine + a.S * sWestLine) * inverse);
            cSE[k] = east ? (float)(-(a.SE + a.E * eSouthLine + a.S * sEastLine) * inverse) : 0;
            cNW[k] = north ? (float)(-(a.NW + a.W * nWestLine + a.N * nWest) * inverse) : 0;
            cNE[k] = east && north ? (float)(-(a.NE + a.E * eNorthLine + a.N * nEast) * inverse) : 0;
        }
    }

    /// <summary>
    /// The rows of the four fine nodes p, p + 2, p + 4, p + 6 as vectors (a lane a node; the corners 0 on a 5-point level, as
    /// <see cref="Row"/> has them), for the weights' vector steps.
    /// </summary>
    private readonly struct FourRows
    {
        public readonly Vector256<double> C, W, E, S, N, SW, SE, NW, NE;

        [MethodImpl(MethodImplOptions.AggressiveInlining)]
        public FourRows(in Stencil f, int p)
        {
            int nx = f.Nx;
            (C, _) = Pair(ref f.Centre, p);
            (W, E) = Pair(ref f.West, p);
            (S, _) = Pair(ref f.South, p);
            (N, _) = Pair(ref f.South, p + nx);
            if (f.NinePoint)
            {
                (SW, _) = Pair(ref f.SouthWest, p); (NE, _) = Pair(ref f.SouthWest, p + nx + 1);
                (SE, _) = Pair(ref f.SouthEast, p); (NW, _) = Pair(ref f.SouthEast, p + nx - 1);
            }
            else { SW = default; NE = default; SE = default; NW = default; }
        }
    }

    /// <summary><see cref="Inverse"/> lane by lane.</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static Vector256<double> Inverse(Vector256<double> denominator) =>
        Vector256.ConditionalSelect(Vector256.GreaterThan(denominator, Vector256<double>.Zero), Vector256<double>.One / denominator, Vector256<double>.Zero);

    /// <summary>value rounded to single precision (as the scalar cast rounds it) into a[i .. i + 3].</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static void StoreSingle(Vector256<double> value, float[] a, int i) =>
        Avx.ConvertToVector128Single(value).StoreUnsafe(ref MemoryMarshal.GetArrayDataReference(a), (nuint)i);

    /// <summary>
    /// <see cref="LineWeights"/> for the four coarse nodes k .. k + 3 of a row whose x-line fine nodes start at xNode and y-line ones at
    /// yNode (each with both neighbours on the lattice): the same sums and products in the same order, each lane rounded as the scalar form.
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static void LineWeightsVector(in Stencil stencil, StencilLevel c, int k, int xNode, int yNode)
    {
        var a = new FourRows(stencil, xNode);
        var inverse = Inverse(a.C + a.S + a.N);
        StoreSingle(-(a.W + a.SW + a.NW) * inverse, c.XLow!, k);
        StoreSingle(-(a.E + a.SE + a.NE) * inverse, c.XHigh!, k);
        a = new FourRows(stencil, yNode);
        inverse = Inverse(a.C + a.W + a.E);
        StoreSingle(-(a.S + a.SW + a.SE) * inverse, c.YLow!, k);
        StoreSingle(-(a.N + a.NW + a.NE) * inverse, c.YHigh!, k);
    }

    /// <summary><see cref="CentreWeights"/> for the four coarse nodes k .. k + 3 of a row with a row above, their centre fine nodes from node.</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static void CentreWeightsVector(in Stencil stencil, StencilLevel c, int k, int node)
    {
        var a = new FourRows(stencil, node);
        int ncx = c.Nx;
        var wSouthLine = Widen(ref MemoryMarshal.GetArrayDataReference(c.YLow!), k); var nWestLine = Widen(ref MemoryMarshal.GetArrayDataReference(c.YHigh!), k);
        var eSouthLine = Widen(ref MemoryMarshal.GetArrayDataReference(c.YLow!), k + 1); var eNorthLine = Widen(ref MemoryMarshal.GetArrayDataReference(c.YHigh!), k + 1);
        var sWestLine = Widen(ref MemoryMarshal.GetArrayDataReference(c.XLow!), k); var sEastLine = Widen(ref MemoryMarshal.GetArrayDataReference(c.XHigh!), k);
        var nWest = Widen(ref MemoryMarshal.GetArrayDataReference(c.XLow!), k + ncx); var nEast = Widen(ref MemoryMarshal.GetArrayDataReference(c.XHigh!), k + ncx);
        var inverse = Inverse(a.C);
        StoreSingle(-(a.SW + a.W * wSouthLine + a.S * sWestLine) * inverse, c.CentreSW!, k);
        StoreSingle(-(a.SE + a.E * eSouthLine + a.S * sEastLine) * inverse, c.CentreSE!, k);
        StoreSingle(-(a.NW + a.W * nWestLine + a.N * nWest) * inverse, c.CentreNW!, k);
        StoreSingle(-(a.NE + a.E * eNorthLine + a.N * nEast) * inverse, c.CentreNE!, k);
    }

    /// <summary>
    /// A_c(K, L) = phi_K^T A phi_L with phi_K coarse node K's prolongation (support: the 3 x 3 fine
    /// nodes around it); per coarse node A phi_K is formed on the 5 x 5 patch around it and dotted
    /// with the basis functions of K and its west, south, south-west and south-east neighbours
    /// (each dot product spelled out over the fine nodes the two supports share). The basis values are read straight from the
    /// prolongation arrays (see <see cref="Basis"/>), never gathered into a table. The coarse nodes away from the lattice's edges
    /// take <see cref="InteriorFromFivePoint"/> or <see cref="InteriorFromNinePoint"/>, the same sums without the loop (the first two
    /// coarsenings are most of the setup), four nodes at a time where the processor has AVX (<see cref="InteriorFromFivePointVector"/>, <see cref="InteriorFromNinePointVector"/>).
    /// The vector ones are too large for the caller's inlining budget: they are calls, compiled optimised on their first one (as tier-0
    /// code they ran a process's second 128² plate in 36-39 ms against 15-18 for the scalar form's, 2026-12-03); the scalar ones, which
    /// only take the few nodes left at a row's end, are left to tiered compilation. One pass over the coarse rows: row J + 1's line weights and row J's centre weights, then
    /// row J's coarse operator, while the fine rows they all read (2J - 2 to 2J + 3) are in cache.
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static void ProlongationAndGalerkinOperator(StencilLevel f, StencilLevel c)
    {
        int ncx = c.Nx, ncy = c.Ny, fnx = f.Nx, fny = f.Ny;
        var weights = new Weights(c);
        Span<double> patch = stackalloc double[25];   // A phi_K on K's 5 x 5 patch, row by row from the south-west corner
        ref double a = ref MemoryMarshal.GetReference(patch);
        // the bases of K and of its west, south, south-west and south-east neighbours at their 3 x 3 supports (edge nodes only)
        Span<double> bases = stackalloc double[5 * 9];
        Span<double> phiK = bases[..9], phiW = bases[9..18], phiS = bases[18..27], phiSW = bases[27..36], phiSE = bases[36..];
        var cc = c.Centre; var cw = c.West; var cs = c.South; var csw = c.SouthWest!; var cse = c.SouthEast!;
        var stencil = new Stencil(f);
        bool nine = stencil.NinePoint;
        // the last coarse column whose support lies inside the fine lattice and which has an east neighbour: the vector steps' end
        int lastVectorColumn = Math.Min((fnx - 2) / 2, ncx - 2);
        int width = Avx.IsSupported ? Vector256<double>.Count : int.MaxValue / 4;   // coarse nodes a vector step covers (none without AVX)
        LineWeights(stencil, c, fny, 0);
        for (int J = 0; J < ncy; J++)
        {
            if (J + 1 < ncy) LineWeights(stencil, c, fny, J + 1);
            CentreWeights(stencil, c, fny, J);
            bool innerRow = J > 0 && 2 * J + 1 < fny;
            for (int I = 0; I < ncx; I++)
            {
                int k = J * ncx + I;
                int p0 = 2 * J * fnx + 2 * I;
                if (innerRow && I > 0 && I + width - 1 <= lastVectorColumn)
                {
                    if (nine) InteriorFromNinePointVector(stencil, weights, k, p0, ncx, cc, cw, cs, csw, cse);
                    else InteriorFromFivePointVector(stencil, weights, k, p0, ncx, cc, cw, cs, csw, cse);
                    I += width - 1;
                    continue;
                }
                if (I > 0 && J > 0 && 2 * I + 1 < fnx && 2 * J + 1 < fny)
                {
                    if (nine) InteriorFromNinePoint(stencil, weights, k, p0, ncx, I, cc, cw, cs, csw, cse);
                    else InteriorFromFivePoint(stencil, weights, k, p0, ncx, I, cc, cw, cs, csw, cse);
                    continue;
                }
                Basis(weights, k, I, J, ncx, phiK);
                patch.Clear();
                for (int t = 0; t < 9; t++)
                {
                    double v = phiK[t];
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
                // phi_K: patch places 6 7 8 / 11 12 13 / 16 17 18
                cc[k] = phiK[0] * patch[6] + phiK[1] * patch[7] + phiK[2] * patch[8] + phiK[3] * patch[11] + phiK[4] * patch[12]
                      + phiK[5] * patch[13] + phiK[6] * patch[16] + phiK[7] * patch[17] + phiK[8] * patch[18];
                if (I > 0)
                {
                    Basis(weights, k - 1, I - 1, J, ncx, phiW);   // the west neighbour's columns 1, 2 over K's patch columns 0, 1 (rows 1 to 3)
                    cw[k] = phiW[1] * patch[5] + phiW[2] * patch[6] + phiW[4] * patch[10] + phiW[5] * patch[11] + phiW[7] * patch[15] + phiW[8] * patch[16];
                }
                if (J > 0)
                {
                    Basis(weights, k - ncx, I, J - 1, ncx, phiS);   // the south neighbour's rows 1, 2 over K's patch rows 0, 1 (columns 1 to 3)
                    cs[k] = phiS[3] * patch[1] + phiS[4] * patch[2] + phiS[5] * patch[3] + phiS[6] * patch[6] + phiS[7] * patch[7] + phiS[8] * patch[8];
                    if (I > 0)
                    {
                        Basis(weights, k - ncx - 1, I - 1, J - 1, ncx, phiSW);   // south-west: its north-east 2 x 2 over K's patch corner 0, 1, 5, 6
                        csw[k] = phiSW[4] * patch[0] + phiSW[5] * patch[1] + phiSW[7] * patch[5] + phiSW[8] * patch[6];
                    }
                    if (I + 1 < ncx)
                    {
                        Basis(weights, k - ncx + 1, I + 1, J - 1, ncx, phiSE);   // south-east: its north-west 2 x 2 over K's patch corner 3, 4, 8, 9
                        cse[k] = phiSE[3] * patch[3] + phiSE[4] * patch[4] + phiSE[6] * patch[8] + phiSE[7] * patch[9];
                    }
                }
            }
        }
    }

    /// <summary>A coarse level's prolongation arrays as references, for the Galerkin product's reads of the basis values.</summary>
    private readonly ref struct Weights
    {
        public readonly ref float XLow, XHigh, YLow, YHigh, CentreSW, CentreSE, CentreNW, CentreNE;

        public Weights(StencilLevel c)
        {
            XLow = ref MemoryMarshal.GetArrayDataReference(c.XLow!); XHigh = ref MemoryMarshal.GetArrayDataReference(c.XHigh!);
            YLow = ref MemoryMarshal.GetArrayDataReference(c.YLow!); YHigh = ref MemoryMarshal.GetArrayDataReference(c.YHigh!);
            CentreSW = ref MemoryMarshal.GetArrayDataReference(c.CentreSW!); CentreSE = ref MemoryMarshal.GetArrayDataReference(c.CentreSE!);
            CentreNW = ref MemoryMarshal.GetArrayDataReference(c.CentreNW!); CentreNE = ref MemoryMarshal.GetArrayDataReference(c.CentreNE!);
        }
    }

    /// <summary>
    /// Coarse node k's (at (I, J)) prolongation weights at its 3 x 3 fine neighbourhood, phi[(dj + 1) 3 + di + 1] for offset (di, dj):
    /// 1 at the node itself, the line and centre weights of the fine nodes around it; 0 off the lattice (the prolongation arrays hold
    /// 0 there, so only the low edges I = 0, J = 0 need a test).
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static void Basis(in Weights w, int k, int I, int J, int ncx, Span<double> phi)
    {
        bool west = I > 0, south = J > 0;
        phi[4] = 1;
        phi[5] = Unsafe.Add(ref w.XLow, k);
        phi[3] = west ? Unsafe.Add(ref w.XHigh, k - 1) : 0;
        phi[7] = Unsafe.Add(ref w.YLow, k);
        phi[1] = south ? Unsafe.Add(ref w.YHigh, k - ncx) : 0;
        phi[8] = Unsafe.Add(ref w.CentreSW, k);
        phi[6] = west ? Unsafe.Add(ref w.CentreSE, k - 1) : 0;
        phi[2] = south ? Unsafe.Add(ref w.CentreNW, k - ncx) : 0;
        phi[0] = west && south ? Unsafe.Add(ref w.CentreNE, k - ncx - 1) : 0;
    }

    /// <summary>
    /// <see cref="GalerkinOperator"/>'s entries for a coarse node whose 3 x 3 support lies inside a 5-point fine level: the same terms
    /// summed in the same order as the patch loop (so the same bits: a term with a 0 factor left out adds exactly 0, one with the
    /// basis value 1 is the other factor), the patch held in locals and A's corners (0 on a 5-point level) left out.
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static void InteriorFromFivePoint(in Stencil stencil, in Weights w, int k, int p0, int ncx, int I, double[] cc, double[] cw, double[] cs, double[] csw, double[] cse)
    {
        int fnx = stencil.Nx;
        // phi_K's values (1 at K itself): offsets (-1, -1) ... (1, 1), row by row
        double v0 = Unsafe.Add(ref w.CentreNE, k - ncx - 1), v1 = Unsafe.Add(ref w.YHigh, k - ncx), v2 = Unsafe.Add(ref w.CentreNW, k - ncx),
            v3 = Unsafe.Add(ref w.XHigh, k - 1), v4 = 1, v5 = Unsafe.Add(ref w.XLow, k),
            v6 = Unsafe.Add(ref w.CentreSE, k - 1), v7 = Unsafe.Add(ref w.YLow, k), v8 = Unsafe.Add(ref w.CentreSW, k);
        int n0 = p0 - fnx - 1;
        double C0 = Unsafe.Add(ref stencil.Centre, n0), W0 = Unsafe.Add(ref stencil.West, n0), E0 = Unsafe.Add(ref stencil.West, n0 + 1), S0 = Unsafe.Add(ref stencil.South, n0), N0 = Unsafe.Add(ref stencil.South, n0 + fnx);
        int n1 = p0 - fnx;
        double C1 = Unsafe.Add(ref stencil.Centre, n1), W1 = Unsafe.Add(ref stencil.West, n1), E1 = Unsafe.Add(ref stencil.West, n1 + 1), S1 = Unsafe.Add(ref stencil.South, n1), N1 = Unsafe.Add(ref stencil.South, n1 + fnx);
        int n2 = p0 - fnx + 1;
        double C2 = Unsafe.Add(ref stencil.Centre, n2), W2 = Unsafe.Add(ref stencil.West, n2), E2 = Unsafe.Add(ref stencil.West, n2 + 1), S2 = Unsafe.Add(ref stencil.South, n2), N2 = Unsafe.Add(ref stencil.South, n2 + fnx);
        int n3 = p0 - 1;
        double C3 = Unsafe.Add(ref stencil.Centre, n3), W3 = Unsafe.Add(ref stencil.West, n3), E3 = Unsafe.Add(ref stencil.West, n3 + 1), S3 = Unsafe.Add(ref stencil.South, n3), N3 = Unsafe.Add(ref stencil.South, n3 + fnx);
        int n4 = p0;
        double C4 = Unsafe.Add(ref stencil.Centre, n4), W4 = Unsafe.Add(ref stencil.West, n4), E4 = Unsafe.Add(ref stencil.West, n4 + 1), S4 = Unsafe.Add(ref stencil.South, n4), N4 = Unsafe.Add(ref stencil.South, n4 + fnx);
        int n5 = p0 + 1;
        double C5 = Unsafe.Add(ref stencil.Centre, n5), W5 = Unsafe.Add(ref stencil.West, n5), E5 = Unsafe.Add(ref stencil.West, n5 + 1), S5 = Unsafe.Add(ref stencil.South, n5), N5 = Unsafe.Add(ref stencil.South, n5 + fnx);
        int n6 = p0 + fnx - 1;
        double C6 = Unsafe.Add(ref stencil.Centre, n6), W6 = Unsafe.Add(ref stencil.West, n6), E6 = Unsafe.Add(ref stencil.West, n6 + 1), S6 = Unsafe.Add(ref stencil.South, n6), N6 = Unsafe.Add(ref stencil.South, n6 + fnx);
        int n7 = p0 + fnx;
        double C7 = Unsafe.Add(ref stencil.Centre, n7), W7 = Unsafe.Add(ref stencil.West, n7), E7 = Unsafe.Add(ref stencil.West, n7 + 1), S7 = Unsafe.Add(ref stencil.South, n7), N7 = Unsafe.Add(ref stencil.South, n7 + fnx);
        int n8 = p0 + fnx + 1;
        double C8 = Unsafe.Add(ref stencil.Centre, n8), W8 = Unsafe.Add(ref stencil.West, n8), E8 = Unsafe.Add(ref stencil.West, n8 + 1), S8 = Unsafe.Add(ref stencil.South, n8), N8 = Unsafe.Add(ref stencil.South, n8 + fnx);
        // a_m = (A phi_K) at patch place m (5 x 5, row by row from the south-west corner, K at 12), each a sum over the support nodes
        // in the patch loop's order; places 0 and 4 (the patch's lower corners) are 0 on a 5-point level, 14 and up are not needed
        double a1 = S0 * v0;
        double a2 = S1 * v1;
        double a3 = S2 * v2;
        double a5 = W0 * v0;
        double a6 = C0 * v0 + W1 * v1 + S3 * v3;
        double a7 = E0 * v0 + C1 * v1 + W2 * v2 + S4 * v4;
        double a8 = E1 * v1 + C2 * v2 + S5 * v5;
        double a9 = E2 * v2;
        double a10 = W3 * v3;
        double a11 = N0 * v0 + C3 * v3 + W4 * v4 + S6 * v6;
        double a12 = N1 * v1 + E3 * v3 + C4 * v4 + W5 * v5 + S7 * v7;
        double a13 = N2 * v2 + E4 * v4 + C5 * v5 + S8 * v8;
        double a15 = W6 * v6;
        double a16 = N3 * v3 + C6 * v6 + W7 * v7;
        double a17 = N4 * v4 + E6 * v6 + C7 * v7 + W8 * v8;
        double a18 = N5 * v5 + E7 * v7 + C8 * v8;
        cc[k] = v0 * a6 + v1 * a7 + v2 * a8 + v3 * a11 + a12 + v5 * a13 + v6 * a16 + v7 * a17 + v8 * a18;
        // the west neighbour's basis at columns 0, 1 of its support (1 at the neighbour itself)
        cw[k] = Unsafe.Add(ref w.YHigh, k - 1 - ncx) * a5 + Unsafe.Add(ref w.CentreNW, k - 1 - ncx) * a6 + a10 + Unsafe.Add(ref w.XLow, k - 1) * a11
              + Unsafe.Add(ref w.YLow, k - 1) * a15 + Unsafe.Add(ref w.CentreSW, k - 1) * a16;
        // the south neighbour's basis at rows 1, 2 of its support
        cs[k] = Unsafe.Add(ref w.XHigh, k - ncx - 1) * a1 + a2 + Unsafe.Add(ref w.XLow, k - ncx) * a3 + Unsafe.Add(ref w.CentreSE, k - ncx - 1) * a6
              + Unsafe.Add(ref w.YLow, k - ncx) * a7 + Unsafe.Add(ref w.CentreSW, k - ncx) * a8;
        // the south-west neighbour's basis at its north-east 2 x 2 (its 1 meets the patch's corner 0, which is 0 here)
        csw[k] = Unsafe.Add(ref w.XLow, k - ncx - 1) * a1 + Unsafe.Add(ref w.YLow, k - ncx - 1) * a5 + Unsafe.Add(ref w.CentreSW, k - ncx - 1) * a6;
        if (I + 1 < ncx)   // the south-east neighbour's basis at its north-west 2 x 2 (patch corner 4 is 0 here)
            cse[k] = Unsafe.Add(ref w.XHigh, k - ncx) * a3 + Unsafe.Add(ref w.CentreSE, k - ncx) * a8 + Unsafe.Add(ref w.YLow, k - ncx + 1) * a9;
    }

    /// <summary>
    /// <see cref="InteriorFromFivePoint"/> for the Vector256&lt;double&gt;.Count coarse nodes k, k + 1, ... of one row (each inside the lattice
    /// with an east neighbour), a lane a node: the fine stencil's entries at stride 2 split from pairs of vectors (<see cref="Pair"/>), the
    /// weights widened from single precision, and every sum formed with the scalar form's products in its order (no fused multiply-add), so
    /// each lane rounds as <see cref="InteriorFromFivePoint"/> does and the coarse operator is the same to the bit.
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static void InteriorFromFivePointVector(in Stencil stencil, in Weights w, int k, int p0, int ncx, double[] cc, double[] cw, double[] cs, double[] csw, double[] cse)
    {
        int fnx = stencil.Nx;
        var v0 = Widen(ref w.CentreNE, k - ncx - 1); var v1 = Widen(ref w.YHigh, k - ncx); var v2 = Widen(ref w.CentreNW, k - ncx);
        var v3 = Widen(ref w.XHigh, k - 1); var v5 = Widen(ref w.XLow, k);
        var v6 = Widen(ref w.CentreSE, k - 1); var v7 = Widen(ref w.YLow, k); var v8 = Widen(ref w.CentreSW, k);
        // fine rows 2J - 1, 2J, 2J + 1 (support rows 0, 1, 2), columns 2I - 1, 2I, 2I + 1 (and 2I + 2 for the east coupling of the last)
        int q0 = p0 - fnx, q1 = p0, q2 = p0 + fnx;
        var (C0, C1) = Pair(ref stencil.Centre, q0 - 1); var (C2, _) = Pair(ref stencil.Centre, q0 + 1);
        var (C3, C4) = Pair(ref stencil.Centre, q1 - 1); var (C5, _) = Pair(ref stencil.Centre, q1 + 1);
        var (C6, C7) = Pair(ref stencil.Centre, q2 - 1); var (C8, _) = Pair(ref stencil.Centre, q2 + 1);
        var (W0, W1) = Pair(ref stencil.West, q0 - 1); var (W2, E2) = Pair(ref stencil.West, q0 + 1);
        var (W3, W4) = Pair(ref stencil.West, q1 - 1); var (W5, E5) = Pair(ref stencil.West, q1 + 1);
        var (W6, W7) = Pair(ref stencil.West, q2 - 1); var (W8, E8) = Pair(ref stencil.West, q2 + 1);
        Vector256<double> E0 = W1, E1 = W2, E3 = W4, E4 = W5, E6 = W7, E7 = W8;
        var (S0, S1) = Pair(ref stencil.South, q0 - 1); var (S2, _) = Pair(ref stencil.South, q0 + 1);
        var (S3, S4) = Pair(ref stencil.South, q1 - 1); var (S5, _) = Pair(ref stencil.South, q1 + 1);
        var (S6, S7) = Pair(ref stencil.South, q2 - 1); var (S8, _) = Pair(ref stencil.South, q2 + 1);
        Vector256<double> N0 = S3, N1 = S4, N2 = S5, N3 = S6, N4 = S7, N5 = S8;   // the north couplings of support row 2 enter only patch places 19 and up
        _ = E5; _ = E8;   // as the east couplings of support column 2 below row 0 (patch places 14 and 19)
        // as in InteriorFromFivePoint, the term with v4 = 1 is its other factor
        var a1 = S0 * v0;
        var a2 = S1 * v1;
        var a3 = S2 * v2;
        var a5 = W0 * v0;
        var a6 = C0 * v0 + W1 * v1 + S3 * v3;
        var a7 = E0 * v0 + C1 * v1 + W2 * v2 + S4;
        var a8 = E1 * v1 + C2 * v2 + S5 * v5;
        var a9 = E2 * v2;
        var a10 = W3 * v3;
        var a11 = N0 * v0 + C3 * v3 + W4 + S6 * v6;
        var a12 = N1 * v1 + E3 * v3 + C4 + W5 * v5 + S7 * v7;
        var a13 = N2 * v2 + E4 + C5 * v5 + S8 * v8;
        var a15 = W6 * v6;
        var a16 = N3 * v3 + C6 * v6 + W7 * v7;
        var a17 = N4 + E6 * v6 + C7 * v7 + W8 * v8;
        var a18 = N5 * v5 + E7 * v7 + C8 * v8;
        (v0 * a6 + v1 * a7 + v2 * a8 + v3 * a11 + a12 + v5 * a13 + v6 * a16 + v7 * a17 + v8 * a18).StoreUnsafe(ref MemoryMarshal.GetArrayDataReference(cc), (nuint)k);
        (Widen(ref w.YHigh, k - 1 - ncx) * a5 + Widen(ref w.CentreNW, k - 1 - ncx) * a6 + a10 + Widen(ref w.XLow, k - 1) * a11
            + Widen(ref w.YLow, k - 1) * a15 + Widen(ref w.CentreSW, k - 1) * a16).StoreUnsafe(ref MemoryMarshal.GetArrayDataReference(cw), (nuint)k);
        (Widen(ref w.XHigh, k - ncx - 1) * a1 + a2 + Widen(ref w.XLow, k - ncx) * a3 + Widen(ref w.CentreSE, k - ncx - 1) * a6
            + Widen(ref w.YLow, k - ncx) * a7 + Widen(ref w.CentreSW, k - ncx) * a8).StoreUnsafe(ref MemoryMarshal.GetArrayDataReference(cs), (nuint)k);
        (Widen(ref w.XLow, k - ncx - 1) * a1 + Widen(ref w.YLow, k - ncx - 1) * a5 + Widen(ref w.CentreSW, k - ncx - 1) * a6).StoreUnsafe(ref MemoryMarshal.GetArrayDataReference(csw), (nuint)k);
        (Widen(ref w.XHigh, k - ncx) * a3 + Widen(ref w.CentreSE, k - ncx) * a8 + Widen(ref w.YLow, k - ncx + 1) * a9).StoreUnsafe(ref MemoryMarshal.GetArrayDataReference(cse), (nuint)k);
    }

    /// <summary><see cref="InteriorFromNinePoint"/> for four coarse nodes of one row, as <see cref="InteriorFromFivePointVector"/> does it for a 5-point level.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static void InteriorFromNinePointVector(in Stencil stencil, in Weights w, int k, int p0, int ncx, double[] cc, double[] cw, double[] cs, double[] csw, double[] cse)
    {
        int fnx = stencil.Nx;
        var v0 = Widen(ref w.CentreNE, k - ncx - 1); var v1 = Widen(ref w.YHigh, k - ncx); var v2 = Widen(ref w.CentreNW, k - ncx);
        var v3 = Widen(ref w.XHigh, k - 1); var v5 = Widen(ref w.XLow, k);
        var v6 = Widen(ref w.CentreSE, k - 1); var v7 = Widen(ref w.YLow, k); var v8 = Widen(ref w.CentreSW, k);
        int q0 = p0 - fnx, q1 = p0, q2 = p0 + fnx;
        var (C0, C1) = Pair(ref stencil.Centre, q0 - 1); var (C2, _) = Pair(ref stencil.Centre, q0 + 1);
        var (C3, C4) = Pair(ref stencil.Centre, q1 - 1); var (C5, _) = Pair(ref stencil.Centre, q1 + 1);
        var (C6, C7) = Pair(ref stencil.Centre, q2 - 1); var (C8, _) = Pair(ref stencil.Centre, q2 + 1);
        var (W0, W1) = Pair(ref stencil.West, q0 - 1); var (W2, E2) = Pair(ref stencil.West, q0 + 1);
        var (W3, W4) = Pair(ref stencil.West, q1 - 1); var (W5, _) = Pair(ref stencil.West, q1 + 1);
        var (W6, W7) = Pair(ref stencil.West, q2 - 1); var (W8, _) = Pair(ref stencil.West, q2 + 1);
        Vector256<double> E0 = W1, E1 = W2, E3 = W4, E4 = W5, E6 = W7, E7 = W8;
        var (S0, S1) = Pair(ref stencil.South, q0 - 1); var (S2, _) = Pair(ref stencil.South, q0 + 1);
        var (S3, S4) = Pair(ref stencil.South, q1 - 1); var (S5, _) = Pair(ref stencil.South, q1 + 1);
        var (S6, S7) = Pair(ref stencil.South, q2 - 1); var (S8, _) = Pair(ref stencil.South, q2 + 1);
        Vector256<double> N0 = S3, N1 = S4, N2 = S5, N3 = S6, N4 = S7, N5 = S8;
        // south-west couplings of support rows 0 to 2; the north-east ones are the south-west ones a row up and a column right
        var (SW0, SW1) = Pair(ref stencil.SouthWest, q0 - 1); var (SW2, _) = Pair(ref stencil.SouthWest, q0 + 1);
        var (SW3, SW4) = Pair(ref stencil.SouthWest, q1 - 1); var (SW5, _) = Pair(ref stencil.SouthWest, q1 + 1);
        var (SW6, SW7) = Pair(ref stencil.SouthWest, q2 - 1); var (SW8, _) = Pair(ref stencil.SouthWest, q2 + 1);
        Vector256<double> NE0 = SW4, NE1 = SW5, NE3 = SW7, NE4 = SW8;
        // south-east couplings; the north-west ones are the south-east ones a row up and a column left (column 2I - 2 for support column 0)
        var (SE0, SE1) = Pair(ref stencil.SouthEast, q0 - 1); var (SE2, _) = Pair(ref stencil.SouthEast, q0 + 1);
        var (NW0, SE3) = Pair(ref stencil.SouthEast, q1 - 2); var (SE4, SE5) = Pair(ref stencil.SouthEast, q1);
        var (NW3, SE6) = Pair(ref stencil.SouthEast, q2 - 2); var (SE7, _) = Pair(ref stencil.SouthEast, q2);
        Vector256<double> NW1 = SE3, NW2 = SE4, NW4 = SE6, NW5 = SE7;
        // as in InteriorFromNinePoint, each term with v4 = 1 is its other factor
        var a0 = SW0 * v0;
        var a1 = S0 * v0 + SW1 * v1;
        var a2 = SE0 * v0 + S1 * v1 + SW2 * v2;
        var a3 = SE1 * v1 + S2 * v2;
        var a4 = SE2 * v2;
        var a5 = W0 * v0 + SW3 * v3;
        var a6 = C0 * v0 + W1 * v1 + S3 * v3 + SW4;
        var a7 = E0 * v0 + C1 * v1 + W2 * v2 + SE3 * v3 + S4 + SW5 * v5;
        var a8 = E1 * v1 + C2 * v2 + SE4 + S5 * v5;
        var a9 = E2 * v2 + SE5 * v5;
        var a10 = NW0 * v0 + W3 * v3 + SW6 * v6;
        var a11 = N0 * v0 + NW1 * v1 + C3 * v3 + W4 + S6 * v6 + SW7 * v7;
        var a12 = NE0 * v0 + N1 * v1 + NW2 * v2 + E3 * v3 + C4 + W5 * v5 + SE6 * v6 + S7 * v7 + SW8 * v8;
        var a13 = NE1 * v1 + N2 * v2 + E4 + C5 * v5 + SE7 * v7 + S8 * v8;
        var a15 = NW3 * v3 + W6 * v6;
        var a16 = N3 * v3 + NW4 + C6 * v6 + W7 * v7;
        var a17 = NE3 * v3 + N4 + NW5 * v5 + E6 * v6 + C7 * v7 + W8 * v8;
        var a18 = NE4 + N5 * v5 + E7 * v7 + C8 * v8;
        (v0 * a6 + v1 * a7 + v2 * a8 + v3 * a11 + a12 + v5 * a13 + v6 * a16 + v7 * a17 + v8 * a18).StoreUnsafe(ref MemoryMarshal.GetArrayDataReference(cc), (nuint)k);
        (Widen(ref w.YHigh, k - 1 - ncx) * a5 + Widen(ref w.CentreNW, k - 1 - ncx) * a6 + a10 + Widen(ref w.XLow, k - 1) * a11
            + Widen(ref w.YLow, k - 1) * a15 + Widen(ref w.CentreSW, k - 1) * a16).StoreUnsafe(ref MemoryMarshal.GetArrayDataReference(cw), (nuint)k);
        (Widen(ref w.XHigh, k - ncx - 1) * a1 + a2 + Widen(ref w.XLow, k - ncx) * a3 + Widen(ref w.CentreSE, k - ncx - 1) * a6
            + Widen(ref w.YLow, k - ncx) * a7 + Widen(ref w.CentreSW, k - ncx) * a8).StoreUnsafe(ref MemoryMarshal.GetArrayDataReference(cs), (nuint)k);
        (a0 + Widen(ref w.XLow, k - ncx - 1) * a1 + Widen(ref w.YLow, k - ncx - 1) * a5 + Widen(ref w.CentreSW, k - ncx - 1) * a6).StoreUnsafe(ref MemoryMarshal.GetArrayDataReference(csw), (nuint)k);
        (Widen(ref w.XHigh, k - ncx) * a3 + a4 + Widen(ref w.CentreSE, k - ncx) * a8 + Widen(ref w.YLow, k - ncx + 1) * a9).StoreUnsafe(ref MemoryMarshal.GetArrayDataReference(cse), (nuint)k);
    }

    /// <summary>The four single-precision weights from index i, widened to double (exactly).</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static Vector256<double> Widen(ref float weights, int i) => Avx.ConvertToVector256Double(Vector128.LoadUnsafe(ref weights, (nuint)i));

    /// <summary>The fine entries a[i + 2t] (Even) and a[i + 2t + 1] (Odd) for t = 0 .. 3: one fine row's values at four consecutive coarse columns.</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static (Vector256<double> Even, Vector256<double> Odd) Pair(ref double a, int i)
    {
        var low = Vector256.LoadUnsafe(ref a, (nuint)i);
        var high = Vector256.LoadUnsafe(ref a, (nuint)(i + Vector256<double>.Count));
        var order = Vector256.Create(0L, 2, 1, 3);   // evens to the lower half, odds to the upper
        var l = Vector256.Shuffle(low, order);
        var h = Vector256.Shuffle(high, order);
        return (Vector256.Create(l.GetLower(), h.GetLower()), Vector256.Create(l.GetUpper(), h.GetUpper()));
    }

    /// <summary>
    /// <see cref="InteriorFromFivePoint"/> below a 9-point level: the same sums as the patch loop, in its order, with A's corners.
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static void InteriorFromNinePoint(in Stencil stencil, in Weights w, int k, int p0, int ncx, int I, double[] cc, double[] cw, double[] cs, double[] csw, double[] cse)
    {
        int fnx = stencil.Nx;
        // phi_K's values (1 at K itself): offsets (-1, -1) ... (1, 1), row by row
        double v0 = Unsafe.Add(ref w.CentreNE, k - ncx - 1), v1 = Unsafe.Add(ref w.YHigh, k - ncx), v2 = Unsafe.Add(ref w.CentreNW, k - ncx),
            v3 = Unsafe.Add(ref w.XHigh, k - 1), v4 = 1, v5 = Unsafe.Add(ref w.XLow, k),
            v6 = Unsafe.Add(ref w.CentreSE, k - 1), v7 = Unsafe.Add(ref w.YLow, k), v8 = Unsafe.Add(ref w.CentreSW, k);
        int n0 = p0 - fnx - 1;
        double C0 = Unsafe.Add(ref stencil.Centre, n0), W0 = Unsafe.Add(ref stencil.West, n0), E0 = Unsafe.Add(ref stencil.West, n0 + 1), S0 = Unsafe.Add(ref stencil.South, n0), N0 = Unsafe.Add(ref stencil.South, n0 + fnx),
            SW0 = Unsafe.Add(ref stencil.SouthWest, n0), NE0 = Unsafe.Add(ref stencil.SouthWest, n0 + fnx + 1), SE0 = Unsafe.Add(ref stencil.SouthEast, n0), NW0 = Unsafe.Add(ref stencil.SouthEast, n0 + fnx - 1);
        int n1 = p0 - fnx;
        double C1 = Unsafe.Add(ref stencil.Centre, n1), W1 = Unsafe.Add(ref stencil.West, n1), E1 = Unsafe.Add(ref stencil.West, n1 + 1), S1 = Unsafe.Add(ref stencil.South, n1), N1 = Unsafe.Add(ref stencil.South, n1 + fnx),
            SW1 = Unsafe.Add(ref stencil.SouthWest, n1), NE1 = Unsafe.Add(ref stencil.SouthWest, n1 + fnx + 1), SE1 = Unsafe.Add(ref stencil.SouthEast, n1), NW1 = Unsafe.Add(ref stencil.SouthEast, n1 + fnx - 1);
        int n2 = p0 - fnx + 1;
        double C2 = Unsafe.Add(ref stencil.Centre, n2), W2 = Unsafe.Add(ref stencil.West, n2), E2 = Unsafe.Add(ref stencil.West, n2 + 1), S2 = Unsafe.Add(ref stencil.South, n2), N2 = Unsafe.Add(ref stencil.South, n2 + fnx),
            SW2 = Unsafe.Add(ref stencil.SouthWest, n2), NE2 = Unsafe.Add(ref stencil.SouthWest, n2 + fnx + 1), SE2 = Unsafe.Add(ref stencil.SouthEast, n2), NW2 = Unsafe.Add(ref stencil.SouthEast, n2 + fnx - 1);
        int n3 = p0 - 1;
        double C3 = Unsafe.Add(ref stencil.Centre, n3), W3 = Unsafe.Add(ref stencil.West, n3), E3 = Unsafe.Add(ref stencil.West, n3 + 1), S3 = Unsafe.Add(ref stencil.South, n3), N3 = Unsafe.Add(ref stencil.South, n3 + fnx),
            SW3 = Unsafe.Add(ref stencil.SouthWest, n3), NE3 = Unsafe.Add(ref stencil.SouthWest, n3 + fnx + 1), SE3 = Unsafe.Add(ref stencil.SouthEast, n3), NW3 = Unsafe.Add(ref stencil.SouthEast, n3 + fnx - 1);
        int n4 = p0;
        double C4 = Unsafe.Add(ref stencil.Centre, n4), W4 = Unsafe.Add(ref stencil.West, n4), E4 = Unsafe.Add(ref stencil.West, n4 + 1), S4 = Unsafe.Add(ref stencil.South, n4), N4 = Unsafe.Add(ref stencil.South, n4 + fnx),
            SW4 = Unsafe.Add(ref stencil.SouthWest, n4), NE4 = Unsafe.Add(ref stencil.SouthWest, n4 + fnx + 1), SE4 = Unsafe.Add(ref stencil.SouthEast, n4), NW4 = Unsafe.Add(ref stencil.SouthEast, n4 + fnx - 1);
        int n5 = p0 + 1;
        double C5 = Unsafe.Add(ref stencil.Centre, n5), W5 = Unsafe.Add(ref stencil.West, n5), E5 = Unsafe.Add(ref stencil.West, n5 + 1), S5 = Unsafe.Add(ref stencil.South, n5), N5 = Unsafe.Add(ref stencil.South, n5 + fnx),
            SW5 = Unsafe.Add(ref stencil.SouthWest, n5), NE5 = Unsafe.Add(ref stencil.SouthWest, n5 + fnx + 1), SE5 = Unsafe.Add(ref stencil.SouthEast, n5), NW5 = Unsafe.Add(ref stencil.SouthEast, n5 + fnx - 1);
        int n6 = p0 + fnx - 1;
        double C6 = Unsafe.Add(ref stencil.Centre, n6), W6 = Unsafe.Add(ref stencil.West, n6), E6 = Unsafe.Add(ref stencil.West, n6 + 1), S6 = Unsafe.Add(ref stencil.South, n6), N6 = Unsafe.Add(ref stencil.South, n6 + fnx),
            SW6 = Unsafe.Add(ref stencil.SouthWest, n6), NE6 = Unsafe.Add(ref stencil.SouthWest, n6 + fnx + 1), SE6 = Unsafe.Add(ref stencil.SouthEast, n6), NW6 = Unsafe.Add(ref stencil.SouthEast, n6 + fnx - 1);
        int n7 = p0 + fnx;
        double C7 = Unsafe.Add(ref stencil.Centre, n7), W7 = Unsafe.Add(ref stencil.West, n7), E7 = Unsafe.Add(ref stencil.West, n7 + 1), S7 = Unsafe.Add(ref stencil.South, n7), N7 = Unsafe.Add(ref stencil.South, n7 + fnx),
            SW7 = Unsafe.Add(ref stencil.SouthWest, n7), NE7 = Unsafe.Add(ref stencil.SouthWest, n7 + fnx + 1), SE7 = Unsafe.Add(ref stencil.SouthEast, n7), NW7 = Unsafe.Add(ref stencil.SouthEast, n7 + fnx - 1);
        int n8 = p0 + fnx + 1;
        double C8 = Unsafe.Add(ref stencil.Centre, n8), W8 = Unsafe.Add(ref stencil.West, n8), E8 = Unsafe.Add(ref stencil.West, n8 + 1), S8 = Unsafe.Add(ref stencil.South, n8), N8 = Unsafe.Add(ref stencil.South, n8 + fnx),
            SW8 = Unsafe.Add(ref stencil.SouthWest, n8), NE8 = Unsafe.Add(ref stencil.SouthWest, n8 + fnx + 1), SE8 = Unsafe.Add(ref stencil.SouthEast, n8), NW8 = Unsafe.Add(ref stencil.SouthEast, n8 + fnx - 1);
        double a0 = SW0 * v0;
        double a1 = S0 * v0 + SW1 * v1;
        double a2 = SE0 * v0 + S1 * v1 + SW2 * v2;
        double a3 = SE1 * v1 + S2 * v2;
        double a4 = SE2 * v2;
        double a5 = W0 * v0 + SW3 * v3;
        double a6 = C0 * v0 + W1 * v1 + S3 * v3 + SW4 * v4;
        double a7 = E0 * v0 + C1 * v1 + W2 * v2 + SE3 * v3 + S4 * v4 + SW5 * v5;
        double a8 = E1 * v1 + C2 * v2 + SE4 * v4 + S5 * v5;
        double a9 = E2 * v2 + SE5 * v5;
        double a10 = NW0 * v0 + W3 * v3 + SW6 * v6;
        double a11 = N0 * v0 + NW1 * v1 + C3 * v3 + W4 * v4 + S6 * v6 + SW7 * v7;
        double a12 = NE0 * v0 + N1 * v1 + NW2 * v2 + E3 * v3 + C4 * v4 + W5 * v5 + SE6 * v6 + S7 * v7 + SW8 * v8;
        double a13 = NE1 * v1 + N2 * v2 + E4 * v4 + C5 * v5 + SE7 * v7 + S8 * v8;
        double a15 = NW3 * v3 + W6 * v6;
        double a16 = N3 * v3 + NW4 * v4 + C6 * v6 + W7 * v7;
        double a17 = NE3 * v3 + N4 * v4 + NW5 * v5 + E6 * v6 + C7 * v7 + W8 * v8;
        double a18 = NE4 * v4 + N5 * v5 + E7 * v7 + C8 * v8;
        cc[k] = v0 * a6 + v1 * a7 + v2 * a8 + v3 * a11 + a12 + v5 * a13 + v6 * a16 + v7 * a17 + v8 * a18;
        // the west neighbour's basis at columns 0, 1 of its support (1 at the neighbour itself)
        cw[k] = Unsafe.Add(ref w.YHigh, k - 1 - ncx) * a5 + Unsafe.Add(ref w.CentreNW, k - 1 - ncx) * a6 + a10 + Unsafe.Add(ref w.XLow, k - 1) * a11
              + Unsafe.Add(ref w.YLow, k - 1) * a15 + Unsafe.Add(ref w.CentreSW, k - 1) * a16;
        // the south neighbour's basis at rows 1, 2 of its support
        cs[k] = Unsafe.Add(ref w.XHigh, k - ncx - 1) * a1 + a2 + Unsafe.Add(ref w.XLow, k - ncx) * a3 + Unsafe.Add(ref w.CentreSE, k - ncx - 1) * a6
              + Unsafe.Add(ref w.YLow, k - ncx) * a7 + Unsafe.Add(ref w.CentreSW, k - ncx) * a8;
        // the south-west neighbour's basis at its north-east 2 x 2
        csw[k] = a0 + Unsafe.Add(ref w.XLow, k - ncx - 1) * a1 + Unsafe.Add(ref w.YLow, k - ncx - 1) * a5 + Unsafe.Add(ref w.CentreSW, k - ncx - 1) * a6;
        if (I + 1 < ncx)   // the south-east neighbour's basis at its north-west 2 x 2
            cse[k] = Unsafe.Add(ref w.XHigh, k - ncx) * a3 + a4 + Unsafe.Add(ref w.CentreSE, k - ncx) * a8 + Unsafe.Add(ref w.YLow, k - ncx + 1) * a9;
    }
}
