using System.CommandLine;

namespace SlotOpt.Cli;

public static class Program
{
    public static int Main(string[] args)
    {
        var parseResult = SlotOptCommand.Build().Parse(args);
        if (parseResult.Errors.Count > 0 && !HelpRequested(args))
        {
            foreach (var error in parseResult.Errors) Console.Error.WriteLine($"error: {error.Message}");
            Console.Error.WriteLine("(run with --help for usage)");
            return ExitCodes.InvalidInput;
        }
        return parseResult.Invoke();
    }

    private static bool HelpRequested(string[] args) => args.Any(a => a is "--help" or "-h" or "-?");
}
