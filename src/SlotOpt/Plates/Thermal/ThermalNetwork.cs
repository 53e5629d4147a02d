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
    private ThermalNetwork(PlateGrid grid, int[] nodeUnknown, int unknowns, bool[] heldNode, double[] nodeAreaM2, int[] rowStart, int[] column, double[] conductionValue, int[] diagonalIndex)
    {
        Grid = grid;
        NodeUnknown = nodeUnknown;
        Unknowns = unknowns;
        HeldNode = heldNode;
        NodeAreaM2 = nodeAreaM2;
        RowStart = rowStart;
        Column = column;
        ConductionValue = conductionValue;
        DiagonalIndex = diagonalIndex;
    }

    public PlateGrid Grid { get; }
    public CellLattice Lattice => Grid.Lattice;
    /// <summary>Unknown of each node, -1 where the node has no metal or is held at ambient.</summary>
    public int[] NodeUnknown { get; }
    public int Unknowns { get; }
    /// <summary>True for metal nodes held at ambient.</summary>
    public bool[] HeldNode { get; }
    /// <summary>One face's area of each node's dual cell (m^2): a quarter of each conducting cell around it.</summary>
    public double[] NodeAreaM2 { get; }
    private int[] RowStart { get; }
    private int[] Column { get; }
    /// <summary>The conduction part of the matrix (W/K), diagonal included (conductance to held neighbours too).</summary>
    private double[] ConductionValue { get; }
    private int[] DiagonalIndex { get; }

    /// <summary>Conductance k t f h_across / h_along summed over the links from unknown u to held nodes (W/K), for the heat the edge takes.</summary>
    public double[] ConductanceToHeld { get; private init; } = Array.Empty<double>();

    public static ThermalNetwork Assemble(PlateGrid grid, double thermalConductivityWPerMK, double thicknessM, ThermalEdge edges)
    {
        var l = grid.Lattice;
        int nx = l.Nx, ny = l.Ny, nxn = l.NodesX;
        double kt = thermalConductivityWPerMK * thicknessM;
        // conducting cross-section fraction per cell: area fraction x remaining thickness fraction
        var f = new double[l.CellCount];
        for (int c = 0; c < f.Length; c++) f[c] = grid.Conductance[c] > 0 ? grid.AreaFraction[c] * (double)grid.ThicknessFraction[c] : 0;
        double F(int i, int j) => i < 0 || j < 0 || i >= nx || j >= ny ? 0 : f[j * nx + i];

        var outsideCell = edges == ThermalEdge.Ambient ? OutsideCells(f, nx, ny) : null;
        bool Outside(int i, int j) => i < 0 || j < 0 || i >= nx || j >= ny || outsideCell![j * nx + i];

        var area = new double[l.NodeCount];
        var held = new bool[l.NodeCount];
        var nodeUnknown = new int[l.NodeCount];
        double quarter = l.CellAreaM2 / 4;
        int unknowns = 0;
        for (int j = 0; j <= ny; j++)
            for (int i = 0; i <= nxn - 1; i++)
            {
                int n = j * nxn + i;
                double fa = 0;
                for (int dj = -1; dj <= 0; dj++)
                    for (int di = -1; di <= 0; di++)
                    {
                        int ci = i + di, cj = j + dj;
                        if (ci >= 0 && cj >= 0 && ci < nx && cj < ny && grid.Conductance[cj * nx + ci] > 0) fa += grid.AreaFraction[cj * nx + ci];
                    }
                area[n] = quarter * fa;
                if (area[n] == 0) { nodeUnknown[n] = -1; continue; }
                if (outsideCell is not null && (Outside(i - 1, j - 1) || Outside(i, j - 1) || Outside(i - 1, j) || Outside(i, j)))
                {
                    held[n] = true;
                    nodeUnknown[n] = -1;
                    continue;
                }
                nodeUnknown[n] = unknowns++;
            }

        var rowStart = new int[unknowns + 1];
        var column = new List<int>(5 * unknowns);
        var value = new List<double>(5 * unknowns);
        var diagonal = new int[unknowns];
        var toHeld = new double[unknowns];
        double rx = l.Hy / l.Hx, ry = l.Hx / l.Hy;
        Span<(int Node, double C)> links = stackalloc (int, double)[4];
        var entries = new (int Col, double V)[5];
        for (int j = 0; j <= ny; j++)
            for (int i = 0; i < nxn; i++)
            {
                int n = j * nxn + i;
                int u = nodeUnknown[n];
                if (u < 0) continue;
                // links: left/right cross the cells below (j-1) and above (j); down/up the cells left (i-1) and right (i)
                links[0] = (i > 0 ? n - 1 : -1, kt * rx * (F(i - 1, j - 1) + F(i - 1, j)) / 2);
                links[1] = (i < nx ? n + 1 : -1, kt * rx * (F(i, j - 1) + F(i, j)) / 2);
                links[2] = (j > 0 ? n - nxn : -1, kt * ry * (F(i - 1, j - 1) + F(i, j - 1)) / 2);
                links[3] = (j < ny ? n + nxn : -1, kt * ry * (F(i - 1, j) + F(i, j)) / 2);
                double diag = 0;
                int count = 0;
                foreach (var (m, c) in links)
                {
                    if (m < 0 || c == 0) continue;
                    diag += c;
                    int v = nodeUnknown[m];
                    if (v >= 0) entries[count++] = (v, -c);
                    else if (held[m]) toHeld[u] += c;
                }
                entries[count++] = (u, diag);
                Array.Sort(entries, 0, count, EntryOrder);
                for (int e = 0; e < count; e++)
                {
                    if (entries[e].Col == u) diagonal[u] = column.Count;
                    column.Add(entries[e].Col);
                    value.Add(entries[e].V);
                }
                rowStart[u + 1] = column.Count;
            }
        return new ThermalNetwork(grid, nodeUnknown, unknowns, held, area, rowStart, column.ToArray(), value.ToArray(), diagonal) { ConductanceToHeld = toHeld };
    }

    private static readonly Comparer<(int Col, double V)> EntryOrder = Comparer<(int Col, double V)>.Create((a, b) => a.Col.CompareTo(b.Col));

    /// <summary>The operator with surface loss: conduction plus 2 h_u A_u on the diagonal (h per unknown, W/m^2K).</summary>
    public CsrMatrix Matrix(double[] surfaceCoefficientWPerM2K)
    {
        var v = (double[])ConductionValue.Clone();
        for (int n = 0; n < NodeUnknown.Length; n++)
        {
            int u = NodeUnknown[n];
            if (u >= 0) v[DiagonalIndex[u]] += 2 * surfaceCoefficientWPerM2K[u] * NodeAreaM2[n];
        }
        return new CsrMatrix(Unknowns, Unknowns, RowStart, Column, v);
    }

    /// <summary>Heat per node from a loss per cell: a quarter of each cell's loss to each of its corners.</summary>
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
