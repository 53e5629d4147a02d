using SlotOpt.Plates;
using SlotOpt.Plates.Conductors;
using SlotOpt.Plates.Geometry;
using SlotOpt.Plates.Grid;
using SlotOpt.Plates.ResistanceLimited;
using SlotOpt.Plates.Sources;
using SlotOpt.Plates.Thick;

namespace SlotOpt.Tests.Plates.OwnField;

public class ReactionModelChoiceTests
{
    private const double CopperSPerM = 1 / 0.017241e-6;   // IACS (IEC 60028:1925 annealed-copper standard)

    // The Reynolds threshold against the closed forms it rests on (J. R. Reitz, J. Appl. Phys. 41:2067, 1970): at
    // Rm = sqrt(eps) the low-speed drag of a line current is overstated by exactly eps (F/F_low = 1/(1 + Rm^2))
    // and that of an axisymmetric source by less ((2/Rm^2)(1 - 1/sqrt(1 + Rm^2))). Tolerance 1e-12: algebra.
    [Theory]
    [InlineData(0.01)]
    [InlineData(0.05)]
    public void Reynolds_threshold_bounds_the_low_speed_overstatement(double eps)
    {
        double rm = ReactionModelChoice.ReynoldsThreshold(eps);
        double line = 1 / (1 + rm * rm), axisymmetric = 2 / (rm * rm) * (1 - 1 / Math.Sqrt(1 + rm * rm));
        Assert.InRange(1 / line - 1, eps - 1e-12, eps + 1e-12);
        Assert.True(1 / axisymmetric - 1 < eps);
    }

    // The thickness threshold against the 1-D skin-effect factor F(x) = (3/x)(sinh x - sin x)/(cosh x - cos x)
    // (Lammeraner & Stafl, Eddy Currents, 1964; Stoll, The Analysis of Eddy Currents, 1974): at the threshold 1 - F stays within eps to 20 % (F = 1 - x^4/630 is its leading term),
    // and for eps = 1 % the threshold (1.58) lies between the table's x = 1.5 (F = 0.992066) and x = 2 (0.975589).
    [Theory]
    [InlineData(0.01)]
    [InlineData(0.003)]
    public void Thickness_threshold_matches_the_skin_effect_factor(double eps)
    {
        double x = ReactionModelChoice.ThicknessThreshold(eps);
        double f = 3 / x * (Math.Sinh(x) - Math.Sin(x)) / (Math.Cosh(x) - Math.Cos(x));
        Assert.InRange((1 - f) / eps, 0.8, 1.2);
        if (eps == 0.01) Assert.InRange(x, 1.5, 2.0);
    }

    // Cases: 1 mm copper, w = 2/(mu0 sigma t) = 27.4 m/s (W. M. Saslow, Am. J. Phys. 60(8):693-711, 1992). At 1 m/s (Rm 0.036) the low-speed model holds; at
    // 27.4 m/s (Rm = 1) the reaction model is needed. 20 mm copper at 50 Hz (t/delta = 2.1 with delta = 9.35 mm,
    // delta = sqrt(2 / (omega mu0 sigma))) is beyond the thin sheet.
    [Fact]
    public void Cases_pick_the_expected_model()
    {
        var sheet = new ConductingSheet(CopperSPerM, 1e-3);
        Assert.Equal(SheetModelKind.ResistanceLimited, ReactionModelChoice.ForMoving(sheet, 1, 0.01).Kind);
        Assert.Equal(SheetModelKind.ThinSheetReaction, ReactionModelChoice.ForMoving(sheet, 27.4, 0.01).Kind);
        Assert.Equal(SheetModelKind.BeyondThinSheet, ReactionModelChoice.ForAc(new ConductingSheet(CopperSPerM, 20e-3), 50, 0.1).Kind);
    }
}

public class ReactionFacadeAcTests(Xunit.Abstractions.ITestOutputHelper output)
{
    // The AC switch over the three models on one 100 mm x 50 mm copper plate in a uniform 50 Hz field:
    // 0.1 mm (Rm 0.09): resistance-limited, equal to ResistanceLimitedSolver (tolerance 1e-9: the same solve);
    // 3 mm (Rm 2.7, t/delta 0.32): thin-sheet reaction, below the resistance-limited loss;
    // 20 mm (t/delta 2.1, delta = sqrt(2 / (omega mu0 sigma)) = 9.35 mm): the layered thick-plate model, the same answer as
    // ThickPlateSolver called directly (tolerance 1e-9), its layer count checked to the wanted 1 %, and its loss
    // below the resistance-limited loss (the eddy currents' field opposes the applied one). Not asserted: its
    // relation to the thin-sheet reaction loss, which here is lower (0.64 W against 1.21 W: a 20 mm block on a
    // 50 mm plate has no thin-sheet limit; the zero-thickness sheet crowds its screening current to the rim).
    [Fact]
    public void Ac_facade_switches_between_the_three_models()
    {
        double copper = 1 / 0.017241e-6;
        var model = SheetModel.Build(PlateGeometry.Rectangle(0.1, 0.05), new GridOptions { CellSizeM = 0.0025 });
        var field = new UniformAcField(0.01, 50);
        var thin = new ConductingSheet(copper, 1e-4);
        var low = PlateModels.SolveAc(model, field, thin);
        Assert.Equal(SheetModelKind.ResistanceLimited, low.Choice.Kind);
        Assert.InRange(low.MeanLossW / ResistanceLimitedSolver.SolveAc(model, field).LossW(thin.SheetConductanceS) - 1, -1e-9, 1e-9);
        var mid = PlateModels.SolveAc(model, field, new ConductingSheet(copper, 3e-3));
        Assert.Equal(SheetModelKind.ThinSheetReaction, mid.Choice.Kind);
        Assert.True(mid.MeanLossW < mid.ResistanceLimitedLossW[0]);
        var thickConductor = new ConductingSheet(copper, 20e-3);
        var thick = PlateModels.SolveAc(model, field, thickConductor);
        var direct = ThickPlateSolver.SolveAcConverged(model, new DepthIndependentField(field), thickConductor, 0.01);
        output.WriteLine($"thick {thick.MeanLossW:E4} W ({direct.Layers} layers, layer error {direct.LayerError:P2}), resistance-limited {thick.ResistanceLimitedLossW[0]:E4} W");
        Assert.Equal(SheetModelKind.BeyondThinSheet, thick.Choice.Kind);
        Assert.InRange(thick.MeanLossW / direct.LossW - 1, -1e-9, 1e-9);
        Assert.True(direct.LayerError <= 0.01);
        Assert.True(thick.MeanLossW > 0 && thick.MeanLossW < thick.ResistanceLimitedLossW[0]);
    }
}
