using System.CommandLine;

namespace SlotOpt.Cli;

/// <summary>
/// Runs a command body with the invocation's output and error writers (the console, or a test's writers) and
/// turns the engine's exceptions into an exit code and a message: one line each on the error writer and, when
/// the command was given --json, one <see cref="ErrorsJson"/> document on the output writer as well.
/// </summary>
public static class CommandRunner
{
    /// <param name="body">Given the output and the error writer; returns the exit code.</param>
    public static int Run(ParseResult parseResult, Func<TextWriter, TextWriter, int> body)
    {
        var output = parseResult.InvocationConfiguration.Output;
        var error = parseResult.InvocationConfiguration.Error;
        var json = WantsJson(parseResult);
        try
        {
            return body(output, error);
        }
        catch (InputException e)
        {
            if (json) output.Write(ErrorsJson.From(ExitCodes.InvalidInput, e.Errors).Serialize());
            foreach (var line in e.Message.Split(Environment.NewLine)) error.WriteLine($"error: {line}");
            return ExitCodes.InvalidInput;
        }
        catch (ResourceLimitException e)
        {
            return Fail(json, output, error, ExitCodes.ResourceLimit, "resource limit", e.Message);
        }
        catch (NumericalFailureException e)
        {
            return Fail(json, output, error, ExitCodes.NumericalFailure, "numerical failure", e.Message);
        }
        catch (Exception e)
        {
            var exit = Fail(json, output, error, ExitCodes.InternalError, "internal error (please report)", $"{e.GetType().Name}: {e.Message}");
            error.WriteLine(e.StackTrace);
            return exit;
        }
    }

    /// <summary>True when the command has a --json option and it was given.</summary>
    public static bool WantsJson(ParseResult parseResult) =>
        parseResult.CommandResult.Command.Options.OfType<Option<bool>>().FirstOrDefault(o => o.Name == "--json") is { } option
        && parseResult.GetValue(option);

    private static int Fail(bool json, TextWriter output, TextWriter error, int exitCode, string kind, string message)
    {
        if (json) output.Write(ErrorsJson.From(exitCode, message).Serialize());
        error.WriteLine($"{kind}: {message}");
        return exitCode;
    }
}
