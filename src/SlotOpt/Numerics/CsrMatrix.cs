namespace SlotOpt.Numerics;

/// <summary>
/// Compressed sparse row matrix on raw arrays: the storage of the sheet operator and of the thermal operator.
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
}
