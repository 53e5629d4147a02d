using System.Diagnostics;
using System.Runtime.InteropServices;
using SlotOpt.Reports;
using SlotOpt.Tests.Cli;

namespace SlotOpt.Tests.Reports;

/// <summary>An existing folder needs --force (in-process), and a run stopped by a signal while it writes leaves nothing behind (a real process: the signal is its subject).</summary>
public sealed class ReportInterruptionTests : IDisposable
{
    private readonly string parent = Path.Combine(Path.GetTempPath(), "slotopt-interrupt-tests-" + Guid.NewGuid().ToString("N")[..8]);

    public ReportInterruptionTests() => Directory.CreateDirectory(parent);

    public void Dispose() => Directory.Delete(parent, recursive: true);

    [Fact]
    public void An_existing_folder_is_not_overwritten_without_force()
    {
        var target = Path.Combine(parent, "report");
        Directory.CreateDirectory(target);
        File.WriteAllText(Path.Combine(target, "keep.txt"), "mine");
        var outcome = SlotOptInProcess.Run("run", ReportRuns.ProblemPath("motor-core-400hz"), "--out", target);
        Assert.Equal(2, outcome.ExitCode);
        Assert.Contains("pass --force to replace it", outcome.Stderr);
        Assert.Equal("", outcome.Stdout);   // refused before the run, not after
        Assert.Equal(["keep.txt"], Directory.GetFiles(target).Select(Path.GetFileName));
    }

    private const int SigTerm = 15;

    [DllImport("libc", EntryPoint = "kill", SetLastError = true)]
    private static extern int Kill(int pid, int signal);

    /// <summary>Attempts at landing the signal inside the write: on a loaded machine the poll below can wake after the report is finished.</summary>
    private const int Attempts = 4;

    [Fact]
    public void Terminated_while_writing_the_report_leaves_no_folder_and_no_temporary_folder()
    {
        var target = Path.Combine(parent, "report");
        var lost = new List<string>();
        for (int attempt = 0; attempt < Attempts; attempt++)
        {
            var (landed, why) = TerminateWhileWriting(target);
            if (landed) return;
            lost.Add(why);
            if (Directory.Exists(target)) Directory.Delete(target, recursive: true);
        }
        Assert.Fail($"the signal never landed inside the report's write in {Attempts} attempts: " + string.Join("; ", lost));
    }

    /// <summary>
    /// One run stopped by SIGTERM as soon as its temporary report folder appears. Returns false (a lost race, not a failure)
    /// when the run finished its report before the signal; otherwise asserts that nothing was left behind.
    /// </summary>
    private (bool Landed, string Why) TerminateWhileWriting(string target)
    {
        using var process = SlotOptProcess.Start("run", ReportRuns.ProblemPath(ReportRuns.Conveyor), "--out", target);
        var stdout = process.StandardOutput.ReadToEndAsync();
        var stderr = process.StandardError.ReadToEndAsync();
        var prefix = ReportFolder.TemporaryPrefix(target);
        var clock = Stopwatch.StartNew();
        var sawTemporary = false;
        while (!process.HasExited && clock.Elapsed < SlotOptProcess.HangGuard)   // ends when the folder appears or the run ends; the guard only stops a hung run
        {
            if (Directory.EnumerateDirectories(parent).Any(d => Path.GetFileName(d).StartsWith(prefix, StringComparison.Ordinal))) { sawTemporary = true; break; }
            Thread.Sleep(2);
        }
        if (!sawTemporary && !process.HasExited) process.Kill(entireProcessTree: true);   // hung: stopped by the guard
        Assert.False(!sawTemporary && !process.HasExited, "the run hung");
        if (!sawTemporary)
        {
            process.WaitForExit();
            Assert.True(process.ExitCode == 0 && stderr.Result.Contains("report: "), $"the run failed before its report folder appeared: exit {process.ExitCode}: {stderr.Result}");
            return (false, "the report was written between two looks for its folder");
        }
        Assert.True(Kill(process.Id, SigTerm) == 0, $"kill failed: errno {Marshal.GetLastPInvokeError()}");
        Assert.True(process.WaitForExit(SlotOptProcess.HangGuard), "the run did not stop on SIGTERM");
        _ = stdout.Result;
        var finished = File.Exists(Path.Combine(target, ReportWriter.HtmlFile)) && !stderr.Result.Contains("interrupted");
        if (finished) return (false, "the report was finished before the signal arrived");   // committed, then the signal: a lost race
        Assert.True(process.ExitCode == 143, $"exit {process.ExitCode}: {stderr.Result}");
        Assert.Contains("interrupted: the report was not written", stderr.Result);
        Assert.False(Directory.Exists(target), "a partial report folder was left");
        Assert.Empty(Directory.EnumerateFileSystemEntries(parent));
        return (true, "");
    }
}
