namespace SlotOpt.Numerics;

/// <summary>How one linear solve went: its status, iterations and the final true relative residual |b - A x| / |b|.</summary>
public readonly record struct SolveReport(SolveStatus Status, int Iterations, double RelativeResidual)
{
    public bool Converged => Status == SolveStatus.Converged;

    /// <summary>The status in words, for error messages.</summary>
    public string Reason => Status switch
    {
        SolveStatus.Converged => "converged",
        SolveStatus.IterationLimit => "no convergence within the iteration limit",
        SolveStatus.NotPositiveDefinite => "the operator or preconditioner is not positive definite (p.Ap <= 0)",
        SolveStatus.Diverged => "the residual grew beyond the divergence limit",
        _ => "a value became NaN or infinite (right-hand side, residual or Krylov vector)",
    };
}
