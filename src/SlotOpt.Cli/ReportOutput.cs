using System.Runtime.InteropServices;
using SlotOpt.Design.Limits;
using SlotOpt.Reports;

namespace SlotOpt.Cli;

/// <summary>
/// The `--out DIR [--force]` side of a command that writes a report folder (`run`, `plate`): the flags checked before any
/// work, and the folder written atomically with SIGINT, SIGTERM and the time limit abandoning it unfinished.
/// </summary>
public static class ReportOutput
{
    /// <summary>Exit codes of a command stopped by a signal while it wrote the report: 128 + the signal's number, as shells report them.</summary>
    private const int InterruptedExit = 130, TerminatedExit = 143;

    /// <summary>Checks --out and --force before any work (<see cref="ReportFolder.CheckTarget"/>); the folder may not hold the input file.</summary>
    /// <exception cref="InputException">--force without --out, or an unusable target.</exception>
    public static void Check(string? reportDir, bool replace, string inputFile)
    {
        if (replace && reportDir is null) throw new InputException("--force only applies with --out DIR");
        if (reportDir is not null) ReportFolder.CheckTarget(reportDir, replace, inputFile);
    }

    /// <summary>
    /// Writes the report atomically. SIGINT or SIGTERM while it is written deletes the unfinished folder
    /// (the handlers are in place before the folder is made) and returns the exit code; null when written.
    /// The time limit passing while it is written deletes the folder too, and ends the command with the limit's error.
    /// </summary>
    public static int? Write(string reportDir, bool replace, RunDeadline deadline, Action<ReportFolder> write)
    {
        deadline.Check("the report");
        using var folder = ReportFolder.Begin(reportDir, replace);
        using var onDeadline = deadline.Token.Register(folder.Abandon);
        int? signalExit = null;
        void Stop(PosixSignalContext context, int exitCode)
        {
            context.Cancel = true;
            signalExit = exitCode;
            folder.Abandon();
        }
        using var onInterrupt = PosixSignalRegistration.Create(PosixSignal.SIGINT, c => Stop(c, InterruptedExit));
        using var onTerminate = PosixSignalRegistration.Create(PosixSignal.SIGTERM, c => Stop(c, TerminatedExit));
        try
        {
            write(folder);
            return null;
        }
        catch (InvalidOperationException) when (signalExit is not null)
        {
            return signalExit;   // the folder was abandoned under the writer
        }
        catch (InvalidOperationException) when (deadline.Token.IsCancellationRequested)
        {
            throw deadline.Passed("the report");   // abandoned under the writer by the deadline
        }
    }
}
