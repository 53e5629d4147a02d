using System.Runtime.CompilerServices;
using SlotOpt.Numerics;
using SlotOpt.Plates.Grid;

namespace SlotOpt.Plates.Thermal;

/// <summary>
/// The plate's heat-conduction network on the nodes of the eddy-current grid (cell corners), the
/// finite-volume dual of <see cref="SheetOperator"/>: each node owns the quarter of every conducting
/// cell around it (its dual cell); neighbouring nodes exchange heat through the two half cells beside
/// their link, conductance C = k t (h_across / h_along) (f1 + f2) / 2 with f = the cell's conducting
/// area fraction x remaining thickness fraction; each node loses heat from both faces of its dual
/// area A through 2 h A. The balance  sum C (T_n - T_m) + 2 h A (T_n - T_inf) = Q_n  is the standard
/// 5-point scheme for k t lap(T) - 2 h (T - T_inf) + q = 0, second order in h on smooth cases
/// (the plane-wall fin equation with a source: Incropera, DeWitt, Bergman, Lavine, Fundamentals of
/// Heat and Mass Transfer, 6th ed., 2007, section 3.6). The matrix is symmetric positive definite
/// whenever some h > 0 or some node is held at ambient.
/// Nodes with no conducting cell around them carry no unknown; with held edges the nodes of the
/// outer edge (those touching the grid's border or an empty cell connected to it) are held at
/// ambient, edges of holes and slots stay insulated.
/// </summary>
public sealed class ThermalNetwork
{
    private ThermalNetwork(PlateGrid grid, int[] nodeUnknown, int unknowns, bool[] heldNode, int heldNodes, double[] nodeAreaM2, double totalAreaM2,
        double[] unitWest, double[] unitSouth, double[] unitDiagonal, double[] unitConductanceToHeld, double conductanceScale, PreconditionerCache cache)
    {
        Grid = grid;
        NodeUnknown = nodeUnknown;
        Unknowns = unknowns;
        HeldNode = heldNode;
        HeldNodes = heldNodes;
        NodeAreaM2 = nodeAreaM2;
        TotalAreaM2 = totalAreaM2;
        UnitWest = unitWest;
        UnitSouth = unitSouth;
        UnitDiagonal = unitDiagonal;
        _unitConductanceToHeld = unitConductanceToHeld;
        ConductanceScaleWPerK = conductanceScale;
        _cache = cache;
    }

    public PlateGrid Grid { get; }
    public CellLattice Lattice => Grid.Lattice;
    /// <summary>Unknown of each node, -1 where the node has no metal or is held at ambient.</summary>
    public int[] NodeUnknown { get; }
    public int Unknowns { get; }
    /// <summary>True for metal nodes held at ambient.</summary>
    public bool[] HeldNode { get; }
    /// <summary>How many nodes are held at ambient (0 with insulated edges).</summary>
    public int HeldNodes { get; }
    /// <summary>One face's area of each node's dual cell (m^2): a quarter of each conducting cell around it.</summary>
    public double[] NodeAreaM2 { get; }
    /// <summary>One face's area of the plate (m^2): <see cref="NodeAreaM2"/> summed in node order.</summary>
    public double TotalAreaM2 { get; }
    /// <summary>k t of the plate (W/K): every conductance is k t times a factor of the grid alone.</summary>
    public double ConductanceScaleWPerK { get; }
    /// <summary>The conduction stencil at k t = 1 W/K, by node: the link from node p to p - 1 (UnitWest) and to p - NodesX (UnitSouth),
    /// 0 unless both nodes carry unknowns; padded with NodesX + 2 zeros, so p + 1 and p + NodesX may be read for every node.</summary>
    internal double[] UnitWest { get; }
    internal double[] UnitSouth { get; }
    /// <summary>The conduction part of the diagonal at k t = 1 W/K, by unknown: all its links, those to held nodes included.</summary>
    internal double[] UnitDiagonal { get; }
    /// <summary>By unknown, at k t = 1 W/K; empty when no node is held.</summary>
    private readonly double[] _unitConductanceToHeld;
    private readonly PreconditionerCache _cache;

    /// <summary>Conductance summed over the links from unknown u to held nodes (W/K), for the heat the edge takes.</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public double ConductanceToHeld(int u) => HeldNodes == 0 ? 0 : ConductanceScaleWPerK * _unitConductanceToHeld[u];

    /// <summary>The same plate and grid with another k t (another material or thickness): shares the grid's arrays and the preconditioner.</summary>
    public ThermalNetwork WithConductivity(double thermalConductivityWPerMK, double thicknessM) =>
        new(Grid, NodeUnknown, Unknowns, HeldNode, HeldNodes, NodeAreaM2, TotalAreaM2, UnitWest, UnitSouth, UnitDiagonal, _unitConductanceToHeld,
            Scale(thermalConductivityWPerMK, thicknessM), _cache);

    private static double Scale(double k, double t)
    {
        double kt = k * t;
        if (!(kt > 0) || !double.IsFinite(kt)) throw new ArgumentOutOfRangeException(nameof(k), $"k t = {kt} W/K: the plate must conduct");
        return kt;
    }

    [MethodImpl(MethodImplOptions.AggressiveOptimization)]   // a few calls a run, each with long loops: optimised from the first
    public static ThermalNetwork Assemble(PlateGrid grid, double thermalConductivityWPerMK, double thicknessM, ThermalEdge edges)
    {
        var l = grid.Lattice;
        int nx = l.Nx, ny = l.Ny, nxn = l.NodesX, px = nx + 2;
        // per cell, on a lattice padded with one empty cell all round (cell (i, j) at (j + 1) px + i + 1): the conducting
        // cross-section fraction (area fraction x remaining thickness fraction); each conducting cell's area fraction goes to its four
        // corners, each node's sum taking its cells in the order south-west, south-east, north-west, north-east (cell order), and the
        // nodes that get some area are counted
        var f = new double[px * (ny + 2)];
        var area = new double[l.NodeCount];
        int metalNodes = 0;
        for (int j = 0; j < ny; j++)
            for (int i = 0; i < nx; i++)
            {
                int c = j * nx + i, k = (j + 1) * px + i + 1;
                if (!(grid.Conductance[c] > 0)) continue;
                double a = grid.AreaFraction[c];
                f[k] = a * (double)grid.ThicknessFraction[c];
                if (!(a > 0)) continue;
                int n = j * nxn + i;
                if (area[n] == 0) metalNodes++;
                area[n] += a;
                if (area[n + 1] == 0) metalNodes++;
                area[n + 1] += a;
                if (area[n + nxn] == 0) metalNodes++;
                area[n + nxn] += a;
                if (area[n + nxn + 1] == 0) metalNodes++;
                area[n + nxn + 1] += a;
            }

        // with held edges, the metal nodes touching the outside (empty cells connected to the border) are held at ambient
        var held = new bool[l.NodeCount];
        int heldNodes = 0;
        if (edges == ThermalEdge.Ambient)
        {
            var outside = OutsideCells(f, px, ny + 2);
            for (int j = 0; j <= ny; j++)
                for (int i = 0; i < nxn; i++)
                {
                    int n = j * nxn + i;
                    int sw = j * px + i, se = sw + 1, nw = sw + px, ne = nw + 1;   // the four cells around node (i, j), padded
                    if (area[n] > 0 && (outside[sw] || outside[se] || outside[nw] || outside[ne])) { held[n] = true; heldNodes++; }
                }
        }

        // one pass over the nodes: the dual area, the unknown, and the links at k t = 1 (a node's neighbours below and to the left are
        // numbered already, those above and to the right are only read for being held)
        var nodeUnknown = new int[l.NodeCount];
        var west = new double[l.NodeCount + nxn + 2];
        var south = new double[l.NodeCount + nxn + 2];
        var diagonal = new double[metalNodes - heldNodes];
        var toHeld = heldNodes > 0 ? new double[metalNodes - heldNodes] : [];
        double quarter = l.CellAreaM2 / 4, totalArea = 0;
        double rx = l.Hy / l.Hx, ry = l.Hx / l.Hy;
        int unknowns = 0;
        for (int j = 0; j <= ny; j++)
            for (int i = 0; i < nxn; i++)
            {
                int n = j * nxn + i;
                area[n] *= quarter;
                totalArea += area[n];
                if (area[n] == 0 || held[n]) { nodeUnknown[n] = -1; continue; }
                int u = unknowns++;
                nodeUnknown[n] = u;
                // links at k t = 1: left/right cross the cells below (j-1) and above (j); down/up the cells left (i-1) and right (i)
                int sw = j * px + i, se = sw + 1, nw = sw + px, ne = nw + 1;
                double down = j > 0 ? ry * (f[sw] + f[se]) / 2 : 0;
                double left = i > 0 ? rx * (f[sw] + f[nw]) / 2 : 0;
                double right = i < nx ? rx * (f[se] + f[ne]) / 2 : 0;
                double up = j < ny ? ry * (f[nw] + f[ne]) / 2 : 0;
                diagonal[u] = down + left + right + up;
                // a node's left link is its left neighbour's right link (the same two half cells), so the stencil is symmetric
                if (down > 0 && nodeUnknown[n - nxn] >= 0) south[n] = down;
                if (left > 0 && nodeUnknown[n - 1] >= 0) west[n] = left;
                if (heldNodes == 0) continue;
                if (down > 0 && held[n - nxn]) toHeld[u] += down;
                if (left > 0 && held[n - 1]) toHeld[u] += left;
                if (right > 0 && held[n + 1]) toHeld[u] += right;
                if (up > 0 && held[n + nxn]) toHeld[u] += up;
            }
        if (unknowns != diagonal.Length) throw new InvalidOperationException($"thermal network: {unknowns} unknowns numbered, {diagonal.Length} counted");
        return new ThermalNetwork(grid, nodeUnknown, unknowns, held, heldNodes, area, totalArea, west, south, diagonal, toHeld,
            Scale(thermalConductivityWPerMK, thicknessM), new PreconditionerCache());
    }

    /// <summary>The diagonal with surface loss: conduction plus 2 h_u A_u (h per unknown, W/m^2K), into <paramref name="diagonal"/> (W/K).</summary>
    public void Diagonal(double[] surfaceCoefficientWPerM2K, double[] diagonal)
    {
        for (int n = 0; n < NodeUnknown.Length; n++)
        {
            int u = NodeUnknown[n];
            if (u >= 0) diagonal[u] = DiagonalAt(n, surfaceCoefficientWPerM2K[u]);
        }
    }

    /// <summary>The diagonal entry of node n (which has an unknown) with surface coefficient h (W/m^2K): k t times its unit conduction plus 2 h A (W/K).</summary>
    public double DiagonalAt(int node, double surfaceCoefficientWPerM2K) =>
        ConductanceScaleWPerK * UnitDiagonal[NodeUnknown[node]] + 2 * surfaceCoefficientWPerM2K * NodeAreaM2[node];

    /// <summary>The operator with surface loss as a sparse matrix, kept only for the tests' references (MathNet's dense solve and the
    /// lattice operator checked against it); the solver never assembles it, it applies <see cref="ThermalOperator"/>. Rows in node
    /// order, each row's entries sorted (down, left, diagonal, right, up).</summary>
    public CsrMatrix Matrix(double[] surfaceCoefficientWPerM2K)
    {
        var diagonal = new double[Unknowns];
        Diagonal(surfaceCoefficientWPerM2K, diagonal);
        int nxn = Lattice.NodesX;
        double kt = ConductanceScaleWPerK;
        var rowStart = new int[Unknowns + 1];
        var column = new List<int>(5 * Unknowns);
        var value = new List<double>(5 * Unknowns);
        for (int n = 0; n < NodeUnknown.Length; n++)
        {
            int u = NodeUnknown[n];
            if (u < 0) continue;
            Link(n - nxn, UnitSouth[n]);
            Link(n - 1, UnitWest[n]);
            column.Add(u);
            value.Add(diagonal[u]);
            Link(n + 1, UnitWest[n + 1]);
            Link(n + nxn, UnitSouth[n + nxn]);
            rowStart[u + 1] = column.Count;
        }
        return new CsrMatrix(Unknowns, Unknowns, rowStart, column.ToArray(), value.ToArray());

        void Link(int m, double c)
        {
            if (c == 0) return;
            column.Add(NodeUnknown[m]);
            value.Add(-kt * c);
        }
    }

    /// <summary>
    /// The multigrid preconditioner for this network's operator on the node lattice (<see cref="ThermalOperator"/>: one unknown per
    /// node, the nodes without an unknown of the network as identity rows, as the multigrid keeps them anyway), with surface
    /// coefficients about h (W/m^2K), built from the operator's current diagonal. Built
    /// once and kept, with the networks of the same grid (<see cref="WithConductivity"/>), while h / (k t) stays within
    /// a factor <see cref="PreconditionerReuseFactor"/> of the one it was built for: the black-box hierarchy of c M is c
    /// times that of M, and conjugate gradients does not see a constant factor on the preconditioner, so only the ratio of
    /// the surface term to the conduction moves the preconditioned spectrum. Not for concurrent solves (it holds the
    /// V-cycle's vectors).
    /// </summary>
    public StructuredMultigrid Preconditioner(ThermalOperator op, double surfaceCoefficientWPerM2K)
    {
        double ratio = surfaceCoefficientWPerM2K / ConductanceScaleWPerK;
        if (_cache.Multigrid is null || !(Math.Abs(Math.Log(ratio / _cache.Ratio)) <= Math.Log(PreconditionerReuseFactor)))
        {
            _cache.EveryNode ??= Enumerable.Range(0, Lattice.NodeCount).ToArray();
            _cache.Multigrid = StructuredMultigrid.ForNodeStencil(Lattice.NodesX, Lattice.NodesY, _cache.EveryNode, UnitWest, UnitSouth, ConductanceScaleWPerK, op.DiagonalWPerK);
            _cache.Ratio = ratio;
        }
        return _cache.Multigrid;
    }

    /// <summary>Reuse the preconditioner while h / (k t) stays within this factor of the one it was built for (measured: within 1.5 the
    /// iterations grow by at most 1 or 2 on the tie-plate demo's grids; a rebuild costs about five V-cycles; common practice, no source).</summary>
    public const double PreconditionerReuseFactor = 1.5;

    private sealed class PreconditionerCache
    {
        public StructuredMultigrid? Multigrid;
        public double Ratio;
        /// <summary>The multigrid's node-to-unknown map: node p is unknown p.</summary>
        public int[]? EveryNode;
    }

    /// <summary>Heat per node from a loss per cell: a quarter of each cell's loss to each of its corners.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]   // a few calls a run, each with long loops: optimised from the first
    public double[] NodeHeat(double[] cellLossW)
    {
        var l = Lattice;
        var q = new double[l.NodeCount];
        for (int j = 0; j < l.Ny; j++)
            for (int i = 0; i < l.Nx; i++)
            {
                double p = cellLossW[j * l.Nx + i] / 4;
                if (p == 0) continue;
                int n = j * l.NodesX + i;
                q[n] += p; q[n + 1] += p; q[n + l.NodesX] += p; q[n + l.NodesX + 1] += p;
            }
        return q;
    }

    /// <summary>Empty cells connected (4-neighbour) to the grid's border: the outside of the plate.</summary>
    private static bool[] OutsideCells(double[] f, int nx, int ny)
    {
        var outside = new bool[nx * ny];
        var queue = new Queue<int>();
        void Seed(int i, int j) { int c = j * nx + i; if (f[c] == 0 && !outside[c]) { outside[c] = true; queue.Enqueue(c); } }
        for (int i = 0; i < nx; i++) { Seed(i, 0); Seed(i, ny - 1); }
        for (int j = 0; j < ny; j++) { Seed(0, j); Seed(nx - 1, j); }
        while (queue.Count > 0)
        {
            int c = queue.Dequeue();
            int i = c % nx, j = c / nx;
            if (i > 0) Seed(i - 1, j);
            if (i < nx - 1) Seed(i + 1, j);
            if (j > 0) Seed(i, j - 1);
            if (j < ny - 1) Seed(i, j + 1);
        }
        return outside;
    }
}
