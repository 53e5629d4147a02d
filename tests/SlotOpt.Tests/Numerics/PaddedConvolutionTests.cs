using System.Numerics;
using System.Runtime.Intrinsics;
using MathNet.Numerics.IntegralTransforms;
using SlotOpt.Numerics;

namespace SlotOpt.Tests.Numerics;

/// <summary>
/// PaddedConvolution against the linear convolution summed term by term from its definition,
/// y[i, j] = sum_{i', j'} k(i - i', j - j') x[i', j'] (e.g. A. V. Oppenheim, R. W. Schafer, "Discrete-Time Signal
/// Processing", 3rd ed., 2010, eq. 2.49, in two dimensions), for complex and real fields, even and odd sizes, a
/// single row, and kernels even, odd and without symmetry. Tolerance 1e-12 relative to the largest term sum: the FFT's
/// rounding on at most 64 x 64 points is about 1e-15 per operation times log N; a wrong twiddle, a skipped butterfly
/// or a wrong Hermitian split is off by order 1.
/// </summary>
public class PaddedConvolutionTests
{
    private static double Kernel(int dx, int dy, int symmetry) => symmetry switch
    {
        0 => Math.Exp(-0.1 * (dx * dx + 2 * dy * dy)) / (1 + Math.Abs(dx)),          // even in both
        1 => dx * Math.Exp(-0.05 * (dx * dx + dy * dy)),                             // odd in dx
        _ => Math.Cos(0.3 * dx + 0.7 * dy + 0.2) / (1 + dx * dx + dy * dy),        // no symmetry
    };

    [Theory]
    [InlineData(7, 5, 0, true)]
    [InlineData(7, 5, 0, false)]
    [InlineData(16, 9, 1, true)]
    [InlineData(16, 9, 1, false)]
    [InlineData(13, 32, 2, true)]
    [InlineData(13, 32, 2, false)]
    [InlineData(1, 6, 2, true)]
    [InlineData(1, 6, 2, false)]
    [InlineData(9, 1, 2, true)]
    [InlineData(9, 1, 2, false)]
    public void Complex_and_real_fields_match_the_direct_linear_convolution(int nx, int ny, int symmetry, bool wideLanes)
    {
        var random = new Random(nx * 100 + ny);
        var x = Enumerable.Range(0, nx * ny).Select(_ => new Complex(random.NextDouble() - 0.5, random.NextDouble() - 0.5)).ToArray();
        var direct = new Complex[nx * ny];
        for (int j = 0; j < ny; j++)
            for (int i = 0; i < nx; i++)
                for (int q = 0; q < ny; q++)
                    for (int p = 0; p < nx; p++)
                        direct[j * nx + i] += Kernel(i - p, j - q, symmetry) * x[q * nx + p];
        double scale = direct.Max(c => c.Magnitude);

        var conv = new PaddedConvolution(nx, ny, PaddedConvolution.PaddedLength(nx), PaddedConvolution.PaddedLength(ny), threads: 1, wideLanes);
        var spectrum = conv.Spectrum(nx - 1, ny - 1, (dx, dy) => Kernel(dx, dy, symmetry));
        for (int round = 0; round < 2; round++)   // twice: leftovers of the first convolution in the padding must not leak into the second
        {
            for (int j = 0; j < ny; j++)
                for (int i = 0; i < nx; i++) { conv.Re[j * conv.PaddedX + i] = x[j * nx + i].Real; conv.Im[j * conv.PaddedX + i] = x[j * nx + i].Imaginary; }
            conv.ConvolveComplex(spectrum);
            for (int j = 0; j < ny; j++)
                for (int i = 0; i < nx; i++)
                {
                    var got = new Complex(conv.Re[j * conv.PaddedX + i], conv.Im[j * conv.PaddedX + i]);
                    Assert.True((got - direct[j * nx + i]).Magnitude <= 1e-12 * scale, $"complex ({i}, {j}): {got} against {direct[j * nx + i]}");
                }
            for (int j = 0; j < ny; j++)
                for (int i = 0; i < nx; i++) conv.Re[j * conv.PaddedX + i] = x[j * nx + i].Real;
            conv.ConvolveReal(spectrum);
            for (int j = 0; j < ny; j++)
                for (int i = 0; i < nx; i++)
                {
                    double expected = 0;
                    for (int q = 0; q < ny; q++)
                        for (int p = 0; p < nx; p++) expected += Kernel(i - p, j - q, symmetry) * x[q * nx + p].Real;
                    Assert.True(Math.Abs(conv.Re[j * conv.PaddedX + i] - expected) <= 1e-12 * scale, $"real ({i}, {j}): {conv.Re[j * conv.PaddedX + i]} against {expected}");
                }
        }
    }

    // A lattice shorter than 2 n - 1 (the convected preconditioner's factor runs on one) convolves circularly: against the circular
    // convolution summed from its definition, y[i, j] = sum_{p, q} k((i - p) mod Mx, (j - q) mod My) x[p, q] with the kernel's offsets
    // wrapped and added (A. V. Oppenheim, R. W. Schafer, "Discrete-Time Signal Processing", 3rd ed., 2010, section 8.6.5, eq. 8.114,
    // in two dimensions), for complex and real fields, lengths 2^k and 3 x 2^k, the input region more than half the lattice (the
    // shortened first and last stages are not taken) or all of it. Tolerance 1e-12 relative to the largest term sum, as above.
    [Theory]
    [InlineData(13, 5, 16, 8, 0, true)]
    [InlineData(13, 5, 16, 8, 0, false)]
    [InlineData(11, 7, 12, 8, 1, true)]
    [InlineData(11, 7, 12, 8, 1, false)]
    [InlineData(16, 6, 16, 6, 2, true)]
    [InlineData(16, 6, 16, 6, 2, false)]
    [InlineData(20, 9, 24, 16, 2, true)]
    [InlineData(20, 9, 24, 16, 2, false)]
    [InlineData(1, 5, 2, 6, 1, true)]
    [InlineData(1, 5, 2, 6, 1, false)]
    public void A_short_lattice_gives_the_direct_circular_convolution(int nx, int ny, int mx, int my, int symmetry, bool wideLanes)
    {
        var random = new Random(nx * 100 + ny + mx);
        var x = Enumerable.Range(0, nx * ny).Select(_ => new Complex(random.NextDouble() - 0.5, random.NextDouble() - 0.5)).ToArray();
        var wrapped = new double[mx, my];
        for (int dy = -(ny - 1); dy < ny; dy++)
            for (int dx = -(nx - 1); dx < nx; dx++) wrapped[(dx + 2 * mx) % mx, (dy + 2 * my) % my] += Kernel(dx, dy, symmetry);
        var direct = new Complex[nx * ny];
        for (int j = 0; j < ny; j++)
            for (int i = 0; i < nx; i++)
                for (int q = 0; q < ny; q++)
                    for (int p = 0; p < nx; p++)
                        direct[j * nx + i] += wrapped[(i - p + mx) % mx, (j - q + my) % my] * x[q * nx + p];
        double scale = direct.Max(c => c.Magnitude);

        var conv = new PaddedConvolution(nx, ny, mx, my, threads: 1, wideLanes);
        var spectrum = conv.Spectrum(nx - 1, ny - 1, (dx, dy) => Kernel(dx, dy, symmetry));
        for (int round = 0; round < 2; round++)   // twice: the first convolution's leftovers outside the input region must not leak into the second
        {
            for (int j = 0; j < ny; j++)
                for (int i = 0; i < nx; i++) { conv.Re[j * mx + i] = x[j * nx + i].Real; conv.Im[j * mx + i] = x[j * nx + i].Imaginary; }
            conv.ConvolveComplex(spectrum);
            for (int j = 0; j < ny; j++)
                for (int i = 0; i < nx; i++)
                {
                    var got = new Complex(conv.Re[j * mx + i], conv.Im[j * mx + i]);
                    Assert.True((got - direct[j * nx + i]).Magnitude <= 1e-12 * scale, $"complex ({i}, {j}): {got} against {direct[j * nx + i]}");
                }
            for (int j = 0; j < ny; j++)
                for (int i = 0; i < nx; i++) conv.Re[j * mx + i] = x[j * nx + i].Real;
            conv.ConvolveReal(spectrum);
            for (int j = 0; j < ny; j++)
                for (int i = 0; i < nx; i++)
                {
                    double expected = 0;
                    for (int q = 0; q < ny; q++)
                        for (int p = 0; p < nx; p++) expected += wrapped[(i - p + mx) % mx, (j - q + my) % my] * x[q * nx + p].Real;
                    Assert.True(Math.Abs(conv.Re[j * mx + i] - expected) <= 1e-12 * scale, $"real ({i}, {j}): {conv.Re[j * mx + i]} against {expected}");
                }
        }
    }

    // A kernel even in y needs only 2 ny - 2 rows for the linear convolution (offsets -ky and +ky share a row and a value; the Dx R
    // product of a moving source runs so): against the direct linear convolution (Oppenheim and Schafer, eq. 2.49, as above), for the
    // radix-3 path (ny = 7: 12 rows instead of 16) and the power-of-two path with more than half the rows occupied (ny = 9: 16 instead
    // of 24; ny = 5: 8 instead of 12). Tolerance 1e-12 relative to the largest term sum, as above; a doubled or missing row is off by order 1.
    [Theory]
    [InlineData(7, 7, 0, true)]
    [InlineData(7, 7, 0, false)]
    [InlineData(10, 9, 1, true)]
    [InlineData(10, 9, 1, false)]
    [InlineData(6, 5, 1, true)]
    [InlineData(6, 5, 1, false)]
    public void A_kernel_even_in_y_is_convolved_linearly_on_two_n_minus_two_rows(int nx, int ny, int symmetry, bool wideLanes)
    {
        var random = new Random(nx * 10 + ny);
        var x = Enumerable.Range(0, nx * ny).Select(_ => random.NextDouble() - 0.5).ToArray();
        var direct = new double[nx * ny];
        for (int j = 0; j < ny; j++)
            for (int i = 0; i < nx; i++)
                for (int q = 0; q < ny; q++)
                    for (int p = 0; p < nx; p++) direct[j * nx + i] += Kernel(i - p, j - q, symmetry) * x[q * nx + p];
        double scale = direct.Max(Math.Abs);
        int mx = PaddedConvolution.PaddedLength(nx), my = PaddedConvolution.EvenPaddedLength(ny);
        Assert.True(my < PaddedConvolution.PaddedLength(ny), $"{my} rows: the case must be shorter than the general padding");
        var conv = new PaddedConvolution(nx, ny, mx, my, threads: 1, wideLanes);
        var spectrum = conv.Spectrum(nx - 1, ny - 1, (dx, dy) => Kernel(dx, dy, symmetry), evenInY: true);
        for (int round = 0; round < 2; round++)
        {
            for (int j = 0; j < ny; j++)
                for (int i = 0; i < nx; i++) conv.Re[j * mx + i] = x[j * nx + i];
            conv.ConvolveReal(spectrum);
            for (int j = 0; j < ny; j++)
                for (int i = 0; i < nx; i++)
                    Assert.True(Math.Abs(conv.Re[j * mx + i] - direct[j * nx + i]) <= 1e-12 * scale, $"({i}, {j}): {conv.Re[j * mx + i]} against {direct[j * nx + i]}");
        }
    }

    [Theory]
    [InlineData(5, 4, 8)]     // 4 is below the region
    [InlineData(5, 10, 8)]    // 10 is neither 2^k nor 3 x 2^k
    public void A_lattice_shorter_than_the_region_or_not_transformable_is_refused(int n, int bad, int good)
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => new PaddedConvolution(n, n, bad, good, 1));
        Assert.Throws<ArgumentOutOfRangeException>(() => new PaddedConvolution(n, n, good, bad, 1));
    }

    // The padded length is the smallest 2^k or 3 x 2^k at least 2 n: the circular convolution there cannot wrap
    // a kernel of 2 n - 1 taps onto the n samples (the property the linear convolution above relies on).
    [Theory]
    [InlineData(1, 2)]
    [InlineData(2, 4)]
    [InlineData(3, 6)]
    [InlineData(255, 512)]
    [InlineData(256, 512)]
    [InlineData(257, 768)]
    [InlineData(299, 768)]
    [InlineData(385, 1024)]
    public void Padded_length_is_the_smallest_power_of_two_or_three_times_one_at_least_twice_n(int n, int expected) =>
        Assert.Equal(expected, PaddedConvolution.PaddedLength(n));

    // The transform pair against MathNet's general-length FFT (MathNet.Numerics.IntegralTransforms.Fourier, Matlab convention:
    // forward e^{-2 pi i k n / N} unscaled, inverse scaled by 1/N), row by row then column by column over the whole padded
    // lattice: lengths 2^k and 3 x 2^k in each direction (the rail of the conveyor demo pads 299 x 39 nodes to 768 x 96), blocks
    // long enough for the SIMD paths and a single row. Tolerance 1e-12 relative to the largest coefficient: rounding is about
    // 1e-16 times log N per coefficient; a wrong twiddle, a misplaced frequency or a skipped stage is off by order 1.
    [Theory]
    [InlineData(299, 39)]
    [InlineData(150, 20)]
    [InlineData(40, 64)]
    [InlineData(3, 1)]
    public void Transforms_match_MathNet_fft_on_the_padded_lattice(int nx, int ny)
    {
        var random = new Random(nx * 1000 + ny);
        var conv = new PaddedConvolution(nx, ny);
        int mx = conv.PaddedX, my = conv.PaddedY;
        var field = new Complex[mx * my];
        for (int j = 0; j < ny; j++)
            for (int i = 0; i < nx; i++) field[j * mx + i] = new Complex(random.NextDouble() - 0.5, random.NextDouble() - 0.5);
        var expected = Transform2D(field, mx, my, forward: true);
        for (int k = 0; k < field.Length; k++) { conv.Re[k] = field[k].Real; conv.Im[k] = field[k].Imaginary; }
        conv.TransformComplex();
        double scale = expected.Max(c => c.Magnitude);
        for (int stored = 0; stored < field.Length; stored++)
        {
            var want = expected[conv.FrequencyIndex(stored)];
            var got = new Complex(conv.Re[stored], conv.Im[stored]);
            Assert.True((got - want).Magnitude <= 1e-12 * scale, $"forward {mx} x {my}, stored {stored}: {got} against {want}");
        }

        var spectrum = Enumerable.Range(0, mx * my).Select(_ => new Complex(random.NextDouble() - 0.5, random.NextDouble() - 0.5)).ToArray();
        for (int stored = 0; stored < spectrum.Length; stored++)
        {
            var value = spectrum[conv.FrequencyIndex(stored)];
            conv.Re[stored] = value.Real; conv.Im[stored] = value.Imaginary;
        }
        conv.InverseTransformComplex();
        var back = Transform2D(spectrum, mx, my, forward: false);
        double total = (double)mx * my;
        scale = back.Max(c => c.Magnitude) * total;
        for (int j = 0; j < ny; j++)
            for (int i = 0; i < nx; i++)
            {
                var want = back[j * mx + i] * total;                                  // the transform's inverse is unscaled
                var got = new Complex(conv.Re[j * mx + i], conv.Im[j * mx + i]);
                Assert.True((got - want).Magnitude <= 1e-12 * scale, $"inverse {mx} x {my}, ({i}, {j}): {got} against {want}");
            }
    }

    // The kernels run 512 bits wide where the processor has AVX-512 and at the portable Vector<T> width otherwise; every lane rounds as
    // the scalar operation would (IEEE 754 element-wise + - *, no fused multiply-add), so both widths must give the same numbers bit for bit
    // (common practice, no source: the project's rule that results do not depend on the machine's vector width). Lattices where the widths
    // take different paths: the moving solve's 200 x 50 nodes on 512 x 96 (radix-3 columns, row stages shorter than a wide register), a
    // 3 x 2^k row of 96 (radix-3 thirds of 32), a row of 24 (thirds of 8: one wide register) and a row of 6 (thirds of 2: below both).
    [Theory]
    [InlineData(200, 50)]
    [InlineData(37, 300)]
    [InlineData(12, 40)]
    [InlineData(3, 17)]
    public void Wide_and_portable_lanes_give_the_same_numbers_bit_for_bit(int nx, int ny)
    {
        var random = new Random(nx + 7 * ny);
        var x = Enumerable.Range(0, nx * ny).Select(_ => (random.NextDouble() - 0.5, random.NextDouble() - 0.5)).ToArray();
        long[] Run(bool wideLanes, bool real)
        {
            var conv = new PaddedConvolution(nx, ny, PaddedConvolution.PaddedLength(nx), PaddedConvolution.PaddedLength(ny), threads: 1, wideLanes);
            if (wideLanes && Vector512.IsHardwareAccelerated) Assert.Equal(Vector512<double>.Count, conv.Lanes);
            if (!wideLanes) Assert.Equal(Vector<double>.Count, conv.Lanes);
            var spectrum = conv.Spectrum(nx - 1, ny - 1, (dx, dy) => Kernel(dx, dy, 2));
            var values = spectrum.Re.Concat(spectrum.Im).ToList();
            for (int j = 0; j < ny; j++)
                for (int i = 0; i < nx; i++) { conv.Re[j * conv.PaddedX + i] = x[j * nx + i].Item1; conv.Im[j * conv.PaddedX + i] = x[j * nx + i].Item2; }
            if (real) conv.ConvolveReal(spectrum);
            else
            {
                conv.TransformComplex();
                values.AddRange(conv.Re.Concat(conv.Im));
                conv.InverseTransformComplex();
            }
            for (int j = 0; j < ny; j++)
                for (int i = 0; i < nx; i++) { values.Add(conv.Re[j * conv.PaddedX + i]); if (!real) values.Add(conv.Im[j * conv.PaddedX + i]); }
            return values.Select(BitConverter.DoubleToInt64Bits).ToArray();
        }
        foreach (bool real in new[] { false, true })
            Assert.Equal(Run(false, real), Run(true, real));
    }

    private static Complex[] Transform2D(Complex[] a, int columns, int rows, bool forward)
    {
        var result = (Complex[])a.Clone();
        var row = new Complex[columns];
        for (int r = 0; r < rows; r++)
        {
            Array.Copy(result, r * columns, row, 0, columns);
            if (forward) Fourier.Forward(row, FourierOptions.Matlab); else Fourier.Inverse(row, FourierOptions.Matlab);
            Array.Copy(row, 0, result, r * columns, columns);
        }
        var column = new Complex[rows];
        for (int c = 0; c < columns; c++)
        {
            for (int r = 0; r < rows; r++) column[r] = result[r * columns + c];
            if (forward) Fourier.Forward(column, FourierOptions.Matlab); else Fourier.Inverse(column, FourierOptions.Matlab);
            for (int r = 0; r < rows; r++) result[r * columns + c] = column[r];
        }
        return result;
    }

    // Two workers split the rows and column strips; every element sees the same operations in the same order, so the
    // result must equal the one-worker result bit for bit (the project's rule: the same numbers for 1 and 2 threads).
    [Fact]
    public void Two_workers_give_the_one_worker_result_bit_for_bit()
    {
        const int nx = 37, ny = 300;   // 96 x 768 padded (radix 3 both ways): column strips of 8, so the columns are split too
        var random = new Random(5);
        var x = Enumerable.Range(0, nx * ny).Select(_ => (random.NextDouble() - 0.5, random.NextDouble() - 0.5)).ToArray();
        double[] Run(int threads, bool real)
        {
            var conv = new PaddedConvolution(nx, ny, threads);
            var spectrum = conv.Spectrum(nx - 1, ny - 1, (dx, dy) => Kernel(dx, dy, 2));
            for (int j = 0; j < ny; j++)
                for (int i = 0; i < nx; i++) { conv.Re[j * conv.PaddedX + i] = x[j * nx + i].Item1; conv.Im[j * conv.PaddedX + i] = x[j * nx + i].Item2; }
            if (real) conv.ConvolveReal(spectrum); else conv.ConvolveComplex(spectrum);
            return Enumerable.Range(0, nx * ny).SelectMany(k => real ? new[] { conv.Re[k / nx * conv.PaddedX + k % nx] }
                : new[] { conv.Re[k / nx * conv.PaddedX + k % nx], conv.Im[k / nx * conv.PaddedX + k % nx] }).ToArray();
        }
        foreach (bool real in new[] { false, true })
            Assert.Equal(Run(1, real).Select(BitConverter.DoubleToInt64Bits), Run(2, real).Select(BitConverter.DoubleToInt64Bits));
    }
}
