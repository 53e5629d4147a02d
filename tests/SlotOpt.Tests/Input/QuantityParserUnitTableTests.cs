using SlotOpt.Input;

namespace SlotOpt.Tests.Input;

/// <summary>
/// Every unit of every quantity kind with every prefix it takes, against the SI definitions written out
/// here independently of the parser. Sources: SI prefixes, BIPM, "The International System of Units
/// (SI Brochure)", 9th ed., 2019, Table 7; minute, hour, day, litre, tonne: same, Table 8; kelvin = degC +
/// 273.15: same, section 2.3.1; bar = 1e5 Pa and gauss = 1e-4 T: SI Brochure, 8th ed., 2006, Tables 8 and 9;
/// inch = 25.4 mm and pound = 0.45359237 kg exactly: International Yard and Pound Agreement, 1959;
/// degF: T/K = (t/degF + 459.67)/1.8, and 1 psi = 6.894757e3 Pa: NIST SP 811 (2008), B.8 and B.9;
/// binary prefixes Ki = 1024, Mi = 1024^2, ...: IEC 80000-13:2008, section 4; newton metre (moment of force): SI Brochure, 9th ed., Table 6 (table number from memory).
/// Tolerance 1e-14 relative: a product of three doubles, each rounded (a few ulp).
/// </summary>
public class QuantityParserUnitTableTests
{
    private static readonly (string Symbol, double Factor)[] Table7 =
    [
        ("Y", 1e24), ("Z", 1e21), ("E", 1e18), ("P", 1e15), ("T", 1e12), ("G", 1e9), ("M", 1e6), ("k", 1e3), ("h", 1e2), ("da", 1e1),
        ("d", 1e-1), ("c", 1e-2), ("m", 1e-3), ("µ", 1e-6), ("μ", 1e-6), ("u", 1e-6), ("n", 1e-9), ("p", 1e-12), ("f", 1e-15), ("a", 1e-18), ("z", 1e-21), ("y", 1e-24),
    ];

    private static readonly (string Symbol, double Factor)[] BinaryAndDecimalMultiples =
    [
        ("da", 10), ("h", 100), ("k", 1e3), ("M", 1e6), ("G", 1e9), ("T", 1e12), ("P", 1e15), ("E", 1e18), ("Z", 1e21), ("Y", 1e24),
        ("Ki", 1024), ("Mi", 1048576), ("Gi", 1073741824), ("Ti", 1099511627776), ("Pi", 1125899906842624), ("Ei", 1152921504606846976),
    ];

    /// <summary>Prefixes: "si" (Table 7), "bytes" (decimal multiples and binary), "" (none). Power: how the prefix enters (2 for an area).</summary>
    private sealed record UnitDefinition(QuantityKind Kind, string Symbol, double SiFactor, string Prefixes, int Power = 1, double Offset = 0);

    private const double Inch = 0.0254, Pound = 0.45359237;

    private static readonly UnitDefinition[] Definitions =
    [
        new(QuantityKind.Length, "m", 1, "si"), new(QuantityKind.Length, "in", 0.0254, ""), new(QuantityKind.Length, "ft", 0.3048, ""), new(QuantityKind.Length, "mil", 25.4e-6, ""),
        new(QuantityKind.FluxDensity, "T", 1, "si"), new(QuantityKind.FluxDensity, "G", 1e-4, "si"),
        new(QuantityKind.Frequency, "Hz", 1, "si"),
        new(QuantityKind.Speed, "m/s", 1, "si"), new(QuantityKind.Speed, "m/min", 1 / 60.0, "si"), new(QuantityKind.Speed, "m/h", 1 / 3600.0, "si"),
        new(QuantityKind.Temperature, "K", 1, "si"),
        new(QuantityKind.Temperature, "degC", 1, "", Offset: 273.15), new(QuantityKind.Temperature, "°C", 1, "", Offset: 273.15),
        new(QuantityKind.Temperature, "℃", 1, "", Offset: 273.15), new(QuantityKind.Temperature, "C", 1, "", Offset: 273.15),
        new(QuantityKind.Temperature, "degF", 1 / 1.8, "", Offset: 459.67), new(QuantityKind.Temperature, "°F", 1 / 1.8, "", Offset: 459.67),
        new(QuantityKind.Temperature, "℉", 1 / 1.8, "", Offset: 459.67), new(QuantityKind.Temperature, "F", 1 / 1.8, "", Offset: 459.67),
        new(QuantityKind.Resistivity, "ohm·m", 1, "si"), new(QuantityKind.Resistivity, "ohmm", 1, "si"),
        new(QuantityKind.Resistivity, "ohm·cm", 0.01, "si"), new(QuantityKind.Resistivity, "ohmcm", 0.01, "si"), new(QuantityKind.Resistivity, "ohm·mm²/m", 1e-6, "si"),
        new(QuantityKind.Density, "g/m³", 1e-3, "si"), new(QuantityKind.Density, "g/dm³", 1, "si"), new(QuantityKind.Density, "g/cm³", 1000, "si"),
        new(QuantityKind.Density, "g/L", 1, "si"), new(QuantityKind.Density, "g/l", 1, "si"),
        new(QuantityKind.Mass, "g", 1e-3, "si"), new(QuantityKind.Mass, "t", 1000, ""), new(QuantityKind.Mass, "lb", 0.45359237, ""),
        new(QuantityKind.Area, "m²", 1, "si", Power: 2),
        new(QuantityKind.Power, "W", 1, "si"),
        new(QuantityKind.Force, "N", 1, "si"),
        new(QuantityKind.Pressure, "Pa", 1, "si"), new(QuantityKind.Pressure, "bar", 1e5, "si"), new(QuantityKind.Pressure, "N/m²", 1, "si"),
        new(QuantityKind.Pressure, "N/mm²", 1e6, ""), new(QuantityKind.Pressure, "psi", 6.894757e3, ""),
        new(QuantityKind.Conductivity, "S/m", 1, "si"), new(QuantityKind.Conductivity, "S/cm", 100, "si"),
        new(QuantityKind.Duration, "s", 1, "si"), new(QuantityKind.Duration, "min", 60, ""), new(QuantityKind.Duration, "h", 3600, ""), new(QuantityKind.Duration, "d", 86400, ""),
        new(QuantityKind.Information, "B", 1, "bytes"),
        new(QuantityKind.Torque, "N·m", 1, "si"), new(QuantityKind.Torque, "Nm", 1, ""),
    ];

    public static TheoryData<QuantityKind, string> Units()
    {
        var data = new TheoryData<QuantityKind, string>();
        foreach (var d in Definitions) data.Add(d.Kind, d.Symbol);
        return data;
    }

    private static IEnumerable<(string Spelling, double Scale)> Spellings(UnitDefinition d)
    {
        yield return (d.Symbol, d.SiFactor);
        var prefixes = d.Prefixes switch { "si" => Table7, "bytes" => BinaryAndDecimalMultiples, _ => [] };
        foreach (var (symbol, factor) in prefixes) yield return (symbol + d.Symbol, Math.Pow(factor, d.Power) * d.SiFactor);
    }

    [Theory]
    [MemberData(nameof(Units))]
    public void Every_prefix_of_the_unit_gives_its_SI_value(QuantityKind kind, string symbol)
    {
        var definition = Definitions.Single(d => d.Kind == kind && d.Symbol == symbol);
        // psi is a rounded 7-digit figure in NIST SP 811: 1e-7 relative for it, 1e-14 for every exact definition
        var tolerance = symbol == "psi" ? 1e-7 : 1e-14;
        foreach (var value in new[] { 1.0, 0.35, -12.5, 7.25e3 })
        {
            foreach (var (spelling, scale) in Spellings(definition))
            {
                var text = $"{value.ToString("R", System.Globalization.CultureInfo.InvariantCulture)} {spelling}";
                Assert.True(QuantityParser.TryParse(text, kind, out var si, out var error), $"{text}: {error}");
                var expected = (value + definition.Offset) * scale;
                Assert.True(Math.Abs(si - expected) <= tolerance * Math.Abs(expected), $"{text} as {kind}: {si:R}, expected {expected:R}");
            }
        }
    }

    /// <summary>The table above is the whole of what the parser accepts: no untested unit, no prefix too many or missing.</summary>
    [Fact]
    public void The_table_lists_exactly_the_spellings_the_parser_accepts()
    {
        foreach (var kind in Enum.GetValues<QuantityKind>())
        {
            var tested = Definitions.Where(d => d.Kind == kind).SelectMany(Spellings).Select(s => s.Spelling).Order(StringComparer.Ordinal).ToList();
            Assert.Equal(tested, QuantityParser.UnitSpellings(kind).Order(StringComparer.Ordinal));
        }
    }

    // The issue's own cases, written as users write them (spaces, ASCII powers, product signs, ohm spellings).
    [Theory]
    [InlineData("24.9 MS/m", QuantityKind.Conductivity, 24.9e6)]
    [InlineData("24.9MS/m", QuantityKind.Conductivity, 24.9e6)]
    [InlineData("58 mS/m", QuantityKind.Conductivity, 58e-3)]
    [InlineData("1 MOhm m", QuantityKind.Resistivity, 1e6)]
    [InlineData("1 mOhm m", QuantityKind.Resistivity, 1e-3)]
    [InlineData("0.52 uOhm m", QuantityKind.Resistivity, 0.52e-6)]
    [InlineData("0.52 µΩ·m", QuantityKind.Resistivity, 0.52e-6)]
    [InlineData("0.52 μΩ m", QuantityKind.Resistivity, 0.52e-6)]
    [InlineData("1.72 uohm*cm", QuantityKind.Resistivity, 1.72e-8)]
    [InlineData("0.0172 ohm mm2/m", QuantityKind.Resistivity, 1.72e-8)]
    [InlineData("1 Mm", QuantityKind.Length, 1e6)]
    [InlineData("1 mm", QuantityKind.Length, 1e-3)]
    [InlineData("2 mm^2", QuantityKind.Area, 2e-6)]
    [InlineData("2 mm2", QuantityKind.Area, 2e-6)]
    [InlineData("7650 kg/m^3", QuantityKind.Density, 7650)]
    [InlineData("7.65 g / cm3", QuantityKind.Density, 7650)]
    [InlineData("1 MPa", QuantityKind.Pressure, 1e6)]
    [InlineData("1 mPa", QuantityKind.Pressure, 1e-3)]
    [InlineData("235 N/mm2", QuantityKind.Pressure, 235e6)]
    [InlineData("1 Ms", QuantityKind.Duration, 1e6)]
    [InlineData("1 ms", QuantityKind.Duration, 1e-3)]
    [InlineData("4 GiB", QuantityKind.Information, 4294967296)]
    [InlineData("4GB", QuantityKind.Information, 4e9)]
    [InlineData("72 km/h", QuantityKind.Speed, 20)]
    [InlineData("-40 degF", QuantityKind.Temperature, 233.15)]
    public void Prefixes_are_matched_with_their_case(string text, QuantityKind kind, double expectedSi)
    {
        Assert.True(QuantityParser.TryParse(text, kind, out var si, out var error), error);
        Assert.Equal(expectedSi, si, 1e-12 * Math.Abs(expectedSi));
    }

    [Theory]
    [InlineData("1 KHz", QuantityKind.Frequency, "kHz")]          // K is the kelvin, not a prefix
    [InlineData("1 MHZ", QuantityKind.Frequency, "MHz or mHz")]
    [InlineData("1 MM", QuantityKind.Length, "Mm or mm")]
    [InlineData("1 kb", QuantityKind.Information, "kB")]
    [InlineData("80 degc", QuantityKind.Temperature, "degC")]
    [InlineData("24.9 ms/M", QuantityKind.Conductivity, "MS/m or mS/m")]
    public void A_unit_right_but_for_its_case_is_refused_with_the_spellings_meant(string text, QuantityKind kind, string suggestion)
    {
        Assert.False(QuantityParser.TryParse(text, kind, out var si, out var error));
        Assert.True(double.IsNaN(si));
        Assert.Contains($"did you mean {suggestion}?", error);
    }

    [Theory]
    [InlineData("1 mB", QuantityKind.Information)]         // no fraction of a byte
    [InlineData("1 kmin", QuantityKind.Duration)]          // minute takes no prefix
    [InlineData("1 kft", QuantityKind.Length)]
    [InlineData("1 mkm", QuantityKind.Length)]             // one prefix at most
    [InlineData("1e308 km", QuantityKind.Length)]          // overflows to infinity
    [InlineData("1e300 EPa", QuantityKind.Pressure)]
    [InlineData("1e400", QuantityKind.Length)]
    [InlineData("-Infinity", QuantityKind.Length)]
    [InlineData("1.5 T", QuantityKind.Length)]
    public void What_is_not_a_finite_value_of_the_kind_is_refused(string text, QuantityKind kind)
    {
        Assert.False(QuantityParser.TryParse(text, kind, out var si, out var error));
        Assert.True(double.IsNaN(si));
        Assert.False(string.IsNullOrWhiteSpace(error));
    }
}
