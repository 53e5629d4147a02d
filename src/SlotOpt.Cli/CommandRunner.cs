namespace SlotOpt.Cli;

/// <summary>Runs a command body and turns the engine's exceptions into a one-line message and an exit code.</summary>
public static class CommandRunner
{
    public static int Run(Func<int> body)
    {
        try
        {
            return body();
        }
        catch (InputException e)
        {
            foreach (var line in e.Message.Split(Environment.NewLine)) Console.Error.WriteLine($"error: {line}");
            return ExitCodes.InvalidInput;
        }
        catch (ResourceLimitException e)
        {
            Console.Error.WriteLine($"resource limit: {e.Message}");
            return ExitCodes.ResourceLimit;
        }
        catch (NumericalFailureException e)
        {
            Console.Error.WriteLine($"numerical failure: {e.Message}");
            return ExitCodes.NumericalFailure;
        }
        catch (Exception e)
        {
            Console.Error.WriteLine($"internal error (please report): {e.GetType().Name}: {e.Message}");
            Console.Error.WriteLine(e.StackTrace);
            return ExitCodes.InternalError;
        }
    }
}
