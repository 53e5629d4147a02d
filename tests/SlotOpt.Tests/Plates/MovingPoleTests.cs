using SlotOpt.Plates.Geometry;
using SlotOpt.Plates.Grid;
using SlotOpt.Plates.ResistanceLimited;
using SlotOpt.Plates.Sources;

namespace SlotOpt.Tests.Plates;

public class MovingPoleTests
{
    private const double RadiusM = 0.01, FluxDensityT = 0.5, SpeedMPerS = 1, ConductivitySPerM = 3.5e7, ThicknessM = 1e-3;

    private static MovingPoles SinglePole(double speed = SpeedMPerS, double b = FluxDensityT) =>
        new(new[] { new Pole(PoleFace.Circle(RadiusM), new Vec2(0, 0), b) }, speed);

    // Heald, "Magnetic braking: improved theory", Am. J. Phys. 56(6):521-522, 1988:
    // uniform B in a circle of radius R on an infinite sheet, low speed: F = 1/2 sigma t v B^2 pi R^2.
    // Finite plate: a disc of radius a = 10 R with the pole at its centre. The image of the boundary
    // (J_r = 0 at r = a) lowers the field inside the pole to (vB/2)(1 - R^2/a^2), so
    // F = 1/2 sigma t v B^2 pi R^2 (1 - R^2/a^2) [D, derived here]; this is the m -> 0 limit of the
    // Smythe/Schieber disc-brake formula T = 1/2 sigma d omega pi r^2 m^2 B^2 [1 - (r/a)^2 / (1 - (m/a)^2)^2]
    // (W. R. Smythe, Trans. AIEE 61:681-684, 1942; D. Schieber, Proc. IEE 121(2):117-122, 1974), with F = T/m and v = omega m. The 1 % correction is what a 10 R plate changes.
    // Tolerances: 3 % against Heald (the brief), 0.3 % against the finite-disc form (the target at 20 cells
    // per radius; measured -0.004 %, -0.74 % before the pole edge's energy was taken by its angle to the lattice).
    [Fact]
    public void Circular_pole_on_large_disc_matches_Heald_drag()
    {
        double a = 10 * RadiusM;
        var model = SheetModel.Build(new PlateGeometry(Polygon.Circle(new Vec2(0, 0), a, 2048)), new GridOptions { CellSizeM = RadiusM / 20 });
        var sweep = ResistanceLimitedSolver.SolveMoving(model, SinglePole(), new[] { 0.0 });
        double drag = sweep.DragN(ConductivitySPerM * ThicknessM)[0];
        double heald = 0.5 * ConductivitySPerM * ThicknessM * SpeedMPerS * FluxDensityT * FluxDensityT * Math.PI * RadiusM * RadiusM;
        Assert.InRange(drag / heald - 1, -0.03, 0.03);
        Assert.InRange(drag / (heald * (1 - RadiusM * RadiusM / (a * a))) - 1, -0.003, 0.003);
    }

    // Resistance-limited regime: psi is linear in dB/dt = -v dB/dx, so loss ~ v^2 B^2 and drag = P/v ~ v B^2
    // (the resistance-limited sheet equation is linear in dB/dt = -v dB/dx; Heald 1988's F is linear in v and quadratic in B). Each case is a
    // separate solve (not the scaling API). Tolerance 1e-6 relative: two solves converged to 1e-8 residual.
    [Theory]
    [InlineData(3.0, 1.0)]   // speed x3 -> loss x9
    [InlineData(1.0, 2.0)]   // field x2 -> loss x4
    public void Loss_grows_with_square_of_speed_and_field(double speedFactor, double fieldFactor)
    {
        var model = SheetModel.Build(PlateGeometry.Rectangle(0.1, 0.1), new GridOptions { CellSizeM = RadiusM / 8 });
        var offsets = new[] { 0.05, 0.06 };
        var baseSweep = ResistanceLimitedSolver.SolveMoving(model, SinglePoleAt(0, 0.05, SpeedMPerS, FluxDensityT), offsets);
        var scaled = ResistanceLimitedSolver.SolveMoving(model, SinglePoleAt(0, 0.05, speedFactor * SpeedMPerS, fieldFactor * FluxDensityT), offsets);
        double expected = speedFactor * speedFactor * fieldFactor * fieldFactor;
        Assert.InRange(scaled.MeanLossPerSiemensW / baseSweep.MeanLossPerSiemensW / expected - 1, -1e-6, 1e-6);
        Assert.InRange(scaled.MeanDragN(1) / baseSweep.MeanDragN(1) / (speedFactor * fieldFactor * fieldFactor) - 1, -1e-6, 1e-6);
    }

    // A pole wholly beyond the plate induces nothing in it: zero drag with a note, not an error.
    // Tolerance: exactly zero (the source term is identically zero, so the solve is skipped).
    [Fact]
    public void Pole_entirely_off_the_plate_gives_zero_with_a_note()
    {
        var model = SheetModel.Build(PlateGeometry.Rectangle(0.1, 0.1), new GridOptions { CellSizeM = 0.005 });
        var sweep = ResistanceLimitedSolver.SolveMoving(model, SinglePoleAt(0.5, 0.05, SpeedMPerS, FluxDensityT), new[] { 0.0, 0.01 });
        Assert.Equal(0.0, sweep.MeanDragN(1));
        Assert.Contains(sweep.Notes, n => n.Contains("no pole overlaps"));
    }

    // Slots across the direction of motion cut the loops the moving pole drives: a comb-slotted plate has
    // less mean drag than the solid one (common practice, no source).
    // The row of 4 alternating poles moves over the plate; the mean is over one slot pitch (4 offsets).
    // Asserted: slotted/solid below 0.8 (measured 0.48), so the check fails if the slots stop cutting current.
    [Fact]
    public void Slotted_plate_has_less_drag_than_solid_over_one_pitch()
    {
        double pitch = 0.02;
        var poles = MovingPoles.Row(PoleFace.Rectangle(0.015, 0.03), new Vec2(0.04, 0.04), 4, 0.03, FluxDensityT, SpeedMPerS);
        var offsets = MovingSweepSolution.OffsetsOverPitch(pitch, 4);
        var solid = PlateGeometry.Rectangle(0.2, 0.06);
        var slotted = PlateGeometry.Rectangle(0.2, 0.06);
        slotted.AddPattern(SlotPatterns.Comb(slotted.Outline, PlateEdge.Bottom, pitch, 0.05, 0.002));
        var options = new GridOptions { CellSizeM = 0.0005 };
        double g = ConductivitySPerM * ThicknessM;
        double solidDrag = ResistanceLimitedSolver.SolveMoving(SheetModel.Build(solid, options), poles, offsets).MeanDragN(g);
        double slottedDrag = ResistanceLimitedSolver.SolveMoving(SheetModel.Build(slotted, options), poles, offsets).MeanDragN(g);
        Assert.True(slottedDrag / solidDrag < 0.8, $"slotted/solid drag = {slottedDrag / solidDrag:F3}");
    }

    private static MovingPoles SinglePoleAt(double x, double y, double speed, double b) =>
        new(new[] { new Pole(PoleFace.Circle(RadiusM), new Vec2(x, y), b) }, speed);
}
