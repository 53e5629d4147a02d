using System.CommandLine;
using SlotOpt.Input;

namespace SlotOpt.Cli;

/// <summary>Reads a flag that carries a quantity with units ("0.35mm", "1.5T", "400Hz", "80degC").</summary>
public static class QuantityOption
{
    /// <param name="placeholder">How the help names the value, e.g. "&lt;LENGTH&gt;".</param>
    /// <param name="oldName">A deprecated spelling still accepted, with a warning, until the next release.</param>
    public static Option<string> Create(string name, string description, bool required = false, string placeholder = "<QUANTITY>", string? oldName = null)
    {
        var option = new Option<string>(name) { Description = description, Required = required, HelpName = placeholder.Trim('<', '>') };
        if (oldName is not null) option.Aliases.Add(oldName);
        return option;
    }

    /// <summary>Warns on the error writer when the flag was given under its deprecated alias.</summary>
    public static void WarnIfOldName(ParseResult parseResult, Option option, TextWriter error)
    {
        var used = parseResult.GetResult(option)?.IdentifierToken?.Value;
        if (used is not null && used != option.Name)
            error.WriteLine($"warning: {used} is deprecated; write {option.Name} (the old name is accepted until the next release)");
    }

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
