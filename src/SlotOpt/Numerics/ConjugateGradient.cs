namespace SlotOpt.Numerics;

/// <summary>
/// Preconditioned conjugate gradients for A x = b, A symmetric positive definite (R. Barrett et al.,
/// "Templates for the Solution of Linear Systems", SIAM, 1994, section 2.3.1, Figure 2.5).
/// x holds the starting guess (warm start) on entry and the solution on exit. When the recursive
/// residual meets the target the true residual is recomputed; if it does not meet it too the
/// iteration restarts from the true residual.
/// </summary>
public static class ConjugateGradient
{
    public static bool TrySolve(ILinearOperator a, ReadOnlySpan<double> b, Span<double> x, IPreconditioner m, ConvergenceCriterion criterion, out SolveReport report)
    {
        int n = a.Rows;
        double normB = Norm(b);
        if (normB == 0)
        {
            x.Clear();
            report = new SolveReport(SolveStatus.Converged, 0, 0);
            return true;
        }
        if (!double.IsFinite(normB)) { report = new SolveReport(SolveStatus.NonFinite, 0, double.NaN); return false; }
        var r = new double[n];
        var z = new double[n];
        var p = new double[n];
        var q = new double[n];
        a.Residual(b, x, r);
        double target = criterion.RelativeResidual * normB;
        double start = Norm(r);
        int iterations = 0;
        while (true)
        {
            double rel = Norm(r);
            if (rel <= target)
            {
                a.Residual(b, x, r);
                double trueNorm = Norm(r);
                if (trueNorm <= target) { report = new SolveReport(SolveStatus.Converged, iterations, trueNorm / normB); return true; }
            }
            if (iterations >= criterion.MaxIterations)
            {
                a.Residual(b, x, r);
                report = new SolveReport(SolveStatus.IterationLimit, iterations, Norm(r) / normB);
                return false;
            }
            // (re)start: p = z = M^-1 r
            m.Apply(r, z);
            z.AsSpan().CopyTo(p);
            double rz = Dot(r, z);
            while (iterations < criterion.MaxIterations)
            {
                criterion.ThrowIfCancelled();
                a.Multiply(p, q);
                double pq = Dot(p, q);
                if (!double.IsFinite(pq) || !double.IsFinite(rz))
                {
                    report = new SolveReport(SolveStatus.NonFinite, iterations, Norm(r) / normB);
                    return false;
                }
                if (!(pq > 0))
                {
                    report = new SolveReport(SolveStatus.NotPositiveDefinite, iterations, Norm(r) / normB);
                    return false;
                }
                double alpha = rz / pq;
                for (int i = 0; i < n; i++) { x[i] += alpha * p[i]; r[i] -= alpha * q[i]; }
                iterations++;
                double rn = Norm(r);
                if (!double.IsFinite(rn) || rn > criterion.DivergenceFactor * Math.Max(start, normB))
                {
                    report = new SolveReport(double.IsFinite(rn) ? SolveStatus.Diverged : SolveStatus.NonFinite, iterations, rn / normB);
                    return false;
                }
                if (rn <= target) break;
                m.Apply(r, z);
                double rzNew = Dot(r, z);
                double beta = rzNew / rz;
                rz = rzNew;
                for (int i = 0; i < n; i++) p[i] = z[i] + beta * p[i];
            }
        }
    }

    public static SolveReport Solve(ILinearOperator a, ReadOnlySpan<double> b, Span<double> x, IPreconditioner m, ConvergenceCriterion criterion) =>
        TrySolve(a, b, x, m, criterion, out var report) ? report : throw new NumericalFailureException($"sheet solver: {report.Description}");

    internal static double Dot(ReadOnlySpan<double> a, ReadOnlySpan<double> b)
    {
        double s = 0;
        for (int i = 0; i < a.Length; i++) s += a[i] * b[i];
        return s;
    }

    internal static double Norm(ReadOnlySpan<double> a) => Math.Sqrt(Dot(a, a));
}
