using System.CommandLine;
using SlotOpt.Input;

namespace SlotOpt.Cli;

/// <summary>Reads a flag that carries a quantity with units ("0.35mm", "1.5T", "400Hz", "80degC").</summary>
public static class QuantityOption
{
    public static Option<string> Create(string name, string description, bool required = false) =>
        new(name) { Description = description, Required = required };

    /// <summary>The flag's value in SI, null when absent; an <see cref="InputException"/> naming the flag when malformed.</summary>
    public static double? Read(ParseResult parseResult, Option<string> option, QuantityKind kind)
    {
        var text = parseResult.GetValue(option);
        if (text is null) return null;
        if (!QuantityParser.TryParse(text, kind, out var si, out var error)) throw new InputException($"{option.Name}: {error}");
        if (PhysicalRange.Violation(si, kind) is { } beyond) throw new InputException($"{option.Name}: {beyond}");
        return si;
    }

    /// <summary>As <see cref="Read"/>, and the value must be strictly positive.</summary>
    public static double? ReadPositive(ParseResult parseResult, Option<string> option, QuantityKind kind)
    {
        var value = Read(parseResult, option, kind);
        if (value is { } v && !(v > 0)) throw new InputException($"{option.Name}: must be positive, got {parseResult.GetValue(option)}");
        return value;
    }
}
