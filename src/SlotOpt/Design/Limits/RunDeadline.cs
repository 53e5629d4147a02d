using System.Diagnostics;
using SlotOpt.Numerics;
using SlotOpt.Tables;

namespace SlotOpt.Design.Limits;

/// <summary>
/// The wall-time limit of one run in progress (--time-limit), started when the run starts. Each phase runs under
/// <see cref="Run{T}"/>: checked before it starts, and every iterative solve inside it (CG, GMRES: their
/// <see cref="ConvergenceCriterion"/>) stops within one iteration once the limit passes. Past the limit the run ends
/// with a ResourceLimitException naming the phase, and nothing of the phase's output is kept.
/// </summary>
public sealed class RunDeadline : IDisposable
{
    /// <summary>The longest delay a CancellationTokenSource takes (about 49 days); a longer limit never fires.</summary>
    private const double LongestTimerSeconds = 4e6;

    private readonly CancellationTokenSource source;
    private readonly Stopwatch clock = Stopwatch.StartNew();

    public RunDeadline(double limitSeconds)
    {
        if (!(limitSeconds >= 0)) throw new ArgumentOutOfRangeException(nameof(limitSeconds), limitSeconds, "time limit must not be negative");
        LimitSeconds = limitSeconds;
        source = limitSeconds < LongestTimerSeconds ? new CancellationTokenSource(TimeSpan.FromSeconds(limitSeconds)) : new CancellationTokenSource();
    }

    public double LimitSeconds { get; }

    /// <summary>Cancelled once the limit passes.</summary>
    public CancellationToken Token => source.Token;

    public double ElapsedSeconds => clock.Elapsed.TotalSeconds;

    public double RemainingSeconds => Math.Max(0, LimitSeconds - ElapsedSeconds);

    public bool HasPassed => Token.IsCancellationRequested || ElapsedSeconds > LimitSeconds;

    /// <summary>Throws when the limit has passed (between phases and between solves).</summary>
    public void Check(string phase)
    {
        if (HasPassed) throw Passed(phase);
    }

    /// <summary>Runs one phase: checked before it starts and after it ends, every solve inside cancelled when the limit passes.</summary>
    public T Run<T>(string phase, Func<T> work)
    {
        Check(phase);
        using var scope = ConvergenceCriterion.CancelWith(Token);
        T result;
        try { result = work(); }
        catch (OperationCanceledException) when (Token.IsCancellationRequested) { throw Passed(phase); }
        Check(phase);
        return result;
    }

    public ResourceLimitException Passed(string phase) =>
        new($"the run passed its time limit of {Numbers.Of(LimitSeconds, "s")} (--time-limit) during {phase}, {Numbers.Of(ElapsedSeconds, "s")} after it started; raise the limit, coarsen the grid or list fewer options");

    public void Dispose() => source.Dispose();
}
