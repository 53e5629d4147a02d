namespace SlotOpt.Numerics;

/// <summary>Cholesky factorisation A = L L^T of a small dense SPD matrix, for the coarsest multigrid level.</summary>
internal sealed class DenseCholesky
{
    private readonly int _n;
    private readonly double[] _l;

    public DenseCholesky(CsrMatrix a)
    {
        _n = a.Rows;
        _l = new double[_n * _n];
        for (int i = 0; i < _n; i++)
            for (int k = a.RowStart[i]; k < a.RowStart[i + 1]; k++)
                _l[i * _n + a.ColumnIndex[k]] = a.Value[k];
        for (int j = 0; j < _n; j++)
        {
            double d = _l[j * _n + j];
            for (int k = 0; k < j; k++) d -= _l[j * _n + k] * _l[j * _n + k];
            if (!(d > 0)) throw new NumericalFailureException($"coarse sheet operator is not positive definite (pivot {d:E3} at {j} of {_n})");
            double ljj = Math.Sqrt(d);
            _l[j * _n + j] = ljj;
            for (int i = j + 1; i < _n; i++)
            {
                double s = _l[i * _n + j];
                for (int k = 0; k < j; k++) s -= _l[i * _n + k] * _l[j * _n + k];
                _l[i * _n + j] = s / ljj;
            }
        }
    }

    public long Bytes => 8L * _l.Length;

    public void Solve(ReadOnlySpan<double> b, Span<double> x)
    {
        for (int i = 0; i < _n; i++)
        {
            double s = b[i];
            for (int k = 0; k < i; k++) s -= _l[i * _n + k] * x[k];
            x[i] = s / _l[i * _n + i];
        }
        for (int i = _n - 1; i >= 0; i--)
        {
            double s = x[i];
            for (int k = i + 1; k < _n; k++) s -= _l[k * _n + i] * x[k];
            x[i] = s / _l[i * _n + i];
        }
    }
}
