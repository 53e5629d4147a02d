using System.Diagnostics;

namespace SlotOpt.Tests.Cli;

/// <summary>
/// Runs the built `slotopt` command as a separate process, as a user would: for the few smoke tests that need
/// the real process (its exit code, signals). Most command tests run in-process (<see cref="SlotOptInProcess"/>).
/// </summary>
public static class SlotOptProcess
{
    public sealed record Outcome(int ExitCode, string Stdout, string Stderr);

    /// <summary>A guard against a hung process only, never a pass criterion: generous enough for a loaded 2-core machine.</summary>
    public static readonly TimeSpan HangGuard = TimeSpan.FromMinutes(15);

    public static Outcome Run(params string[] args) => RunIn(AppContext.BaseDirectory, args);

    /// <summary>Runs in a given working directory: for paths a user gives relative to where they stand (`--out .`).</summary>
    public static Outcome RunIn(string workingDirectory, params string[] args)
    {
        using var process = Start(workingDirectory, args);
        var stdout = process.StandardOutput.ReadToEndAsync();
        var stderr = process.StandardError.ReadToEndAsync();
        if (!process.WaitForExit(HangGuard))
        {
            process.Kill(entireProcessTree: true);
            throw new TimeoutException($"slotopt {string.Join(' ', args)} still ran after {HangGuard.TotalMinutes} min: hung");
        }
        return new Outcome(process.ExitCode, stdout.Result, stderr.Result);
    }

    /// <summary>Starts `dotnet slotopt.dll ARGS` with output and error redirected.</summary>
    public static Process Start(params string[] args) => Start(AppContext.BaseDirectory, args);

    private static Process Start(string workingDirectory, string[] args)
    {
        var start = new ProcessStartInfo("dotnet")
        {
            RedirectStandardOutput = true,
            RedirectStandardError = true,
            UseShellExecute = false,
            WorkingDirectory = workingDirectory,
        };
        start.ArgumentList.Add(Path.Combine(AppContext.BaseDirectory, "slotopt.dll"));
        foreach (var a in args) start.ArgumentList.Add(a);
        return Process.Start(start)!;
    }
}
