using System.Globalization;
using System.Text.RegularExpressions;

namespace SlotOpt.Input;

/// <summary>
/// Reads "0.35 mm", "1.5T", "400 Hz", "2 m/s", "80 degC", "0.52 uOhm m", "24.9 MS/m" or a plain SI number
/// into an SI double (temperatures in kelvin), against the one quantity the caller expects. Unit symbols
/// and prefixes are matched case-sensitively, as the SI writes them ("M" is mega, "m" is milli); every
/// spelling a kind accepts is listed by <see cref="UnitSpellings"/>, and no spelling means two things.
/// A result that is not finite (an overflow such as "1e308 km") is refused, never returned.
/// </summary>
public static partial class QuantityParser
{
    public static string SiUnit(QuantityKind kind) => kind switch
    {
        QuantityKind.Length => "m",
        QuantityKind.FluxDensity => "T",
        QuantityKind.Frequency => "Hz",
        QuantityKind.Speed => "m/s",
        QuantityKind.Temperature => "K",
        QuantityKind.Resistivity => "ohm m",
        QuantityKind.Density => "kg/m^3",
        QuantityKind.Mass => "kg",
        QuantityKind.Area => "m^2",
        QuantityKind.Power => "W",
        QuantityKind.Force => "N",
        QuantityKind.Pressure => "Pa",
        QuantityKind.Conductivity => "S/m",
        QuantityKind.Duration => "s",
        QuantityKind.Information => "B",
        QuantityKind.Torque => "N m",
        _ => throw new ArgumentOutOfRangeException(nameof(kind)),
    };

    public static string Example(QuantityKind kind) => kind switch
    {
        QuantityKind.Length => "\"0.35 mm\"",
        QuantityKind.FluxDensity => "\"1.5 T\"",
        QuantityKind.Frequency => "\"50 Hz\"",
        QuantityKind.Speed => "\"2 m/s\"",
        QuantityKind.Temperature => "\"40 degC\"",
        QuantityKind.Resistivity => "\"0.52 uOhm m\"",
        QuantityKind.Density => "\"7650 kg/m3\"",
        QuantityKind.Mass => "\"12 kg\"",
        QuantityKind.Area => "\"0.01 m2\"",
        QuantityKind.Power => "\"150 W\"",
        QuantityKind.Force => "\"20 N\"",
        QuantityKind.Pressure => "\"69 GPa\"",
        QuantityKind.Conductivity => "\"24.9 MS/m\"",
        QuantityKind.Duration => "\"10 min\"",
        QuantityKind.Information => "\"4 GB\"",
        QuantityKind.Torque => "\"2.5 N m\"",
        _ => throw new ArgumentOutOfRangeException(nameof(kind)),
    };

    public static string Describe(QuantityKind kind) => kind switch
    {
        QuantityKind.FluxDensity => "flux density",
        _ => kind.ToString().ToLowerInvariant(),
    };

    /// <summary>Every unit spelling the kind accepts (prefixed ones included), after <see cref="Normalise"/>.</summary>
    public static IReadOnlyCollection<string> UnitSpellings(QuantityKind kind) => Spellings[kind].Keys;

    /// <summary>Parses text as the given quantity; false with a one-line reason when it is not one. Never throws.</summary>
    public static bool TryParse(string? text, QuantityKind kind, out double si, out string error)
    {
        si = double.NaN;
        error = "";
        if (string.IsNullOrWhiteSpace(text))
        {
            error = $"expected a {Describe(kind)} such as {Example(kind)}, got an empty value";
            return false;
        }
        var trimmed = text.Trim();
        if (double.TryParse(trimmed, NumberStyles.Float, CultureInfo.InvariantCulture, out var plain))
        {
            si = plain;
        }
        else
        {
            var match = NumberThenUnit().Match(trimmed);
            if (!match.Success || !double.TryParse(match.Groups[1].Value, NumberStyles.Float, CultureInfo.InvariantCulture, out var value))
            {
                error = $"\"{Shorten(trimmed)}\" is not a {Describe(kind)}; write it like {Example(kind)} or as a plain number in {SiUnit(kind)}";
                return false;
            }
            var unit = Normalise(match.Groups[2].Value);
            if (!Spellings[kind].TryGetValue(unit, out var scale))
            {
                error = $"\"{Shorten(trimmed)}\": unknown unit \"{Shorten(match.Groups[2].Value.Trim())}\" for a {Describe(kind)}{CaseHint(kind, unit)}; units: {UnitList(kind)}; e.g. {Example(kind)}";
                return false;
            }
            // SI value = (value + offset) * factor; the offset is non-zero only for degC and degF
            si = (value + scale.Offset) * scale.Factor;
        }
        if (!double.IsFinite(si))
        {
            error = $"\"{Shorten(trimmed)}\" is not a finite {Describe(kind)} (it overflows the range of numbers, about 1.8e308 in {SiUnit(kind)})";
            si = double.NaN;
            return false;
        }
        return true;
    }

    /// <summary>
    /// The unit text as looked up: whitespace and the product signs "*", "." and "·" between symbols become
    /// one "·" (none around "/"), "^2"/"^3" and a 2 or 3 right after a letter become "²"/"³", and the
    /// spellings "Ohm", "Ω" (U+03A9) and "Ω" (U+2126) of the ohm become "ohm". Letters keep their case.
    /// </summary>
    public static string Normalise(string unit)
    {
        var u = unit.Trim();
        u = SlashWithSpace().Replace(u, "/");
        u = ProductSign().Replace(u, "·");
        u = u.Replace("^2", "²").Replace("^3", "³");
        u = PowerAfterLetter().Replace(u, m => m.Value == "2" ? "²" : "³");
        return u.Replace("Ohm", "ohm").Replace("Ω", "ohm").Replace("\u2126", "ohm");
    }

    /// <summary>How a prefix may attach to a unit.</summary>
    private enum Prefixing { None, Si, DecimalAndBinaryMultiples }

    /// <summary>
    /// One unit: SI value = (value + Offset) * Factor. With prefixes, the prefix's factor is raised to
    /// PrefixPower (2 for "mm²": the prefix scales the metre, which is squared).
    /// </summary>
    private sealed record Unit(string Symbol, double Factor, Prefixing Prefixing, int PrefixPower = 1, double Offset = 0);

    private readonly record struct Scale(double Factor, double Offset);

    /// <summary>SI prefixes: BIPM, The International System of Units (SI Brochure), 9th ed., 2019, Table 7; "u" and "μ" (Greek mu) spell micro in ASCII and Unicode text (common practice, no source).</summary>
    private static readonly (string Symbol, double Factor)[] SiPrefixes =
    [
        ("Y", 1e24), ("Z", 1e21), ("E", 1e18), ("P", 1e15), ("T", 1e12), ("G", 1e9), ("M", 1e6), ("k", 1e3), ("h", 1e2), ("da", 1e1),
        ("d", 1e-1), ("c", 1e-2), ("m", 1e-3), ("µ", 1e-6), ("μ", 1e-6), ("u", 1e-6), ("n", 1e-9), ("p", 1e-12), ("f", 1e-15), ("a", 1e-18), ("z", 1e-21), ("y", 1e-24),
    ];

    /// <summary>Binary prefixes: IEC 80000-13:2008, section 4 (Ki = 2^10, Mi = 2^20, ...).</summary>
    private static readonly (string Symbol, double Factor)[] BinaryPrefixes =
        [("Ki", 1L << 10), ("Mi", 1L << 20), ("Gi", 1L << 30), ("Ti", 1L << 40), ("Pi", 1L << 50), ("Ei", 1L << 60)];

    // Non-SI units: inch = 25.4 mm exactly (International Yard and Pound Agreement, 1959); pound = 0.45359237 kg (same);
    // minute, hour, day, litre, tonne: BIPM SI Brochure 2019, Table 8; bar = 1e5 Pa, gauss = 1e-4 T: BIPM SI Brochure,
    // 8th ed., 2006, Tables 8 and 9; degF: T/K = (t/°F + 459.67) / 1.8, NIST SP 811 (2008), B.9; psi = lbf/in² with
    // lbf = 0.45359237 kg x 9.80665 m/s² (standard gravity, 3rd CGPM 1901), NIST SP 811 (2008), B.8.
    private const double Inch = 0.0254, Pound = 0.45359237, StandardGravity = 9.80665;

    private static readonly Dictionary<QuantityKind, Unit[]> Units = new()
    {
        [QuantityKind.Length] = [new("m", 1, Prefixing.Si), new("in", Inch, Prefixing.None), new("ft", 12 * Inch, Prefixing.None), new("mil", Inch / 1000, Prefixing.None)],
        [QuantityKind.FluxDensity] = [new("T", 1, Prefixing.Si), new("G", 1e-4, Prefixing.Si)],
        [QuantityKind.Frequency] = [new("Hz", 1, Prefixing.Si)],
        [QuantityKind.Speed] = [new("m/s", 1, Prefixing.Si), new("m/min", 1.0 / 60, Prefixing.Si), new("m/h", 1.0 / 3600, Prefixing.Si)],
        [QuantityKind.Temperature] =
        [
            new("K", 1, Prefixing.Si),
            new("degC", 1, Prefixing.None, Offset: 273.15), new("°C", 1, Prefixing.None, Offset: 273.15), new("℃", 1, Prefixing.None, Offset: 273.15), new("C", 1, Prefixing.None, Offset: 273.15),
            new("degF", 1 / 1.8, Prefixing.None, Offset: 459.67), new("°F", 1 / 1.8, Prefixing.None, Offset: 459.67), new("℉", 1 / 1.8, Prefixing.None, Offset: 459.67), new("F", 1 / 1.8, Prefixing.None, Offset: 459.67),
        ],
        [QuantityKind.Resistivity] =
        [
            new("ohm·m", 1, Prefixing.Si), new("ohmm", 1, Prefixing.Si), new("ohm·cm", 1e-2, Prefixing.Si), new("ohmcm", 1e-2, Prefixing.Si),
            new("ohm·mm²/m", 1e-6, Prefixing.Si),
        ],
        [QuantityKind.Density] = [new("g/m³", 1e-3, Prefixing.Si), new("g/dm³", 1, Prefixing.Si), new("g/cm³", 1e3, Prefixing.Si), new("g/L", 1, Prefixing.Si), new("g/l", 1, Prefixing.Si)],
        [QuantityKind.Mass] = [new("g", 1e-3, Prefixing.Si), new("t", 1000, Prefixing.None), new("lb", Pound, Prefixing.None)],
        [QuantityKind.Area] = [new("m²", 1, Prefixing.Si, PrefixPower: 2)],
        [QuantityKind.Power] = [new("W", 1, Prefixing.Si)],
        [QuantityKind.Force] = [new("N", 1, Prefixing.Si)],
        [QuantityKind.Pressure] =
        [
            new("Pa", 1, Prefixing.Si), new("bar", 1e5, Prefixing.Si), new("N/m²", 1, Prefixing.Si), new("N/mm²", 1e6, Prefixing.None),
            new("psi", Pound * StandardGravity / (Inch * Inch), Prefixing.None),
        ],
        [QuantityKind.Conductivity] = [new("S/m", 1, Prefixing.Si), new("S/cm", 100, Prefixing.Si)],
        [QuantityKind.Duration] = [new("s", 1, Prefixing.Si), new("min", 60, Prefixing.None), new("h", 3600, Prefixing.None), new("d", 86400, Prefixing.None)],
        [QuantityKind.Information] = [new("B", 1, Prefixing.DecimalAndBinaryMultiples)],
        [QuantityKind.Torque] = [new("N·m", 1, Prefixing.Si), new("Nm", 1, Prefixing.None)],
    };

    /// <summary>Every spelling of every kind with its scale; built once, refusing any spelling that would mean two things.</summary>
    private static readonly Dictionary<QuantityKind, Dictionary<string, Scale>> Spellings = BuildSpellings();

    private static Dictionary<QuantityKind, Dictionary<string, Scale>> BuildSpellings()
    {
        var all = new Dictionary<QuantityKind, Dictionary<string, Scale>>();
        foreach (var (kind, units) in Units)
        {
            var spellings = new Dictionary<string, Scale>(StringComparer.Ordinal);
            void Add(string spelling, Scale scale)
            {
                if (!spellings.TryAdd(spelling, scale))
                    throw new InvalidOperationException($"the unit spelling \"{spelling}\" of {kind} is defined twice");
            }
            foreach (var unit in units)
            {
                Add(unit.Symbol, new Scale(unit.Factor, unit.Offset));
                var prefixes = unit.Prefixing switch
                {
                    Prefixing.Si => SiPrefixes,
                    Prefixing.DecimalAndBinaryMultiples => SiPrefixes.Where(p => p.Factor > 1).Concat(BinaryPrefixes).ToArray(),
                    _ => [],
                };
                foreach (var (symbol, factor) in prefixes)
                    Add(symbol + unit.Symbol, new Scale(Math.Pow(factor, unit.PrefixPower) * unit.Factor, unit.Offset));
            }
            all[kind] = spellings;
        }
        return all;
    }

    private static string UnitList(QuantityKind kind) => string.Join(", ", Units[kind].Select(u => u.Prefixing switch
    {
        Prefixing.Si => $"{u.Symbol} (with SI prefixes)",
        Prefixing.DecimalAndBinaryMultiples => $"{u.Symbol} (with k, M, G, ... or Ki, Mi, Gi, ...)",
        _ => u.Symbol,
    }).Distinct());

    /// <summary>" (units are case-sensitive: did you mean kHz?)" when the unit matches a known spelling but for case.</summary>
    private static string CaseHint(QuantityKind kind, string unit)
    {
        var near = Spellings[kind].Keys.Where(s => string.Equals(s, unit, StringComparison.OrdinalIgnoreCase)).Order(StringComparer.Ordinal).ToList();
        return near.Count == 0 ? "" : $" (units are case-sensitive: did you mean {string.Join(" or ", near)}?)";
    }

    private static string Shorten(string text) => text.Length <= 60 ? text : text[..57] + "...";

    [GeneratedRegex(@"^([-+]?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?)\s*(\S.*)$")]
    private static partial Regex NumberThenUnit();

    [GeneratedRegex(@"\s*/\s*")]
    private static partial Regex SlashWithSpace();

    [GeneratedRegex(@"\s*[*.·⋅]\s*|\s+")]
    private static partial Regex ProductSign();

    [GeneratedRegex(@"(?<=\p{L})[23](?![0-9])")]
    private static partial Regex PowerAfterLetter();
}
