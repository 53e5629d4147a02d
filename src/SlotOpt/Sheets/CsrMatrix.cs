namespace SlotOpt.Sheets;

/// <summary>
/// Compressed sparse row matrix on raw arrays: the storage of the sheet operator, the multigrid
/// transfer operators and their Galerkin products. Column indices are sorted within each row.
/// </summary>
public sealed class CsrMatrix
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

    /// <summary>The diagonal entries (zero where a row has none).</summary>
    public double[] Diagonal()
    {
        var d = new double[Rows];
        for (int i = 0; i < Rows; i++)
            for (int k = RowStart[i]; k < RowStart[i + 1]; k++)
                if (ColumnIndex[k] == i) d[i] = Value[k];
        return d;
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
    /// C = A B by Gustavson's row-by-row algorithm with a dense marker (F. G. Gustavson,
    /// "Two fast algorithms for sparse matrices: multiplication and permuted transposition",
    /// ACM TOMS 4(3), 1978): a symbolic pass sizes C, a numeric pass fills it.
    /// </summary>
    public static CsrMatrix Multiply(CsrMatrix a, CsrMatrix b)
    {
        if (a.Columns != b.Rows) throw new ArgumentException("inner dimensions differ");
        int n = a.Rows, m = b.Columns;
        var marker = new int[m];
        Array.Fill(marker, -1);
        var rowStart = new int[n + 1];
        for (int i = 0; i < n; i++)
        {
            int count = 0;
            for (int ka = a.RowStart[i]; ka < a.RowStart[i + 1]; ka++)
            {
                int j = a.ColumnIndex[ka];
                for (int kb = b.RowStart[j]; kb < b.RowStart[j + 1]; kb++)
                {
                    int c = b.ColumnIndex[kb];
                    if (marker[c] != i) { marker[c] = i; count++; }
                }
            }
            rowStart[i + 1] = rowStart[i] + count;
        }
        var ci = new int[rowStart[n]];
        var v = new double[rowStart[n]];
        var position = marker; // reuse: position of column c in the current row, valid when >= rowStart[i]
        Array.Fill(position, -1);
        for (int i = 0; i < n; i++)
        {
            int begin = rowStart[i], end = begin;
            for (int ka = a.RowStart[i]; ka < a.RowStart[i + 1]; ka++)
            {
                int j = a.ColumnIndex[ka];
                double av = a.Value[ka];
                for (int kb = b.RowStart[j]; kb < b.RowStart[j + 1]; kb++)
                {
                    int c = b.ColumnIndex[kb];
                    int p = position[c];
                    if (p < begin) { p = end++; position[c] = p; ci[p] = c; v[p] = 0; }
                    v[p] += av * b.Value[kb];
                }
            }
            Array.Sort(ci, v, begin, end - begin);
        }
        return new CsrMatrix(n, m, rowStart, ci, v);
    }
}
