using SlotOpt.Plates.ResistanceLimited;

namespace SlotOpt.Plates.Thermal;

/// <summary>
/// The eddy-current loss split over the grid's cells (W per cell, row-major j * nx + i). The sheet
/// operator's loss is P = G sum_e R_e I_e^2 over the grid edges (see <see cref="SheetOperator"/>),
/// with R_e = (h_along / h_edge)(1/g1 + 1/g2)/2 the resistance of the two half cells the edge current
/// crosses; each half cell's share (h_along / h_edge) / (2 g) I_e^2 is given to that cell, so the
/// cells sum to the solver's loss exactly. For AC the time average: I^2 -> (|I_re|^2 + |I_im|^2) / 2.
/// </summary>
public static class CellLossMap
{
    public static double[] Of(UnitConductanceSolution solution, double sheetConductanceS)
    {
        var model = solution.Model;
        var l = model.Lattice;
        var g = model.Grid.Conductance;
        var map = model.Regions.NodeUnknown;
        var loss = new double[l.CellCount];
        double weight = solution.PsiIm is null ? sheetConductanceS : 0.5 * sheetConductanceS;
        double rx = l.Hy / l.Hx, ry = l.Hx / l.Hy;
        int nxn = l.NodesX;
        for (int j = 0; j <= l.Ny; j++)
            for (int i = 0; i <= l.Nx; i++)
            {
                int n = j * nxn + i;
                // right link: between cells (i, j-1) and (i, j); up link: between cells (i-1, j) and (i, j)
                if (i < l.Nx) Share(n, n + 1, i, j - 1, i, j, rx);
                if (j < l.Ny) Share(n, n + nxn, i - 1, j, i, j, ry);
            }
        return loss;

        void Share(int a, int b, int i1, int j1, int i2, int j2, double aspect)
        {
            if (i1 < 0 || j1 < 0 || i2 >= l.Nx || j2 >= l.Ny) return;
            int c1 = j1 * l.Nx + i1, c2 = j2 * l.Nx + i2;
            if (g[c1] == 0 || g[c2] == 0) return;
            double i2sum = Squared(solution.PsiRe, a, b);
            if (solution.PsiIm is { } im) i2sum += Squared(im, a, b);
            double s = weight * aspect * 0.5 * i2sum;
            loss[c1] += s / g[c1];
            loss[c2] += s / g[c2];
        }

        double Squared(double[] psi, int a, int b)
        {
            double pa = map[a] < 0 ? 0 : psi[map[a]], pb = map[b] < 0 ? 0 : psi[map[b]];
            return (pb - pa) * (pb - pa);
        }
    }
}
