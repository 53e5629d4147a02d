using SlotOpt.Input;

namespace SlotOpt.Tests.Input;

public class QuantityParserTests
{
    // Unit definitions: BIPM, "The International System of Units (SI Brochure)", 9th ed., 2019
    // (prefixes, Table 7; kelvin = degC + 273.15, section 2.3.1); 1 mil = 25.4e-6 m (inch = 25.4 mm exactly,
    // International Yard and Pound Agreement, 1959). Tolerance 1e-12 relative: pure unit arithmetic.
    [Theory]
    [InlineData("0.35 mm", QuantityKind.Length, 0.35e-3)]
    [InlineData("0.35mm", QuantityKind.Length, 0.35e-3)]
    [InlineData("11 mil", QuantityKind.Length, 11 * 25.4e-6)]
    [InlineData("1.5T", QuantityKind.FluxDensity, 1.5)]
    [InlineData("0.2 mT", QuantityKind.FluxDensity, 0.2e-3)]
    [InlineData("400Hz", QuantityKind.Frequency, 400)]
    [InlineData("2 kHz", QuantityKind.Frequency, 2000)]
    [InlineData("2 m/s", QuantityKind.Speed, 2)]
    [InlineData("80degC", QuantityKind.Temperature, 353.15)]
    [InlineData("40 °C", QuantityKind.Temperature, 313.15)]
    [InlineData("77 K", QuantityKind.Temperature, 77)]
    [InlineData("0.52 uOhm m", QuantityKind.Resistivity, 0.52e-6)]
    [InlineData("1.72e-8 ohm m", QuantityKind.Resistivity, 1.72e-8)]
    [InlineData("7.65 g/cm3", QuantityKind.Density, 7650)]
    [InlineData("7650 kg/m3", QuantityKind.Density, 7650)]
    [InlineData("0.5", QuantityKind.Length, 0.5)]
    public void Reads_units_into_SI(string text, QuantityKind kind, double expectedSi)
    {
        Assert.True(QuantityParser.TryParse(text, kind, out var si, out var error), error);
        Assert.Equal(expectedSi, si, 1e-12 * Math.Max(1, Math.Abs(expectedSi)));
    }

    [Theory]
    [InlineData("1.5 furlongs", QuantityKind.Length)]
    [InlineData("1.5 T", QuantityKind.Length)]
    [InlineData("50 Hz", QuantityKind.FluxDensity)]
    [InlineData("", QuantityKind.Frequency)]
    [InlineData("NaN", QuantityKind.Frequency)]
    [InlineData("Infinity", QuantityKind.Length)]
    public void Refuses_what_is_not_the_expected_quantity(string text, QuantityKind kind)
    {
        Assert.False(QuantityParser.TryParse(text, kind, out _, out var error));
        Assert.False(string.IsNullOrWhiteSpace(error));
    }
}
