using MathNet.Numerics;
using SlotOpt.Plates.Conductors;
using SlotOpt.Plates.Geometry;
using SlotOpt.Plates.Sources.Magnets;
using SlotOpt.Plates.Thick;
using Xunit.Abstractions;

namespace SlotOpt.Tests.Plates;

/// <summary>
/// The laterally infinite slab under sliding magnets (<see cref="SlabUnderMovingMagnets"/>, derivation in Plates/REACTION.md),
/// against the published thin-sheet and half-space results and against the real-space closed-form fields.
/// </summary>
public class ThickSlabTests(ITestOutputHelper output)
{
    private const double Copper = 58e6;
    private const double DipoleMoment = 3.81972;   // A m^2
    private static readonly CuboidMagnet Square = new(0.02, 0.02, 0.01, 1.2);
    private const double Gap = 0.002;

    private static MagnetArray One(IPermanentMagnet magnet) => new(new[] { new MagnetPlacement(magnet, new Vec2(0, 0), 1) }, Gap);

    // Half-space of copper (58 MS/m) under a normal dipole m = 3.81972 A m^2 at h = 20 mm: drag 0.0041535, 0.041213, 0.31658,
    // 0.60459 N at 0.01, 0.1, 1, 10 m/s (J. R. Reitz, "Forces on moving magnets due to eddy currents", J. Appl. Phys. 41 (1970)
    // 2067, the thick-plate result; these values re-derived by full integration of his reflection coefficient, given to 5 digits).
    // Tolerance 1.5e-4 relative: the rounding of the 5-digit values (at most 1.2e-4 of 0.0041535), the quadrature asked for 1e-8.
    [Fact]
    public void Half_space_drag_under_a_dipole_matches_Reitz()
    {
        var slab = new SlabUnderMovingMagnets(Copper, double.PositiveInfinity);
        var forces = slab.Solve(SurfaceFieldSpectrum.OfNormalDipole(DipoleMoment, 0.02), new[] { 0.01, 0.1, 1, 10 }, 1e-8);
        var expected = new[] { 0.0041535, 0.041213, 0.31658, 0.60459 };
        for (int s = 0; s < expected.Length; s++)
        {
            output.WriteLine($"v {forces[s].SpeedMPerS} m/s: drag {forces[s].DragN:G8} N (Reitz {expected[s]}), lift {forces[s].LiftN:G6} N, loss/v {forces[s].LossW / forces[s].SpeedMPerS:G8}, level {forces[s].QuadratureLevel}, error {forces[s].RelativeErrorEstimate:E1}");
            Assert.InRange(forces[s].DragN / expected[s] - 1, -1.5e-4, 1.5e-4);
        }
    }

    // Half-space, low speed, normal dipole: F_D = mu0^2 m^2 sigma v / (128 pi h^3) (derived in the class comment of SlabUnderMovingMagnets;
    // the same as a thin sheet of thickness h/3 under Reitz's 1970 low-speed thin-sheet drag F0 v / (2 w)). Tolerance 1e-7: the quadrature asked for 1e-9.
    [Theory]
    [InlineData(0.02)]
    [InlineData(0.005)]
    public void Half_space_low_speed_drag_is_a_sheet_a_third_of_the_height_thick(double heightM)
    {
        var slab = new SlabUnderMovingMagnets(Copper, double.PositiveInfinity);
        double perSpeed = slab.LowSpeedDragPerSpeed(SurfaceFieldSpectrum.OfNormalDipole(DipoleMoment, heightM), 1e-9);
        double exact = Validity.Mu0 * Validity.Mu0 * DipoleMoment * DipoleMoment * Copper / (128 * Math.PI * Math.Pow(heightM, 3));
        output.WriteLine($"h {heightM}: {perSpeed:G10} against {exact:G10} N s/m");
        Assert.InRange(perSpeed / exact - 1, -1e-7, 1e-7);
    }

    // Thin limit, own field, any speed: a slab 10 um thick with sigma d = 58 kS (w = 2 / (mu0 sigma d) = 27.44 m/s) under the dipole at
    // h = 20 mm against Reitz's thin-sheet closed forms F_L = F0 [1 - w / sqrt(v^2 + w^2)], F_D = (w / v) F_L, F0 = 3 mu0 m^2 / (32 pi h^4)
    // (Reitz 1970, re-derived with the thin-sheet reflection R = i s / (1 + i s), s = (v / w) cos phi). The slab departs from the sheet by
    // O(k d) and O(d / delta_c): tolerance 2e-3 (measured below 5e-4 at d / h = 5e-4).
    [Fact]
    public void Thin_slab_reaches_Reitz_thin_sheet_lift_and_drag()
    {
        const double d = 1e-5, h = 0.02;
        var slab = new SlabUnderMovingMagnets(58e3 / d, d);
        double w = 2 / (Validity.Mu0 * 58e3), f0 = 3 * Validity.Mu0 * DipoleMoment * DipoleMoment / (32 * Math.PI * Math.Pow(h, 4));
        var speeds = new[] { 0.1 * w, w, 5 * w };
        var forces = slab.Solve(SurfaceFieldSpectrum.OfNormalDipole(DipoleMoment, h), speeds, 1e-7);
        for (int s = 0; s < speeds.Length; s++)
        {
            double v = speeds[s], lift = f0 * (1 - w / Math.Sqrt(v * v + w * w)), drag = w / v * lift;
            output.WriteLine($"v/w {v / w:G3}: drag {forces[s].DragN / drag:F6}, lift {forces[s].LiftN / lift:F6} of Reitz's thin sheet");
            Assert.InRange(forces[s].DragN / drag - 1, -2e-3, 2e-3);
            Assert.InRange(forces[s].LiftN / lift - 1, -2e-3, 2e-3);
            // Davis's ratio for a thin sheet, any source: F_D / F_L = w / v (W. M. Saslow, Am. J. Phys. 60(8) (1992) 693-711).
            Assert.InRange(forces[s].DragN / forces[s].LiftN / (w / v) - 1, -2e-3, 2e-3);
        }
    }

    // Davis's ratio for a real magnet (the cuboid) over a thin slab: F_D / F_L = w / v whatever the magnet's shape (Saslow 1992).
    // Same tolerance and reason as above.
    [Fact]
    public void Thin_slab_under_a_cuboid_has_Daviss_drag_to_lift_ratio()
    {
        const double d = 1e-5;
        var slab = new SlabUnderMovingMagnets(58e3 / d, d);
        double w = 2 / (Validity.Mu0 * 58e3);
        foreach (var f in slab.Solve(SurfaceFieldSpectrum.Of(One(Square)), new[] { 0.3 * w, 3 * w }, 1e-7))
        {
            output.WriteLine($"v/w {f.SpeedMPerS / w:G3}: (F_D / F_L) / (w / v) = {f.DragN / f.LiftN / (w / f.SpeedMPerS):F6}");
            Assert.InRange(f.DragN / f.LiftN / (w / f.SpeedMPerS) - 1, -2e-3, 2e-3);
        }
    }

    // Thin limit, low speed, real magnets: F_D = (1/2) sigma d v integral Bz^2 dA over the plane of the sheet (the exact infinite-sheet
    // drag for a source with 90-degree symmetry, derived in MagnetSheetDragTests; Heald, Am. J. Phys. 56(6) (1988) 521 for a uniform disc),
    // with integral Bz^2 dA from the real-space closed forms (Akoun and Yonnet 1984 for the cuboid, Derby and Olbert 2010 for the
    // cylinder) by MathNet Gauss-Legendre. This checks the footprint transforms of SurfaceFieldSpectrum through Parseval.
    // d = 0.1 nm: the thickness correction, about -k d with k ~ 1 / gap, is near 2e-8 (measured -1.7e-6 at d = 10 nm, as expected).
    // Tolerance 2e-7: the correction and the two quadratures (each converged to 1e-9).
    [Fact]
    public void Thin_slab_low_speed_drag_is_half_sigma_d_v_times_the_integral_of_Bz_squared()
    {
        const double d = 1e-10;
        var slab = new SlabUnderMovingMagnets(Copper, d);
        var cylinder = new CylinderMagnet(0.02, 0.01, 1.2);
        foreach (var (magnet, integral) in new (IPermanentMagnet, double)[] { (Square, SquareIntegralOfBz2(96)), (cylinder, CylinderIntegralOfBz2(cylinder, 96)) })
        {
            double perSpeed = slab.LowSpeedDragPerSpeed(SurfaceFieldSpectrum.Of(One(magnet)), 1e-9);
            double exact = 0.5 * Copper * d * integral;
            output.WriteLine($"{magnet.GetType().Name}: {perSpeed:G10} against {exact:G10} N s/m");
            Assert.InRange(perSpeed / exact - 1, -2e-7, 2e-7);
        }
    }

    // The real-space reference integrals themselves: order 96 against 160 per piece, 1e-9 relative.
    [Fact]
    public void Real_space_reference_integrals_are_converged()
    {
        Assert.InRange(SquareIntegralOfBz2(96) / SquareIntegralOfBz2(160) - 1, -1e-9, 1e-9);
        var cylinder = new CylinderMagnet(0.02, 0.01, 1.2);
        Assert.InRange(CylinderIntegralOfBz2(cylinder, 96) / CylinderIntegralOfBz2(cylinder, 160) - 1, -1e-9, 1e-9);
    }

    // Energy: the drag times the speed (from Maxwell's stress above the slab) equals the Joule loss (from the field inside it), two
    // different routes through the solution; a 5 mm copper slab under the cuboid from well below to well above the critical speed.
    // Tolerance 1e-6: the quadrature asked for 1e-8; the identity is exact.
    [Fact]
    public void Drag_times_speed_equals_the_joule_loss()
    {
        var slab = new SlabUnderMovingMagnets(Copper, 0.005);
        foreach (var f in slab.Solve(SurfaceFieldSpectrum.Of(One(Square)), new[] { 0.05, 1, 20, 400 }, 1e-8))
        {
            output.WriteLine($"v {f.SpeedMPerS}: drag {f.DragN:G8} N, lift {f.LiftN:G6} N, loss / (drag v) {f.LossW / (f.DragN * f.SpeedMPerS):F9}");
            Assert.InRange(f.LossW / (f.DragN * f.SpeedMPerS) - 1, -1e-6, 1e-6);
        }
    }

    // Low speed: the slab with its own field approaches the resistance-limited drag (the drag per speed at v -> 0), ratio 1 - O(Rm^2);
    // at 1 mm/s over 5 mm of copper Rm = mu0 sigma v h ~ 1e-6. Tolerance 1e-6.
    [Fact]
    public void Own_field_solution_reaches_the_resistance_limited_drag_at_low_speed()
    {
        var slab = new SlabUnderMovingMagnets(Copper, 0.005);
        var spectrum = SurfaceFieldSpectrum.Of(One(Square));
        double low = slab.LowSpeedDragPerSpeed(spectrum, 1e-9) * 1e-3;
        var f = slab.Solve(spectrum, new[] { 1e-3 }, 1e-9)[0];
        output.WriteLine($"own field {f.DragN:G10} N, resistance-limited {low:G10} N");
        Assert.InRange(f.DragN / low - 1, -1e-6, 1e-6);
    }

    // Thick limit at high speed: over a half-space F_D / F_L falls as sqrt(v0' / v) (Saslow, Am. J. Phys. 60(8) (1992) 693-711, the
    // thick-sheet limit of Davis's ratio): quadrupling the speed halves the ratio. At v = 1 and 4 km/s over copper, h = 20 mm
    // (mu0 sigma v h = 1.5e3 and 5.8e3) the next term is O(Rm^-1/2) ~ 3 %; tolerance 3 %.
    [Fact]
    public void Half_space_drag_to_lift_ratio_falls_as_the_inverse_square_root_of_speed()
    {
        var slab = new SlabUnderMovingMagnets(Copper, double.PositiveInfinity);
        var f = slab.Solve(SurfaceFieldSpectrum.OfNormalDipole(DipoleMoment, 0.02), new[] { 1000.0, 4000.0 }, 1e-7);
        double ratio = (f[1].DragN / f[1].LiftN) / (f[0].DragN / f[0].LiftN);
        output.WriteLine($"ratio(4 km/s) / ratio(1 km/s) = {ratio:F5}");
        Assert.InRange(ratio, 0.5 * 0.97, 0.5 * 1.03);
    }

    // A slab of finite thickness at low speed: the depth factor 1 - e^{-2 k d} splits the drag into the half-space's under the dipole at
    // h less the half-space's at h + d, F_D = (mu0^2 m^2 sigma v / (128 pi)) (1 / h^3 - 1 / (h + d)^3) (from the closed form above).
    // Tolerance 1e-7 (quadrature asked for 1e-9). At speed a slab many skin depths thick (10 cm of copper at 10 m/s,
    // delta_c = sqrt(2 h / (mu0 sigma v)) = 7.4 mm) carries the half-space's drag: tolerance 1e-4 (e^{-2 d / delta_c} ~ 1e-12 would be the field's reach).
    [Fact]
    public void Finite_slab_low_speed_drag_is_a_difference_of_half_spaces_and_a_thick_slab_at_speed_is_a_half_space()
    {
        const double h = 0.02, d = 0.01;
        var spectrum = SurfaceFieldSpectrum.OfNormalDipole(DipoleMoment, h);
        double perSpeed = new SlabUnderMovingMagnets(Copper, d).LowSpeedDragPerSpeed(spectrum, 1e-9);
        double exact = Validity.Mu0 * Validity.Mu0 * DipoleMoment * DipoleMoment * Copper / (128 * Math.PI) * (1 / Math.Pow(h, 3) - 1 / Math.Pow(h + d, 3));
        output.WriteLine($"d {d}: {perSpeed:G10} against {exact:G10} N s/m");
        Assert.InRange(perSpeed / exact - 1, -1e-7, 1e-7);
        var thick = new SlabUnderMovingMagnets(Copper, 0.1).Solve(spectrum, new[] { 10.0 }, 1e-8)[0];
        var half = new SlabUnderMovingMagnets(Copper, double.PositiveInfinity).Solve(spectrum, new[] { 10.0 }, 1e-8)[0];
        output.WriteLine($"10 cm slab at 10 m/s: {thick.DragN / half.DragN:F9} of the half-space's drag");
        Assert.InRange(thick.DragN / half.DragN - 1, -1e-4, 1e-4);
    }

    // Non-convergence is reported, not returned as a number: an accuracy below what doubles can show fails with a reason.
    [Fact]
    public void Unreachable_accuracy_fails_with_a_reason()
    {
        var slab = new SlabUnderMovingMagnets(Copper, 0.005);
        Assert.False(slab.TrySolve(SurfaceFieldSpectrum.OfNormalDipole(DipoleMoment, 0.02), new[] { 1.0 }, 1e-17, out var forces, out var failure));
        Assert.Null(forces);
        Assert.Contains("did not converge", failure);
    }

    /// <summary>Integral of Bz^2 over the plane at the slab's surface under the square magnet (quarter plane times 4, tail mapped as in MagnetSheetDragTests).</summary>
    private static double SquareIntegralOfBz2(int order)
    {
        double a = Square.LengthXM / 2, z = -(Gap + Square.HeightM / 2);
        double Line(Func<double, double> f) =>
            Integrate.GaussLegendre(f, 0, a, order) + Integrate.GaussLegendre(f, a, 2 * a, order) + Integrate.GaussLegendre(f, 2 * a, 8 * a, order)
            + Integrate.GaussLegendre(s => f(8 * a / s) * 8 * a / (s * s), 1e-300, 1, order / 2);
        return 4 * Line(y => Line(x => { double b = Square.FluxDensityAt(x, y, z).Z; return b * b; }));
    }

    /// <summary>2 pi integral of Bz(r)^2 r dr under the cylinder magnet (the tail r &gt; 8 R mapped to s = 8 R / r).</summary>
    private static double CylinderIntegralOfBz2(CylinderMagnet c, int order)
    {
        double radius = c.DiameterM / 2, z = -(Gap + c.HeightM / 2);
        double F(double r) { double b = c.FluxDensityAt(r, 0, z).Z; return b * b * r; }
        return 2 * Math.PI * (Integrate.GaussLegendre(F, 0, radius, order) + Integrate.GaussLegendre(F, radius, 2 * radius, order)
            + Integrate.GaussLegendre(F, 2 * radius, 8 * radius, order) + Integrate.GaussLegendre(s => F(8 * radius / s) * 8 * radius / (s * s), 1e-300, 1, order / 2));
    }
}
