using SlotOpt.Numerics;
using SlotOpt.Plates.Conductors;
using SlotOpt.Plates.Geometry;
using SlotOpt.Plates.Grid;
using SlotOpt.Plates.Sources;

namespace SlotOpt.Tests.Plates.OwnField;

/// <summary>
/// A point magnetic dipole of moment MomentAm2 along +z (normal to the sheet), at HeightM above the
/// sheet, over (Position.X + offset, Position.Y), moving along +x at SpeedMPerS. Its field at the
/// sheet (z = 0, source at z = h, dz = -h, r^2 = rho^2 + h^2):
/// Bz = (mu0 m / 4 pi)(3 dz^2 - r^2) / r^5 and dBz/dz = (mu0 m / 4 pi)(9 dz / r^5 - 15 dz^3 / r^7)
/// (the point-dipole field, e.g. J. D. Jackson, "Classical Electrodynamics", 3rd ed., eq. 5.56).
/// This is the source of the Reitz (1970) thin-sheet results (J. R. Reitz, J. Appl. Phys. 41:2067, 1970).
/// </summary>
public sealed class MovingDipole : IMovingSheetSource
{
    private const int LinePoints = 8;

    public MovingDipole(Vec2 position, double heightM, double momentAm2, double speedMPerS)
    {
        if (!(heightM > 0) || !double.IsFinite(heightM)) throw new InputException($"the dipole's height above the sheet must be positive (got {heightM} m)");
        if (!double.IsFinite(momentAm2)) throw new InputException("the dipole moment is not finite");
        if (!(speedMPerS > 0) || !double.IsFinite(speedMPerS)) throw new InputException($"the speed must be positive (got {speedMPerS} m/s)");
        Position = position;
        HeightM = heightM;
        MomentAm2 = momentAm2;
        SpeedMPerS = speedMPerS;
    }

    public Vec2 Position { get; }
    public double HeightM { get; }
    public double MomentAm2 { get; }
    public double SpeedMPerS { get; }

    /// <summary>Perfect-image force F0 = 3 mu0 m^2 / (32 pi h^4) (J. R. Reitz, J. Appl. Phys. 41:2067, 1970): the lift as v -> infinity over a wide thin sheet.</summary>
    public double ImageForceN => 3 * Validity.Mu0 * MomentAm2 * MomentAm2 / (32 * Math.PI * Math.Pow(HeightM, 4));

    public double FieldZ(double dx, double dy)
    {
        double dz = -HeightM, r2 = dx * dx + dy * dy + dz * dz;
        return Validity.Mu0 * MomentAm2 / (4 * Math.PI) * (3 * dz * dz - r2) / (r2 * r2 * Math.Sqrt(r2));
    }

    public double FieldGradientZ(double dx, double dy)
    {
        double dz = -HeightM, r2 = dx * dx + dy * dy + dz * dz, r5 = r2 * r2 * Math.Sqrt(r2);
        return Validity.Mu0 * MomentAm2 / (4 * Math.PI) * (9 * dz / r5 - 15 * dz * dz * dz / (r5 * r2));
    }

    /// <summary>Dual cell of node (i, j): integral of -v dBz/dx = -v (line integral of Bz on its right edge - on its left edge), Gauss-Legendre along y.</summary>
    public void IntegrateRate(CellLattice lattice, double offsetXM, double[] node)
    {
        var (t, w) = Quadrature.GaussLegendre01(LinePoints);
        double cx = Position.X + offsetXM, cy = Position.Y;
        var line = new double[lattice.NodesX + 1];
        for (int j = 0; j < lattice.NodesY; j++)
        {
            double y0 = lattice.NodeY(j) - lattice.Hy / 2;
            for (int e = 0; e <= lattice.NodesX; e++)
            {
                double x = lattice.NodeX(e) - lattice.Hx / 2;
                double s = 0;
                for (int q = 0; q < LinePoints; q++) s += w[q] * FieldZ(x - cx, y0 + t[q] * lattice.Hy - cy);
                line[e] = s * lattice.Hy;
            }
            for (int i = 0; i < lattice.NodesX; i++) node[j * lattice.NodesX + i] = -SpeedMPerS * (line[i + 1] - line[i]);
        }
    }

    /// <summary>Dual-cell integral of dBz/dz per node, 4 x 4 Gauss-Legendre points: the source knows its gradient.</summary>
    public LiftField IntegrateLiftField(CellLattice l, double offsetXM, double[] node)
    {
        var (t, w) = Quadrature.GaussLegendre01(4);
        double cx = Position.X + offsetXM, cy = Position.Y;
        for (int j = 0; j < l.NodesY; j++)
            for (int i = 0; i < l.NodesX; i++)
            {
                double x0 = l.NodeX(i) - l.Hx / 2 - cx, y0 = l.NodeY(j) - l.Hy / 2 - cy, s = 0;
                for (int a = 0; a < 4; a++)
                    for (int b = 0; b < 4; b++)
                        s += w[a] * w[b] * FieldGradientZ(x0 + t[a] * l.Hx, y0 + t[b] * l.Hy);
                node[j * l.NodesX + i] = s * l.CellAreaM2;
            }
        return LiftField.NormalGradient;
    }
}
