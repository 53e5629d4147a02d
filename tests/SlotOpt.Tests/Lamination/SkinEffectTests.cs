using System.Numerics;
using SlotOpt.Lamination;

namespace SlotOpt.Tests.Lamination;

public class SkinEffectTests
{
    /// <summary>
    /// Independent exact 1-D solution: a lamination with mean flux imposed has complex permeability
    /// mu_eff = mu tanh(g)/g, g = (1+j) x/2 (R. L. Stoll, The Analysis of Eddy Currents, Clarendon Press, Oxford, 1974),
    /// so P = (omega Bp^2 / 2 mu) Im(g coth g) and P / P_classical = 6 Im(g coth g) / x^2.
    /// </summary>
    private static double ComplexPermeabilityFactor(double x)
    {
        var g = new Complex(1, 1) * x / 2;
        var gCothG = g * Complex.Cosh(g) / Complex.Sinh(g);
        return 6 * gCothG.Imaginary / (x * x);
    }

    // Tolerance 1e-10: two exact forms of the same solution, differing only by rounding.
    [Theory]
    [InlineData(0.2)]
    [InlineData(0.7)]
    [InlineData(1.0)]
    [InlineData(2.5)]
    [InlineData(6.0)]
    [InlineData(15.0)]
    [InlineData(35.0)]
    public void Matches_the_complex_permeability_solution(double x)
    {
        Assert.Equal(ComplexPermeabilityFactor(x), SkinEffect.Factor(x), 1e-10);
    }

    // F(x) = (3/x)(sinh x - sin x)/(cosh x - cos x) (J. Lammeraner and M. Stafl, Eddy Currents, Iliffe, 1964;
    // R. L. Stoll, The Analysis of Eddy Currents, 1974), values computed from it to 6 decimals. Tolerance 1e-6.
    [Theory]
    [InlineData(0.5, 0.999901)]
    [InlineData(1, 0.998417)]
    [InlineData(1.5, 0.992066)]
    [InlineData(2, 0.975589)]
    [InlineData(2.5, 0.943555)]
    [InlineData(3, 0.893205)]
    [InlineData(4, 0.752276)]
    [InlineData(5, 0.610030)]
    [InlineData(10, 0.299992)]
    [InlineData(20, 0.150000)]
    public void Matches_the_tabulated_factor(double x, double expected)
    {
        Assert.Equal(expected, SkinEffect.Factor(x), 1e-6);
    }

    // Limits of the same F(x) (Stoll 1974): F -> 1 - x^4/630 (x -> 0), F -> 3/x (x -> infinity).
    [Fact]
    public void Has_the_published_limits()
    {
        var x = 0.1;
        Assert.Equal(1.0, (1 - SkinEffect.Factor(x)) * 630 / Math.Pow(x, 4), 1e-3);   // next term is O(x^4)
        Assert.Equal(1.0, SkinEffect.Factor(100) * 100 / 3, 1e-12);                 // exponentially small remainder
        Assert.Equal(1.0, SkinEffect.Factor(0));
    }
}
