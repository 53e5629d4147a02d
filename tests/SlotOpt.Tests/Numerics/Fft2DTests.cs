using System.Numerics;
using SlotOpt.Numerics;

namespace SlotOpt.Tests.Numerics;

/// <summary>
/// Fft2D against the direct 2-D DFT X[k, l] = sum_{m, n} x[m, n] exp(-2 pi i (k m / M + l n / N)) (the
/// definition, e.g. A. V. Oppenheim, R. W. Schafer, "Discrete-Time Signal Processing", 3rd ed., 2010,
/// eq. 8.67 in one dimension), evaluated term by term. Tolerance 1e-10 relative to the largest
/// coefficient: the direct sum of M N <= 512 terms of size <= 1 carries rounding of about 1e-13, the
/// FFT less; a wrong twiddle or axis would be off by order 1.
/// </summary>
public class Fft2DTests
{
    private static Complex[] Random2D(int seed, int rows, int columns)
    {
        var random = new Random(seed);
        return Enumerable.Range(0, rows * columns).Select(_ => new Complex(2 * random.NextDouble() - 1, 2 * random.NextDouble() - 1)).ToArray();
    }

    private static Complex[] DirectDft(Complex[] a, int rows, int columns)
    {
        var result = new Complex[a.Length];
        for (int k = 0; k < rows; k++)
            for (int l = 0; l < columns; l++)
            {
                Complex s = Complex.Zero;
                for (int m = 0; m < rows; m++)
                    for (int n = 0; n < columns; n++)
                        s += a[m * columns + n] * Complex.FromPolarCoordinates(1, -2 * Math.PI * ((double)k * m / rows + (double)l * n / columns));
                result[k * columns + l] = s;
            }
        return result;
    }

    [Theory]
    [InlineData(1, 8, 16)]
    [InlineData(2, 16, 4)]
    [InlineData(3, 6, 10)]     // not powers of two
    public void ForwardMatchesDirectDft(int seed, int rows, int columns)
    {
        var a = Random2D(seed, rows, columns);
        var expected = DirectDft(a, rows, columns);
        new Fft2D(rows, columns).Forward(a);
        double scale = expected.Max(c => c.Magnitude);
        for (int i = 0; i < a.Length; i++) Assert.True((a[i] - expected[i]).Magnitude <= 1e-10 * scale, $"coefficient {i}: {a[i]} against {expected[i]}");
    }

    // Inverse(Forward(x)) = x (inverse scaled by 1/N), and Inverse(Forward(a) .* Forward(b)) is the circular
    // convolution of a and b, summed directly here: the property the reaction operator relies on.
    [Fact]
    public void InverseUndoesForwardAndProductIsCircularConvolution()
    {
        const int rows = 8, columns = 8;
        var a = Random2D(4, rows, columns);
        var b = Random2D(5, rows, columns);
        var fft = new Fft2D(rows, columns);
        var roundTrip = (Complex[])a.Clone();
        fft.Forward(roundTrip);
        fft.Inverse(roundTrip);
        for (int i = 0; i < a.Length; i++) Assert.True((roundTrip[i] - a[i]).Magnitude <= 1e-12, $"round trip {i}");

        var fa = (Complex[])a.Clone();
        var fb = (Complex[])b.Clone();
        fft.Forward(fa);
        fft.Forward(fb);
        var product = fa.Zip(fb, (x, y) => x * y).ToArray();
        fft.Inverse(product);
        for (int k = 0; k < rows; k++)
            for (int l = 0; l < columns; l++)
            {
                Complex s = Complex.Zero;
                for (int m = 0; m < rows; m++)
                    for (int n = 0; n < columns; n++)
                        s += a[m * columns + n] * b[((k - m + rows) % rows) * columns + (l - n + columns) % columns];
                Assert.True((product[k * columns + l] - s).Magnitude <= 1e-10 * rows * columns, $"convolution at ({k}, {l})");
            }
    }
}
