using SlotOpt.Cli;

namespace SlotOpt.Tests.Cli;

/// <summary>
/// Runs a `slotopt` command line in this process, through the same entry point as the executable
/// (<see cref="SlotOpt.Cli.Program.Invoke"/>), with its output and error captured: the exit code and the text
/// are what a user sees, without starting a process. Paths in the arguments are taken as given (absolute in tests).
/// </summary>
public static class SlotOptInProcess
{
    public static SlotOptProcess.Outcome Run(params string[] args)
    {
        using var output = new StringWriter();
        using var error = new StringWriter();
        var exitCode = SlotOpt.Cli.Program.Invoke(args, output, error);
        return new SlotOptProcess.Outcome(exitCode, output.ToString(), error.ToString());
    }
}
