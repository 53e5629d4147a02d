using SlotOpt.Numerics;

namespace SlotOpt.Plates.Sources.Magnets;

/// <summary>
/// A cylindrical magnet magnetised along its axis (z, normal to the plate): the field of the equivalent
/// ideal solenoid (surface current M = Br / mu0) in the closed form of N. Derby and S. Olbert,
/// "Cylindrical magnets and ideal solenoids", Am. J. Phys. 78 (2010) 229-235, their closed forms for the
/// off-axis field: with radius a, half-height b, B0 = Br / pi, z_pm = z +- b, gamma = (a - rho) / (a + rho),
/// alpha_pm = a / sqrt(z_pm^2 + (rho + a)^2), beta_pm = z_pm / sqrt(z_pm^2 + (rho + a)^2),
/// k_pm = sqrt((z_pm^2 + (a - rho)^2) / (z_pm^2 + (a + rho)^2)):
/// B_rho = B0 [alpha_+ C(k_+, 1, 1, -1) - alpha_- C(k_-, 1, 1, -1)],
/// B_z = B0 a / (a + rho) [beta_+ C(k_+, gamma^2, 1, gamma) - beta_- C(k_-, gamma^2, 1, gamma)],
/// C being Bulirsch's complete elliptic integral (<see cref="EllipticIntegral.Cel"/>). Valid inside and outside;
/// singular only on the rim of an end face.
/// </summary>
public sealed class CylinderMagnet : IPermanentMagnet
{
    public CylinderMagnet(double diameterM, double heightM, double remanenceT)
    {
        if (!(diameterM > 0) || !double.IsFinite(diameterM)) throw new InputException($"a cylinder magnet's diameter must be positive (got {diameterM} m)");
        if (!(heightM > 0) || !double.IsFinite(heightM)) throw new InputException($"a cylinder magnet's height must be positive (got {heightM} m)");
        if (!double.IsFinite(remanenceT) || remanenceT == 0) throw new InputException($"a magnet's remanence must be finite and non-zero (got {remanenceT} T)");
        DiameterM = diameterM;
        HeightM = heightM;
        RemanenceT = remanenceT;
    }

    public double DiameterM { get; }
    public double HeightM { get; }
    public double RemanenceT { get; }
    public double HalfLengthXM => DiameterM / 2;
    public double HalfWidthYM => DiameterM / 2;
    public double VolumeM3 => Math.PI * DiameterM * DiameterM / 4 * HeightM;

    public FluxDensityVector FluxDensityAt(double x, double y, double z)
    {
        double a = DiameterM / 2, b = HeightM / 2, b0 = RemanenceT / Math.PI;
        double rho = Math.Sqrt(x * x + y * y);
        double bZ = FluxDensityZAt(x, y, z);
        if (rho < 1e-12 * a) return new FluxDensityVector(0, 0, bZ);   // on the axis B_rho = 0 (x / rho undefined)
        double bRho = 0;
        for (int side = 0; side < 2; side++)
        {
            double zs = side == 0 ? z + b : z - b, sign = side == 0 ? 1 : -1;
            double d = Math.Sqrt(zs * zs + (rho + a) * (rho + a));
            double kc = Math.Sqrt((zs * zs + (a - rho) * (a - rho)) / (zs * zs + (a + rho) * (a + rho)));
            bRho += sign * (a / d) * EllipticIntegral.Cel(kc, 1, 1, -1);      // B_rho = B0 [alpha_+ C(k_+, 1, 1, -1) - alpha_- C(k_-, 1, 1, -1)]
        }
        bRho *= b0;
        return new FluxDensityVector(bRho * x / rho, bRho * y / rho, bZ);
    }

    public double FluxDensityZAt(double x, double y, double z)
    {
        double a = DiameterM / 2, b = HeightM / 2, b0 = RemanenceT / Math.PI;
        double rho = Math.Sqrt(x * x + y * y);
        double gamma = (a - rho) / (a + rho);
        double bZ = 0;
        for (int side = 0; side < 2; side++)
        {
            double zs = side == 0 ? z + b : z - b, sign = side == 0 ? 1 : -1;
            double d = Math.Sqrt(zs * zs + (rho + a) * (rho + a));
            double kc = Math.Sqrt((zs * zs + (a - rho) * (a - rho)) / (zs * zs + (a + rho) * (a + rho)));
            bZ += sign * (zs / d) * EllipticIntegral.Cel(kc, gamma * gamma, 1, gamma);   // B_z = B0 a / (a + rho) [beta_+ C(k_+, gamma^2, 1, gamma) - beta_- C(...)]
        }
        return bZ * (b0 * a / (a + rho));
    }
}
