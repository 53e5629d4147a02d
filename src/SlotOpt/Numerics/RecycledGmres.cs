namespace SlotOpt.Numerics;

/// <summary>
/// GMRES for a sequence of systems A x = b_k with one real non-symmetric operator A and one preconditioner M, keeping what the earlier
/// solves learnt: the search space of Krylov subspace recycling (GCRO form: E. de Sturler, "Truncation strategies for optimal Krylov
/// subspace methods", SIAM J. Numer. Anal. 36 (1999) 864-889; M. L. Parks, E. de Sturler, G. Mackey, D. D. Johnson and S. Maiti,
/// "Recycling Krylov subspaces for sequences of linear systems", SIAM J. Sci. Comput. 28 (2006) 1651-1674, section 2). It keeps pairs
/// (U, C) with A U = C and C^T C = I. Each solve first projects onto them (x += U C^T r, r -= C C^T r: the minimal-residual start in
/// span U), then runs right-preconditioned GMRES on (I - C C^T) A M^-1 (every new direction A z_j is orthogonalised against C too), so
/// the Arnoldi relation is A Z = C B + V H with B = C^T A Z, and the update x += Z y - U B y minimises |b - A x| over span U + span Z.
/// What is kept: each GMRES cycle's own space, U_new = (Z - U B) R^-1 and C_new = V Q with H = Q R (the Givens rotations' QR, so
/// A U_new = C_new, orthonormal and orthogonal to the older C). Once more than <see cref="Capacity"/> vectors are kept the oldest
/// cycles' are dropped (a subset of an orthonormal set stays orthonormal); Parks et al. keep harmonic Ritz vectors instead, not done here.
/// Stopping as <see cref="Gmres"/>: the true relative residual |b - A x| / |b| at most criterion.RelativeResidual, confirmed at each restart
/// and at the end, so a kept space that has drifted from A U = C by rounding costs iterations, never accuracy; failing after
/// criterion.MaxIterations inner iterations or on NaN/Inf. Memory: 2 Capacity + 2 restart + 1 vectors of the unknowns at most
/// (Capacity = restart = 60: 241 real vectors, below the complex GMRES(60) that Design's memory model bounds each own-field solve by).
/// Not thread-safe: one instance per operator and thread; its answers depend only on the sequence of right-hand sides and starts.
/// </summary>
public sealed class RecycledGmres
{
    /// <summary>Kept vectors (U and C pairs) by default: six moving-source solves of ten iterations.</summary>
    public const int DefaultCapacity = 60;

    private readonly RealMap _a;
    private readonly RealMap _preconditioner;
    private readonly int _n;
    private readonly int _restart;
    private readonly List<double[]> _u = [];
    private readonly List<double[]> _c = [];
    private readonly Queue<int> _cycleSizes = new();   // vectors each kept cycle added, oldest first

    public RecycledGmres(RealMap a, RealMap preconditioner, int unknowns, int capacity = DefaultCapacity, int restart = ComplexGmres.DefaultRestart)
    {
        if (unknowns < 1) throw new ArgumentOutOfRangeException(nameof(unknowns), unknowns, "a system needs at least one unknown");
        if (capacity < 0) throw new ArgumentOutOfRangeException(nameof(capacity), capacity, "the kept space cannot be negative");
        _a = a;
        _preconditioner = preconditioner;
        _n = unknowns;
        Capacity = capacity;
        _restart = Math.Max(1, restart);
    }

    /// <summary>Most vector pairs kept between solves.</summary>
    public int Capacity { get; }

    /// <summary>Vector pairs kept now.</summary>
    public int Kept => _u.Count;

    /// <summary>Solves A x = b from the start in x, then keeps this solve's search space for the next.</summary>
    /// <param name="image">null, or a buffer for A x as in <see cref="Gmres.TrySolve(RealMap, RealMap, double[], double[], double[], bool, ConvergenceCriterion, int, out SolveReport)"/>:
    /// when <paramref name="imageHoldsGuess"/> it holds A x of the start on entry; on success it holds A x of the answer</param>
    public bool TrySolve(double[] b, double[] x, double[]? image, bool imageHoldsGuess, ConvergenceCriterion criterion, out SolveReport report)
    {
        if (b.Length != _n || x.Length != _n) throw new ArgumentException($"the system has {_n} unknowns, the right-hand side {b.Length} and the start {x.Length}");
        if (image is not null && image.Length != _n) throw new ArgumentException($"the image has {image.Length} values for {_n} unknowns", nameof(image));
        if (imageHoldsGuess && image is null) throw new ArgumentException("an image of the guess needs the image buffer", nameof(imageHoldsGuess));
        int n = _n, m = _restart;
        double normB = Norm(b);
        if (normB == 0) { Array.Clear(x); if (image is not null) Array.Clear(image); report = new SolveReport(SolveStatus.Converged, 0, 0); return true; }
        if (!double.IsFinite(normB)) { report = new SolveReport(SolveStatus.NonFinite, 0, double.NaN); return false; }
        double target = criterion.RelativeResidual * normB;
        var v = new double[m + 1][];
        v[0] = new double[n];
        var z = new double[m][];
        var h = new double[m + 1, m];
        var bk = new double[Capacity, m];   // B = C^T A Z of this cycle (rows: the kept vectors at the cycle's start)
        var cs = new double[m];
        var sn = new double[m];
        var g = new double[m + 1];
        var w = new double[n];
        int iterations = 0;
        bool known = imageHoldsGuess, projectedOnly = false;
        while (true)
        {
            if (known) Array.Copy(image!, w, n); else _a(x, w);
            known = false;
            v[0] ??= new double[n];      // a kept cycle took the previous arrays
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
            // the minimal-residual start in span U: x += U C^T r, r -= C C^T r (modified Gram-Schmidt against the orthonormal C)
            int k = _u.Count;
            for (int i = 0; i < k; i++)
            {
                double ci = Dot(_c[i], v[0]);
                Axpy(-ci, _c[i], v[0]);
                Axpy(ci, _u[i], x);
            }
            beta = Norm(v[0]);
            if (k > 0 && beta <= target)
            {
                // the projection alone meets the target: confirm it on the true residual; if that already failed once (the kept space has
                // drifted from A U = C by rounding), iterate on the small projected residual, or forget the kept space if it is exactly zero
                bool confirmAgain = !projectedOnly;
                projectedOnly = true;
                if (confirmAgain) continue;
                if (beta == 0) { Forget(); continue; }
            }
            Scale(v[0], 1 / beta);
            Array.Clear(g);
            g[0] = beta;
            int j = 0;
            for (; j < m && iterations < criterion.MaxIterations; j++)
            {
                criterion.ThrowIfCancelled();
                z[j] ??= new double[n];
                _preconditioner(v[j], z[j]);
                _a(z[j], w);
                for (int i = 0; i < k; i++)
                {
                    double bij = Dot(_c[i], w);
                    bk[i, j] = bij;
                    Axpy(-bij, _c[i], w);
                }
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
                else Array.Clear(v[j + 1]);
                for (int i = 0; i < j; i++) Rotate(ref h[i, j], ref h[i + 1, j], cs[i], sn[i]);
                (cs[j], sn[j]) = Givens(h[j, j], h[j + 1, j]);
                Rotate(ref h[j, j], ref h[j + 1, j], cs[j], sn[j]);
                Rotate(ref g[j], ref g[j + 1], cs[j], sn[j]);
                iterations++;
                if (Math.Abs(g[j + 1]) <= target || hnext == 0) { j++; break; }
            }
            // y = R^-1 g (the rotated H is upper triangular, j x j); x += Z y - U (B y)
            var y = new double[j];
            for (int i = j - 1; i >= 0; i--)
            {
                double s = g[i];
                for (int l = i + 1; l < j; l++) s -= h[i, l] * y[l];
                y[i] = s / h[i, i];
            }
            for (int i = 0; i < j; i++) Axpy(y[i], z[i], x);
            for (int i = 0; i < k; i++)
            {
                double s = 0;
                for (int l = 0; l < j; l++) s += bk[i, l] * y[l];
                Axpy(-s, _u[i], x);
            }
            Keep(v, z, h, bk, cs, sn, k, j);
        }
    }

    /// <summary>
    /// Keeps this cycle's space: with Omega the cycle's rotations, Omega H = [R; 0], so A (Z - U B) = V H = (V Omega^T)[R; 0]:
    /// C_new = the first j columns of V Omega^T (orthonormal, orthogonal to C) and U_new = (Z - U B) R^-1. Overwrites V and Z.
    /// </summary>
    private void Keep(double[][] v, double[][] z, double[,] h, double[,] bk, double[] cs, double[] sn, int k, int j)
    {
        if (Capacity == 0 || j == 0) return;
        double largest = 0;
        for (int i = 0; i < j; i++) largest = Math.Max(largest, Math.Abs(h[i, i]));
        for (int i = 0; i < j; i++)
            if (!(Math.Abs(h[i, i]) > 1e-12 * largest)) return;   // a near-singular R: keep nothing from this cycle
        int n = _n;
        // V Omega^T: the rotations applied to the columns in order (col_i, col_i+1) := (c col_i + s col_i+1, -s col_i + c col_i+1)
        for (int i = 0; i < j; i++)
        {
            double c = cs[i], s = sn[i];
            var a = v[i];
            var bcol = v[i + 1];
            for (int l = 0; l < n; l++)
            {
                double t = c * a[l] + s * bcol[l];
                bcol[l] = -s * a[l] + c * bcol[l];
                a[l] = t;
            }
        }
        // Z - U B, then the back substitution (Z - U B) R^-1 column by column
        for (int i = 0; i < k; i++)
            for (int l = 0; l < j; l++) Axpy(-bk[i, l], _u[i], z[l]);
        for (int col = 0; col < j; col++)
        {
            for (int i = 0; i < col; i++) Axpy(-h[i, col], z[i], z[col]);
            Scale(z[col], 1 / h[col, col]);
        }
        int keep = Math.Min(j, Capacity);
        while (_u.Count + keep > Capacity && _cycleSizes.Count > 0)
        {
            int drop = _cycleSizes.Dequeue();
            _u.RemoveRange(0, drop);
            _c.RemoveRange(0, drop);
        }
        for (int i = 0; i < keep; i++)
        {
            _u.Add(z[i]);
            _c.Add(v[i]);
            z[i] = null!;     // now the kept space's: the next cycle allocates its own
            v[i] = null!;
        }
        _cycleSizes.Enqueue(keep);
    }

    /// <summary>Drops every kept vector.</summary>
    public void Forget()
    {
        _u.Clear();
        _c.Clear();
        _cycleSizes.Clear();
    }

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
