namespace SlotOpt.Numerics;

/// <summary>
/// When the linear solve stops: converged when the true relative residual |b - A x| / |b| is at
/// most RelativeResidual; failed after MaxIterations, on NaN/Inf, or when the residual grows
/// beyond DivergenceFactor times its start (loss of positive definiteness or a broken preconditioner).
/// </summary>
public sealed record ConvergenceCriterion
{
    public double RelativeResidual { get; init; } = 1e-8;
    public int MaxIterations { get; init; } = 300;
    public double DivergenceFactor { get; init; } = 1e6;

    public static ConvergenceCriterion Default { get; } = new();
}
