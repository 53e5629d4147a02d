namespace SlotOpt.Numerics;

/// <summary>
/// Compressed sparse row matrix on raw arrays: the storage of the sheet operator and of the thermal operator,
/// with the transfer operators and Galerkin products of the algebraic multigrid (<see cref="Plates.Grid.MultigridHierarchy"/>).
/// Column indices are sorted within each row.
/// </summary>
public sealed class CsrMatrix : ILinearOperator
{
    public int Rows { get; }
    public int Columns { get; }
    public int[] RowStart { get; }
    public int[] ColumnIndex { get; }
    public double[] Value { get; }

    public CsrMatrix(int rows, int columns, int[] rowStart, int[] columnIndex, double[] value)
    {
        if (rowStart.Length != rows + 1) throw new ArgumentException("rowStart must have rows + 1 entries", nameof(rowStart));
        Rows = rows;
        Columns = columns;
        RowStart = rowStart;
        ColumnIndex = columnIndex;
        Value = value;
    }

    public int NonZeros => RowStart[Rows];

    /// <summary>Bytes held by the three arrays.</summary>
    public long Bytes => 4L * RowStart.Length + 4L * NonZeros + 8L * NonZeros;

    /// <summary>y = A x.</summary>
    public void Multiply(ReadOnlySpan<double> x, Span<double> y)
    {
        var rs = RowStart; var ci = ColumnIndex; var v = Value;
        for (int i = 0; i < Rows; i++)
        {
            double s = 0;
            for (int k = rs[i], e = rs[i + 1]; k < e; k++) s += v[k] * x[ci[k]];
            y[i] = s;
        }
    }

    /// <summary>r = b - A x.</summary>
    public void Residual(ReadOnlySpan<double> b, ReadOnlySpan<double> x, Span<double> r)
    {
        var rs = RowStart; var ci = ColumnIndex; var v = Value;
        for (int i = 0; i < Rows; i++)
        {
            double s = b[i];
            for (int k = rs[i], e = rs[i + 1]; k < e; k++) s -= v[k] * x[ci[k]];
            r[i] = s;
        }
    }

    /// <summary>y += A x.</summary>
    public void MultiplyAdd(ReadOnlySpan<double> x, Span<double> y)
    {
        var rs = RowStart; var ci = ColumnIndex; var v = Value;
        for (int i = 0; i < Rows; i++)
        {
            double s = 0;
            for (int k = rs[i], e = rs[i + 1]; k < e; k++) s += v[k] * x[ci[k]];
            y[i] += s;
        }
    }

    public CsrMatrix Transpose()
    {
        var count = new int[Columns + 1];
        for (int k = 0; k < NonZeros; k++) count[ColumnIndex[k] + 1]++;
        for (int c = 0; c < Columns; c++) count[c + 1] += count[c];
        var start = (int[])count.Clone();
        var ci = new int[NonZeros];
        var v = new double[NonZeros];
        for (int i = 0; i < Rows; i++)
            for (int k = RowStart[i]; k < RowStart[i + 1]; k++)
            {
                int p = count[ColumnIndex[k]]++;
                ci[p] = i;
                v[p] = Value[k];
            }
        return new CsrMatrix(Columns, Rows, start, ci, v);
    }

    /// <summary>
    /// Galerkin product C = R A P in one sweep over the rows of R (no stored A P): row I of C is
    /// sum over i in row I of R of R_Ii (row i of A) P, accumulated row by row with a dense marker
    /// (F. G. Gustavson, "Two fast algorithms for sparse matrices: multiplication and permuted
    /// transposition", ACM TOMS 4(3), 1978); a symbolic pass sizes C, a numeric pass fills it.
    /// </summary>
    public static CsrMatrix GalerkinProduct(CsrMatrix r, CsrMatrix a, CsrMatrix p)
    {
        if (r.Columns != a.Rows || a.Columns != p.Rows) throw new ArgumentException("dimensions differ");
        int n = r.Rows, m = p.Columns;
        var marker = new int[m];
        Array.Fill(marker, -1);
        var rowStart = new int[n + 1];
        for (int row = 0; row < n; row++)
        {
            int count = 0;
            for (int kr = r.RowStart[row]; kr < r.RowStart[row + 1]; kr++)
            {
                int i = r.ColumnIndex[kr];
                for (int ka = a.RowStart[i]; ka < a.RowStart[i + 1]; ka++)
                {
                    int k = a.ColumnIndex[ka];
                    for (int kp = p.RowStart[k]; kp < p.RowStart[k + 1]; kp++)
                    {
                        int c = p.ColumnIndex[kp];
                        if (marker[c] != row) { marker[c] = row; count++; }
                    }
                }
            }
            rowStart[row + 1] = rowStart[row] + count;
        }
        var ci = new int[rowStart[n]];
        var v = new double[rowStart[n]];
        var position = marker;
        Array.Fill(position, -1);
        for (int row = 0; row < n; row++)
        {
            int begin = rowStart[row], end = begin;
            for (int kr = r.RowStart[row]; kr < r.RowStart[row + 1]; kr++)
            {
                int i = r.ColumnIndex[kr];
                double rv = r.Value[kr];
                for (int ka = a.RowStart[i]; ka < a.RowStart[i + 1]; ka++)
                {
                    int k = a.ColumnIndex[ka];
                    double ra = rv * a.Value[ka];
                    for (int kp = p.RowStart[k]; kp < p.RowStart[k + 1]; kp++)
                    {
                        int c = p.ColumnIndex[kp];
                        int q = position[c];
                        if (q < begin) { q = end++; position[c] = q; ci[q] = c; v[q] = 0; }
                        v[q] += ra * p.Value[kp];
                    }
                }
            }
            Array.Sort(ci, v, begin, end - begin);
        }
        return new CsrMatrix(n, m, rowStart, ci, v);
    }
}
