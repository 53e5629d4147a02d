namespace SlotOpt.Plates.Sources.Magnets;

/// <summary>
/// A cuboid magnet: length along x (the travel), width along y, height along z (the magnetisation).
/// Field in closed form from the surface-charge model: the faces z = +c and z = -c carry the magnetic
/// charge densities +M and -M (M = Br / mu0), so outside B = (Br / 4 pi) (I_top - I_bottom) with
/// I = integral over the face of (r - r') / |r - r'|^3 dA' (G. Akoun and J.-P. Yonnet, "3D analytical
/// calculation of the forces exerted between two cuboidal magnets", IEEE Trans. Magn. 20(5) (1984)
/// 1962-1964; E. P. Furlani, "Permanent Magnet and Electromechanical Devices", Academic Press 2001, ch. 4).
/// Each face integral is a signed sum over the face's four corners of an antiderivative G(u, v) with
/// d^2 G / du dv = the integrand, u = x - x', v = y - y', w = z - z_face, R = sqrt(u^2 + v^2 + w^2):
/// G = atan(u v / (w R)) for w / R^3 (z), G = -ln(v + R) for u / R^3 (x), G = -ln(u + R) for v / R^3 (y).
/// Inside the magnet B = mu0 (H + M) adds Br along z.
/// </summary>
public sealed class CuboidMagnet : IPermanentMagnet
{
    public CuboidMagnet(double lengthXM, double widthYM, double heightM, double remanenceT)
    {
        if (!(lengthXM > 0) || !double.IsFinite(lengthXM)) throw new InputException($"a cuboid magnet's length must be positive (got {lengthXM} m)");
        if (!(widthYM > 0) || !double.IsFinite(widthYM)) throw new InputException($"a cuboid magnet's width must be positive (got {widthYM} m)");
        if (!(heightM > 0) || !double.IsFinite(heightM)) throw new InputException($"a cuboid magnet's height must be positive (got {heightM} m)");
        if (!double.IsFinite(remanenceT) || remanenceT == 0) throw new InputException($"a magnet's remanence must be finite and non-zero (got {remanenceT} T)");
        LengthXM = lengthXM;
        WidthYM = widthYM;
        HeightM = heightM;
        RemanenceT = remanenceT;
    }

    public double LengthXM { get; }
    public double WidthYM { get; }
    public double HeightM { get; }
    public double RemanenceT { get; }
    public double HalfLengthXM => LengthXM / 2;
    public double HalfWidthYM => WidthYM / 2;
    public double VolumeM3 => LengthXM * WidthYM * HeightM;

    public FluxDensityVector FluxDensityAt(double x, double y, double z)
    {
        double a = LengthXM / 2, b = WidthYM / 2, c = HeightM / 2;
        var top = FaceIntegral(x, y, z - c, a, b);
        var bottom = FaceIntegral(x, y, z + c, a, b);
        double k = RemanenceT / (4 * Math.PI);
        double inside = Math.Abs(x) < a && Math.Abs(y) < b && Math.Abs(z) < c ? RemanenceT : 0;   // B = mu0 (H + M) inside
        return new FluxDensityVector(k * (top.X - bottom.X), k * (top.Y - bottom.Y), k * (top.Z - bottom.Z) + inside);
    }

    public double FluxDensityZAt(double x, double y, double z)
    {
        double a = LengthXM / 2, b = WidthYM / 2, c = HeightM / 2;
        double top = FaceIntegralZ(x, y, z - c, a, b), bottom = FaceIntegralZ(x, y, z + c, a, b);
        double k = RemanenceT / (4 * Math.PI);
        double inside = Math.Abs(x) < a && Math.Abs(y) < b && Math.Abs(z) < c ? RemanenceT : 0;   // B = mu0 (H + M) inside
        return k * (top - bottom) + inside;
    }

    /// <summary>The integral over the face [-a, a] x [-b, b] at height w below the point of (r - r') / |r - r'|^3 dA'.</summary>
    private static FluxDensityVector FaceIntegral(double x, double y, double w, double a, double b)
    {
        double sx = 0, sy = 0;
        for (int i = 0; i < 2; i++)
        {
            double u = i == 0 ? x + a : x - a;   // u = x - x' at x' = -a, then x' = +a
            for (int j = 0; j < 2; j++)
            {
                double v = j == 0 ? y + b : y - b;
                double sign = i == j ? 1 : -1;   // corner sum G(u_hi, v_hi) - G(u_lo, v_hi) - G(u_hi, v_lo) + G(u_lo, v_lo)
                double r = Math.Sqrt(u * u + v * v + w * w);
                sx -= sign * LogOfSumWithDistance(v, u * u + w * w, r);
                sy -= sign * LogOfSumWithDistance(u, v * v + w * w, r);
            }
        }
        return new FluxDensityVector(sx, sy, FaceIntegralZ(x, y, w, a, b));
    }

    /// <summary>The z part of <see cref="FaceIntegral"/>: the corner sum of atan(u v / (w R)).</summary>
    private static double FaceIntegralZ(double x, double y, double w, double a, double b)
    {
        double sz = 0;
        if (w == 0) return sz;   // in the face's own plane the corner terms cancel outside the face
        for (int i = 0; i < 2; i++)
        {
            double u = i == 0 ? x + a : x - a;
            for (int j = 0; j < 2; j++)
            {
                double v = j == 0 ? y + b : y - b;
                double sign = i == j ? 1 : -1;
                double r = Math.Sqrt(u * u + v * v + w * w);
                sz += sign * Math.Atan(u * v / (w * r));
            }
        }
        return sz;
    }

    /// <summary>ln(s + R) with R^2 = s^2 + q, without cancellation for negative s: ln(q / (R - s)).</summary>
    private static double LogOfSumWithDistance(double s, double q, double r) => s >= 0 ? Math.Log(s + r) : Math.Log(q / (r - s));
}
