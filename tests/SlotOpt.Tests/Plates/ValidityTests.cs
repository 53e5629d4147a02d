using SlotOpt.Plates.Conductors;

namespace SlotOpt.Tests.Plates;

public class ValidityTests
{
    // Copper at 20 degC, IACS resistivity 0.017241 uOhm m (IEC 60028:1925 annealed-copper standard).
    private const double CopperSPerM = 1 / 0.017241e-6;

    // W. M. Saslow, Am. J. Phys. 60(8):693-711, 1992: receding-image speed w = 2/(mu0 sigma d) is 27.4 m/s for 1 mm copper, and Rm = v / w,
    // so Rm = 1 at v = 27.4 m/s. Tolerance 0.2 %: the reference gives 3 significant digits.
    [Fact]
    public void Moving_Reynolds_number_is_one_at_the_receding_image_speed()
    {
        var v = Validity.ForMoving(new ConductingSheet(CopperSPerM, 1e-3), 27.4);
        Assert.InRange(v.ReynoldsNumber, 0.998, 1.002);
        Assert.NotEmpty(v.Warnings);                                               // 1 > 0.3
        Assert.Empty(Validity.ForMoving(new ConductingSheet(CopperSPerM, 1e-3), 0.25 * 27.4).Warnings);   // 0.25 < 0.3
    }

    // Skin depth delta = sqrt(2 / (omega mu0 sigma)) of IACS copper at 50 Hz is 9.35 mm (computed; Stoll, The Analysis of Eddy Currents, 1974), so a 9.35 mm plate has t/delta = 1.
    // Tolerance 0.1 %: 3 significant digits in the reference.
    [Fact]
    public void Thickness_to_skin_depth_matches_copper_at_50_Hz()
    {
        var v = Validity.ForAc(new ConductingSheet(CopperSPerM, 9.35e-3), 50, 1e-3);
        Assert.InRange(v.ThicknessToSkinDepth!.Value, 0.999, 1.001);
        var thick = Validity.ForAc(new ConductingSheet(CopperSPerM, 20e-3), 50, 1e-3);
        Assert.Contains(thick.Warnings, w => w.Contains("skin depth"));
    }
}
