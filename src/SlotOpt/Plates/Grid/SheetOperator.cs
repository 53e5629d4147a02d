using SlotOpt.Numerics;

namespace SlotOpt.Plates.Grid;

/// <summary>
/// The discrete operator of div(grad(psi) / G) = dBz/dt at unit reference sheet conductance, as
/// a resistor network: the current across the grid edge from node a to node b is psi_b - psi_a,
/// it flows between the centres of the two cells beside that edge, through the two half cells'
/// resistance R = (h_along / h_edge) (1/g1 + 1/g2) / 2 (ohm per unit G). Faraday's law around each
/// node's dual cell gives  sum_edges R_e (psi_n - psi_m) = -(integral of dBz/dt over the dual cell),
/// so A psi = -s with A = sum_e R_e (e_a - e_b)(e_a - e_b)^T: symmetric positive definite, and the
/// loss is P = sum_e R_e I_e^2 = psi^T A psi = -psi . s. On smooth cases this is the standard
/// 5-point finite-volume scheme, second order in h.
/// </summary>
public sealed class SheetOperator
{
    public PlateGrid Grid { get; }
    public NodeRegions Regions { get; }
    public CsrMatrix Matrix { get; }

    private SheetOperator(PlateGrid grid, NodeRegions regions, CsrMatrix matrix)
    {
        Grid = grid;
        Regions = regions;
        Matrix = matrix;
    }

    public static SheetOperator Assemble(PlateGrid grid, NodeRegions regions)
    {
        var l = grid.Lattice;
        int n = regions.UnknownCount;
        if (n == 0) throw NoFreeNode();
        var nodeUnknown = regions.NodeUnknown;
        // nodes of each unknown
        var nodeStart = new int[n + 1];
        foreach (int u in nodeUnknown) if (u >= 0) nodeStart[u + 1]++;
        for (int u = 0; u < n; u++) nodeStart[u + 1] += nodeStart[u];
        var fill = (int[])nodeStart.Clone();
        var nodesOf = new int[nodeStart[n]];
        for (int k = 0; k < nodeUnknown.Length; k++) if (nodeUnknown[k] >= 0) nodesOf[fill[nodeUnknown[k]]++] = k;

        var rowStart = new int[n + 1];
        for (int u = 0; u < n; u++) rowStart[u + 1] = rowStart[u] + 1 + 4 * (nodeStart[u + 1] - nodeStart[u]);
        var col = new int[rowStart[n]];
        var val = new double[rowStart[n]];
        var g = grid.Conductance;
        double rx = l.Hy / l.Hx, ry = l.Hx / l.Hy;
        int nxn = l.NodesX;
        int write = 0;
        var finalStart = new int[n + 1];
        for (int u = 0; u < n; u++)
        {
            int begin = write;
            col[write] = u; val[write] = 0; write++;
            double diag = 0;
            for (int q = nodeStart[u]; q < nodeStart[u + 1]; q++)
            {
                int node = nodesOf[q];
                int i = node % nxn, j = node / nxn;
                // right, left: horizontal edges (current crosses them in y); up, down: vertical edges
                if (i < l.Nx) Edge(node + 1, Resistance(g, l, i, j - 1, i, j, rx));
                if (i > 0) Edge(node - 1, Resistance(g, l, i - 1, j - 1, i - 1, j, rx));
                if (j < l.Ny) Edge(node + nxn, Resistance(g, l, i - 1, j, i, j, ry));
                if (j > 0) Edge(node - nxn, Resistance(g, l, i - 1, j - 1, i, j - 1, ry));
            }
            val[begin] = diag;
            if (!(diag > 0)) throw NoConductingCellBeside(u);
            // sort the row by column and merge duplicates, compacting towards the front
            Array.Sort(col, val, begin, write - begin);
            int w = begin;
            for (int k = begin + 1; k < write; k++)
            {
                if (col[k] == col[w]) val[w] += val[k];
                else { w++; col[w] = col[k]; val[w] = val[k]; }
            }
            write = w + 1;
            finalStart[u + 1] = write;
            // the next row is written from here on: rows only shrink, so it never overtakes its own capacity

            void Edge(int other, double r)
            {
                if (r == 0) return;
                int v = nodeUnknown[other];
                if (v == u) return;
                diag += r;
                if (v >= 0) { col[write] = v; val[write] = -r; write++; }
            }
        }
        Array.Resize(ref col, write);
        Array.Resize(ref val, write);
        return new SheetOperator(grid, regions, new CsrMatrix(n, n, finalStart, col, val));
    }

    internal static InputException NoFreeNode() =>
        new("the plate has no free stream-function node on this grid: every node touches a hole or the outside; refine the grid");

    internal static InputException NoConductingCellBeside(int unknown) =>
        new($"stream-function unknown {unknown} has no conducting cell beside it; the plate is disconnected at grid scale: refine the grid");

    /// <summary>Edge resistance between cells (i1, j1) and (i2, j2); 0 (no edge) when either is missing or empty.</summary>
    private static double Resistance(double[] g, CellLattice l, int i1, int j1, int i2, int j2, double aspect)
    {
        if (i1 < 0 || j1 < 0 || i2 >= l.Nx || j2 >= l.Ny || i2 < 0 || j2 < 0 || i1 >= l.Nx || j1 >= l.Ny) return 0;
        double g1 = g[j1 * l.Nx + i1], g2 = g[j2 * l.Nx + i2];
        if (g1 == 0 || g2 == 0) return 0;
        return EdgeResistance(1 / g1, 1 / g2, aspect);
    }

    /// <summary>The resistance of the grid edge between two cells from their inverse relative conductances: aspect (1/g1 + 1/g2) / 2, the two half cells in series; 0 when either cell is empty (inverse 0).</summary>
    internal static double EdgeResistance(double inverse1, double inverse2, double aspect) =>
        inverse1 == 0 || inverse2 == 0 ? 0 : aspect * 0.5 * (inverse1 + inverse2);
}
