namespace SlotOpt.Numerics;

/// <summary>
/// When the linear solve stops: converged when the true relative residual |b - A x| / |b| is at
/// most RelativeResidual; otherwise it stops with the <see cref="SolveStatus"/> that says why: after
/// MaxIterations (IterationLimit), on NaN/Inf (NonFinite), when the residual grows beyond
/// DivergenceFactor times its start (Diverged), or on loss of positive definiteness (NotPositiveDefinite).
/// Every iteration also checks <see cref="Cancellation"/> and throws OperationCanceledException once it is
/// cancelled (the run's time limit): the run's token (<see cref="CancelWith"/>) unless a criterion names its own.
/// </summary>
public sealed record ConvergenceCriterion
{
    public double RelativeResidual { get; init; } = 1e-8;
    public int MaxIterations { get; init; } = 300;
    public double DivergenceFactor { get; init; } = 1e6;

    private static readonly AsyncLocal<CancellationToken> RunCancellation = new();
    private readonly CancellationToken? cancellation;

    /// <summary>The token every iteration checks: this criterion's own, else the one the running code set with <see cref="CancelWith"/>.</summary>
    public CancellationToken Cancellation { get => cancellation ?? RunCancellation.Value; init => cancellation = value; }

    public static ConvergenceCriterion Default { get; } = new();

    /// <summary>Throws OperationCanceledException when the solve must stop (one read of a flag: cheap enough for every iteration).</summary>
    public void ThrowIfCancelled() => Cancellation.ThrowIfCancellationRequested();

    /// <summary>
    /// Every solve started by this code (and the parallel work it starts) until the scope is disposed honours the token,
    /// so a time limit reaches every solver loop without a parameter through every layer.
    /// </summary>
    public static IDisposable CancelWith(CancellationToken token)
    {
        var previous = RunCancellation.Value;
        RunCancellation.Value = token;
        return new Restore(previous);
    }

    private sealed class Restore(CancellationToken previous) : IDisposable
    {
        public void Dispose() => RunCancellation.Value = previous;
    }
}
