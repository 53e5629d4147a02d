using System.Text.RegularExpressions;

namespace SlotOpt;

/// <summary>
/// One user mistake and its place: the file and line, the key (or the flag) and what is wrong. Printed as
/// "file:line: key: message" ("--flag: message" for a flag); `--json` prints the parts as they are.
/// </summary>
public sealed partial record InputError(string? File, int? Line, string? Key, string Message)
{
    public override string ToString() => (File, Line, Key) switch
    {
        (not null, not null, { Length: > 0 }) => $"{File}:{Line}: {Key}: {Message}",
        (not null, not null, _) => $"{File}:{Line}: {Message}",
        (not null, null, { Length: > 0 }) => $"{File}: {Key}: {Message}",
        (not null, null, _) => $"{File}: {Message}",
        (null, _, { Length: > 0 }) => $"{Key}: {Message}",
        _ => Message,
    };

    /// <summary>
    /// The parts of a message written in the house form: "file:line: key: message", "file:line: message",
    /// "file.toml: message" (or .csv), "--flag: message" or "--flag VALUE: message"; any other text is a message without a place.
    /// </summary>
    public static InputError FromText(string text)
    {
        if (FileLineKey().Match(text) is { Success: true } placed)
            return new InputError(placed.Groups["file"].Value, int.Parse(placed.Groups["line"].Value, System.Globalization.CultureInfo.InvariantCulture),
                placed.Groups["key"].Success ? placed.Groups["key"].Value : null, placed.Groups["message"].Value);
        if (FileOnly().Match(text) is { Success: true } file)
            return new InputError(file.Groups["file"].Value, null, null, file.Groups["message"].Value);
        if (Flag().Match(text) is { Success: true } flag)
            return new InputError(null, null, flag.Groups["flag"].Value, flag.Groups["message"].Value);
        return new InputError(null, null, null, text);
    }

    [GeneratedRegex(@"^(?<file>.+?):(?<line>\d+): (?:(?<key>[A-Za-z_][\w.\[\]-]*): )?(?<message>.*)$", RegexOptions.Singleline)]
    private static partial Regex FileLineKey();

    [GeneratedRegex(@"^(?<file>[^\s:]*\.(?:toml|csv)): (?<message>.*)$", RegexOptions.Singleline)]
    private static partial Regex FileOnly();

    [GeneratedRegex(@"^(?<flag>--[a-z][a-z-]*)(?: [^:]*)?: (?<message>.*)$", RegexOptions.Singleline)]
    private static partial Regex Flag();
}
