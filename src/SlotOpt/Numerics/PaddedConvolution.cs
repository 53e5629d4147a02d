using System.Numerics;
using System.Runtime.CompilerServices;

namespace SlotOpt.Numerics;

/// <summary>
/// Linear 2-D convolution of a field on an Nx x Ny lattice with a kernel of offsets |dx| &lt; Nx, |dy| &lt; Ny, by
/// radix-2 FFT on a lattice zero-padded to PaddedX x PaddedY (powers of two at least 2 N, so the circular
/// convolution there is the linear one). The field sits in <see cref="Re"/> (and <see cref="Im"/> for a complex
/// field), row-major with row stride PaddedX, in rows 0..Ny-1 and columns 0..Nx-1; write that whole region before
/// each convolution (the rest is never read), read the result from the same region.
/// <para>
/// Work saved against a plain 2-D FFT, all exact: the padding is never transformed (the first butterfly stage of
/// the forward transform sees zeros in its upper half, the last stage of the inverse computes only the rows and
/// columns read back); rows are transformed in natural order, columns (a butterfly over whole row segments, SIMD
/// across columns, in cache-sized column strips) without the bit-reversal permutation: forward by decimation in
/// frequency (natural in, bit-reversed out), inverse by decimation in time (bit-reversed in, natural out), with the
/// kernel's spectrum stored in the same order (J. W. Cooley, J. W. Tukey, Math. Comp. 19 (1965) 297-301; the
/// DIF/DIT pair without reordering: E. O. Brigham, "The Fast Fourier Transform and its Applications", 1988, ch. 11).
/// A real field (<see cref="ConvolveReal"/>) transforms its rows two at a time as one complex row
/// z = x_a + i x_b and splits them by X_a[k] = (Z[k] + conj Z[-k]) / 2, X_b[k] = (Z[k] - conj Z[-k]) / 2i,
/// then transforms only the PaddedX/2 + 1 columns of the Hermitian half (W. H. Press et al., "Numerical Recipes",
/// 3rd ed., 2007, section 12.3): about half the work of a complex field.
/// </para>
/// Buffers are allocated once; a convolution allocates only its workers' delegates. Not thread-safe: one per thread
/// (its own workers, <see cref="Threads"/>, are its business).
/// </summary>
internal sealed class PaddedConvolution
{
    private readonly double[] _colCos, _colSin;       // e^{-2 pi i t / N} = cos - i sin, t < N/2 (N = PaddedY)
    private readonly double[] _stageCos, _stageSin;   // rows, stage h at [h, 2h): e^{-2 pi i t / 2h} = cos - i sin, t < h
    private readonly int[] _rowReverse;
    private readonly double[][] _lineRe, _lineIm;   // one row buffer per worker
    private readonly int _strip;

    public int Nx { get; }
    public int Ny { get; }
    public int PaddedX { get; }
    public int PaddedY { get; }
    public double[] Re { get; }
    public double[] Im { get; }
    /// <summary>Workers the transforms split their rows and column strips over (1: the calling thread only). Results do not depend on it: every row and column is transformed by the same operations whichever worker takes it.</summary>
    public int Threads { get; }
    public long Bytes => 8L * (Re.Length + Im.Length + 2L * Threads * PaddedX + _stageCos.Length + _stageSin.Length + _colCos.Length + _colSin.Length) + 4L * _rowReverse.Length;

    public PaddedConvolution(int nx, int ny, int threads = 1)
    {
        if (nx < 1 || ny < 1) throw new ArgumentOutOfRangeException(nameof(nx), "the lattice needs at least one node each way");
        if (threads < 1) throw new ArgumentOutOfRangeException(nameof(threads), "at least one worker");
        Nx = nx; Ny = ny; Threads = threads;
        PaddedX = PaddedLength(nx);
        PaddedY = PaddedLength(ny);
        Re = new double[PaddedX * PaddedY];
        Im = new double[PaddedX * PaddedY];
        (_stageCos, _stageSin) = StageTwiddles(PaddedX);
        (_colCos, _colSin) = Twiddles(PaddedY);
        _rowReverse = BitReversal(PaddedX);
        _lineRe = Enumerable.Range(0, threads).Select(_ => new double[PaddedX]).ToArray();
        _lineIm = Enumerable.Range(0, threads).Select(_ => new double[PaddedX]).ToArray();
        // a column strip of both arrays over all rows in about 128 kB (level-2 cache), whole SIMD vectors wide
        int width = Math.Max(1, 128 * 1024 / (16 * PaddedY) / Vector<double>.Count) * Vector<double>.Count;
        _strip = Math.Min(width, PaddedX);
    }

    /// <summary>The smallest power of two at least 2 n (so at least 2 n - 1 for the linear convolution, and at least 2).</summary>
    public static int PaddedLength(int n)
    {
        int m = 2;
        while (m < 2 * n) m <<= 1;
        return m;
    }

    /// <summary>
    /// The kernel k(dx, dy), |dx| &lt;= kx &lt; Nx, |dy| &lt;= ky &lt; Ny, as the spectrum this convolution multiplies by (its
    /// DFT on the padded lattice in the column order of the transforms, scaled by 1 / (PaddedX PaddedY) for the inverse).
    /// </summary>
    public KernelSpectrum Spectrum(int kx, int ky, Func<int, int, double> kernel)
    {
        if (kx >= Nx || ky >= Ny) throw new ArgumentOutOfRangeException(nameof(kx), "the kernel reaches beyond the lattice");
        int mx = PaddedX, my = PaddedY;
        var re = new double[mx * my];
        var im = new double[mx * my];
        for (int dy = -ky; dy <= ky; dy++)
            for (int dx = -kx; dx <= kx; dx++)
                re[((dy + my) % my) * mx + (dx + mx) % mx] = kernel(dx, dy);
        for (int j = 0; j < my; j++) ForwardRow(re, im, j * mx, mx);
        ForwardColumns(re, im, mx, my);
        double scale = 1.0 / ((double)mx * my);
        for (int i = 0; i < re.Length; i++) { re[i] *= scale; im[i] *= scale; }
        return new KernelSpectrum(this, re, im);
    }

    /// <summary>Row-major frequency index (q * PaddedX + p, natural order) of each stored spectrum entry.</summary>
    public int FrequencyIndex(int stored)
    {
        int row = stored / PaddedX, p = stored % PaddedX;
        return ReverseBits(row, PaddedY) * PaddedX + p;
    }

    /// <summary>Re + i Im := kernel * (Re + i Im) on the input region.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public void ConvolveComplex(KernelSpectrum spectrum)
    {
        Check(spectrum);
        int mx = PaddedX, my = PaddedY;
        Split(Ny, (from, to, _) => { for (int j = from; j < to; j++) ForwardRow(Re, Im, j * mx, Nx); });
        ForwardColumns(Re, Im, mx, Ny);
        Multiply(spectrum, mx);
        InverseColumns(Re, Im, mx, Ny);
        Split(Ny, (from, to, _) => { for (int j = from; j < to; j++) InverseRow(Re, Im, j * mx, Nx); });
    }

    /// <summary>Re := kernel * Re on the input region, for a real field and a real kernel (Im is scratch).</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public void ConvolveReal(KernelSpectrum spectrum)
    {
        Check(spectrum);
        int mx = PaddedX, half = mx / 2, columns = half + 1, pairs = (Ny + 1) / 2;
        Split(pairs, (from, to, worker) => ForwardRowPairs(from, to, _lineRe[worker], _lineIm[worker]));
        ForwardColumns(Re, Im, columns, Ny);
        Multiply(spectrum, columns);
        InverseColumns(Re, Im, columns, Ny);
        Split(pairs, (from, to, worker) => InverseRowPairs(from, to, _lineRe[worker], _lineIm[worker]));
    }

    /// <summary>Rows 2p and 2p + 1 (p in [from, to)) of a real field transformed as one complex row and split into their Hermitian halves.</summary>
    private void ForwardRowPairs(int from, int to, double[] lr, double[] li)
    {
        int mx = PaddedX, columns = mx / 2 + 1;
        for (int a = 2 * from; a < 2 * to; a += 2)
        {
            int b = a + 1;
            bool pair = b < Ny;
            Array.Copy(Re, a * mx, lr, 0, Nx);
            if (pair) Array.Copy(Re, b * mx, li, 0, Nx); else Array.Clear(li, 0, Nx);
            ForwardRow(lr, li, 0, Nx);
            // X_a[k] = (Z[k] + conj Z[-k]) / 2, X_b[k] = (Z[k] - conj Z[-k]) / 2i
            for (int k = 0; k < columns; k++)
            {
                int minus = (mx - k) & (mx - 1);
                double zr = lr[k], zi = li[k], wr = lr[minus], wi = li[minus];
                Re[a * mx + k] = 0.5 * (zr + wr);
                Im[a * mx + k] = 0.5 * (zi - wi);
                if (pair)
                {
                    Re[b * mx + k] = 0.5 * (zi + wi);
                    Im[b * mx + k] = -0.5 * (zr - wr);
                }
            }
        }
    }

    /// <summary>Rows 2p and 2p + 1 (p in [from, to)) back from their Hermitian halves by one complex inverse row transform.</summary>
    private void InverseRowPairs(int from, int to, double[] lr, double[] li)
    {
        int mx = PaddedX, half = mx / 2, columns = half + 1;
        for (int a = 2 * from; a < 2 * to; a += 2)
        {
            int b = a + 1;
            bool pair = b < Ny;
            // Z[k] = X_a[k] + i X_b[k], with X[-k] = conj X[k] for the upper half
            for (int k = 0; k < columns; k++)
            {
                double ar = Re[a * mx + k], ai = Im[a * mx + k];
                double br = pair ? Re[b * mx + k] : 0, bi = pair ? Im[b * mx + k] : 0;
                lr[k] = ar - bi; li[k] = ai + br;
                if (k > 0 && k < half) { lr[mx - k] = ar + bi; li[mx - k] = br - ai; }
            }
            InverseRow(lr, li, 0, Nx);
            Array.Copy(lr, 0, Re, a * mx, Nx);
            if (pair) Array.Copy(li, 0, Re, b * mx, Nx);
        }
    }

    private void Check(KernelSpectrum spectrum)
    {
        if (!ReferenceEquals(spectrum.Owner, this)) throw new ArgumentException("the spectrum belongs to another convolution lattice", nameof(spectrum));
    }

    /// <summary>body(from, to, worker) over [0, count) in Threads contiguous parts, at once when Threads &gt; 1.</summary>
    private void Split(int count, Action<int, int, int> body)
    {
        int parts = Math.Min(Threads, count);
        if (parts <= 1) { body(0, count, 0); return; }
        Parallel.For(0, parts, new ParallelOptions { MaxDegreeOfParallelism = parts }, p => body((int)((long)count * p / parts), (int)((long)count * (p + 1) / parts), p));
    }

    private void Multiply(KernelSpectrum spectrum, int columns) =>
        Split(PaddedY, (from, to, _) => MultiplyRows(spectrum, columns, from, to));

    private void MultiplyRows(KernelSpectrum spectrum, int columns, int from, int to)
    {
        int mx = PaddedX;
        var sr = spectrum.Re; var si = spectrum.Im;
        int v = Vector<double>.Count;
        for (int q = from; q < to; q++)
        {
            int i = q * mx, e = i + columns;
            for (; i <= e - v; i += v)
            {
                var xr = new Vector<double>(Re, i); var xi = new Vector<double>(Im, i);
                var yr = new Vector<double>(sr, i); var yi = new Vector<double>(si, i);
                (xr * yr - xi * yi).CopyTo(Re, i);
                (xr * yi + xi * yr).CopyTo(Im, i);
            }
            for (; i < e; i++)
            {
                double xr = Re[i], xi = Im[i];
                Re[i] = xr * sr[i] - xi * si[i];
                Im[i] = xr * si[i] + xi * sr[i];
            }
        }
    }

    /// <summary>Forward DFT of the row at re/im[o .. o + PaddedX) in natural order; entries from <paramref name="nonzero"/> on are taken as zero (nonzero &lt;= N/2 or = N).</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private void ForwardRow(double[] re, double[] im, int o, int nonzero)
    {
        int n = PaddedX;
        var c = _stageCos; var s = _stageSin;
        int h = n / 2;
        if (nonzero <= h)
        {
            // first stage with a zero upper half: a' = a, b' = a w^t
            Twiddle(re, im, o, o + h, nonzero, c, s, h, -1);
            Array.Clear(re, o + nonzero, h - nonzero); Array.Clear(im, o + nonzero, h - nonzero);
            Array.Clear(re, o + h + nonzero, h - nonzero); Array.Clear(im, o + h + nonzero, h - nonzero);
            h >>= 1;
        }
        for (; h >= 1; h >>= 1)
            for (int g = o; g < o + n; g += 2 * h) DifRowButterflies(re, im, g, g + h, h, c, s);
        Permute(re, im, o);
    }

    /// <summary>Inverse DFT (unscaled) of the row at re/im[o ..) in natural order; only entries below <paramref name="needed"/> (&lt;= N/2) are computed in the last stage.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private void InverseRow(double[] re, double[] im, int o, int needed)
    {
        int n = PaddedX, last = n / 2;
        var c = _stageCos; var s = _stageSin;
        Permute(re, im, o);
        for (int h = 1; h < last; h <<= 1)
            for (int g = o; g < o + n; g += 2 * h) DitRowButterflies(re, im, g, g + h, h, c, s);
        DitRowHalf(re, im, o, o + last, Math.Min(needed, last), c, s, last);
    }

    private void Permute(double[] re, double[] im, int o)
    {
        var rev = _rowReverse;
        for (int i = 0; i < rev.Length; i++)
        {
            int j = rev[i];
            if (j > i) { (re[o + i], re[o + j]) = (re[o + j], re[o + i]); (im[o + i], im[o + j]) = (im[o + j], im[o + i]); }
        }
    }

    /// <summary>x[b + t] = x[a + t] w_t for t &lt; count, w_t = cos - (sign) i sin from the stage table at h (sign -1: forward).</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static void Twiddle(double[] re, double[] im, int a, int b, int count, double[] c, double[] s, int h, int sign)
    {
        for (int t = 0; t < count; t++)
        {
            double ar = re[a + t], ai = im[a + t], wr = c[h + t], wi = sign * s[h + t];
            re[b + t] = ar * wr - ai * wi; im[b + t] = ar * wi + ai * wr;
        }
    }

    /// <summary>For t &lt; h: (x[a + t], x[b + t]) := (sum, (difference) e^{-2 pi i t / 2h}), SIMD along the row where h allows.</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static void DifRowButterflies(double[] re, double[] im, int a, int b, int h, double[] c, double[] s)
    {
        int t = 0, v = Vector<double>.Count;
        if (h >= v)
            for (; t <= h - v; t += v)
            {
                var ar = new Vector<double>(re, a + t); var ai = new Vector<double>(im, a + t);
                var br = new Vector<double>(re, b + t); var bi = new Vector<double>(im, b + t);
                var wr = new Vector<double>(c, h + t); var wi = -new Vector<double>(s, h + t);
                (ar + br).CopyTo(re, a + t); (ai + bi).CopyTo(im, a + t);
                var xr = ar - br; var xi = ai - bi;
                (xr * wr - xi * wi).CopyTo(re, b + t); (xr * wi + xi * wr).CopyTo(im, b + t);
            }
        for (; t < h; t++)
        {
            double ar = re[a + t], ai = im[a + t], br = re[b + t], bi = im[b + t];
            re[a + t] = ar + br; im[a + t] = ai + bi;
            double xr = ar - br, xi = ai - bi, wr = c[h + t], wi = -s[h + t];
            re[b + t] = xr * wr - xi * wi; im[b + t] = xr * wi + xi * wr;
        }
    }

    /// <summary>For t &lt; h: (x[a + t], x[b + t]) := (a + w b, a - w b), w = e^{+2 pi i t / 2h}, SIMD along the row where h allows.</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static void DitRowButterflies(double[] re, double[] im, int a, int b, int h, double[] c, double[] s)
    {
        int t = 0, v = Vector<double>.Count;
        if (h >= v)
            for (; t <= h - v; t += v)
            {
                var ar = new Vector<double>(re, a + t); var ai = new Vector<double>(im, a + t);
                var br = new Vector<double>(re, b + t); var bi = new Vector<double>(im, b + t);
                var wr = new Vector<double>(c, h + t); var wi = new Vector<double>(s, h + t);
                var tr = br * wr - bi * wi; var ti = br * wi + bi * wr;
                (ar + tr).CopyTo(re, a + t); (ai + ti).CopyTo(im, a + t);
                (ar - tr).CopyTo(re, b + t); (ai - ti).CopyTo(im, b + t);
            }
        for (; t < h; t++)
        {
            double br = re[b + t], bi = im[b + t], wr = c[h + t], wi = s[h + t];
            double tr = br * wr - bi * wi, ti = br * wi + bi * wr;
            re[b + t] = re[a + t] - tr; im[b + t] = im[a + t] - ti;
            re[a + t] += tr; im[a + t] += ti;
        }
    }

    /// <summary>For t &lt; count: x[a + t] += w_t x[b + t], w_t = e^{+2 pi i t / 2h} (the inverse last stage where only the lower half is read back).</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static void DitRowHalf(double[] re, double[] im, int a, int b, int count, double[] c, double[] s, int h)
    {
        int t = 0, v = Vector<double>.Count;
        for (; t <= count - v; t += v)
        {
            var br = new Vector<double>(re, b + t); var bi = new Vector<double>(im, b + t);
            var wr = new Vector<double>(c, h + t); var wi = new Vector<double>(s, h + t);
            (new Vector<double>(re, a + t) + br * wr - bi * wi).CopyTo(re, a + t);
            (new Vector<double>(im, a + t) + br * wi + bi * wr).CopyTo(im, a + t);
        }
        for (; t < count; t++)
        {
            double br = re[b + t], bi = im[b + t], wr = c[h + t], wi = s[h + t];
            re[a + t] += br * wr - bi * wi; im[a + t] += br * wi + bi * wr;
        }
    }

    /// <summary>
    /// Forward DFT along every column (first <paramref name="columns"/> of each row), decimation in frequency, output rows
    /// in bit-reversed order; rows from <paramref name="nonzero"/> on are taken as zero (nonzero &lt;= PaddedY/2 or = PaddedY).
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private void ForwardColumns(double[] re, double[] im, int columns, int nonzero) =>
        Split((columns + _strip - 1) / _strip, (from, to, _) => ForwardColumnStrips(re, im, columns, nonzero, from, to));

    private void ForwardColumnStrips(double[] re, double[] im, int columns, int nonzero, int fromStrip, int toStrip)
    {
        int n = PaddedY, mx = PaddedX;
        var c = _colCos; var s = _colSin;
        for (int c0 = fromStrip * _strip; c0 < Math.Min(columns, toStrip * _strip); c0 += _strip)
        {
            int width = Math.Min(_strip, columns - c0);
            int h = n / 2;
            if (nonzero <= h)
            {
                for (int t = 0; t < h; t++)
                {
                    int a = t * mx + c0, b = (t + h) * mx + c0;
                    if (t < nonzero) TwiddleSegment(re, im, a, b, width, c[t], -s[t]);
                    else { Array.Clear(re, a, width); Array.Clear(im, a, width); Array.Clear(re, b, width); Array.Clear(im, b, width); }
                }
                h >>= 1;
            }
            for (; h >= 1; h >>= 1)
            {
                int step = n / (2 * h);
                for (int g = 0; g < n; g += 2 * h)
                    for (int t = 0; t < h; t++)
                        DifButterfly(re, im, (g + t) * mx + c0, (g + t + h) * mx + c0, width, c[t * step], -s[t * step]);
            }
        }
    }

    /// <summary>Inverse DFT (unscaled) along every column from bit-reversed rows to natural rows; the last stage computes only rows below <paramref name="needed"/> (&lt;= PaddedY/2).</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private void InverseColumns(double[] re, double[] im, int columns, int needed) =>
        Split((columns + _strip - 1) / _strip, (from, to, _) => InverseColumnStrips(re, im, columns, needed, from, to));

    private void InverseColumnStrips(double[] re, double[] im, int columns, int needed, int fromStrip, int toStrip)
    {
        int n = PaddedY, mx = PaddedX, last = n / 2;
        var c = _colCos; var s = _colSin;
        for (int c0 = fromStrip * _strip; c0 < Math.Min(columns, toStrip * _strip); c0 += _strip)
        {
            int width = Math.Min(_strip, columns - c0);
            for (int h = 1; h < last; h <<= 1)
            {
                int step = n / (2 * h);
                for (int g = 0; g < n; g += 2 * h)
                    for (int t = 0; t < h; t++)
                        DitButterfly(re, im, (g + t) * mx + c0, (g + t + h) * mx + c0, width, c[t * step], s[t * step]);
            }
            for (int t = 0; t < Math.Min(needed, last); t++)
                DitHalf(re, im, t * mx + c0, (t + last) * mx + c0, width, c[t], s[t]);
        }
    }

    /// <summary>x[b..] = x[a..] w over a row segment (the forward first stage against a zero half).</summary>
    private static void TwiddleSegment(double[] re, double[] im, int a, int b, int width, double wr, double wi)
    {
        for (int k = 0; k < width; k++)
        {
            double ar = re[a + k], ai = im[a + k];
            re[b + k] = ar * wr - ai * wi; im[b + k] = ar * wi + ai * wr;
        }
    }

    /// <summary>(a, b) := (a + b, (a - b) w) over a row segment, SIMD across columns.</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static void DifButterfly(double[] re, double[] im, int a, int b, int width, double wr, double wi)
    {
        int k = 0, v = Vector<double>.Count;
        if (width >= v)
        {
            var vwr = new Vector<double>(wr); var vwi = new Vector<double>(wi);
            for (; k <= width - v; k += v)
            {
                var ar = new Vector<double>(re, a + k); var ai = new Vector<double>(im, a + k);
                var br = new Vector<double>(re, b + k); var bi = new Vector<double>(im, b + k);
                (ar + br).CopyTo(re, a + k); (ai + bi).CopyTo(im, a + k);
                var xr = ar - br; var xi = ai - bi;
                (xr * vwr - xi * vwi).CopyTo(re, b + k); (xr * vwi + xi * vwr).CopyTo(im, b + k);
            }
        }
        for (; k < width; k++)
        {
            double ar = re[a + k], ai = im[a + k], br = re[b + k], bi = im[b + k];
            re[a + k] = ar + br; im[a + k] = ai + bi;
            double xr = ar - br, xi = ai - bi;
            re[b + k] = xr * wr - xi * wi; im[b + k] = xr * wi + xi * wr;
        }
    }

    /// <summary>(a, b) := (a + w b, a - w b) over a row segment, SIMD across columns.</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static void DitButterfly(double[] re, double[] im, int a, int b, int width, double wr, double wi)
    {
        int k = 0, v = Vector<double>.Count;
        if (width >= v)
        {
            var vwr = new Vector<double>(wr); var vwi = new Vector<double>(wi);
            for (; k <= width - v; k += v)
            {
                var ar = new Vector<double>(re, a + k); var ai = new Vector<double>(im, a + k);
                var br = new Vector<double>(re, b + k); var bi = new Vector<double>(im, b + k);
                var tr = br * vwr - bi * vwi; var ti = br * vwi + bi * vwr;
                (ar + tr).CopyTo(re, a + k); (ai + ti).CopyTo(im, a + k);
                (ar - tr).CopyTo(re, b + k); (ai - ti).CopyTo(im, b + k);
            }
        }
        for (; k < width; k++)
        {
            double br = re[b + k], bi = im[b + k];
            double tr = br * wr - bi * wi, ti = br * wi + bi * wr;
            re[b + k] = re[a + k] - tr; im[b + k] = im[a + k] - ti;
            re[a + k] += tr; im[a + k] += ti;
        }
    }

    /// <summary>a := a + w b over a row segment (the inverse last stage where only the lower half is read back).</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static void DitHalf(double[] re, double[] im, int a, int b, int width, double wr, double wi)
    {
        int k = 0, v = Vector<double>.Count;
        if (width >= v)
        {
            var vwr = new Vector<double>(wr); var vwi = new Vector<double>(wi);
            for (; k <= width - v; k += v)
            {
                var br = new Vector<double>(re, b + k); var bi = new Vector<double>(im, b + k);
                (new Vector<double>(re, a + k) + br * vwr - bi * vwi).CopyTo(re, a + k);
                (new Vector<double>(im, a + k) + br * vwi + bi * vwr).CopyTo(im, a + k);
            }
        }
        for (; k < width; k++)
        {
            double br = re[b + k], bi = im[b + k];
            re[a + k] += br * wr - bi * wi; im[a + k] += br * wi + bi * wr;
        }
    }

    private static (double[] Cos, double[] Sin) Twiddles(int n)
    {
        var cos = new double[Math.Max(1, n / 2)];
        var sin = new double[cos.Length];
        for (int t = 0; t < n / 2; t++) { cos[t] = Math.Cos(2 * Math.PI * t / n); sin[t] = Math.Sin(2 * Math.PI * t / n); }
        return (cos, sin);
    }

    private static (double[] Cos, double[] Sin) StageTwiddles(int n)
    {
        var cos = new double[n];
        var sin = new double[n];
        for (int h = 1; h < n; h <<= 1)
            for (int t = 0; t < h; t++) { cos[h + t] = Math.Cos(Math.PI * t / h); sin[h + t] = Math.Sin(Math.PI * t / h); }
        return (cos, sin);
    }

    private static int[] BitReversal(int n)
    {
        var rev = new int[n];
        for (int i = 0; i < n; i++) rev[i] = ReverseBits(i, n);
        return rev;
    }

    private static int ReverseBits(int i, int n)
    {
        int r = 0;
        for (int m = n >> 1; m > 0; m >>= 1, i >>= 1) r = (r << 1) | (i & 1);
        return r;
    }
}

/// <summary>A kernel's spectrum as stored by the <see cref="PaddedConvolution"/> it was made for (scaled, columns in transform order).</summary>
internal sealed class KernelSpectrum
{
    internal PaddedConvolution Owner { get; }
    internal double[] Re { get; }
    internal double[] Im { get; }

    internal KernelSpectrum(PaddedConvolution owner, double[] re, double[] im)
    {
        Owner = owner; Re = re; Im = im;
    }

    /// <summary>
    /// A new spectrum f(p, q, value) at every frequency (p, q) of the padded lattice (natural indices; value unscaled, as
    /// the plain DFT of the kernel): a multiplier built from this kernel's spectrum, for the same convolution.
    /// </summary>
    public KernelSpectrum Map(Func<int, int, Complex, Complex> f)
    {
        var o = Owner;
        double scale = (double)o.PaddedX * o.PaddedY;
        var re = new double[Re.Length];
        var im = new double[Im.Length];
        for (int i = 0; i < re.Length; i++)
        {
            int natural = o.FrequencyIndex(i);
            var value = f(natural % o.PaddedX, natural / o.PaddedX, new Complex(Re[i], Im[i]) * scale) / scale;
            re[i] = value.Real; im[i] = value.Imaginary;
        }
        return new KernelSpectrum(o, re, im);
    }

    public long Bytes => 8L * (Re.Length + Im.Length);
}
