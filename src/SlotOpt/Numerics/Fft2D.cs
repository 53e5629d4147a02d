using System.Numerics;
using MathNet.Numerics.IntegralTransforms;

namespace SlotOpt.Numerics;

/// <summary>
/// 2-D discrete Fourier transform of a row-major rows x columns array, as 1-D transforms of every row
/// then every column (MathNet's managed provider has no multi-dimensional transform). Matlab
/// convention: forward exp(-2 pi i k n / N) unscaled, inverse scaled by 1/N, so
/// Inverse(Forward(a) .* Forward(b)) is the circular convolution of a and b.
/// </summary>
internal sealed class Fft2D
{
    private readonly int _rows, _columns;
    private readonly Complex[] _line;

    public Fft2D(int rows, int columns)
    {
        _rows = rows;
        _columns = columns;
        _line = new Complex[Math.Max(rows, columns)];
    }

    public void Forward(Complex[] a) => Transform(a, forward: true);
    public void Inverse(Complex[] a) => Transform(a, forward: false);

    private void Transform(Complex[] a, bool forward)
    {
        var row = new Complex[_columns];
        for (int r = 0; r < _rows; r++)
        {
            Array.Copy(a, r * _columns, row, 0, _columns);
            if (forward) Fourier.Forward(row, FourierOptions.Matlab); else Fourier.Inverse(row, FourierOptions.Matlab);
            Array.Copy(row, 0, a, r * _columns, _columns);
        }
        var column = _line.Length == _rows ? _line : new Complex[_rows];
        for (int c = 0; c < _columns; c++)
        {
            for (int r = 0; r < _rows; r++) column[r] = a[r * _columns + c];
            if (forward) Fourier.Forward(column, FourierOptions.Matlab); else Fourier.Inverse(column, FourierOptions.Matlab);
            for (int r = 0; r < _rows; r++) a[r * _columns + c] = column[r];
        }
    }
}
