using MathNet.Numerics;
using SlotOpt.Plates.Geometry;
using SlotOpt.Plates.Grid;
using SlotOpt.Plates.ResistanceLimited;
using SlotOpt.Plates.Sources.Magnets;

namespace SlotOpt.Tests.Plates.Magnets;

/// <summary>
/// A magnet over a wide thin sheet (sheet conductance G = sigma t) at low speed (the eddy currents' own field
/// neglected: the resistance-limited regime, mu0 sigma t v much below 1).
///
/// Exact infinite-sheet forces, derived here. K = curl(psi z), E = K / G, Faraday's law (curl E)_z = -dBz/dt gives
/// lap psi = G dBz/dt. With Fourier transforms f^(k) = integral f e^{-i k.r} dA and k^2 = kx^2 + ky^2:
/// - Sliding at v along x: dBz/dt = -v dBz/dx, so -k^2 psi^ = -i kx v G Bz^, psi^ = i kx v G Bz^ / k^2. Loss
///   P = integral |grad psi|^2 / G dA = (1/G) integral k^2 |psi^|^2 d^2k / (2 pi)^2 = G v^2 integral (kx^2 / k^2) |Bz^|^2 d^2k / (2 pi)^2.
///   If |Bz^|^2 is unchanged by a 90-degree turn (kx, ky) -> (ky, kx) (a square magnet, a disc), the kx^2 / k^2 and
///   ky^2 / k^2 parts are equal and sum to 1, so by Parseval P = (1/2) G v^2 integral Bz^2 dA and the drag
///   F = P / v = (1/2) sigma t v integral Bz^2 dA. For a uniform Bz = B inside a circle of radius R this is
///   (1/2) sigma t v B^2 pi R^2: D. W. Heald, "Magnetic braking: improved theory", Am. J. Phys. 56(6) (1988) 521-522.
/// - Approaching at v (the field pattern moves toward the sheet): Bz^(k, z) ~ e^{-|k| (z_m - z)} below the magnet, so
///   dBz^/dt = |k| v Bz^, psi^ = -v G Bz^ / |k|, P = G v^2 integral |Bz^|^2 d^2k / (2 pi)^2 = G v^2 integral Bz^2 dA (no symmetry
///   needed) and the damping force F = P / v = sigma t v integral Bz^2 dA.
/// The integral of Bz^2 over the infinite plane is computed from the closed-form field (checked in MagnetFieldTests) by
/// MathNet's Gauss-Legendre rules on pieces of the quarter plane, the tail x > 8 a mapped to s = 8 a / x in (0, 1].
/// </summary>
public class MagnetSheetDragTests(Xunit.Abstractions.ITestOutputHelper output)
{
    private const double Side = 0.02, Height = 0.01, Gap = 0.002, Br = 1.2, Speed = 1.0;

    private static readonly CuboidMagnet Square = new(Side, Side, Height, Br);

    /// <summary>Integral of Bz^2 over the whole plane at the sheet, quarter plane times 4 (the field is even in x and y).</summary>
    private static double SquaredFieldIntegral(int order)
    {
        double a = Side / 2, zSheet = -(Gap + Height / 2);
        double Line(Func<double, double> f) =>
            Integrate.GaussLegendre(f, 0, a, order) + Integrate.GaussLegendre(f, a, 2 * a, order) + Integrate.GaussLegendre(f, 2 * a, 8 * a, order)
            + Integrate.GaussLegendre(s => f(8 * a / s) * 8 * a / (s * s), 1e-300, 1, order / 2);   // tail: Bz^2 ~ x^-6, so the mapped integrand ~ s^4
        return 4 * Line(y => Line(x => { double b = Square.FluxDensityAt(x, y, zSheet).Z; return b * b; }));
    }

    private static (SheetModel Model, MagnetArray Array) WidePlate(double plateFactor, double cellM)
    {
        double l = plateFactor * Side;
        var array = new MagnetArray(new[] { new MagnetPlacement(Square, new Vec2(l / 2, l / 2), 1) }, Gap);
        return (SheetModel.Build(PlateGeometry.Rectangle(l, l), new GridOptions { CellSizeM = cellM }), array);
    }

    // The reference integral itself: Gauss-Legendre of order 64 per piece against order 128. Tolerance 1e-9 relative (it is far below the checks' tolerances).
    [Fact]
    public void Reference_integral_of_squared_field_is_converged()
    {
        double coarse = SquaredFieldIntegral(64), fine = SquaredFieldIntegral(128);
        Assert.InRange(coarse / fine - 1, -1e-9, 1e-9);
    }

    // Sliding: the resistance-limited solver on a square plate 8 magnet sides wide, magnet centred, 1 mm cells (half the gap),
    // against the exact infinite-sheet drag (1/2) sigma t v integral Bz^2 dA derived above. Measured ratio 0.99824: the plate's edge
    // (psi = 0 there closes the currents inside) costs 0.10 % (0.99928 on a plate 16 sides wide), the grid 0.06 % (0.99872 at 0.5 mm cells,
    // second order). Tolerance 0.5 %.
    [Fact]
    public void Square_magnet_sliding_over_wide_sheet_gives_the_infinite_sheet_drag()
    {
        var (model, array) = WidePlate(8, 0.001);
        var sweep = ResistanceLimitedSolver.SolveMoving(model, new SlidingMagnets(array, Speed), new[] { 0.0 });
        double g = 5.8e7 * 1e-3;   // copper sheet 1 mm thick (IEC 60028 annealed copper, 58 MS/m); the regime's scaling makes any G equivalent
        double exact = 0.5 * g * Speed * SquaredFieldIntegral(64);
        Assert.InRange(sweep.DragN(g)[0] / exact - 1, -0.005, 0.005);
    }

    // The same for a disc magnet (a cylinder, 20 mm across and 10 mm high, 2 mm above the sheet): its field is axisymmetric, so the
    // 90-degree condition holds and the drag is (1/2) sigma t v integral Bz^2 dA, the integral 2 pi int_0^inf Bz(rho)^2 rho drho by
    // MathNet's Gauss-Legendre rules on [0, R], [R, 2R], [2R, 8R] and the mapped tail (order 64 against 128 agree to 1e-9). The
    // circle needs no cut cells (the plate is square; the field is smooth). Measured ratio 0.99825; tolerance 0.5 %, as for the square magnet.
    [Fact]
    public void Disc_magnet_sliding_over_wide_sheet_gives_the_infinite_sheet_drag()
    {
        var disc = new CylinderMagnet(Side, Height, Br);
        double zSheet = -(Gap + Height / 2), r = Side / 2;
        double Radial(int order)
        {
            double F(double rho) { double b = disc.FluxDensityAt(rho, 0, zSheet).Z; return b * b * rho; }
            return 2 * Math.PI * (Integrate.GaussLegendre(F, 0, r, order) + Integrate.GaussLegendre(F, r, 2 * r, order) + Integrate.GaussLegendre(F, 2 * r, 8 * r, order)
                + Integrate.GaussLegendre(s => F(8 * r / s) * 8 * r / (s * s), 1e-300, 1, order / 2));
        }
        double reference = Radial(64);
        Assert.InRange(reference / Radial(128) - 1, -1e-9, 1e-9);
        double l = 8 * Side;
        var array = new MagnetArray(new[] { new MagnetPlacement(disc, new Vec2(l / 2, l / 2), 1) }, Gap);
        var model = SheetModel.Build(PlateGeometry.Rectangle(l, l), new GridOptions { CellSizeM = 0.001 });
        var sweep = ResistanceLimitedSolver.SolveMoving(model, new SlidingMagnets(array, Speed), new[] { 0.0 });
        double g = 5.8e7 * 1e-3;
        output.WriteLine($"disc: drag / exact = {sweep.DragN(g)[0] / (0.5 * g * Speed * reference):F5}");
        Assert.InRange(sweep.DragN(g)[0] / (0.5 * g * Speed * reference) - 1, -0.005, 0.005);
    }

    // Approaching: the same plate and magnet moving straight toward it, against the exact infinite-sheet damping force
    // sigma t v integral Bz^2 dA derived above. Measured ratio 0.99934 (0.99983 at 0.5 mm cells: the grid's second-order error;
    // 0.99935 on a plate 16 sides wide: the plate's edge costs nothing visible, the source has no net flux change to carry to it).
    // Tolerance 0.3 %.
    [Fact]
    public void Square_magnet_approaching_wide_sheet_gives_the_infinite_sheet_damping()
    {
        var (model, array) = WidePlate(8, 0.001);
        var approach = ApproachDamping.Solve(model, array, Speed);
        double g = 5.8e7 * 1e-3;
        double exact = g * Speed * SquaredFieldIntegral(64);
        Assert.InRange(approach.DampingForceN(g) / exact - 1, -0.003, 0.003);
        Assert.InRange(approach.RelativeResidual, 0, 1e-8);
    }

    // Newton's third law across two computations: the force on the plate from the solver's power balance (drag P / v along +x when sliding;
    // -P / v along z when approaching, the plate pushed away), with the closed-form cuboid field as the source, against the force on the
    // magnet F = grad(m . B_sheet) (J. D. Jackson, "Classical Electrodynamics", 3rd ed. 1999, eq. 5.69, number from memory) from the sheet
    // currents' dipole-layer field at the magnet, m = Br V / mu0. A 4 mm cube 20 mm above the plate is small against its distance:
    // a cube's field departs from its dipole field only at l = 5, (a / d)^4 ~ 1e-3 times a small coefficient (measured: an 8 mm cube gives the
    // same ratio to 1e-4). What remains is the point-dipole sum over 2 mm dual cells, O((h / d)^2): measured +0.18 % (+0.05 % at 1 mm cells).
    // Tolerance 0.5 % on the force along the motion, and the cross components below 1e-6 of it (zero by the plate's symmetry).
    [Fact]
    public void Force_on_magnet_from_sheet_currents_is_equal_and_opposite_to_force_on_plate()
    {
        double l = 0.24, side = 0.004, gap = 0.02, g = 5.8e7 * 1e-3;
        var cube = new CuboidMagnet(side, side, side, Br);
        var array = new MagnetArray(new[] { new MagnetPlacement(cube, new Vec2(l / 2, l / 2), 1) }, gap);
        var model = SheetModel.Build(PlateGeometry.Rectangle(l, l), new GridOptions { CellSizeM = 0.002 });
        double height = gap + side / 2, moment = Br * cube.VolumeM3;

        var sweep = ResistanceLimitedSolver.SolveMoving(model, new SlidingMagnets(array, Speed), new[] { 0.0 });
        double plateDrag = sweep.DragN(g)[0];
        var onMagnet = SheetReactionOnMagnet.ForceN(model, sweep.Peak.PsiRe, g, l / 2, l / 2, height, moment);
        Assert.InRange(-onMagnet.X / plateDrag - 1, -0.005, 0.005);
        Assert.InRange(Math.Abs(onMagnet.Y) + Math.Abs(onMagnet.Z), 0, 1e-6 * plateDrag);

        var approach = ApproachDamping.Solve(model, array, Speed);
        double plateDamping = approach.DampingForceN(g);
        var repulsion = SheetReactionOnMagnet.ForceN(model, approach.PsiPerSiemens, g, l / 2, l / 2, height, moment);
        Assert.InRange(repulsion.Z / plateDamping - 1, -0.005, 0.005);
        Assert.InRange(Math.Abs(repulsion.X) + Math.Abs(repulsion.Y), 0, 1e-6 * plateDamping);
    }
}
