using System.CommandLine;

namespace SlotOpt.Cli;

/// <summary>
/// Runs a command body with the invocation's output and error writers (the console, or a test's writers) and
/// turns the engine's exceptions into a one-line message on the error writer and an exit code.
/// </summary>
public static class CommandRunner
{
    /// <param name="body">Given the output and the error writer; returns the exit code.</param>
    public static int Run(ParseResult parseResult, Func<TextWriter, TextWriter, int> body)
    {
        var output = parseResult.InvocationConfiguration.Output;
        var error = parseResult.InvocationConfiguration.Error;
        try
        {
            return body(output, error);
        }
        catch (InputException e)
        {
            foreach (var line in e.Message.Split(Environment.NewLine)) error.WriteLine($"error: {line}");
            return ExitCodes.InvalidInput;
        }
        catch (ResourceLimitException e)
        {
            error.WriteLine($"resource limit: {e.Message}");
            return ExitCodes.ResourceLimit;
        }
        catch (NumericalFailureException e)
        {
            error.WriteLine($"numerical failure: {e.Message}");
            return ExitCodes.NumericalFailure;
        }
        catch (Exception e)
        {
            error.WriteLine($"internal error (please report): {e.GetType().Name}: {e.Message}");
            error.WriteLine(e.StackTrace);
            return ExitCodes.InternalError;
        }
    }
}
