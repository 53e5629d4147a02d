using MathNet.Numerics;
using SlotOpt.Numerics;
using SlotOpt.Plates.Sources.Magnets;

namespace SlotOpt.Tests.Plates.Magnets;

public class MagnetFieldTests
{
    private const double Br = 1.2;

    // Bulirsch's cel against its defining integral C(kc, p, c, s) = int_0^{pi/2} (c cos^2 + s sin^2) / ((cos^2 + p sin^2) sqrt(cos^2 + kc^2 sin^2)) dphi
    // (R. Bulirsch, Numer. Math. 13 (1969) 305-315), evaluated by MathNet's adaptive Gauss-Kronrod quadrature to 1e-14.
    // Tolerance 1e-11 relative: the iteration stops near 1e-16, the reference quadrature is good to about 1e-13.
    [Theory]
    [InlineData(0.3, 1.0, 1.0, -1.0)]
    [InlineData(0.7, 0.25, 1.0, 0.5)]
    [InlineData(0.05, 0.01, 1.0, 0.1)]
    [InlineData(0.999, 0.0, 1.0, 0.0)]
    public void Bulirsch_cel_matches_its_defining_integral(double kc, double p, double c, double s)
    {
        double reference = Integrate.GaussKronrod(phi =>
        {
            double co = Math.Cos(phi) * Math.Cos(phi), si = Math.Sin(phi) * Math.Sin(phi);
            return (c * co + s * si) / ((co + p * si) * Math.Sqrt(co + kc * kc * si));
        }, 0, Math.PI / 2, 1e-14, 20, 61);
        Assert.InRange(EllipticIntegral.Cel(kc, p, c, s) / reference - 1, -1e-11, 1e-11);
    }

    // On the axis of a cylinder magnet (radius R, height h), at distance z from its face:
    // Bz = (Br / 2) [(h + z) / sqrt((h + z)^2 + R^2) - z / sqrt(z^2 + R^2)]: the on-axis field of a finite ideal solenoid
    // with n I = Br / mu0 (D. J. Griffiths, "Introduction to Electrodynamics", 3rd ed. 1999, Problem 5.11, B = (mu0 n I / 2)(cos theta2 - cos theta1);
    // problem number from memory), which is also the rho -> 0 limit in N. Derby and S. Olbert, Am. J. Phys. 78 (2010) 229-235.
    // Tolerance 1e-12 relative: both are closed forms, only rounding and the cel iteration (1e-16) differ.
    [Theory]
    [InlineData(0.001)]
    [InlineData(0.005)]
    [InlineData(0.02)]
    [InlineData(0.1)]
    public void Cylinder_on_axis_field_matches_the_solenoid_formula(double z)
    {
        double radius = 0.01, h = 0.006;
        var magnet = new CylinderMagnet(2 * radius, h, Br);
        double expected = Br / 2 * ((h + z) / Math.Sqrt((h + z) * (h + z) + radius * radius) - z / Math.Sqrt(z * z + radius * radius));
        var below = magnet.FluxDensityAt(0, 0, -(h / 2 + z));   // below the magnet, toward the plate
        var above = magnet.FluxDensityAt(0, 0, h / 2 + z);
        Assert.InRange(below.Z / expected - 1, -1e-12, 1e-12);
        Assert.InRange(above.Z / expected - 1, -1e-12, 1e-12);
        Assert.Equal(0.0, below.X);
    }

    // On the axis of a block magnet (half sides a, b, height h), at distance z from its face:
    // Bz = (Br / pi) [atan(a b / (z sqrt(a^2 + b^2 + z^2))) - atan(a b / ((z + h) sqrt(a^2 + b^2 + (z + h)^2)))]
    // (the solid angle of a rectangle seen from its axis, for the two charged faces; E. P. Furlani,
    // "Permanent Magnet and Electromechanical Devices", Academic Press 2001, ch. 4, from memory).
    // Tolerance 1e-12 relative: closed forms on both sides.
    [Theory]
    [InlineData(0.001)]
    [InlineData(0.01)]
    [InlineData(0.05)]
    public void Cuboid_on_axis_field_matches_the_block_formula(double z)
    {
        double a = 0.01, b = 0.006, h = 0.008;
        var magnet = new CuboidMagnet(2 * a, 2 * b, h, Br);
        double Term(double d) => Math.Atan(a * b / (d * Math.Sqrt(a * a + b * b + d * d)));
        double expected = Br / Math.PI * (Term(z) - Term(z + h));
        var below = magnet.FluxDensityAt(0, 0, -(h / 2 + z));
        Assert.InRange(below.Z / expected - 1, -1e-12, 1e-12);
        Assert.InRange(Math.Abs(below.X) + Math.Abs(below.Y), 0, 1e-12 * expected);
    }

    // Off-axis: the closed forms against a direct numerical integration of the surface-charge integral
    // B = (Br / 4 pi) [int_top (r - r') / |r - r'|^3 dA' - int_bottom (...) dA'] (the charge model of Akoun and Yonnet 1984 and
    // Furlani 2001 ch. 4, before any integral is done), by MathNet's Gauss-Legendre product rule of order 256 on each face
    // (polar coordinates on the cylinder's faces). Points at least 0.2 magnet sizes from any face, where order 256 resolves the
    // 1/R^2 peak to better than 1e-9. Tolerance 1e-7 of |B| per component.
    [Theory]
    [InlineData(0.003, 0.002, -0.008)]
    [InlineData(0.012, -0.004, -0.006)]
    [InlineData(0.02, 0.015, 0.0)]
    [InlineData(-0.007, 0.009, 0.012)]
    public void Cuboid_field_matches_numerical_surface_charge_integral(double x, double y, double z)
    {
        double a = 0.01, b = 0.006, c = 0.004;
        var magnet = new CuboidMagnet(2 * a, 2 * b, 2 * c, Br);
        var closed = magnet.FluxDensityAt(x, y, z);
        double[] Face(double zf) => Enumerable.Range(0, 3).Select(k => Integrate.OnRectangle((xp, yp) =>
        {
            double dx = x - xp, dy = y - yp, dz = z - zf, r3 = Math.Pow(dx * dx + dy * dy + dz * dz, 1.5);
            return (k == 0 ? dx : k == 1 ? dy : dz) / r3;
        }, -a, a, -b, b, 256)).ToArray();
        var top = Face(c);
        var bottom = Face(-c);
        var numeric = new[] { 0, 1, 2 }.Select(k => Br / (4 * Math.PI) * (top[k] - bottom[k])).ToArray();
        double scale = closed.Magnitude;
        Assert.InRange(Math.Abs(closed.X - numeric[0]), 0, 1e-7 * scale);
        Assert.InRange(Math.Abs(closed.Y - numeric[1]), 0, 1e-7 * scale);
        Assert.InRange(Math.Abs(closed.Z - numeric[2]), 0, 1e-7 * scale);
    }

    // As above for the cylinder: the charged end faces in polar coordinates (r', phi'), dA' = r' dr' dphi'. Tolerance 1e-7 of |B|.
    [Theory]
    [InlineData(0.004, 0.003, -0.009)]
    [InlineData(0.015, 0.0, -0.005)]
    [InlineData(0.009, -0.012, 0.0)]
    [InlineData(-0.02, 0.01, 0.011)]
    public void Cylinder_field_matches_numerical_surface_charge_integral(double x, double y, double z)
    {
        double radius = 0.01, c = 0.004;
        var magnet = new CylinderMagnet(2 * radius, 2 * c, Br);
        var closed = magnet.FluxDensityAt(x, y, z);
        double[] Face(double zf) => Enumerable.Range(0, 3).Select(k => Integrate.OnRectangle((rp, phi) =>
        {
            double dx = x - rp * Math.Cos(phi), dy = y - rp * Math.Sin(phi), dz = z - zf, r3 = Math.Pow(dx * dx + dy * dy + dz * dz, 1.5);
            return (k == 0 ? dx : k == 1 ? dy : dz) / r3 * rp;
        }, 0, radius, 0, 2 * Math.PI, 256)).ToArray();
        var top = Face(c);
        var bottom = Face(-c);
        var numeric = new[] { 0, 1, 2 }.Select(k => Br / (4 * Math.PI) * (top[k] - bottom[k])).ToArray();
        double scale = closed.Magnitude;
        Assert.InRange(Math.Abs(closed.X - numeric[0]), 0, 1e-7 * scale);
        Assert.InRange(Math.Abs(closed.Y - numeric[1]), 0, 1e-7 * scale);
        Assert.InRange(Math.Abs(closed.Z - numeric[2]), 0, 1e-7 * scale);
    }

    // Outside a magnet B is divergence-free and curl-free (Maxwell: div B = 0 everywhere, curl B = mu0 J = 0 with no current there).
    // Central differences with step s = 1e-5 m against a field that varies on 5 mm: truncation (s / 5 mm)^2 ~ 4e-6,
    // rounding 1e-16 / 2e-3 relative; tolerance 1e-4 of |B| / (1 mm).
    [Theory]
    [InlineData("cuboid", 0.003, 0.002, -0.009)]
    [InlineData("cuboid", 0.013, -0.004, -0.002)]
    [InlineData("cylinder", 0.004, 0.003, -0.009)]
    [InlineData("cylinder", 0.011, 0.006, 0.001)]
    public void Field_outside_is_divergence_and_curl_free(string shape, double x, double y, double z)
    {
        IPermanentMagnet magnet = shape == "cuboid" ? new CuboidMagnet(0.02, 0.012, 0.008, Br) : new CylinderMagnet(0.02, 0.008, Br);
        const double s = 1e-5;
        FluxDensityVector D(int axis)
        {
            double ex = axis == 0 ? s : 0, ey = axis == 1 ? s : 0, ez = axis == 2 ? s : 0;
            var p = magnet.FluxDensityAt(x + ex, y + ey, z + ez);
            var m = magnet.FluxDensityAt(x - ex, y - ey, z - ez);
            return (1 / (2 * s)) * (p + (-1) * m);
        }
        var dx = D(0); var dy = D(1); var dz = D(2);
        double limit = 1e-4 * magnet.FluxDensityAt(x, y, z).Magnitude / 1e-3;
        Assert.InRange(dx.X + dy.Y + dz.Z, -limit, limit);          // div B
        Assert.InRange(dy.Z - dz.Y, -limit, limit);                  // (curl B)_x
        Assert.InRange(dz.X - dx.Z, -limit, limit);                  // (curl B)_y
        Assert.InRange(dx.Y - dy.X, -limit, limit);                  // (curl B)_z
    }

    // Far away a uniformly magnetised body is a dipole m = Br V / mu0: B = (mu0 / 4 pi) [3 n (n . m) - m] / r^3
    // (J. D. Jackson, "Classical Electrodynamics", 3rd ed. 1999, eq. 5.56, number from memory). At r = 20 magnet sizes the
    // next multipole (l = 3 for a cylinder of these proportions, l = 5 for a cube) is below (size / r)^2 = 2.5e-3 of it; tolerance 3e-3 of |B|.
    [Theory]
    [InlineData("cuboid")]
    [InlineData("cylinder")]
    public void Far_field_is_the_dipole_field(string shape)
    {
        IPermanentMagnet magnet = shape == "cuboid" ? new CuboidMagnet(0.01, 0.01, 0.01, Br) : new CylinderMagnet(0.01, 0.01, Br);
        double r = 0.2, theta = 0.7, phi = 0.3;
        double x = r * Math.Sin(theta) * Math.Cos(phi), y = r * Math.Sin(theta) * Math.Sin(phi), z = r * Math.Cos(theta);
        double k = Br * magnet.VolumeM3 / (4 * Math.PI * r * r * r);   // mu0 m / (4 pi r^3)
        double nz = z / r;
        var dipole = new FluxDensityVector(k * 3 * nz * x / r, k * 3 * nz * y / r, k * (3 * nz * nz - 1));
        var b = magnet.FluxDensityAt(x, y, z);
        double tol = 3e-3 * dipole.Magnitude;
        Assert.InRange(b.X - dipole.X, -tol, tol);
        Assert.InRange(b.Y - dipole.Y, -tol, tol);
        Assert.InRange(b.Z - dipole.Z, -tol, tol);
    }

    // Bz alone (FluxDensityZAt, for the sources that use only Bz) is the full vector's Z bit for bit: the same operations in the same
    // order. The full vector itself is checked above against published closed forms (solenoid and block on axis), the surface-charge
    // integral, Maxwell's div/curl and the dipole far field. Points inside, beside the rim, level with a face (the cuboid's w = 0 branch),
    // on the axis, below the magnet and far away. Tolerance: none (bit-identical), since the disc's reports must not change.
    [Theory]
    [InlineData("cuboid")]
    [InlineData("cylinder")]
    public void Z_alone_is_the_full_vectors_Z_bit_for_bit(string shape)
    {
        IPermanentMagnet magnet = shape == "cuboid" ? new CuboidMagnet(0.02, 0.012, 0.008, Br) : new CylinderMagnet(0.02, 0.008, Br);
        double[][] points =
        [
            [0.002, -0.001, 0.001], [0.0101, 0.0003, -0.004], [0.013, -0.004, -0.002], [0.004, 0.003, -0.009], [0, 0, -0.007],
            [0.011, 0.006, 0.004], [-0.007, 0.0059, 0.0001], [0.25, -0.13, -0.4], [-1.5, 2.0, 0.8], [0.003, 0.002, 0.012],
        ];
        foreach (var p in points)
        {
            double full = magnet.FluxDensityAt(p[0], p[1], p[2]).Z, alone = magnet.FluxDensityZAt(p[0], p[1], p[2]);
            Assert.True(BitConverter.DoubleToInt64Bits(full) == BitConverter.DoubleToInt64Bits(alone), $"{shape} at ({p[0]}, {p[1]}, {p[2]}): Z {full:R}, alone {alone:R}");
        }
    }
}
