using System.Numerics;
using System.Runtime.CompilerServices;

namespace SlotOpt.Numerics;

/// <summary>y = Op x for complex vectors.</summary>
public delegate void ComplexMap(Complex[] x, Complex[] y);

/// <summary>
/// Restarted GMRES(m) with right preconditioning for a complex, non-Hermitian A x = b
/// (Y. Saad, "Iterative Methods for Sparse Linear Systems", 2nd ed., SIAM, 2003, Algorithm 9.5;
/// modified Gram-Schmidt Arnoldi, complex Givens rotations). x holds the warm start on entry.
/// Stops when the true relative residual |b - A x| / |b| is at most criterion.RelativeResidual
/// (the Arnoldi estimate is confirmed by a true residual at each restart and at the end), fails
/// after criterion.MaxIterations inner iterations or on NaN/Inf. The preconditioned vectors z_j = M^-1 v_j are
/// kept and the update is x += Z y (flexible GMRES: Y. Saad, "A flexible inner-outer preconditioned GMRES algorithm",
/// SIAM J. Sci. Comput. 14 (1993) 461-469; with an exact fixed M the same iterate as x += M^-1 (V y)), so the Arnoldi
/// relation A Z = V H holds for the vectors actually used even when M^-1 is applied in single precision: the true
/// residual then follows the Arnoldi estimate instead of stalling at the preconditioner's rounding. The basis and the
/// preconditioned vectors (at most 2 m + 1 vectors) are allocated as the iteration reaches them. A zero start takes r0 = b
/// without applying A (exact); every later residual (at a restart and at the end) is computed with A.
/// </summary>
public static class ComplexGmres
{
    public const int DefaultRestart = 60;

    public static bool TrySolve(ComplexMap a, ComplexMap preconditioner, Complex[] b, Complex[] x, ConvergenceCriterion criterion, int restart, out SolveReport report)
    {
        int n = b.Length;
        double normB = Norm(b);
        if (normB == 0) { Array.Clear(x); report = new SolveReport(SolveStatus.Converged, 0, 0); return true; }
        if (!double.IsFinite(normB)) { report = new SolveReport(SolveStatus.NonFinite, 0, double.NaN); return false; }
        restart = Math.Max(1, restart);
        double target = criterion.RelativeResidual * normB;
        var v = new Complex[restart + 1][];   // allocated as the iteration reaches them
        v[0] = new Complex[n];
        var h = new Complex[restart + 1, restart];
        var cs = new double[restart];
        var sn = new Complex[restart];
        var g = new Complex[restart + 1];
        var z = new Complex[restart][];    // z_j = M^-1 v_j, allocated as the iteration reaches them
        var w = new Complex[n];
        int iterations = 0;
        bool zeroStart = Array.TrueForAll(x, e => e == Complex.Zero);
        while (true)
        {
            if (zeroStart) { Array.Copy(b, v[0], n); zeroStart = false; }   // r0 = b - A 0: no product
            else Residual(a, b, x, v[0], w);
            double beta = Norm(v[0]);
            if (!double.IsFinite(beta)) { report = new SolveReport(SolveStatus.NonFinite, iterations, double.NaN); return false; }
            if (beta <= target) { report = new SolveReport(SolveStatus.Converged, iterations, beta / normB); return true; }
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
                z[j] ??= new Complex[n];
                preconditioner(v[j], z[j]);
                a(z[j], w);
                for (int i = 0; i <= j; i++)
                {
                    Complex hij = Dot(v[i], w);
                    h[i, j] = hij;
                    Axpy(-hij, v[i], w);
                }
                double hnext = Norm(w);
                if (!double.IsFinite(hnext)) { report = new SolveReport(SolveStatus.NonFinite, iterations, double.NaN); return false; }
                h[j + 1, j] = hnext;
                v[j + 1] ??= new Complex[n];
                if (hnext > 0) { Array.Copy(w, v[j + 1], n); Scale(v[j + 1], 1 / hnext); }
                for (int i = 0; i < j; i++) Rotate(ref h[i, j], ref h[i + 1, j], cs[i], sn[i]);
                (cs[j], sn[j]) = Givens(h[j, j], h[j + 1, j]);
                Rotate(ref h[j, j], ref h[j + 1, j], cs[j], sn[j]);
                Rotate(ref g[j], ref g[j + 1], cs[j], sn[j]);
                iterations++;
                if (g[j + 1].Magnitude <= target || hnext == 0) { j++; break; }
            }
            // y = H^-1 g (upper triangular, j x j), x += Z y
            var y = new Complex[j];
            for (int i = j - 1; i >= 0; i--)
            {
                Complex s = g[i];
                for (int k = i + 1; k < j; k++) s -= h[i, k] * y[k];
                y[i] = s / h[i, i];
            }
            for (int i = 0; i < j; i++) Axpy(y[i], z[i], x);
        }
    }

    public static SolveReport Solve(ComplexMap a, ComplexMap preconditioner, Complex[] b, Complex[] x, ConvergenceCriterion criterion, int restart = DefaultRestart) =>
        TrySolve(a, preconditioner, b, x, criterion, restart, out var report) ? report
            : throw new NumericalFailureException($"coupled sheet solver: {report.Reason} (relative residual {report.RelativeResidual:E2} after {report.Iterations} iterations)");

    /// <summary>Complex Givens rotation zeroing b in (a, b): c = |a|/r, s = (a/|a|) conj(b)/r, r = sqrt(|a|^2 + |b|^2).</summary>
    private static (double C, Complex S) Givens(Complex a, Complex b)
    {
        double aa = a.Magnitude, r = Math.Sqrt(aa * aa + b.Magnitude * b.Magnitude);
        if (r == 0) return (1, Complex.Zero);
        if (aa == 0) return (0, Complex.Conjugate(b) / r);
        return (aa / r, a / aa * Complex.Conjugate(b) / r);
    }

    /// <summary>(a, b) := (c a + s b, -conj(s) a + c b).</summary>
    private static void Rotate(ref Complex a, ref Complex b, double c, Complex s)
    {
        Complex t = c * a + s * b;
        b = -Complex.Conjugate(s) * a + c * b;
        a = t;
    }

    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static void Residual(ComplexMap a, Complex[] b, Complex[] x, Complex[] r, Complex[] work)
    {
        a(x, work);
        for (int i = 0; i < b.Length; i++) r[i] = b[i] - work[i];
    }

    /// <summary>x^H y.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    internal static Complex Dot(Complex[] x, Complex[] y)
    {
        double re = 0, im = 0;
        for (int i = 0; i < x.Length; i++)
        {
            re += x[i].Real * y[i].Real + x[i].Imaginary * y[i].Imaginary;
            im += x[i].Real * y[i].Imaginary - x[i].Imaginary * y[i].Real;
        }
        return new Complex(re, im);
    }

    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    internal static double Norm(Complex[] x)
    {
        double s = 0;
        for (int i = 0; i < x.Length; i++) s += x[i].Real * x[i].Real + x[i].Imaginary * x[i].Imaginary;
        return Math.Sqrt(s);
    }

    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static void Scale(Complex[] x, double f)
    {
        for (int i = 0; i < x.Length; i++) x[i] *= f;
    }

    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static void Axpy(Complex alpha, Complex[] x, Complex[] y)
    {
        for (int i = 0; i < x.Length; i++) y[i] += alpha * x[i];
    }
}
