namespace SlotOpt.Numerics;

/// <summary>
/// When the linear solve stops: converged when the true relative residual |b - A x| / |b| is at
/// most RelativeResidual; otherwise it stops with the <see cref="SolveStatus"/> that says why: after
/// MaxIterations (IterationLimit), on NaN/Inf (NonFinite), when the residual grows beyond
/// DivergenceFactor times its start (Diverged), or on loss of positive definiteness (NotPositiveDefinite).
/// </summary>
public sealed record ConvergenceCriterion
{
    public double RelativeResidual { get; init; } = 1e-8;
    public int MaxIterations { get; init; } = 300;
    public double DivergenceFactor { get; init; } = 1e6;

    public static ConvergenceCriterion Default { get; } = new();
}
