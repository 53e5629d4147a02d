using System.Globalization;

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

    /// <summary>The status with the residual and iterations, for error messages: "no convergence within the iteration limit (relative residual 3.2e-5 after 400 iterations)".</summary>
    public string Description => $"{Reason} (relative residual {RelativeResidual.ToString("0.#e0", CultureInfo.InvariantCulture)} after {Iterations} iterations)";
}
