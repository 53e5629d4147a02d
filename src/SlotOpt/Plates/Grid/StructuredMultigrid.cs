using System.Runtime.CompilerServices;
using System.Runtime.Intrinsics;
using System.Runtime.InteropServices;
using SlotOpt.Numerics;

namespace SlotOpt.Plates.Grid;

/// <summary>
/// Black-box multigrid V-cycle (J. E. Dendy, "Black box multigrid", J. Comput. Phys. 48 (1982)
/// 366–386) as the preconditioner of the sheet operator, on the plate's node lattice itself:
/// 5-point stencil storage on the finest level, 9-point Galerkin stencils below (see
/// <see cref="BlackBoxCoarsening"/>), coarsest level by band Cholesky.
///
/// The lattice carries every node. Nodes of the outside (psi = 0) are decoupled rows (a diagonal on the
/// matrix's own scale, so the single-precision scaling fits them too; the cycle returns 0 there for their 0 residual), their
/// edges folded into their neighbours' diagonals. A merged region (a hole, an enclosed slot or cut:
/// one unknown of the sheet operator) stays a cluster of lattice nodes whose mutual edges get a
/// conductance <see cref="GlueFactor"/> times the largest edge conductance of the plate, so the
/// cluster moves as one on every level: the operator-dependent prolongation and the Galerkin
/// products carry the glue down like any strong coupling. The glued lattice operator L_g agrees
/// with the sheet operator A on vectors constant on each region (A = E^T L_g E, E copying each
/// unknown to its nodes), and the preconditioner is M^-1 = Q^T V Q with Q spreading an unknown's
/// residual evenly over its k nodes (Q = E / k, so E^T Q = I) and V the V-cycle of L_g. Q^T V Q is
/// symmetric positive definite, as conjugate gradients needs: one forward Gauss–Seidel sweep before
/// and one backward after the coarse correction on the finest and first coarse levels, a forward and a backward sweep on each side
/// below (see <see cref="SymmetricSmoothingFrom"/>; V is symmetric), zero start.
/// The hierarchy is built in double and kept in single precision for the cycle (stencils, level
/// vectors, transfer weights; see <see cref="StencilLevel"/>), the operator and the conjugate gradients
/// stay in double; the output M^-1 r is rounded to single precision the same way on every path.
/// All buffers are allocated once; a cycle allocates nothing.
/// </summary>
public sealed class StructuredMultigrid : IPreconditioner
{
    /// <summary>
    /// Glue within a merged region relative to the largest edge conductance: the preconditioner
    /// then differs from the exact region constraint by about 1e-4 relative, far below what the
    /// conjugate-gradient iteration notices, while the coefficient contrast stays within what
    /// black-box multigrid coarsens robustly (Dendy 1982 reports jumps of 1e6). Common practice, no source.
    /// </summary>
    public const double GlueFactor = 1e4;
    /// <summary>Coarsen while both sides have at least this many nodes.</summary>
    private const int MinimumSide = 4;
    /// <summary>
    /// From this level down (0 the finest) the cycle smooths with a symmetric Gauss–Seidel pair on each side (forward then backward before
    /// the coarse correction, forward then backward after: the cycle stays symmetric), above it with one sweep a side. On the plate of the
    /// `sheets` bench at 1024² this lowers the contraction per conjugate-gradient step from 0.102 to 0.096 (9 steps to 8) for a few per cent
    /// more work a cycle (these levels hold a sixteenth of the finest level's nodes); from level 1 it reaches 0.089 but saves no step at any
    /// size from 128² to 2048² for the sweeps on a quarter of the finest level's nodes. Measured 2026-12-03, `sheets --profile`; the sweep
    /// pair itself is common practice, no source.
    /// </summary>
    private const int SymmetricSmoothingFrom = 2;
    /// <summary>Stop coarsening at this many nodes (band Cholesky below).</summary>
    private const int CoarsestNodes = 300;

    private readonly StencilLevel[] _levels;
    /// <summary>
    /// The power of two s the single-precision stencils are scaled by (see <see cref="StencilLevel.ToSinglePrecision"/>): the cycle
    /// solves (s A) x' = r, so x' = x / s stays near r in size (s A has diagonals up to about 1) whatever the units of A.
    /// </summary>
    private readonly double _stencilScale;
    private readonly BandCholesky _coarsest;
    private readonly double[] _coarsestVector;
    private readonly bool _coarsestColumnsFirst;
    private readonly int[] _nodeUnknown;
    /// <summary>Nodes of merged regions, grouped by region: MergedNodes[MergedStart[m] .. MergedStart[m + 1]), region m is unknown MergedUnknown[m].</summary>
    private readonly int[] _mergedNodes, _mergedStart, _mergedUnknown;
    /// <summary>The merged regions' residuals while <see cref="CycleInPlace"/> has them spread over their nodes.</summary>
    private readonly double[] _mergedResidual;
    /// <summary><see cref="Apply"/>'s right-hand side on the padded lattice, allocated on its first call (the thin-plate solves never make one).</summary>
    private double[]? _applyRightHandSide;

    private StructuredMultigrid(StencilLevel[] levels, double stencilScale, BandCholesky coarsest, bool coarsestColumnsFirst, int[] nodeUnknown, int[] mergedNodes, int[] mergedStart, int[] mergedUnknown, LatticeSheetOperator op)
    {
        Operator = op;
        _levels = levels;
        _stencilScale = stencilScale;
        _coarsest = coarsest;
        _coarsestColumnsFirst = coarsestColumnsFirst;
        _coarsestVector = new double[levels[^1].Nodes];
        _nodeUnknown = nodeUnknown;
        _mergedNodes = mergedNodes;
        _mergedStart = mergedStart;
        _mergedUnknown = mergedUnknown;
        _mergedResidual = new double[mergedUnknown.Length];
    }

    public int LevelCount => _levels.Length;

    /// <summary>The sheet operator on this preconditioner's finest level (shares its node vectors: apply the two in turn).</summary>
    public LatticeSheetOperator Operator { get; }

    /// <summary>Bytes held: stencils, transfer weights, level vectors, the coarsest factor and the region lists.</summary>
    public long Bytes => _levels.Sum(l => l.Bytes) + Operator.Bytes + _coarsest.Bytes + 8L * (_coarsestVector.Length + (_applyRightHandSide?.Length ?? 0))
        + 4L * (_mergedNodes.Length + _mergedStart.Length + _mergedUnknown.Length);

    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public static StructuredMultigrid Build(PlateGrid grid, NodeRegions regions)
    {
        var (fine, outsideWeight) = FineLevel(grid, regions);
        var (levels, scale, coarsest, columnsFirst) = Hierarchy(fine);

        // merged regions: their nodes, grouped
        var map = regions.NodeUnknown;
        var regionOf = new Dictionary<int, int>();
        var mergedUnknown = new List<int>();
        var count = new List<int>();
        for (int p = 0; p < map.Length; p++)
        {
            int u = map[p];
            if (u < 0 || !regions.IsMerged[u]) continue;
            if (!regionOf.TryGetValue(u, out int m)) { m = mergedUnknown.Count; regionOf[u] = m; mergedUnknown.Add(u); count.Add(0); }
            count[m]++;
        }
        var start = new int[mergedUnknown.Count + 1];
        for (int m = 0; m < count.Count; m++) start[m + 1] = start[m] + count[m];
        var fill = (int[])start.Clone();
        var nodes = new int[start[^1]];
        for (int p = 0; p < map.Length; p++)
        {
            int u = map[p];
            if (u >= 0 && regions.IsMerged[u]) nodes[fill[regionOf[u]]++] = p;
        }
        var merged = mergedUnknown.ToArray();
        var op = new LatticeSheetOperator(fine, outsideWeight, regions.UnknownCount, map, nodes, start, merged);
        return new StructuredMultigrid(levels, scale, coarsest, columnsFirst, map, nodes, start, merged, op);
    }

    /// <summary>
    /// The V-cycle for any symmetric positive definite matrix whose unknowns sit one to a node of a nodesX x nodesY lattice
    /// and couple only to their 4 lattice neighbours (a 5-point stencil), such as the plate's temperature operator
    /// (Plates/Thermal: conduction plus a positive diagonal), built from the stencil itself: the entry between node p and
    /// p - 1 is -scale westConductance[p], between p and p - nodesX -scale southConductance[p] (0 unless both nodes carry
    /// unknowns; arrays of at least nodesX nodesY + nodesX + 1 entries), the diagonal by unknown. Nodes without an unknown
    /// (no metal, or held at a given value) are decoupled rows (diagonal: the largest of the given ones); no merged regions. Its <see cref="Operator"/> applies the same matrix.
    /// </summary>
    public static StructuredMultigrid ForNodeStencil(int nodesX, int nodesY, int[] nodeUnknown, double[] westConductance, double[] southConductance,
        double conductanceScale, double[] diagonal)
    {
        int nodes = nodesX * nodesY;
        if (nodeUnknown.Length != nodes) throw new ArgumentException("one entry per lattice node", nameof(nodeUnknown));
        if (westConductance.Length < nodes + nodesX + 1 || southConductance.Length < nodes + nodesX + 1) throw new ArgumentException("one coupling per lattice node and the padding", nameof(westConductance));
        if (diagonal.Length == 0) throw SheetOperator.NoFreeNode();
        var fine = new StencilLevel(nodesX, nodesY, ninePoint: false);
        var c = fine.Centre; var w = fine.West; var s = fine.South;
        var rowSum = new double[nodes];   // the diagonal part no coupling carries, as the operator's outside weight
        bool anyDecoupled = false;
        // one pass: each row's couplings from the inputs, its east and north ones read ahead as they will be stored
        for (int p = 0; p < nodes; p++)
        {
            int u = nodeUnknown[p];
            if (u < 0) { anyDecoupled = true; continue; }   // decoupled; its diagonal below
            double centre = diagonal[u];
            if (!(centre > 0)) throw new ArgumentException($"unknown {u} has no positive diagonal", nameof(diagonal));
            c[p] = centre;
            if (westConductance[p] != 0)
            {
                if (p % nodesX == 0 || nodeUnknown[p - 1] < 0) throw new ArgumentException($"unknown {u} couples west to a node without an unknown", nameof(westConductance));
                w[p] = -conductanceScale * westConductance[p];
            }
            if (southConductance[p] != 0)
            {
                if (p < nodesX || nodeUnknown[p - nodesX] < 0) throw new ArgumentException($"unknown {u} couples south to a node without an unknown", nameof(southConductance));
                s[p] = -conductanceScale * southConductance[p];
            }
            int e = p + 1, n = p + nodesX;
            double east = e < nodes && nodeUnknown[e] >= 0 && westConductance[e] != 0 ? -conductanceScale * westConductance[e] : 0;
            double north = n < nodes && nodeUnknown[n] >= 0 && southConductance[n] != 0 ? -conductanceScale * southConductance[n] : 0;
            rowSum[p] = centre + w[p] + east + s[p] + north;
        }
        if (anyDecoupled)
        {
            double largestDiagonal = diagonal.Max();
            for (int p = 0; p < nodes; p++) if (nodeUnknown[p] < 0) c[p] = largestDiagonal;
        }
        var (levels, scale, coarsest, columnsFirst) = Hierarchy(fine);
        var op = new LatticeSheetOperator(fine, rowSum, diagonal.Length, nodeUnknown, [], [0], []);
        return new StructuredMultigrid(levels, scale, coarsest, columnsFirst, nodeUnknown, [], [0], [], op);
    }

    /// <summary>
    /// The levels below a filled finest level, down to the coarsest and its band Cholesky factor; each level is turned to single
    /// precision once the next is built (the finest keeps its double couplings for the operator). The scale is the power of two
    /// nearest 1 / (the largest diagonal of the finest level).
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static (StencilLevel[] Levels, double Scale, BandCholesky Coarsest, bool ColumnsFirst) Hierarchy(StencilLevel fine)
    {
        double largest = 0;
        for (int p = 0; p < fine.Nodes; p++) largest = Math.Max(largest, fine.Centre[p]);
        if (!double.IsFinite(largest) || !(largest > 0)) throw new NumericalFailureException($"multigrid: largest diagonal {largest} is not a positive finite number");
        double scale = Math.ScaleB(1, -Math.ILogB(largest));
        var levels = new List<StencilLevel> { fine };
        var current = fine;
        while (current.Nx >= MinimumSide && current.Ny >= MinimumSide && current.Nodes > CoarsestNodes)
        {
            var next = BlackBoxCoarsening.Coarsen(current);
            current.ToSinglePrecision(scale, keepDoubleCouplings: current == fine);
            current = next;
            levels.Add(current);
        }
        // coarsest: numbered with the shorter side fastest, so the half-bandwidth is that side + 1
        bool columnsFirst = current.Ny < current.Nx;
        int fast = columnsFirst ? current.Ny : current.Nx;
        var last = current;
        var coarsest = new BandCholesky(last.Nodes, fast + 1, (a, b) =>
        {
            var (ia, ja) = Position(a, fast, columnsFirst);
            var (ib, jb) = Position(b, fast, columnsFirst);
            int di = ib - ia, dj = jb - ja;
            return Math.Abs(di) <= 1 && Math.Abs(dj) <= 1 ? scale * last.Entry(ia, ja, di, dj) : 0;
        });
        if (last != fine) last.ReleaseStencil();
        return (levels.ToArray(), scale, coarsest, columnsFirst);
    }

    private static (int I, int J) Position(int index, int fast, bool columnsFirst) =>
        columnsFirst ? (index / fast, index % fast) : (index % fast, index / fast);

    /// <summary>
    /// The finest level: edge weights as in <see cref="SheetOperator"/> (same resistances, the
    /// same node lattice), outside nodes as decoupled rows (diagonal: the glue), merged regions glued; and each node's
    /// weight of edges to the outside (the diagonal part of A that no coupling carries).
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static (StencilLevel Level, double[] OutsideWeight) FineLevel(PlateGrid grid, NodeRegions regions)
    {
        var l = grid.Lattice;
        int nx = l.NodesX, ny = l.NodesY, cx = l.Nx, cy = l.Ny;
        var level = new StencilLevel(nx, ny, ninePoint: false);
        var map = regions.NodeUnknown;
        double rx = l.Hy / l.Hx, ry = l.Hx / l.Hy;
        var c = level.Centre; var w = level.West; var s = level.South;
        // each edge's resistance (as SheetOperator's) into w and s until the couplings replace it, from the inverse conductances
        // (0 for an empty cell) of the cell rows below and above node row j, two rows kept as j advances
        var g = grid.Conductance;
        var below = new double[cx];
        var above = new double[cx];
        double largest = 0;
        for (int j = 0; j < ny; j++)
        {
            (below, above) = (above, below);
            if (j < cy)
                for (int i = 0; i < cx; i++) { double v = g[j * cx + i]; above[i] = v == 0 ? 0 : 1 / v; }
            for (int i = 0; i < nx; i++)
            {
                int p = j * nx + i;
                // edge (i - 1, j)-(i, j) between cells (i - 1, j - 1) and (i - 1, j); edge (i, j - 1)-(i, j) between cells (i - 1, j - 1) and (i, j - 1)
                w[p] = i > 0 && j > 0 && j < cy ? SheetOperator.EdgeResistance(below[i - 1], above[i - 1], rx) : 0;
                s[p] = j > 0 && i > 0 && i < cx ? SheetOperator.EdgeResistance(below[i - 1], below[i], ry) : 0;
                largest = Math.Max(largest, Math.Max(w[p], s[p]));
            }
        }
        double glue = GlueFactor * largest;
        var outside = new double[nx * ny];
        if (regions.UnknownCount == 0) throw SheetOperator.NoFreeNode();
        var conducting = new bool[regions.UnknownCount];   // an edge of positive conductance reaches the unknown (A's diagonal > 0), else it is refused
        for (int j = 0; j < ny; j++)
            for (int i = 0; i < nx; i++)
            {
                int p = j * nx + i;
                if (map[p] < 0) c[p] += glue;   // outside: a decoupled row on the matrix's scale
                if (i > 0) w[p] = Couple(p - 1, p, w[p], glue, map, c, conducting, outside);
                if (j > 0) s[p] = Couple(p - nx, p, s[p], glue, map, c, conducting, outside);
            }
        for (int u = 0; u < conducting.Length; u++) if (!conducting[u]) throw SheetOperator.NoConductingCellBeside(u);
        return (level, outside);

        // the edge between nodes a and p (p the stored side) with conductance r in the sheet operator: adds to the diagonals, returns the stored coupling
        [MethodImpl(MethodImplOptions.AggressiveInlining)]
        static double Couple(int a, int p, double r, double glue, int[] map, double[] c, bool[] conducting, double[] outside)
        {
            int ua = map[a], up = map[p];
            if (ua < 0 && up < 0) return 0;
            if (ua == up) { c[a] += glue; c[p] += glue; return -glue; }
            if (r == 0) return 0;
            if (ua >= 0) { c[a] += r; conducting[ua] |= r > 0; }
            if (up >= 0) { c[p] += r; conducting[up] |= r > 0; }
            if (ua >= 0 && up >= 0) return -r;
            if (ua >= 0) outside[a] += r;
            else outside[p] += r;
            return 0;
        }
    }

    /// <summary>
    /// z = M^-1 r in the unknowns' numbering. The cycle runs on r times a power of two that brings its largest entry near 1 (exact,
    /// and with the stencil's own scale it keeps single precision clear of overflow and denormals whatever the units); z is scaled
    /// back, so it is the same as <see cref="CycleInPlace"/> gives for the same r, but for that exact power-of-two factor.
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public void Apply(ReadOnlySpan<double> r, Span<double> z)
    {
        var top = _levels[0];
        var b = _applyRightHandSide ??= new double[top.X.Length];
        int o = top.Pad;
        double largest = 0;
        for (int u = 0; u < r.Length; u++) largest = Math.Max(largest, Math.Abs(r[u]));
        if (largest == 0) { z.Clear(); return; }
        double scale = double.IsFinite(largest) ? Math.ScaleB(1, -Math.ILogB(largest)) : 1;   // not finite: the NaN or infinity goes through to z, for the caller to see
        Operator.Runs.ToLattice(r, b, o);   // the outside of b stays 0: only this pass writes b
        for (int m = 0; m < _mergedUnknown.Length; m++)
        {
            double share = r[_mergedUnknown[m]] / (_mergedStart[m + 1] - _mergedStart[m]);
            for (int q = _mergedStart[m]; q < _mergedStart[m + 1]; q++) b[o + _mergedNodes[q]] = share;
        }
        Cycle(b, scale);
        var x = top.X;
        double back = _stencilScale / scale;   // x' = scale x / s
        Operator.Runs.FromLattice(x, o, back, z);
        for (int m = 0; m < _mergedUnknown.Length; m++)
        {
            double sum = 0;
            for (int q = _mergedStart[m]; q < _mergedStart[m + 1]; q++) sum += x[o + _mergedNodes[q]];
            z[_mergedUnknown[m]] = (float)(sum / (_mergedStart[m + 1] - _mergedStart[m])) * back;   // rounded as CycleInPlace stores it
        }
    }

    /// <summary>The finest level, whose right-hand side and iterate <see cref="CycleInPlace"/> uses (the lattice conjugate gradients' r and z).</summary>
    internal StencilLevel Finest => _levels[0];

    /// <summary>
    /// z = Q^T V Q r on the lattice in <see cref="LatticeConjugateGradient"/>'s layout: r given (padded lattice, double), z into
    /// the finest level's iterate (single precision). A merged region's residual is spread evenly over its nodes for the cycle and put
    /// back after; its value in z is the mean over its nodes, at its first node, 0 at the others. z comes out divided by the stencil's
    /// scale s (a constant factor, to which conjugate gradients are blind). The caller keeps r within a few decades of 1 (the lattice
    /// conjugate gradients solve for b / |b|). Returns r.z, summed by the last sweep as it writes z (the merged regions' nodes then
    /// exchanged for their representatives' terms), so the conjugate gradients need no pass of their own for it.
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    internal double CycleInPlace(double[] b)
    {
        var top = _levels[0];
        int o = top.Pad;
        var kept = _mergedResidual;
        for (int m = 0; m < _mergedUnknown.Length; m++)
        {
            int first = o + _mergedNodes[_mergedStart[m]];
            kept[m] = b[first];
            double share = kept[m] / (_mergedStart[m + 1] - _mergedStart[m]);
            for (int q = _mergedStart[m]; q < _mergedStart[m + 1]; q++) b[o + _mergedNodes[q]] = share;
        }
        double product = Cycle(b, 1);
        var x = top.X;
        for (int m = 0; m < _mergedUnknown.Length; m++)
        {
            double sum = 0, spread = 0;
            for (int q = _mergedStart[m]; q < _mergedStart[m + 1]; q++) { int i = o + _mergedNodes[q]; sum += x[i]; spread += b[i] * x[i]; x[i] = 0; b[i] = 0; }
            int first = o + _mergedNodes[_mergedStart[m]];
            x[first] = (float)(sum / (_mergedStart[m + 1] - _mergedStart[m]));
            b[first] = kept[m];
            product += kept[m] * x[first] - spread;
        }
        return product;
    }

    /// <summary>Solves A psi = b by conjugate gradients on the lattice with this V-cycle (see <see cref="LatticeConjugateGradient"/>); psi holds the warm start.</summary>
    public bool TrySolve(ReadOnlySpan<double> b, Span<double> psi, ConvergenceCriterion criterion, out SolveReport report)
    {
        if (b.Length != Operator.Rows || psi.Length != Operator.Rows) throw new ArgumentException("one value per unknown", nameof(b));
        return LatticeConjugateGradient.TrySolve(this, b, psi, criterion, out report);
    }

    /// <summary>
    /// The V-cycle for s A from the finest level, whose right-hand side is <paramref name="rhsScale"/> times <paramref name="rhs"/> (padded
    /// lattice, double); returns the sum of rhs times the cycle's output over the nodes (see <see cref="StencilLevel.SmoothFiveBackward"/>).
    /// </summary>
    private double Cycle(double[] rhs, double rhsScale)
    {
        var top = _levels[0];
        if (_levels.Length == 1)
        {
            var v = _coarsestVector;
            for (int p = 0; p < top.Nodes; p++) v[CoarsestIndex(top, p)] = rhsScale * rhs[top.Pad + p];
            SolveCoarsest(top);
            double product = 0;
            for (int p = 0; p < top.Nodes; p++) product += rhs[top.Pad + p] * top.X[top.Pad + p];
            return product;
        }
        top.SmoothFiveFromZeroThenResidual(rhs, rhsScale);
        Restrict(top, _levels[1]);
        CycleBelow(1);
        ProlongAdd(_levels[1], top);
        return top.SmoothFiveBackward(rhs, rhsScale);
    }

    /// <summary>The V-cycle from coarse level k, its right-hand side in its B.</summary>
    private void CycleBelow(int k)
    {
        var level = _levels[k];
        if (k == _levels.Length - 1)
        {
            var v = _coarsestVector;
            for (int p = 0; p < level.Nodes; p++) v[CoarsestIndex(level, p)] = level.B[level.Pad + p];
            SolveCoarsest(level);
            return;
        }
        bool symmetric = k >= SymmetricSmoothingFrom;
        level.SmoothFromZeroThenResidual();
        if (symmetric) { level.SmoothBackward(); level.Residual(); }
        var coarse = _levels[k + 1];
        Restrict(level, coarse);
        CycleBelow(k + 1);
        ProlongAdd(coarse, level);
        if (symmetric) level.SmoothForward();
        level.SmoothBackward();
    }

    /// <summary>Node p of the coarsest level in the band Cholesky factor's numbering (the shorter side fastest).</summary>
    private int CoarsestIndex(StencilLevel level, int p) => _coarsestColumnsFirst ? (p % level.Nx) * level.Ny + p / level.Nx : p;

    /// <summary>Solves the coarsest level for the right-hand side in <see cref="_coarsestVector"/> (Cholesky numbering) into its X.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private void SolveCoarsest(StencilLevel level)
    {
        var v = _coarsestVector;
        int o = level.Pad;
        _coarsest.Solve(v);
        for (int p = 0; p < level.Nodes; p++) level.X[o + p] = (float)v[CoarsestIndex(level, p)];
    }

    /// <summary>
    /// b_c = P^T r_f: each coarse node gathers the residual of the up to 9 fine nodes its basis function covers. Coarse nodes
    /// whose 9 fine nodes all lie on the lattice take a loop without tests; the lattice's edges take <see cref="RestrictAtEdge"/>
    /// (same terms, same grouping).
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    internal static void Restrict(StencilLevel f, StencilLevel c)
    {
        int fnx = f.Nx, fny = f.Ny, ncx = c.Nx, ncy = c.Ny, fo = f.Pad, co = c.Pad;
        ref float r = ref MemoryMarshal.GetArrayDataReference(f.R);
        ref float b = ref MemoryMarshal.GetArrayDataReference(c.B);
        ref float xl = ref MemoryMarshal.GetArrayDataReference(c.XLow!); ref float xh = ref MemoryMarshal.GetArrayDataReference(c.XHigh!);
        ref float yl = ref MemoryMarshal.GetArrayDataReference(c.YLow!); ref float yh = ref MemoryMarshal.GetArrayDataReference(c.YHigh!);
        ref float sw = ref MemoryMarshal.GetArrayDataReference(c.CentreSW!); ref float se = ref MemoryMarshal.GetArrayDataReference(c.CentreSE!);
        ref float nw = ref MemoryMarshal.GetArrayDataReference(c.CentreNW!); ref float ne = ref MemoryMarshal.GetArrayDataReference(c.CentreNE!);
        int lastInner = (fnx - 2) / 2;   // the last coarse column with a fine column on its right
        int width = Vector256.IsHardwareAccelerated ? Vector256<float>.Count : int.MaxValue / 4;   // coarse nodes a vector step covers (none without 256-bit vectors)
        for (int J = 0; J < ncy; J++)
        {
            if (J == 0 || 2 * J + 1 >= fny)
            {
                for (int I = 0; I < ncx; I++) RestrictAtEdge(f, c, I, J);
                continue;
            }
            RestrictAtEdge(f, c, 0, J);
            int I0 = 1;
            for (; I0 + width - 1 <= lastInner; I0 += width)
            {
                // the same sums as below for Vector256<float>.Count coarse nodes: each fine row's nodes split into those at even
                // offsets from the coarse column (2I), odd ones (2I + 1) and odd ones one to the left (2I - 1)
                int k = J * ncx + I0, q = fo + 2 * J * fnx + 2 * I0;
                var (centre, east, west) = FineRow(ref r, q);
                var middle = centre + Load(ref xl, k) * east + Load(ref xh, k - 1) * west;
                (centre, east, west) = FineRow(ref r, q + fnx);
                var above = Load(ref yl, k) * centre + Load(ref sw, k) * east + Load(ref se, k - 1) * west;
                (centre, east, west) = FineRow(ref r, q - fnx);
                var below = Load(ref yh, k - ncx) * centre + Load(ref nw, k - ncx) * east + Load(ref ne, k - ncx - 1) * west;
                (middle + above + below).StoreUnsafe(ref b, (nuint)(co + k));
            }
            for (int I = I0; I <= lastInner; I++)
            {
                int k = J * ncx + I, q = fo + 2 * J * fnx + 2 * I;
                // three rows summed apart, so the additions do not wait on one another
                float middle = Unsafe.Add(ref r, q) + Unsafe.Add(ref xl, k) * Unsafe.Add(ref r, q + 1) + Unsafe.Add(ref xh, k - 1) * Unsafe.Add(ref r, q - 1);
                float above = Unsafe.Add(ref yl, k) * Unsafe.Add(ref r, q + fnx) + Unsafe.Add(ref sw, k) * Unsafe.Add(ref r, q + fnx + 1)
                               + Unsafe.Add(ref se, k - 1) * Unsafe.Add(ref r, q + fnx - 1);
                float below = Unsafe.Add(ref yh, k - ncx) * Unsafe.Add(ref r, q - fnx) + Unsafe.Add(ref nw, k - ncx) * Unsafe.Add(ref r, q - fnx + 1)
                               + Unsafe.Add(ref ne, k - ncx - 1) * Unsafe.Add(ref r, q - fnx - 1);
                float v = middle + above + below;
                Unsafe.Add(ref b, co + k) = v;
            }
            for (int I = lastInner + 1; I < ncx; I++) RestrictAtEdge(f, c, I, J);
        }

        // Vector256<float>.Count floats from index i
        static Vector256<float> Load(ref float a, int i) => Vector256.LoadUnsafe(ref a, (nuint)i);
    }

    /// <summary>
    /// Fine row values at q + 2k (centre), q + 2k + 1 (east) and q + 2k - 1 (west) for k = 0 .. Vector256&lt;float&gt;.Count - 1: the
    /// fine neighbours of as many consecutive coarse nodes in one fine row.
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static (Vector256<float> Centre, Vector256<float> East, Vector256<float> West) FineRow(ref float r, int q)
    {
        var (centre, east) = Deinterleave(Vector256.LoadUnsafe(ref r, (nuint)q), Vector256.LoadUnsafe(ref r, (nuint)(q + Vector256<float>.Count)));
        var (west, _) = Deinterleave(Vector256.LoadUnsafe(ref r, (nuint)(q - 1)), Vector256.LoadUnsafe(ref r, (nuint)(q - 1 + Vector256<float>.Count)));
        return (centre, east, west);
    }

    /// <summary>The even- and odd-numbered entries of the 16 floats low, high (low first).</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static (Vector256<float> Even, Vector256<float> Odd) Deinterleave(Vector256<float> low, Vector256<float> high)
    {
        var order = Vector256.Create(0, 2, 4, 6, 1, 3, 5, 7);   // evens to the lower half, odds to the upper
        var l = Vector256.Shuffle(low, order);
        var h = Vector256.Shuffle(high, order);
        return (Vector256.Create(l.GetLower(), h.GetLower()), Vector256.Create(l.GetUpper(), h.GetUpper()));
    }

    /// <summary>The 16 floats even_0, odd_0, even_1, odd_1, ... as two vectors (lower eight first): the inverse of <see cref="Deinterleave"/>.</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static (Vector256<float> Low, Vector256<float> High) Interleave(Vector256<float> even, Vector256<float> odd)
    {
        var order = Vector256.Create(0, 4, 1, 5, 2, 6, 3, 7);
        return (Vector256.Shuffle(Vector256.Create(even.GetLower(), odd.GetLower()), order),
                Vector256.Shuffle(Vector256.Create(even.GetUpper(), odd.GetUpper()), order));
    }

    /// <summary>One coarse node of <see cref="Restrict"/>, testing which of its fine neighbours lie on the lattice.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static void RestrictAtEdge(StencilLevel f, StencilLevel c, int I, int J)
    {
        var r = f.R;
        int fnx = f.Nx, fny = f.Ny, ncx = c.Nx, fo = f.Pad;
        int i = 2 * I, j = 2 * J, k = J * ncx + I, q = fo + j * fnx + i;
        bool up = j + 1 < fny, down = J > 0, right = i + 1 < fnx, left = I > 0;
        float middle = r[q], above = 0, below = 0;   // grouped as in the loop without tests
        if (right) middle += c.XLow![k] * r[q + 1];
        if (left) middle += c.XHigh![k - 1] * r[q - 1];
        if (up)
        {
            above = c.YLow![k] * r[q + fnx];
            if (right) above += c.CentreSW![k] * r[q + fnx + 1];
            if (left) above += c.CentreSE![k - 1] * r[q + fnx - 1];
        }
        if (down)
        {
            below = c.YHigh![k - ncx] * r[q - fnx];
            if (right) below += c.CentreNW![k - ncx] * r[q - fnx + 1];
            if (left) below += c.CentreNE![k - ncx - 1] * r[q - fnx - 1];
        }
        float v = middle + above + below;
        c.B[c.Pad + k] = v;
    }

    /// <summary>x_f += P x_c, row by row of the fine lattice; Vector256&lt;float&gt;.Count coarse columns at a time (the fine row's pairs interleaved), the rest node by node.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    internal static void ProlongAdd(StencilLevel c, StencilLevel f)
    {
        int fnx = f.Nx, fny = f.Ny, ncx = c.Nx, fo = f.Pad, co = c.Pad;
        ref float xc = ref MemoryMarshal.GetArrayDataReference(c.X); ref float xf = ref MemoryMarshal.GetArrayDataReference(f.X);
        ref float xl = ref MemoryMarshal.GetArrayDataReference(c.XLow!); ref float xh = ref MemoryMarshal.GetArrayDataReference(c.XHigh!);
        ref float yl = ref MemoryMarshal.GetArrayDataReference(c.YLow!); ref float yh = ref MemoryMarshal.GetArrayDataReference(c.YHigh!);
        ref float sw = ref MemoryMarshal.GetArrayDataReference(c.CentreSW!); ref float se = ref MemoryMarshal.GetArrayDataReference(c.CentreSE!);
        ref float nw = ref MemoryMarshal.GetArrayDataReference(c.CentreNW!); ref float ne = ref MemoryMarshal.GetArrayDataReference(c.CentreNE!);
        int pairs = fnx / 2;                       // fine columns 2I, 2I + 1 for I < pairs; a last even column when fnx is odd
        int width = Vector256.IsHardwareAccelerated ? Vector256<float>.Count : int.MaxValue / 4;   // coarse columns a vector step covers (none without 256-bit vectors)
        for (int j = 0; j < fny; j++)
        {
            int row = fo + j * fnx, k0 = (j / 2) * ncx;
            int I = 0;
            if ((j & 1) == 0)
            {
                for (; I + width <= pairs; I += width)
                {
                    int k = k0 + I;
                    var low = Load(ref xc, co + k);
                    AddPairs(ref xf, row + 2 * I, low, Load(ref xl, k) * low + Load(ref xh, k) * Load(ref xc, co + k + 1));
                }
                for (; I < pairs; I++)
                {
                    int k = k0 + I;
                    float low = Unsafe.Add(ref xc, co + k), high = Unsafe.Add(ref xc, co + k + 1);
                    Unsafe.Add(ref xf, row + 2 * I) += low;
                    Unsafe.Add(ref xf, row + 2 * I + 1) += Unsafe.Add(ref xl, k) * low + Unsafe.Add(ref xh, k) * high;
                }
                if ((fnx & 1) == 1) Unsafe.Add(ref xf, row + fnx - 1) += Unsafe.Add(ref xc, co + k0 + pairs);
            }
            else
            {
                for (; I + width <= pairs; I += width)
                {
                    int k = k0 + I;
                    var a = Load(ref xc, co + k); var d = Load(ref xc, co + k + ncx);
                    AddPairs(ref xf, row + 2 * I, Load(ref yl, k) * a + Load(ref yh, k) * d,
                        (Load(ref sw, k) * a + Load(ref se, k) * Load(ref xc, co + k + 1)) + (Load(ref nw, k) * d + Load(ref ne, k) * Load(ref xc, co + k + ncx + 1)));
                }
                for (; I < pairs; I++)
                {
                    int k = k0 + I;
                    float a = Unsafe.Add(ref xc, co + k), b = Unsafe.Add(ref xc, co + k + 1), d = Unsafe.Add(ref xc, co + k + ncx), e = Unsafe.Add(ref xc, co + k + ncx + 1);
                    Unsafe.Add(ref xf, row + 2 * I) += Unsafe.Add(ref yl, k) * a + Unsafe.Add(ref yh, k) * d;
                    Unsafe.Add(ref xf, row + 2 * I + 1) += (Unsafe.Add(ref sw, k) * a + Unsafe.Add(ref se, k) * b) + (Unsafe.Add(ref nw, k) * d + Unsafe.Add(ref ne, k) * e);
                }
                if ((fnx & 1) == 1)
                {
                    int k = k0 + pairs;
                    Unsafe.Add(ref xf, row + fnx - 1) += Unsafe.Add(ref yl, k) * Unsafe.Add(ref xc, co + k) + Unsafe.Add(ref yh, k) * Unsafe.Add(ref xc, co + k + ncx);
                }
            }
        }

        // Vector256<float>.Count floats from index i
        static Vector256<float> Load(ref float a, int i) => Vector256.LoadUnsafe(ref a, (nuint)i);

        // x[i + 2k] += even_k, x[i + 2k + 1] += odd_k
        static void AddPairs(ref float x, int i, Vector256<float> even, Vector256<float> odd)
        {
            var (low, high) = Interleave(even, odd);
            (Vector256.LoadUnsafe(ref x, (nuint)i) + low).StoreUnsafe(ref x, (nuint)i);
            (Vector256.LoadUnsafe(ref x, (nuint)(i + Vector256<float>.Count)) + high).StoreUnsafe(ref x, (nuint)(i + Vector256<float>.Count));
        }
    }

    /// <summary>
    /// z = M^-1 r for a multigrid of <see cref="ForNodeStencil"/> whose every lattice node is an unknown (node p unknown p), with r on
    /// the padded lattice itself (node p at Pad + p, zeros round it: the finest level's layout), so the cycle reads r where it lies.
    /// z is not copied out: it is <paramref name="zScale"/> times <paramref name="z"/>, the finest level's single-precision iterate in
    /// the same layout (zeros round it), valid until the next cycle; (double)z[i] * zScale is the number <see cref="Apply"/> gives for
    /// node i - Pad. <paramref name="largest"/> is max |r| over the nodes (the caller's pass over r has it); it only picks the power of
    /// two the cycle scales r by. Returns r . z (conjugate gradients' rho), summed by the cycle's last sweep as it writes z.
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    internal double ApplyOnLattice(double[] r, double largest, out float[] z, out double zScale)
    {
        var top = _levels[0];
        int n = top.Nodes;
        if (_mergedUnknown.Length != 0 || _nodeUnknown.Length != n) throw new InvalidOperationException("the lattice apply needs one unknown per node and no merged regions");
        if (r.Length != top.X.Length) throw new ArgumentException("one value per node of the padded lattice", nameof(r));
        z = top.X;
        if (largest == 0) { Array.Clear(z); zScale = 0; return 0; }
        double scale = double.IsFinite(largest) ? Math.ScaleB(1, -Math.ILogB(largest)) : 1;   // as Apply: a NaN or infinity goes through to z
        double product = Cycle(r, scale);   // sum of r times the cycle's output, formed by its last sweep
        zScale = _stencilScale / scale;
        return product * zScale;
    }
}
