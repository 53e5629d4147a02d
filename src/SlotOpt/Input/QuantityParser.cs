using System.Globalization;
using System.Text.RegularExpressions;
using UnitsNet;

namespace SlotOpt.Input;

/// <summary>
/// Reads "0.35 mm", "1.5T", "400 Hz", "2 m/s", "80 degC", "0.52 uOhm m" or a plain SI number
/// into an SI double (temperatures in kelvin), against the one quantity the caller expects.
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
        _ => throw new ArgumentOutOfRangeException(nameof(kind)),
    };

    /// <summary>Parses text as the given quantity; false with a one-line reason when it is not one.</summary>
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
        else if (!TryParseWithUnit(trimmed, kind, out si))
        {
            error = $"\"{trimmed}\" is not a {Describe(kind)}; write it like {Example(kind)} or as a plain number in {SiUnit(kind)}";
            return false;
        }
        if (!double.IsFinite(si))
        {
            error = $"\"{trimmed}\" is not a finite {Describe(kind)}";
            return false;
        }
        return true;
    }

    /// <summary>Parses or throws <see cref="FormatException"/> with the reason.</summary>
    public static double Parse(string text, QuantityKind kind) =>
        TryParse(text, kind, out var si, out var error) ? si : throw new FormatException(error);

    public static string Describe(QuantityKind kind) => kind switch
    {
        QuantityKind.FluxDensity => "flux density",
        _ => kind.ToString().ToLowerInvariant(),
    };

    private static bool TryParseWithUnit(string text, QuantityKind kind, out double si)
    {
        si = double.NaN;
        var match = NumberThenUnit().Match(text);
        if (!match.Success) return false;
        if (!double.TryParse(match.Groups[1].Value, NumberStyles.Float, CultureInfo.InvariantCulture, out var value) || !double.IsFinite(value)) return false;
        var unit = NormaliseUnit(match.Groups[2].Value.Trim());
        var culture = CultureInfo.InvariantCulture;
        var joined = value.ToString("R", culture) + " " + unit;
        switch (kind)
        {
            case QuantityKind.Length when Length.TryParse(joined, culture, out var q): si = q.Meters; return true;
            case QuantityKind.FluxDensity when MagneticField.TryParse(joined, culture, out var q): si = q.Teslas; return true;
            case QuantityKind.Frequency when Frequency.TryParse(joined, culture, out var q): si = q.Hertz; return true;
            case QuantityKind.Speed when Speed.TryParse(joined, culture, out var q): si = q.MetersPerSecond; return true;
            case QuantityKind.Temperature when Temperature.TryParse(joined, culture, out var q): si = q.Kelvins; return true;
            case QuantityKind.Resistivity when ElectricResistivity.TryParse(joined, culture, out var q): si = q.OhmMeters; return true;
            case QuantityKind.Density when Density.TryParse(joined, culture, out var q): si = q.KilogramsPerCubicMeter; return true;
            case QuantityKind.Mass when Mass.TryParse(joined, culture, out var q): si = q.Kilograms; return true;
            case QuantityKind.Area when Area.TryParse(joined, culture, out var q): si = q.SquareMeters; return true;
            case QuantityKind.Power when Power.TryParse(joined, culture, out var q): si = (double)q.Watts; return true;
            case QuantityKind.Force when Force.TryParse(joined, culture, out var q): si = q.Newtons; return true;
            case QuantityKind.Pressure when Pressure.TryParse(joined, culture, out var q): si = q.Pascals; return true;
            case QuantityKind.Conductivity when ElectricConductivity.TryParse(joined, culture, out var q): si = q.SiemensPerMeter; return true;
            case QuantityKind.Duration when Duration.TryParse(joined, culture, out var q): si = q.Seconds; return true;
            case QuantityKind.Information when Information.TryParse(joined, culture, out var q): si = (double)q.Bytes; return true;
            default: return false;
        }
    }

    /// <summary>Maps the ASCII spellings engineers type onto the symbols UnitsNet reads.</summary>
    private static string NormaliseUnit(string unit)
    {
        var u = unit.Replace(" ", "").Replace("*", "·").Replace(".", "·");
        u = u switch
        {
            "degC" or "degc" or "C" => "°C",
            "degF" or "degf" or "F" => "°F",
            "kg/m3" or "kg/m^3" => "kg/m³",
            "g/cm3" or "g/cm^3" => "g/cm³",
            "kg/dm3" or "kg/dm^3" => "kg/dm³",
            "m2" or "m^2" => "m²",
            "cm2" or "cm^2" => "cm²",
            "mm2" or "mm^2" => "mm²",
            _ => u,
        };
        // Resistivity: "uOhm m", "uohm*m", "Ohm m", "nOhm m"
        var lower = u.ToLowerInvariant();
        if (lower.EndsWith("ohm·m") || lower.EndsWith("ohmm"))
        {
            var prefix = lower[..lower.IndexOf("ohm", StringComparison.Ordinal)];
            var symbolPrefix = prefix switch { "u" or "µ" or "μ" => "µ", "n" => "n", "m" => "m", "" => "", "k" => "k", "M" => "M", _ => prefix };
            u = symbolPrefix + "Ω·m";
        }
        return u;
    }

    [GeneratedRegex(@"^([-+]?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?)\s*(.+)$")]
    private static partial Regex NumberThenUnit();
}
