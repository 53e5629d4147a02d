namespace SlotOpt.Numerics;

/// <summary>Why an iterative solve stopped (see <see cref="ConvergenceCriterion"/>).</summary>
public enum SolveStatus
{
    /// <summary>The true relative residual met the target.</summary>
    Converged,
    /// <summary>MaxIterations iterations without meeting the target.</summary>
    IterationLimit,
    /// <summary>Conjugate gradients met p.Ap &lt;= 0: the operator or the preconditioner is not symmetric positive definite.</summary>
    NotPositiveDefinite,
    /// <summary>The residual grew beyond DivergenceFactor times its start.</summary>
    Diverged,
    /// <summary>The right-hand side, the residual or a Krylov vector became NaN or infinite.</summary>
    NonFinite,
}
