using System.Numerics;
using System.Runtime.CompilerServices;
using System.Runtime.InteropServices;
using System.Runtime.Intrinsics;

namespace SlotOpt.Numerics;

/// <summary>
/// The arithmetic of the scalar field <see cref="FlexibleGmres"/> runs in (real or complex): conjugate and modulus of a
/// number, and the Arnoldi process's vector kernels (x^H y, |x|, x *= f, y += alpha x).
/// </summary>
internal interface IKrylovField<T> where T : INumberBase<T>
{
    static abstract T Conjugate(T value);
    static abstract double Modulus(T value);
    static abstract T Dot(T[] x, T[] y);
    static abstract double Norm(T[] x);
    static abstract void Scale(T[] x, double factor);
    static abstract void Axpy(T alpha, T[] x, T[] y);
}

/// <summary>The real field.</summary>
internal readonly struct RealField : IKrylovField<double>
{
    public static double Conjugate(double value) => value;
    public static double Modulus(double value) => Math.Abs(value);

    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public static double Dot(double[] x, double[] y)
    {
        double s = 0;
        for (int i = 0; i < x.Length; i++) s += x[i] * y[i];
        return s;
    }

    public static double Norm(double[] x) => Math.Sqrt(Dot(x, x));

    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public static void Scale(double[] x, double factor)
    {
        for (int i = 0; i < x.Length; i++) x[i] *= factor;
    }

    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public static void Axpy(double alpha, double[] x, double[] y)
    {
        for (int i = 0; i < x.Length; i++) y[i] += alpha * x[i];
    }
}

/// <summary>
/// The complex field. The kernels read a Complex[] as its interleaved doubles (re0, im0, re1, im1, ...), two complex numbers to a
/// 256-bit vector (Vector256 is correct on any machine and runs as AVX instructions where the processor has them); an odd count
/// leaves one number to a scalar tail.
/// </summary>
internal readonly struct ComplexField : IKrylovField<Complex>
{
    public static Complex Conjugate(Complex value) => Complex.Conjugate(value);
    public static double Modulus(Complex value) => value.Magnitude;

    /// <summary>(a, b, c, d) -> (b, a, d, c): each complex number's parts exchanged.</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static Vector256<double> SwapPairs(Vector256<double> v) => Vector256.Shuffle(v, Vector256.Create(1L, 0L, 3L, 2L));

    /// <summary>x^H y.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public static Complex Dot(Complex[] x, Complex[] y)
    {
        var xd = MemoryMarshal.Cast<Complex, double>(x.AsSpan());
        var yd = MemoryMarshal.Cast<Complex, double>(y.AsSpan());
        // re: sum of x_d y_d over all doubles; im: sum of x_re y_im - x_im y_re, i.e. x_d (swapped y)_d with signs (+, -)
        var real = Vector256<double>.Zero; var imag = Vector256<double>.Zero;
        var sign = Vector256.Create(1.0, -1.0, 1.0, -1.0);
        int i = 0;
        for (; i + 4 <= xd.Length; i += 4)
        {
            var a = Vector256.Create(xd.Slice(i, 4)); var b = Vector256.Create(yd.Slice(i, 4));
            real += a * b;
            imag += a * SwapPairs(b) * sign;
        }
        double re = Vector256.Sum(real), im = Vector256.Sum(imag);
        for (int k = i / 2; k < x.Length; k++)
        {
            re += x[k].Real * y[k].Real + x[k].Imaginary * y[k].Imaginary;
            im += x[k].Real * y[k].Imaginary - x[k].Imaginary * y[k].Real;
        }
        return new Complex(re, im);
    }

    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public static double Norm(Complex[] x)
    {
        var xd = MemoryMarshal.Cast<Complex, double>(x.AsSpan());
        var sum = Vector256<double>.Zero;
        int i = 0;
        for (; i + 4 <= xd.Length; i += 4) { var a = Vector256.Create(xd.Slice(i, 4)); sum += a * a; }
        double s = Vector256.Sum(sum);
        for (; i < xd.Length; i++) s += xd[i] * xd[i];
        return Math.Sqrt(s);
    }

    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public static void Scale(Complex[] x, double factor)
    {
        var xd = MemoryMarshal.Cast<Complex, double>(x.AsSpan());
        var f = Vector256.Create(factor);
        int i = 0;
        for (; i + 4 <= xd.Length; i += 4) (Vector256.Create(xd.Slice(i, 4)) * f).CopyTo(xd.Slice(i, 4));
        for (; i < xd.Length; i++) xd[i] *= factor;
    }

    /// <summary>y += alpha x: (re, im) += alpha_re (x_re, x_im) + alpha_im (-x_im, x_re).</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public static void Axpy(Complex alpha, Complex[] x, Complex[] y)
    {
        var xd = MemoryMarshal.Cast<Complex, double>(x.AsSpan());
        var yd = MemoryMarshal.Cast<Complex, double>(y.AsSpan());
        var ar = Vector256.Create(alpha.Real);
        var ai = Vector256.Create(-alpha.Imaginary, alpha.Imaginary, -alpha.Imaginary, alpha.Imaginary);
        int i = 0;
        for (; i + 4 <= xd.Length; i += 4)
        {
            var a = Vector256.Create(xd.Slice(i, 4));
            (Vector256.Create(yd.Slice(i, 4)) + ar * a + ai * SwapPairs(a)).CopyTo(yd.Slice(i, 4));
        }
        for (int k = i / 2; k < x.Length; k++) y[k] += alpha * x[k];
    }
}
