using System.Numerics;
using System.Runtime.CompilerServices;
using System.Runtime.InteropServices;
using System.Runtime.Intrinsics;

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

    // The vector kernels below read a Complex[] as its interleaved doubles (re0, im0, re1, im1, ...), two complex numbers to a
    // 256-bit vector; SwapPairs turns (re, im) into (im, re) within each number. Vector256 is correct on any machine and runs as
    // AVX instructions where the processor has them.

    /// <summary>(a, b, c, d) -> (b, a, d, c): each complex number's parts exchanged.</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static Vector256<double> SwapPairs(Vector256<double> v) => Vector256.Shuffle(v, Vector256.Create(1L, 0L, 3L, 2L));

    /// <summary>x^H y.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    internal static Complex Dot(Complex[] x, Complex[] y)
    {
        var xd = MemoryMarshal.Cast<Complex, double>(x.AsSpan());
        var yd = MemoryMarshal.Cast<Complex, double>(y.AsSpan());
        // re: sum of x_d y_d over all doubles; im: sum of x_re y_im - x_im y_re, i.e. x_d (swapped y)_d with signs (+, -)
        var real = Vector256<double>.Zero; var imag = Vector256<double>.Zero;
        var sign = Vector256.Create(1.0, -1.0, 1.0, -1.0);
        int i = 0;
        for (; i + 4 <= xd.Length; i += 4)
        {
            var a = Vector256.Create(xd.Slice(i, 4)); var b = Vector256.Create(yd.Slice(i, 4));
            real += a * b;
            imag += a * SwapPairs(b) * sign;
        }
        double re = Vector256.Sum(real), im = Vector256.Sum(imag);
        for (int k = i / 2; k < x.Length; k++)
        {
            re += x[k].Real * y[k].Real + x[k].Imaginary * y[k].Imaginary;
            im += x[k].Real * y[k].Imaginary - x[k].Imaginary * y[k].Real;
        }
        return new Complex(re, im);
    }

    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    internal static double Norm(Complex[] x)
    {
        var xd = MemoryMarshal.Cast<Complex, double>(x.AsSpan());
        var sum = Vector256<double>.Zero;
        int i = 0;
        for (; i + 4 <= xd.Length; i += 4) { var a = Vector256.Create(xd.Slice(i, 4)); sum += a * a; }
        double s = Vector256.Sum(sum);
        for (; i < xd.Length; i++) s += xd[i] * xd[i];
        return Math.Sqrt(s);
    }

    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static void Scale(Complex[] x, double f)
    {
        var xd = MemoryMarshal.Cast<Complex, double>(x.AsSpan());
        var factor = Vector256.Create(f);
        int i = 0;
        for (; i + 4 <= xd.Length; i += 4) (Vector256.Create(xd.Slice(i, 4)) * factor).CopyTo(xd.Slice(i, 4));
        for (; i < xd.Length; i++) xd[i] *= f;
    }

    /// <summary>y += alpha x: (re, im) += alpha_re (x_re, x_im) + alpha_im (-x_im, x_re).</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static void Axpy(Complex alpha, Complex[] x, Complex[] y)
    {
        var xd = MemoryMarshal.Cast<Complex, double>(x.AsSpan());
        var yd = MemoryMarshal.Cast<Complex, double>(y.AsSpan());
        var ar = Vector256.Create(alpha.Real);
        var ai = Vector256.Create(-alpha.Imaginary, alpha.Imaginary, -alpha.Imaginary, alpha.Imaginary);
        int i = 0;
        for (; i + 4 <= xd.Length; i += 4)
        {
            var a = Vector256.Create(xd.Slice(i, 4));
            (Vector256.Create(yd.Slice(i, 4)) + ar * a + ai * SwapPairs(a)).CopyTo(yd.Slice(i, 4));
        }
        for (int k = i / 2; k < x.Length; k++) y[k] += alpha * x[k];
    }
}
