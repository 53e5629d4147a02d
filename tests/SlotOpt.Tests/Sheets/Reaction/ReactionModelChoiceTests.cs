using SlotOpt.Sheets;

namespace SlotOpt.Tests.Sheets.Reaction;

public class ReactionModelChoiceTests
{
    private const double CopperSPerM = 1 / 0.017241e-6;   // IACS (REFERENCES §6)

    // The Reynolds threshold against the closed forms it rests on (Reitz 1970 via REFERENCES §7): at
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
    // (REFERENCES §2): at the threshold 1 - F stays within eps to 20 % (F = 1 - x^4/630 is its leading term),
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

    // Cases: 1 mm copper, w = 27.4 m/s (REFERENCES §7). At 1 m/s (Rm 0.036) the low-speed model holds; at
    // 27.4 m/s (Rm = 1) the reaction model is needed. 20 mm copper at 50 Hz (t/delta = 2.1 with delta = 9.35 mm,
    // REFERENCES §2) is beyond the thin sheet.
    [Fact]
    public void Cases_pick_the_expected_model()
    {
        var sheet = new Conductor(CopperSPerM, 1e-3);
        Assert.Equal(SheetModelKind.ResistanceLimited, ReactionModelChoice.ForMoving(sheet, 1, 0.01).Kind);
        Assert.Equal(SheetModelKind.ThinSheetReaction, ReactionModelChoice.ForMoving(sheet, 27.4, 0.01).Kind);
        Assert.Equal(SheetModelKind.BeyondThinSheet, ReactionModelChoice.ForAc(new Conductor(CopperSPerM, 20e-3), 50, 0.1).Kind);
    }
}
