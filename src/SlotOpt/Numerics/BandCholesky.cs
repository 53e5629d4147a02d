using System.Runtime.CompilerServices;

namespace SlotOpt.Numerics;

/// <summary>
/// Cholesky factorisation A = L L^T of a symmetric positive definite band matrix of half-bandwidth
/// w (A_ij = 0 for |i - j| > w), L stored by rows in its band (G. H. Golub, C. F. Van Loan, "Matrix
/// Computations", 4th ed., 2013, Algorithm 4.3.5): n w^2 operations instead of n^3 / 3.
/// For the coarsest level of the structured multigrid, numbered with its shorter side fastest. Both loops are compiled optimised on
/// their first call (one factorisation a plate, one solve a cycle: too few calls for tiered compilation to reach them before a
/// plate's solve is over).
/// </summary>
internal sealed class BandCholesky
{
    private readonly int _n, _w;
    private readonly double[] _l;   // row i, column i - w + k at _l[i * (w + 1) + k], k = 0..w

    /// <summary>entry(i, j) for j in [i - w, i] gives A_ij.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public BandCholesky(int n, int halfBandwidth, Func<int, int, double> entry)
    {
        _n = n; _w = halfBandwidth;
        int s = _w + 1;
        _l = new double[n * s];
        for (int i = 0; i < n; i++)
            for (int j = Math.Max(0, i - _w); j <= i; j++)
            {
                double v = entry(i, j);
                for (int k = Math.Max(0, i - _w); k < j; k++) v -= At(i, k) * At(j, k);
                if (j < i) _l[i * s + j - i + _w] = v / At(j, j);
                else
                {
                    if (!(v > 0)) throw new NumericalFailureException($"coarse sheet operator is not positive definite (pivot {v:E3} at {i} of {n})");
                    _l[i * s + _w] = Math.Sqrt(v);
                }
            }
    }

    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private double At(int i, int j) => j < i - _w ? 0 : _l[i * (_w + 1) + j - i + _w];

    public long Bytes => 8L * _l.Length;

    /// <summary>Solves A x = b in place (x holds b on entry).</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public void Solve(Span<double> x)
    {
        int s = _w + 1;
        for (int i = 0; i < _n; i++)
        {
            double v = x[i];
            for (int k = Math.Max(0, i - _w); k < i; k++) v -= _l[i * s + k - i + _w] * x[k];
            x[i] = v / _l[i * s + _w];
        }
        for (int i = _n - 1; i >= 0; i--)
        {
            double v = x[i] / _l[i * s + _w];
            x[i] = v;
            for (int k = Math.Max(0, i - _w); k < i; k++) x[k] -= _l[i * s + k - i + _w] * v;
        }
    }
}
