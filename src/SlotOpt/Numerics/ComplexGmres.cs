using System.Numerics;

namespace SlotOpt.Numerics;

/// <summary>y = Op x for complex vectors.</summary>
public delegate void ComplexMap(Complex[] x, Complex[] y);

/// <summary>Restarted flexible GMRES(m) for a complex, non-Hermitian A x = b: <see cref="FlexibleGmres"/> in the complex field.</summary>
public static class ComplexGmres
{
    public const int DefaultRestart = 60;

    public static bool TrySolve(ComplexMap a, ComplexMap preconditioner, Complex[] b, Complex[] x, ConvergenceCriterion criterion, int restart, out SolveReport report) =>
        FlexibleGmres.TrySolve<Complex, ComplexField>(a.Invoke, preconditioner.Invoke, b, x, null, false, criterion, restart, out report);

    public static SolveReport Solve(ComplexMap a, ComplexMap preconditioner, Complex[] b, Complex[] x, ConvergenceCriterion criterion, int restart = DefaultRestart) =>
        TrySolve(a, preconditioner, b, x, criterion, restart, out var report) ? report
            : throw new NumericalFailureException($"coupled sheet solver: {report.Description}");
}
