using SlotOpt.Reports.Json;

namespace SlotOpt.Cli;

/// <summary>What a command prints on standard output with --json when it fails: every error with its place, and the exit code it returns.</summary>
public sealed record ErrorsJson(int ExitCode, IReadOnlyList<ErrorsJson.Error> Errors) : VersionedJson
{
    /// <summary>One error: the file, line and key (or the flag, as the key) where known, and what is wrong.</summary>
    public sealed record Error(string? File, int? Line, string? Key, string Message);

    public static ErrorsJson From(int exitCode, IEnumerable<InputError> errors) =>
        new(exitCode, errors.Select(e => new Error(e.File, e.Line, e.Key, e.Message)).ToList());

    public static ErrorsJson From(int exitCode, string message) => new(exitCode, [new Error(null, null, null, message)]);
}
