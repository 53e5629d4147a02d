using SlotOpt.Lamination;
using SlotOpt.Materials;
using SlotOpt.Plates.Geometry;
using SlotOpt.Plates.Grid;
using SlotOpt.Plates.ResistanceLimited;
using SlotOpt.Plates.Sources;
using SlotOpt.Waveforms;

namespace SlotOpt.Tests.Hardening;

/// <summary>Numerical edge cases: each ends in a right number, a zero with a note, or a clear refusal; never NaN.</summary>
public class NumericalEdgeCaseTests
{
    private static UnitConductanceSolution SolveUniform(PlateGeometry geometry, double cellM, double peakT = 0.01) =>
        ResistanceLimitedSolver.SolveAc(SheetModel.Build(geometry, new GridOptions { CellSizeM = cellM }), new UniformAcField(peakT, 50));

    [Fact]
    public void Zero_field_gives_exactly_zero_loss()
    {
        var solution = SolveUniform(PlateGeometry.Rectangle(0.2, 0.1), 0.005, peakT: 0);
        Assert.Equal(0, solution.LossPerSiemensW);
    }

    [Fact]
    public void Zero_speed_is_refused_in_words()
    {
        var e = Assert.Throws<InputException>(() => MovingPoles.Row(PoleFace.Circle(0.01), new Vec2(0.1, 0.05), 1, 0, 0.3, 0));
        Assert.Contains("speed must be positive", e.Message);
    }

    // A cut across the whole plate makes two separate conductors. Square 1 x 1 cut into two 1 x 0.5 halves:
    // by the torsion analogy (Timoshenko and Goodier, Theory of Elasticity, 1970, ch. 10, k1 table)
    // loss goes with J = k1 a^3 b: 2 k1(2) 0.5^3 1 against k1(1) 1^4, ratio 2 x 0.22868 x 0.125 / 0.14058 = 0.4067.
    // Tolerance 1.5 %: 64 cells across, discretisation error well under 1 % for each shape.
    [Fact]
    public void A_cut_through_the_plate_makes_two_conductors()
    {
        var solid = SolveUniform(PlateGeometry.Rectangle(1, 1), 1.0 / 64);
        var cutPlate = PlateGeometry.Rectangle(1, 1).AddCut(new CutLine(new Vec2(-0.01, 0.5), new Vec2(1.01, 0.5)));
        var cut = SolveUniform(cutPlate, 1.0 / 64);
        var expected = 2 * FiniteWidth.TorsionCoefficient(0.5, 1) * 0.125 / FiniteWidth.TorsionCoefficient(1, 1);
        Assert.Equal(0.4067, expected, 1e-3);
        Assert.Equal(expected, cut.LossPerSiemensW / solid.LossPerSiemensW, expected * 0.015);
    }

    // Slots that leave a ligament of a single cell: the solve converges, the loss is finite and lies between
    // the plate cut clean through at that line and the solid plate.
    [Fact]
    public void A_one_cell_ligament_solves_to_a_finite_loss_between_the_extremes()
    {
        const double cell = 0.0025;
        var outline = Polygon.Rectangle(0, 0, 0.2, 0.1);
        var almost = new PlateGeometry(outline).AddPattern(SlotPatterns.Comb(outline, PlateEdge.Bottom, 0.04, 0.1 - cell, 0.004));
        var loss = SolveUniform(almost, cell).LossPerSiemensW;
        var solid = SolveUniform(new PlateGeometry(outline), cell).LossPerSiemensW;
        Assert.True(double.IsFinite(loss) && loss > 0 && loss < solid, $"{loss} vs solid {solid}");
    }

    // Extreme aspect ratio 100:1: the strip is nearly the infinite slab, F_w(0.01) = 0.99370 (torsion of a thin rectangle, Timoshenko and Goodier 1970 ch. 10, derived
    // from the T&G series), so loss per length = G (dB/dt)^2 J/4 with J = k1 a^3 b. Tolerance 1 %.
    [Fact]
    public void A_100_to_1_strip_matches_the_slab_within_a_percent()
    {
        const double a = 0.01, b = 1.0;
        var solution = SolveUniform(PlateGeometry.Rectangle(b, a), a / 16);
        var omega = 2 * Math.PI * 50;
        var expected = Math.Pow(omega * 0.01, 2) / 2 * FiniteWidth.TorsionCoefficient(a, b) * a * a * a * b / 4;
        Assert.Equal(expected, solution.LossPerSiemensW, expected * 0.01);
    }

    // A lamination ten skin depths thick: the classical term carries F = 3/x (Lammeraner and Stafl, Eddy Currents, 1964; Stoll 1974: F(x) = (3/x)(sinh x - sin x)/(cosh x - cos x), F(10) = 0.299992)
    // and the result is flagged; nothing overflows.
    [Fact]
    public void A_lamination_much_thicker_than_the_skin_depth_is_corrected_and_flagged()
    {
        var steel = MaterialLibrary.BuiltIn.GetSteel("M800-65A", "test");
        var f = 10e3;
        var delta = SkinDepth.Of(steel.Resistivity20COhmM, f, steel.RelativePermeability);
        var thick = steel with { ThicknessM = 10 * delta };
        var loss = LaminationLossModel.Evaluate(thick, new SineWaveform(0.1, f));
        Assert.Equal(0.299992, loss.SkinFactor, 1e-6);
        Assert.True(double.IsFinite(loss.TotalWPerKg));
        Assert.Contains(loss.Flags, x => x.Code == "thick-against-skin-depth");
    }

    [Fact]
    public void Flux_at_and_beyond_saturation_is_flagged_not_hidden()
    {
        var steel = MaterialLibrary.BuiltIn.GetSteel("M270-35A", "test");
        var atMax = LaminationLossModel.Evaluate(steel, new SineWaveform(steel.MaxFluxT, 50));
        Assert.Contains(atMax.Flags, x => x.Code == "flux-near-saturation");
        var beyond = LaminationLossModel.Evaluate(steel, new SineWaveform(steel.MaxFluxT * 1.05, 50));
        Assert.Contains(beyond.Flags, x => x.Code == "flux-beyond-grade");
    }
}
