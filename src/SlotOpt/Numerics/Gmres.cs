namespace SlotOpt.Numerics;

/// <summary>y = Op x for real vectors.</summary>
public delegate void RealMap(double[] x, double[] y);

/// <summary>Restarted flexible GMRES(m) for a real, non-symmetric A x = b: <see cref="FlexibleGmres"/> in the real field.</summary>
public static class Gmres
{
    public static bool TrySolve(RealMap a, RealMap preconditioner, double[] b, double[] x, ConvergenceCriterion criterion, int restart, out SolveReport report) =>
        TrySolve(a, preconditioner, b, x, null, false, criterion, restart, out report);

    /// <param name="image">null, or a buffer for A x: when <paramref name="imageHoldsGuess"/> it holds A x of the warm start on entry
    /// (the image a previous solve returned for this x, saving the first application of A); on success it holds A x of the answer</param>
    public static bool TrySolve(RealMap a, RealMap preconditioner, double[] b, double[] x, double[]? image, bool imageHoldsGuess,
        ConvergenceCriterion criterion, int restart, out SolveReport report) =>
        FlexibleGmres.TrySolve<double, RealField>(a.Invoke, preconditioner.Invoke, b, x, image, imageHoldsGuess, criterion, restart, out report);

    public static SolveReport Solve(RealMap a, RealMap preconditioner, double[] b, double[] x, ConvergenceCriterion criterion, int restart = ComplexGmres.DefaultRestart) =>
        TrySolve(a, preconditioner, b, x, criterion, restart, out var report) ? report
            : throw new NumericalFailureException($"GMRES: {report.Description}");
}
