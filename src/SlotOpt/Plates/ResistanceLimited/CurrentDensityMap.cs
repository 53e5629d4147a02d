using SlotOpt.Plates.Grid;

namespace SlotOpt.Plates.ResistanceLimited;

/// <summary>
/// Current density per cell (A/m^2) at the cell centres, for plots: J = K / (t f_t), with the
/// sheet current K = curl(psi z) from the cell's four corner values (K_x = dpsi/dy, K_y = -dpsi/dx)
/// and f_t the remaining thickness fraction. For AC it is the local amplitude |Ĵ| =
/// sqrt(|Ĵ_re|^2 + |Ĵ_im|^2) (the peak when the phase is uniform); for a moving source the
/// instantaneous value. Non-conducting cells hold 0.
/// </summary>
public sealed class CurrentDensityMap
{
    public CurrentDensityMap(double[] xM, double[] yM, double[,] valueAPerM2)
    {
        XM = xM;
        YM = yM;
        ValueAPerM2 = valueAPerM2;
    }

    /// <summary>Cell-centre x (nx values) and y (ny values).</summary>
    public double[] XM { get; }
    public double[] YM { get; }
    /// <summary>[j, i]: row j (y), column i (x).</summary>
    public double[,] ValueAPerM2 { get; }

    /// <summary>Builds the map of |J| for a unit-conductance solution scaled to conductivity sigma: J = sigma K_unit / f_t.</summary>
    internal static (CurrentDensityMap Map, double PeakAPerM2, double RmsAPerM2) Build(SheetModel model, double[] psiRe, double[]? psiIm, double conductivitySPerM)
    {
        var l = model.Lattice;
        var grid = model.Grid;
        var map = model.Regions.NodeUnknown;
        var values = new double[l.Ny, l.Nx];
        double peak = 0, sumSquares = 0, sumWeight = 0;
        double timeAverage = psiIm is null ? 1 : 0.5;   // <J^2> = |Ĵ|^2 / 2 for AC
        for (int j = 0; j < l.Ny; j++)
            for (int i = 0; i < l.Nx; i++)
            {
                int c = j * l.Nx + i;
                if (grid.Conductance[c] == 0) continue;
                int n00 = j * l.NodesX + i;
                double k2 = SheetCurrentSquared(psiRe, map, n00, l);
                if (psiIm is not null) k2 += SheetCurrentSquared(psiIm, map, n00, l);
                double jv = conductivitySPerM * Math.Sqrt(k2) / grid.ThicknessFraction[c];
                values[j, i] = jv;
                peak = Math.Max(peak, jv);
                double w = grid.AreaFraction[c] * grid.ThicknessFraction[c];
                sumSquares += w * timeAverage * jv * jv;
                sumWeight += w;
            }
        var xs = Enumerable.Range(0, l.Nx).Select(l.CellCentreX).ToArray();
        var ys = Enumerable.Range(0, l.Ny).Select(l.CellCentreY).ToArray();
        return (new CurrentDensityMap(xs, ys, values), peak, sumWeight > 0 ? Math.Sqrt(sumSquares / sumWeight) : 0);
    }

    private static double SheetCurrentSquared(double[] psi, int[] map, int n00, CellLattice l)
    {
        double Value(int node) => map[node] < 0 ? 0 : psi[map[node]];
        double p00 = Value(n00), p10 = Value(n00 + 1), p01 = Value(n00 + l.NodesX), p11 = Value(n00 + l.NodesX + 1);
        double kx = (p01 + p11 - p00 - p10) / (2 * l.Hy);    // K_x = dpsi/dy
        double ky = -(p10 + p11 - p00 - p01) / (2 * l.Hx);   // K_y = -dpsi/dx
        return kx * kx + ky * ky;
    }
}
