using SlotOpt.Design.SolidParts;
using SlotOpt.Design;

namespace SlotOpt.Tests.Design;

public class FingerStiffnessTests
{
    /// <summary>First root of the cantilever frequency equation cos(x) cosh(x) + 1 = 0, by bisection (independent of the code's constant).</summary>
    private static double FirstCantileverRoot()
    {
        double lo = 1, hi = 3;
        for (var i = 0; i < 200; i++)
        {
            var mid = (lo + hi) / 2;
            if ((Math.Cos(lo) * Math.Cosh(lo) + 1) * (Math.Cos(mid) * Math.Cosh(mid) + 1) <= 0) hi = mid; else lo = mid;
        }
        return (lo + hi) / 2;
    }

    // Euler-Bernoulli cantilever, f1 = (beta1 L)^2/(2 pi L^2) sqrt(EI/(rho A)) with beta1 L the first root of
    // cos x cosh x = -1 (R. D. Blevins, Formulas for Natural Frequency and Mode Shape, 1979, Table 8-1:
    // 1.87510407). Aluminium strip 10 mm wide, 100 mm long, E 68.9 GPa, 2700 kg/m^3. Tolerance 1e-9 relative.
    [Fact]
    public void First_mode_follows_the_cantilever_equation()
    {
        var root = FirstCantileverRoot();
        Assert.Equal(1.87510407, root, 1e-7);
        double e = 68.9e9, rho = 2700, w = 0.010, l = 0.100;
        var expected = root * root / (2 * Math.PI * l * l) * Math.Sqrt(e * w * w / 12 / rho);
        Assert.Equal(expected, FingerStiffness.FirstModeHz(l, w, e, rho), expected * 1e-7);
    }

    [Fact]
    public void Longest_finger_inverts_the_first_mode()
    {
        var l = FingerStiffness.LongestFingerM(0.008, 50, 193e9, 8000);
        Assert.Equal(FingerStiffness.FrequencyMargin * 2 * 50, FingerStiffness.FirstModeHz(l, 0.008, 193e9, 8000), 1e-6);
    }
}
