using System.Diagnostics;

namespace SlotOpt.Tests.Cli;

/// <summary>Runs the built `slotopt` command as a separate process, as a user would, with a time limit.</summary>
public static class SlotOptProcess
{
    public sealed record Outcome(int ExitCode, string Stdout, string Stderr);

    public static Outcome Run(params string[] args) => RunIn(null, args);

    public static Outcome RunIn(string? workingDirectory, params string[] args)
    {
        var dll = Path.Combine(AppContext.BaseDirectory, "slotopt.dll");
        var start = new ProcessStartInfo("dotnet")
        {
            RedirectStandardOutput = true,
            RedirectStandardError = true,
            UseShellExecute = false,
            WorkingDirectory = workingDirectory ?? AppContext.BaseDirectory,
        };
        start.ArgumentList.Add(dll);
        foreach (var a in args) start.ArgumentList.Add(a);
        using var process = Process.Start(start)!;
        var stdout = process.StandardOutput.ReadToEndAsync();
        var stderr = process.StandardError.ReadToEndAsync();
        if (!process.WaitForExit(60_000))
        {
            process.Kill(entireProcessTree: true);
            throw new TimeoutException($"slotopt {string.Join(' ', args)} did not finish in 60 s");
        }
        return new Outcome(process.ExitCode, stdout.Result, stderr.Result);
    }
}
