using System.CommandLine;

namespace SlotOpt.Cli;

public static class Program
{
    public static int Main(string[] args) => Invoke(args, Console.Out, Console.Error);

    /// <summary>Parses and runs one command line, writing to the given output and error writers; returns the exit code.</summary>
    public static int Invoke(string[] args, TextWriter output, TextWriter error)
    {
        var root = SlotOptCommand.Build();
        var parseResult = root.Parse(args);
        if (parseResult.Errors.Count > 0 && !HelpRequested(args))
        {
            var messages = parseResult.Errors.Select(e => e.Message).Concat(Hints(root, parseResult, args)).ToList();
            if (args.Contains("--json"))
                output.Write(ErrorsJson.From(ExitCodes.InvalidInput, messages.Select(InputError.FromText)).Serialize());
            foreach (var m in messages) error.WriteLine($"error: {m}");
            error.WriteLine("(run with --help for usage)");
            return ExitCodes.InvalidInput;
        }
        return parseResult.Invoke(new InvocationConfiguration { Output = output, Error = error });
    }

    /// <summary>
    /// What the parser cannot say: the nearest command to a mistyped one, and a hint to quote a quantity
    /// written with a space ("--frequency 50 Hz" leaves "Hz" as a stray argument).
    /// </summary>
    private static IEnumerable<string> Hints(RootCommand root, ParseResult parseResult, string[] args)
    {
        var commands = root.Subcommands.Select(c => c.Name).ToList();
        if (parseResult.CommandResult.Command == root && args.FirstOrDefault(a => !a.StartsWith('-')) is { } first && !commands.Contains(first))
        {
            var nearest = SlotOpt.Tables.NameSuggestion.Nearest(first, commands);
            yield return nearest is null
                ? $"\"{first}\" is not a command; the commands are {string.Join(", ", commands)}"
                : $"\"{first}\" is not a command; did you mean {nearest}?";
        }
        foreach (var stray in parseResult.UnmatchedTokens)
        {
            var at = Array.IndexOf(args, stray);
            if (at >= 2 && args[at - 2].StartsWith("--", StringComparison.Ordinal) && double.TryParse(args[at - 1], System.Globalization.NumberStyles.Float, System.Globalization.CultureInfo.InvariantCulture, out _))
                yield return $"{args[at - 2]}: a quantity with a space must be quoted: {args[at - 2]} \"{args[at - 1]} {stray}\" (or written without the space: {args[at - 1]}{stray})";
        }
    }

    private static bool HelpRequested(string[] args) => args.Any(a => a is "--help" or "-h" or "-?");
}
