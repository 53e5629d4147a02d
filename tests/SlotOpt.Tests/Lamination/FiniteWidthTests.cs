using SlotOpt.Lamination;

namespace SlotOpt.Tests.Lamination;

public class FiniteWidthTests
{
    // S. P. Timoshenko and J. N. Goodier, Theory of Elasticity, 3rd ed., 1970, ch. 10, table of k1 for
    // torsion of rectangular bars (J = k1 a^3 b), printed to three decimals. Tolerance 6e-4: half a unit
    // of the table's last digit plus its own rounding.
    [Theory]
    [InlineData(1.0, 0.141)]
    [InlineData(1.2, 0.166)]
    [InlineData(1.5, 0.196)]
    [InlineData(2.0, 0.229)]
    [InlineData(2.5, 0.249)]
    [InlineData(3.0, 0.263)]
    [InlineData(4.0, 0.281)]
    [InlineData(5.0, 0.291)]
    [InlineData(10.0, 0.312)]
    public void Torsion_coefficient_matches_Timoshenko_and_Goodier(double longOverShort, double k1)
    {
        Assert.Equal(k1, FiniteWidth.TorsionCoefficient(1, longOverShort), 6e-4);
    }

    // Roark's Formulas for Stress and Strain, 6th ed., Table 20, case 4 (as seen in a secondary
    // reproduction of the table): K = a b^3 [16/3 - 3.36 (b/a)(1 - b^4/(12 a^4))] with half-sides a >= b.
    // Roark's approximation is stated good to about 0.2 %; tolerance 0.3 %.
    [Theory]
    [InlineData(1.0)]
    [InlineData(2.0)]
    [InlineData(3.0)]
    [InlineData(10.0)]
    public void Torsion_coefficient_agrees_with_Roark(double longOverShort)
    {
        double a = longOverShort / 2, b = 0.5;
        var roark = a * Math.Pow(b, 3) * (16.0 / 3 - 3.36 * (b / a) * (1 - Math.Pow(b, 4) / (12 * Math.Pow(a, 4))));
        var series = FiniteWidth.TorsionCoefficient(1, longOverShort) * longOverShort;
        Assert.Equal(roark, series, roark * 3e-3);
    }

    // Eddy factor F_w = 3 k1, k1 the torsion coefficient of S. P. Timoshenko and J. N. Goodier, Theory of
    // Elasticity, 3rd ed., McGraw-Hill, 1970, ch. 10 "Torsion of rectangular bars" (computed from its series, 5 decimals): w/d = 10 -> 0.93698,
    // 2 -> 0.68605, square -> 0.42173; a sheet far wider than thick -> 1. Tolerance 1e-5.
    [Theory]
    [InlineData(10, 0.93698)]
    [InlineData(2, 0.68605)]
    [InlineData(1, 0.42173)]
    [InlineData(100, 0.99370)]
    public void Width_factor_matches_the_series_table(double widthOverThickness, double expected)
    {
        Assert.Equal(expected, FiniteWidth.Factor(0.35e-3, widthOverThickness * 0.35e-3), 1e-5);
    }

    [Fact]
    public void Infinite_width_leaves_the_classical_loss_alone()
    {
        Assert.Equal(1.0, FiniteWidth.Factor(0.5e-3, double.PositiveInfinity));
    }
}
