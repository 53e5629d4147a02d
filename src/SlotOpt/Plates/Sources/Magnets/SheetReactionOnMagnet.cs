using SlotOpt.Plates.Grid;

namespace SlotOpt.Plates.Sources.Magnets;

/// <summary>
/// The force on a magnet from the sheet currents' field, for a magnet small against its distance from the
/// sheet: F = grad(m . B_sheet) at the magnet's centre (the force on a point dipole in an external field;
/// J. D. Jackson, "Classical Electrodynamics", 3rd ed. 1999, eq. 5.69), m = Br V / mu0 along z. The sheet
/// current K = curl(psi z) is a layer of dipoles psi z per unit area, so each lattice node contributes a
/// dipole psi hx hy whose field is B = mu0 p / (4 pi) (3 dz^2 - rho^2) / rho^5 along z at the magnet
/// (Jackson eq. 5.56), giving m . B = (Br V / 4 pi) psi hx hy f, f = (3 dz^2 - rho^2) / rho^5, dz and rho
/// from the node to the magnet; grad f = (dx (3 rho^2 - 15 dz^2), dy (3 rho^2 - 15 dz^2), dz (9 rho^2 - 15 dz^2)) / rho^7.
/// Point dipoles per dual cell are accurate to O((h / rho)^2).
/// </summary>
public static class SheetReactionOnMagnet
{
    /// <summary>
    /// The force (newtons) on a magnet of remanence times volume remanenceVolumeTm3 (signed by its polarity)
    /// centred at (xM, yM) and heightM above the sheet, from the sheet function psi (per model unknown, at
    /// unit conductance) scaled to sheet conductance G.
    /// </summary>
    public static (double X, double Y, double Z) ForceN(SheetModel model, double[] psiPerSiemens, double sheetConductanceS,
        double xM, double yM, double heightM, double remanenceVolumeTm3)
    {
        if (!(heightM > 0)) throw new InputException($"the magnet's centre must be above the sheet (got {heightM} m)");
        var l = model.Lattice;
        var map = model.Regions.NodeUnknown;
        double fx = 0, fy = 0, fz = 0;
        for (int j = 0; j < l.NodesY; j++)
            for (int i = 0; i < l.NodesX; i++)
            {
                int u = map[j * l.NodesX + i];
                if (u < 0) continue;   // outside the plate: psi = 0
                double psi = psiPerSiemens[u];
                double dx = xM - l.NodeX(i), dy = yM - l.NodeY(j), dz = heightM;
                double r2 = dx * dx + dy * dy + dz * dz, r7 = r2 * r2 * r2 * Math.Sqrt(r2);
                double lateral = (3 * r2 - 15 * dz * dz) / r7;
                fx += psi * dx * lateral;
                fy += psi * dy * lateral;
                fz += psi * dz * (9 * r2 - 15 * dz * dz) / r7;
            }
        double scale = remanenceVolumeTm3 / (4 * Math.PI) * sheetConductanceS * l.CellAreaM2;
        return (scale * fx, scale * fy, scale * fz);
    }
}
