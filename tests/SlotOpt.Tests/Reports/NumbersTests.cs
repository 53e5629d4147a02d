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

    [Fact]
    public void Current_density_prints_in_amperes_per_square_millimetre() =>
        Assert.Equal("5.785 A/mm²", Numbers.CurrentDensity(5.7849e6));   // 1 A/mm² = 1e6 A/m² (SI prefix milli, squared)

    [Fact]
    public void Temperatures_print_to_a_tenth_of_a_kelvin() =>
        Assert.Equal("95.4 °C", Numbers.Celsius(368.55));   // 0 °C = 273.15 K (BIPM, The International System of Units, 9th ed., 2019, section 2.3.1)
}
