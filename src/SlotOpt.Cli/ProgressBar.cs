using System.Diagnostics;

namespace SlotOpt.Cli;

/// <summary>
/// A one-line progress bar on the error writer, shown only when that is the console's standard error on a
/// terminal and only once the work has run for a second; redirected output (logs, tests, CI) stays clean.
/// </summary>
public sealed class ProgressBar : IProgress<int>, IDisposable
{
    private readonly string label;
    private readonly int total;
    private readonly Stopwatch clock = Stopwatch.StartNew();
    private readonly object gate = new();
    private readonly TextWriter error;
    private readonly bool enabled;
    private int done;
    private bool drawn;

    public ProgressBar(string label, int total, TextWriter error)
    {
        this.label = label;
        this.total = Math.Max(total, 1);
        this.error = error;
        enabled = ReferenceEquals(error, Console.Error) && !Console.IsErrorRedirected;
    }

    public void Report(int increment)
    {
        lock (gate)
        {
            done += increment;
            if (!enabled || clock.Elapsed.TotalSeconds < 1) return;
            const int width = 30;
            var filled = (int)Math.Round(width * Math.Min(done, total) / (double)total);
            error.Write($"\r{label} [{new string('#', filled)}{new string('.', width - filled)}] {done}/{total}");
            drawn = true;
        }
    }

    public void Dispose()
    {
        lock (gate)
        {
            if (drawn) error.WriteLine();
        }
    }
}
