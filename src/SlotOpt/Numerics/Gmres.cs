namespace SlotOpt.Numerics;

/// <summary>y = Op x for real vectors.</summary>
public delegate void RealMap(double[] x, double[] y);

/// <summary>
/// Restarted GMRES(m) with right preconditioning for a real, non-symmetric A x = b (Y. Saad, "Iterative
/// Methods for Sparse Linear Systems", 2nd ed., SIAM, 2003, Algorithm 9.5; modified Gram-Schmidt Arnoldi,
/// Givens rotations): the real twin of <see cref="ComplexGmres"/>, with the same stopping rule (the true
/// relative residual |b - A x| / |b| at most criterion.RelativeResidual, confirmed at each restart and at
/// the end), failing after criterion.MaxIterations inner iterations or on NaN/Inf. x holds the warm start
/// on entry. Krylov vectors are allocated as the iteration reaches them. The preconditioned vectors
/// z_j = M^-1 v_j are kept, so the update is x += Z y without a further application of M^-1 (the storage of
/// flexible GMRES: Y. Saad, "A flexible inner-outer preconditioned GMRES algorithm", SIAM J. Sci. Comput. 14 (1993)
/// 461-469; with a fixed M it is the same iterate as x += M^-1 (V y)).
/// </summary>
public static class Gmres
{
    public static bool TrySolve(RealMap a, RealMap preconditioner, double[] b, double[] x, ConvergenceCriterion criterion, int restart, out SolveReport report) =>
        TrySolve(a, preconditioner, b, x, null, false, criterion, restart, out report);

    /// <param name="image">null, or a buffer for A x: when <paramref name="imageHoldsGuess"/> it holds A x of the warm start on entry
    /// (the image a previous solve returned for this x, saving the first application of A); on success it holds A x of the answer
    /// (the one the final true residual was computed with)</param>
    public static bool TrySolve(RealMap a, RealMap preconditioner, double[] b, double[] x, double[]? image, bool imageHoldsGuess,
        ConvergenceCriterion criterion, int restart, out SolveReport report)
    {
        if (image is not null && image.Length != b.Length) throw new ArgumentException($"the image has {image.Length} values for {b.Length} unknowns", nameof(image));
        if (imageHoldsGuess && image is null) throw new ArgumentException("an image of the guess needs the image buffer", nameof(imageHoldsGuess));
        int n = b.Length;
        double normB = Norm(b);
        if (normB == 0) { Array.Clear(x); if (image is not null) Array.Clear(image); report = new SolveReport(SolveStatus.Converged, 0, 0); return true; }
        if (!double.IsFinite(normB)) { report = new SolveReport(SolveStatus.NonFinite, 0, double.NaN); return false; }
        restart = Math.Max(1, restart);
        double target = criterion.RelativeResidual * normB;
        var v = new double[restart + 1][];
        v[0] = new double[n];
        var h = new double[restart + 1, restart];
        var cs = new double[restart];
        var sn = new double[restart];
        var g = new double[restart + 1];
        var z = new double[restart][];    // z_j = M^-1 v_j, allocated as the iteration reaches them
        var w = new double[n];
        int iterations = 0;
        bool known = imageHoldsGuess;
        while (true)
        {
            if (known) Array.Copy(image!, w, n); else a(x, w);
            known = false;
            for (int i = 0; i < n; i++) v[0][i] = b[i] - w[i];
            double beta = Norm(v[0]);
            if (!double.IsFinite(beta)) { report = new SolveReport(SolveStatus.NonFinite, iterations, double.NaN); return false; }
            if (beta <= target)
            {
                if (image is not null) Array.Copy(w, image, n);
                report = new SolveReport(SolveStatus.Converged, iterations, beta / normB);
                return true;
            }
            if (iterations >= criterion.MaxIterations)
            {
                report = new SolveReport(SolveStatus.IterationLimit, iterations, beta / normB);
                return false;
            }
            Scale(v[0], 1 / beta);
            Array.Clear(g);
            g[0] = beta;
            int j = 0;
            for (; j < restart && iterations < criterion.MaxIterations; j++)
            {
                criterion.ThrowIfCancelled();
                z[j] ??= new double[n];
                preconditioner(v[j], z[j]);
                a(z[j], w);
                for (int i = 0; i <= j; i++)
                {
                    double hij = Dot(v[i], w);
                    h[i, j] = hij;
                    Axpy(-hij, v[i], w);
                }
                double hnext = Norm(w);
                if (!double.IsFinite(hnext)) { report = new SolveReport(SolveStatus.NonFinite, iterations, double.NaN); return false; }
                h[j + 1, j] = hnext;
                v[j + 1] ??= new double[n];
                if (hnext > 0) { Array.Copy(w, v[j + 1], n); Scale(v[j + 1], 1 / hnext); }
                for (int i = 0; i < j; i++) Rotate(ref h[i, j], ref h[i + 1, j], cs[i], sn[i]);
                (cs[j], sn[j]) = Givens(h[j, j], h[j + 1, j]);
                Rotate(ref h[j, j], ref h[j + 1, j], cs[j], sn[j]);
                Rotate(ref g[j], ref g[j + 1], cs[j], sn[j]);
                iterations++;
                if (Math.Abs(g[j + 1]) <= target || hnext == 0) { j++; break; }
            }
            // y = H^-1 g (upper triangular, j x j), x += Z y (= M^-1 (V y))
            var y = new double[j];
            for (int i = j - 1; i >= 0; i--)
            {
                double s = g[i];
                for (int k = i + 1; k < j; k++) s -= h[i, k] * y[k];
                y[i] = s / h[i, i];
            }
            for (int i = 0; i < j; i++) Axpy(y[i], z[i], x);
        }
    }

    public static SolveReport Solve(RealMap a, RealMap preconditioner, double[] b, double[] x, ConvergenceCriterion criterion, int restart = ComplexGmres.DefaultRestart) =>
        TrySolve(a, preconditioner, b, x, criterion, restart, out var report) ? report
            : throw new NumericalFailureException($"GMRES: {report.Reason} (relative residual {report.RelativeResidual:E2} after {report.Iterations} iterations)");

    /// <summary>Givens rotation zeroing b in (a, b): c = a / r, s = b / r, r = sqrt(a^2 + b^2).</summary>
    private static (double C, double S) Givens(double a, double b)
    {
        double r = Math.Sqrt(a * a + b * b);
        return r == 0 ? (1, 0) : (a / r, b / r);
    }

    /// <summary>(a, b) := (c a + s b, -s a + c b).</summary>
    private static void Rotate(ref double a, ref double b, double c, double s)
    {
        double t = c * a + s * b;
        b = -s * a + c * b;
        a = t;
    }

    private static double Dot(double[] x, double[] y)
    {
        double s = 0;
        for (int i = 0; i < x.Length; i++) s += x[i] * y[i];
        return s;
    }

    private static double Norm(double[] x) => Math.Sqrt(Dot(x, x));

    private static void Scale(double[] x, double f)
    {
        for (int i = 0; i < x.Length; i++) x[i] *= f;
    }

    private static void Axpy(double alpha, double[] x, double[] y)
    {
        for (int i = 0; i < x.Length; i++) y[i] += alpha * x[i];
    }
}
