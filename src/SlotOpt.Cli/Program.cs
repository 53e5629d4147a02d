using System.CommandLine;

namespace SlotOpt.Cli;

public static class Program
{
    public static int Main(string[] args) => Invoke(args, Console.Out, Console.Error);

    /// <summary>Parses and runs one command line, writing to the given output and error writers; returns the exit code.</summary>
    public static int Invoke(string[] args, TextWriter output, TextWriter error)
    {
        var parseResult = SlotOptCommand.Build().Parse(args);
        if (parseResult.Errors.Count > 0 && !HelpRequested(args))
        {
            if (args.Contains("--json"))
                output.Write(ErrorsJson.From(ExitCodes.InvalidInput, parseResult.Errors.Select(e => InputError.FromText(e.Message))).Serialize());
            foreach (var e in parseResult.Errors) error.WriteLine($"error: {e.Message}");
            error.WriteLine("(run with --help for usage)");
            return ExitCodes.InvalidInput;
        }
        return parseResult.Invoke(new InvocationConfiguration { Output = output, Error = error });
    }

    private static bool HelpRequested(string[] args) => args.Any(a => a is "--help" or "-h" or "-?");
}
