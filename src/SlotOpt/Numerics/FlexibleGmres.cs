using System.Numerics;

namespace SlotOpt.Numerics;

/// <summary>
/// Restarted GMRES(m) with right preconditioning for a non-symmetric (real) or non-Hermitian (complex) A x = b
/// (Y. Saad, "Iterative Methods for Sparse Linear Systems", 2nd ed., SIAM, 2003, Algorithm 9.5; modified Gram-Schmidt
/// Arnoldi, Givens rotations, complex ones in the complex field), behind <see cref="Gmres"/> and <see cref="ComplexGmres"/>.
/// x holds the warm start on entry. Stops when the true relative residual |b - A x| / |b| is at most
/// criterion.RelativeResidual (the Arnoldi estimate is confirmed by a true residual at each restart and at the end), fails
/// after criterion.MaxIterations inner iterations or on NaN/Inf. The preconditioned vectors z_j = M^-1 v_j are kept and the
/// update is x += Z y (flexible GMRES: Y. Saad, "A flexible inner-outer preconditioned GMRES algorithm", SIAM J. Sci. Comput.
/// 14 (1993) 461-469; with an exact fixed M the same iterate as x += M^-1 (V y)), so the Arnoldi relation A Z = V H holds for
/// the vectors actually used even when M^-1 varies or is applied in single precision: the true residual then follows the
/// Arnoldi estimate instead of stalling at the preconditioner's rounding. The basis and the preconditioned vectors (at most
/// 2 m + 1 vectors) are allocated as the iteration reaches them. A zero start takes r0 = b without applying A (exact); every
/// later residual (at a restart and at the end) is computed with A, or for the first one taken from a given image A x.
/// </summary>
internal static class FlexibleGmres
{
    /// <param name="image">null, or a buffer for A x: when <paramref name="imageHoldsGuess"/> it holds A x of the warm start on entry
    /// (the image a previous solve returned for this x, saving the first application of A); on success it holds A x of the answer
    /// (the one the final true residual was computed with)</param>
    public static bool TrySolve<T, TField>(Action<T[], T[]> a, Action<T[], T[]> preconditioner, T[] b, T[] x, T[]? image, bool imageHoldsGuess,
        ConvergenceCriterion criterion, int restart, out SolveReport report)
        where T : INumberBase<T>
        where TField : IKrylovField<T>
    {
        if (image is not null && image.Length != b.Length) throw new ArgumentException($"the image has {image.Length} values for {b.Length} unknowns", nameof(image));
        if (imageHoldsGuess && image is null) throw new ArgumentException("an image of the guess needs the image buffer", nameof(imageHoldsGuess));
        int n = b.Length;
        double normB = TField.Norm(b);
        if (normB == 0) { Array.Clear(x); if (image is not null) Array.Clear(image); report = new SolveReport(SolveStatus.Converged, 0, 0); return true; }
        if (!double.IsFinite(normB)) { report = new SolveReport(SolveStatus.NonFinite, 0, double.NaN); return false; }
        restart = Math.Max(1, restart);
        double target = criterion.RelativeResidual * normB;
        var v = new T[restart + 1][];
        v[0] = new T[n];
        var h = new T[restart + 1, restart];
        var cs = new double[restart];
        var sn = new T[restart];
        var g = new T[restart + 1];
        var z = new T[restart][];    // z_j = M^-1 v_j, allocated as the iteration reaches them
        var w = new T[n];
        int iterations = 0;
        bool known = imageHoldsGuess;
        bool zeroStart = !known && Array.TrueForAll(x, e => e == T.Zero);
        while (true)
        {
            if (known) Array.Copy(image!, w, n);
            else if (zeroStart) Array.Clear(w);   // A 0 = 0: no product
            else a(x, w);
            known = false; zeroStart = false;
            for (int i = 0; i < n; i++) v[0][i] = b[i] - w[i];
            double beta = TField.Norm(v[0]);
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
            TField.Scale(v[0], 1 / beta);
            Array.Clear(g);
            g[0] = Real(beta);
            int j = 0;
            for (; j < restart && iterations < criterion.MaxIterations; j++)
            {
                criterion.ThrowIfCancelled();
                z[j] ??= new T[n];
                preconditioner(v[j], z[j]);
                a(z[j], w);
                for (int i = 0; i <= j; i++)
                {
                    T hij = TField.Dot(v[i], w);
                    h[i, j] = hij;
                    TField.Axpy(-hij, v[i], w);
                }
                double hnext = TField.Norm(w);
                if (!double.IsFinite(hnext)) { report = new SolveReport(SolveStatus.NonFinite, iterations, double.NaN); return false; }
                h[j + 1, j] = Real(hnext);
                v[j + 1] ??= new T[n];
                if (hnext > 0) { Array.Copy(w, v[j + 1], n); TField.Scale(v[j + 1], 1 / hnext); }
                for (int i = 0; i < j; i++) Rotate(ref h[i, j], ref h[i + 1, j], cs[i], sn[i]);
                (cs[j], sn[j]) = Givens(h[j, j], h[j + 1, j]);
                Rotate(ref h[j, j], ref h[j + 1, j], cs[j], sn[j]);
                Rotate(ref g[j], ref g[j + 1], cs[j], sn[j]);
                iterations++;
                if (TField.Modulus(g[j + 1]) <= target || hnext == 0) { j++; break; }
            }
            // y = H^-1 g (upper triangular, j x j), x += Z y
            var y = new T[j];
            for (int i = j - 1; i >= 0; i--)
            {
                T s = g[i];
                for (int k = i + 1; k < j; k++) s -= h[i, k] * y[k];
                y[i] = s / h[i, i];
            }
            for (int i = 0; i < j; i++) TField.Axpy(y[i], z[i], x);
        }

        static T Real(double value) => T.CreateChecked(value);

        // Givens rotation zeroing b in (a, b): c = |a|/r, s = (a/|a|) conj(b)/r, r = sqrt(|a|^2 + |b|^2) (for real a >= 0 the
        // familiar c = a/r, s = b/r)
        static (double C, T S) Givens(T a, T b)
        {
            double aa = TField.Modulus(a), bb = TField.Modulus(b), r = Math.Sqrt(aa * aa + bb * bb);
            if (r == 0) return (1, T.Zero);
            if (aa == 0) return (0, TField.Conjugate(b) / Real(r));
            return (aa / r, a / Real(aa) * TField.Conjugate(b) / Real(r));
        }

        // (a, b) := (c a + s b, -conj(s) a + c b)
        static void Rotate(ref T a, ref T b, double c, T s)
        {
            T t = Real(c) * a + s * b;
            b = -TField.Conjugate(s) * a + Real(c) * b;
            a = t;
        }
    }
}
