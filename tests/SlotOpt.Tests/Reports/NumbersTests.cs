using SlotOpt.Tables;
using SlotOpt.Reports;

namespace SlotOpt.Tests.Reports;

/// <summary>
/// Issue 17: one number rule. Four significant figures, integer digits never rounded away, halves away from zero,
/// trailing zeros dropped (rounding to significant figures: common practice, no source). Exact strings.
/// </summary>
public class NumbersTests
{
    [Theory]
    [InlineData(11.131, "11.13")]
    [InlineData(168.035, "168")]
    [InlineData(10.07, "10.07")]
    [InlineData(166.918, "166.9")]
    [InlineData(29.60, "29.6")]
    [InlineData(12345.6, "12346")]
    [InlineData(0.000123456, "0.0001235")]
    [InlineData(2.5e-8, "2.5e-8")]
    [InlineData(-3.14159, "-3.142")]
    [InlineData(0.12346, "0.1235")]
    [InlineData(9999.6, "10000")]
    [InlineData(0, "0")]
    public void Four_significant_figures(double value, string expected) => Assert.Equal(expected, Numbers.Sig(value));

    // Estimates (grid errors, payback times) to two significant figures: their own accuracy is a factor, not a digit
    // (Roache 1997's grid convergence index carries a safety factor of 1.25 to 3), so a third figure would claim what they do not hold.
    [Theory]
    [InlineData(0.08358, "0.084")]
    [InlineData(17.11, "17")]
    [InlineData(0.4422, "0.44")]
    [InlineData(123.4, "123")]
    [InlineData(0, "0")]
    public void Estimates_print_to_two_significant_figures(double value, string expected) => Assert.Equal(expected, Numbers.Estimate(value));

    [Fact]
    public void Estimated_fractions_print_as_percentages_to_two_figures() => Assert.Equal("17 %", Numbers.EstimatePercent(0.1711));

    [Fact]
    public void Current_density_prints_in_amperes_per_square_millimetre() =>
        Assert.Equal("5.785 A/mm²", Numbers.CurrentDensity(5.7849e6));   // 1 A/mm² = 1e6 A/m² (SI prefix milli, squared)

    [Fact]
    public void Temperatures_print_to_a_tenth_of_a_kelvin() =>
        Assert.Equal("95.4 °C", Numbers.Celsius(368.55));   // 0 °C = 273.15 K (BIPM, The International System of Units, 9th ed., 2019, section 2.3.1)

    [Fact]
    public void Fractions_print_as_percentages_by_the_same_rule()
    {
        Assert.Equal("1 %", Numbers.Percent(0.01));
        Assert.Equal("0.1235 %", Numbers.Percent(0.0012346));
    }

    // The plates' warnings and model reasons follow the rule too: 1 mm copper (IACS 0.017241 uOhm m, IEC 60028:1925) at 10 m/s has
    // Rm = mu0 sigma t v / 2 = 0.36443 (W. M. Saslow, Am. J. Phys. 60(8):693-711, 1992: Rm = v / w, w = 2 / (mu0 sigma t)), printed with
    // four significant figures, not the three of the old G3; the model choice's accuracy of 1 % prints as "1 %". Exact strings.
    [Fact]
    public void Plate_warnings_and_model_reasons_print_numbers_by_the_rule()
    {
        var copper = new SlotOpt.Plates.Conductors.ConductingSheet(1 / 0.017241e-6, 1e-3);
        var warning = Assert.Single(SlotOpt.Plates.Conductors.Validity.ForMoving(copper, 10).Warnings);
        Assert.StartsWith("magnetic Reynolds number 0.3644 > 0.3:", warning);
        var choice = SlotOpt.Plates.ReactionModelChoice.Choose(0.05, 0.1, 0.01);
        Assert.Equal("Rm = 0.05 <= 0.1 and t/delta = 0.1 <= " + Numbers.Sig(choice.ThicknessThreshold) + ": the resistance-limited model is within 1 %", choice.Reason);
    }
}
