using System.Numerics;
using System.Runtime.CompilerServices;
using System.Runtime.Intrinsics;

namespace SlotOpt.Numerics;

/// <summary>
/// Linear 2-D convolution of a field on an Nx x Ny lattice with a kernel of offsets |dx| &lt; Nx, |dy| &lt; Ny, by
/// FFT on a lattice zero-padded to PaddedX x PaddedY (each the smallest 2^k or 3 x 2^k at least 2 N, so the circular
/// convolution there is the linear one; or lengths the caller gives, from N up: below 2 N - 1 the convolution is circular,
/// or linear for a kernel even in that direction at 2 N - 2, see <see cref="Spectrum"/>). The field sits in <see cref="Re"/> (and <see cref="Im"/> for a complex
/// field), row-major with row stride PaddedX, in rows 0..Ny-1 and columns 0..Nx-1; write that whole region before
/// each convolution (the rest is never read), read the result from the same region.
/// <para>
/// A length N = f m (f = 1 or 3, m a power of two) is transformed without reordering: forward by decimation in frequency
/// (natural in, scrambled out: for f = 3 a radix-3 stage across the thirds of the sequence, then radix-2 stages within each
/// third), inverse by decimation in time (scrambled in, natural out), its exact mirror (J. W. Cooley, J. W. Tukey, Math. Comp.
/// 19 (1965) 297-301; mixed radices: R. C. Singleton, IEEE Trans. Audio Electroacoust. 17 (1969) 93-103; the DIF/DIT pair
/// without reordering: E. O. Brigham, "The Fast Fourier Transform and its Applications", 1988, ch. 11). Frequency f k + r
/// sits at position r m + bitreverse_m(k). Work saved against a plain 2-D FFT, all exact: the padding is never transformed
/// (zero inputs skip or shorten the first stage, the last inverse stage computes only the rows and columns read back); a
/// 3 x 2^k length where a power of two would be 4/3 as long (the padded area falls by up to 44 %); rows are transformed
/// with SIMD along the row, columns as butterflies over whole row segments (SIMD across columns, in column strips of half the
/// level-2 cache). The kernels are written once over <see cref="ISimdLanes{TSelf}"/>: 512 bits wide where the processor has AVX-512
/// (there a row's three short radix-2 stages also run as 8-point DFTs inside one register), else at the portable Vector&lt;T&gt; width;
/// the two give the same numbers (element-wise IEEE operations, no fused multiply-add), which a test checks bit for bit.
/// A real field (<see cref="ConvolveReal"/>) transforms its rows two at a time as one complex row z = x_a + i x_b and splits
/// them by X_a[k] = (Z[k] + conj Z[-k]) / 2, X_b[k] = (Z[k] - conj Z[-k]) / 2i, then transforms only the PaddedX/2 + 1
/// columns of the Hermitian half (W. H. Press et al., "Numerical Recipes", 3rd ed., 2007, section 12.3): about half the work
/// of a complex field. Spectra keep their columns in natural order and their rows in the transform's order.
/// </para>
/// Buffers are allocated once; a convolution allocates only its workers' delegates. Not thread-safe: one per thread
/// (its own workers, <see cref="Threads"/>, are its business).
/// </summary>
internal sealed class PaddedConvolution
{
    private const double HalfRootThree = 0.86602540378443864676;       // sin(2 pi / 3)

    private readonly int _factorX, _blockX, _factorY, _blockY;       // padded length = factor x block, factor 1 or 3, block a power of two
    private readonly double[] _colCos, _colSin;       // e^{-2 pi i t / N} = cos - i sin, t < N (N = PaddedY)
    private readonly double[] _stageCos, _stageSin;   // rows, radix-2 stage h at [h, 2h): e^{-2 pi i t / 2h} = cos - i sin, t < h
    private readonly double[] _thirdCos, _thirdSin;   // rows, radix-3 stage: e^{-2 pi i r t / N} at (r - 1) m + t, r = 1, 2, t < m
    private readonly int[] _rowPosition;              // natural frequency -> its position in a row transform
    private readonly int[] _rowConjugatePosition;     // natural frequency k -> the position of -k (mod PaddedX) in a row transform
    private readonly double[] _zeroRow;               // PaddedX / 2 + 1 zeros: the missing partner of a real field's last odd row
    private readonly int[] _rowFrequency;             // position in a row transform -> natural frequency
    private readonly int[] _colFrequency;             // row of a spectrum -> natural frequency
    private readonly double[][] _lineRe, _lineIm;     // one row buffer per worker
    private readonly int _strip;
    private static readonly int StripBytes = LevelTwoCacheBytes() / 2;
    private readonly bool _wide;                      // the kernels run on WideLanes (512 bits), else on PortableLanes

    public int Nx { get; }
    public int Ny { get; }
    public int PaddedX { get; }
    public int PaddedY { get; }
    public double[] Re { get; }
    public double[] Im { get; }
    /// <summary>Workers the transforms split their rows and column strips over (1: the calling thread only). Results do not depend on it: every row and column is transformed by the same operations whichever worker takes it.</summary>
    public int Threads { get; }
    /// <summary>Doubles in one SIMD register of the kernels (8 with AVX-512 unless turned off, else <see cref="System.Numerics.Vector{T}.Count"/>). Results do not depend on it.</summary>
    public int Lanes => _wide ? WideLanes.Count : PortableLanes.Count;
    public long Bytes => 8L * (Re.Length + Im.Length + 2L * Threads * PaddedX + _stageCos.Length + _stageSin.Length + _thirdCos.Length + _thirdSin.Length
        + _colCos.Length + _colSin.Length + _zeroRow.Length) + 4L * (_rowPosition.Length + _rowConjugatePosition.Length + _rowFrequency.Length + _colFrequency.Length);

    public PaddedConvolution(int nx, int ny, int threads = 1) : this(nx, ny, PaddedLength(nx), PaddedLength(ny), threads) { }

    /// <summary>
    /// A convolution on a lattice of the given lengths (each 2^k or 3 x 2^k, at least the input region's): below 2 n - 1 the
    /// convolution is circular (the kernel's offsets wrap around), which serves multipliers that need not be exact (a preconditioner's).
    /// </summary>
    /// <param name="wideLanes">run the kernels 512 bits wide where the processor has it (AVX-512); false keeps the portable width (a test
    /// compares the two)</param>
    public PaddedConvolution(int nx, int ny, int paddedX, int paddedY, int threads, bool wideLanes = true)
    {
        if (nx < 1 || ny < 1) throw new ArgumentOutOfRangeException(nameof(nx), "the lattice needs at least one node each way");
        if (threads < 1) throw new ArgumentOutOfRangeException(nameof(threads), "at least one worker");
        if (paddedX < Math.Max(nx, 2) || paddedY < Math.Max(ny, 2) || !Transformable(paddedX) || !Transformable(paddedY))
            throw new ArgumentOutOfRangeException(nameof(paddedX), $"lattice {paddedX} x {paddedY}: each length must be 2^k or 3 x 2^k, at least 2 and the input region's {nx} x {ny}");
        Nx = nx; Ny = ny; Threads = threads;
        PaddedX = paddedX;
        PaddedY = paddedY;
        (_factorX, _blockX) = Factor(PaddedX);
        (_factorY, _blockY) = Factor(PaddedY);
        Re = new double[PaddedX * PaddedY];
        Im = new double[PaddedX * PaddedY];
        (_stageCos, _stageSin) = StageTwiddles(_blockX);
        (_thirdCos, _thirdSin) = ThirdTwiddles(PaddedX, _factorX == 3 ? _blockX : 0);
        (_colCos, _colSin) = Twiddles(PaddedY);
        _rowFrequency = Frequencies(_factorX, _blockX);
        _rowPosition = new int[PaddedX];
        for (int s = 0; s < PaddedX; s++) _rowPosition[_rowFrequency[s]] = s;
        _rowConjugatePosition = Enumerable.Range(0, PaddedX).Select(k => _rowPosition[(PaddedX - k) % PaddedX]).ToArray();
        _zeroRow = new double[PaddedX / 2 + 1];
        _colFrequency = Frequencies(_factorY, _blockY);
        _lineRe = Enumerable.Range(0, threads).Select(_ => new double[PaddedX]).ToArray();
        _lineIm = Enumerable.Range(0, threads).Select(_ => new double[PaddedX]).ToArray();
        _wide = wideLanes && Vector512.IsHardwareAccelerated && WideLanes.Count > PortableLanes.Count;
        // a column strip of both arrays over all rows in half the level-2 cache, whole SIMD vectors wide, and at least one strip a
        // worker in a real field's PaddedX / 2 + 1 columns (measured 2026-12-03, load 15-28 on the 2-core machine, 2 MB level-2 cache: the
        // AC 256^2 convolution on 512 x 512 with 1 MB strips 1.5-1.8 times as fast as with 128 kB ones, which ran 16 columns at a time)
        int width = Math.Max(1, StripBytes / (16 * PaddedY) / Lanes) * Lanes;
        int share = ((PaddedX / 2 + 1 + threads - 1) / threads + Lanes - 1) / Lanes * Lanes;
        _strip = Math.Min(Math.Min(width, share), PaddedX);
    }

    /// <summary>
    /// The level-2 cache of the first processor as Linux reports it (/sys/devices/system/cpu/cpu0/cache/index*/, level 2, size "2048K"),
    /// else 256 kB (the smallest level-2 cache of current x86 and Arm server cores: common practice, no source). It sets only the column
    /// strips' width, never the numbers.
    /// </summary>
    private static int LevelTwoCacheBytes()
    {
        const int Fallback = 256 * 1024;
        try
        {
            foreach (var index in Directory.EnumerateDirectories("/sys/devices/system/cpu/cpu0/cache", "index*"))
            {
                if (File.ReadAllText(Path.Combine(index, "level")).Trim() != "2") continue;
                var size = File.ReadAllText(Path.Combine(index, "size")).Trim();
                int scale = size.EndsWith('K') ? 1024 : size.EndsWith('M') ? 1024 * 1024 : 1;
                return int.TryParse(size.TrimEnd('K', 'M'), out int value) && value > 0 ? (int)Math.Min((long)value * scale, 64L << 20) : Fallback;
            }
        }
        catch (IOException) { }
        catch (UnauthorizedAccessException) { }
        return Fallback;
    }

    /// <summary>The smallest 2^k or 3 x 2^k at least 2 n - 2 (and 2): linear for a kernel even in that direction (see <see cref="Spectrum"/>'s evenInY).</summary>
    public static int EvenPaddedLength(int n) => TransformLength(2 * n - 2);

    /// <summary>The smallest 2^k or 3 x 2^k at least 2 n (so at least 2 n - 1 for the linear convolution, and at least 2).</summary>
    public static int PaddedLength(int n) => TransformLength(2 * n);

    /// <summary>The smallest length this class transforms, 2^k or 3 x 2^k, that is at least <paramref name="atLeast"/> (and at least 2).</summary>
    public static int TransformLength(int atLeast)
    {
        int power = 2, three = 3;
        while (power < atLeast) power <<= 1;
        while (three < atLeast) three <<= 1;
        return Math.Min(power, three);
    }

    private static bool Transformable(int n) => (n & (n - 1)) == 0 || (n % 3 == 0 && ((n / 3) & (n / 3 - 1)) == 0);

    /// <summary>(f, m) with n = f m, f = 1 for a power of two and 3 otherwise.</summary>
    private static (int Factor, int Block) Factor(int n) => (n & (n - 1)) == 0 ? (1, n) : (3, n / 3);

    /// <summary>
    /// The kernel k(dx, dy), |dx| &lt;= kx &lt; Nx, |dy| &lt;= ky &lt; Ny, as the spectrum this convolution multiplies by (its
    /// DFT on the padded lattice in the row order of the transforms, scaled by 1 / (PaddedX PaddedY) for the inverse).
    /// </summary>
    /// <param name="evenInY">the kernel is even in dy (k(dx, -dy) = k(dx, dy)), and a lattice of only 2 ky rows is linear for it: the offsets
    /// -ky and +ky share one row, which must hold k(dx, ky) once (output i and input p with i - p = +-ky take that row's value either way)</param>
    public KernelSpectrum Spectrum(int kx, int ky, Func<int, int, double> kernel, bool evenInY = false)
    {
        if (kx >= Nx || ky >= Ny) throw new ArgumentOutOfRangeException(nameof(kx), "the kernel reaches beyond the lattice");
        int mx = PaddedX, my = PaddedY;
        var re = new double[mx * my];
        var im = new double[mx * my];
        for (int dy = -ky; dy <= ky; dy++)
            for (int dx = -kx; dx <= kx; dx++)
                if (!(evenInY && dy < 0 && dy + my <= ky))   // with evenInY, -dy's row is +dy's own: written once
                    re[((dy % my + my) % my) * mx + (dx % mx + mx) % mx] += kernel(dx, dy);   // wrapped offsets add up on a circular lattice (none wrap when padded)
        if (_wide) ForwardWholeLattice<WideLanes>(re, im); else ForwardWholeLattice<PortableLanes>(re, im);
        double scale = 1.0 / ((double)mx * my);
        for (int i = 0; i < re.Length; i++) { re[i] *= scale; im[i] *= scale; }
        return new KernelSpectrum(this, re, im);
    }

    /// <summary>The DFT of the whole padded lattice in re/im, one worker (a kernel's spectrum, unscaled).</summary>
    private void ForwardWholeLattice<V>(double[] re, double[] im) where V : struct, ISimdLanes<V>
    {
        int mx = PaddedX, my = PaddedY;
        for (int j = 0; j < my; j++)
        {
            ForwardRow<V>(re, im, j * mx, mx);
            RowToNatural(re, im, j * mx, 0);
        }
        ForwardColumns<V>(re, im, mx, my);
    }

    /// <summary>Row-major frequency index (q * PaddedX + p, natural order) of each stored spectrum entry.</summary>
    public int FrequencyIndex(int stored) => _colFrequency[stored / PaddedX] * PaddedX + stored % PaddedX;

    /// <summary>Re + i Im := kernel * (Re + i Im) on the input region.</summary>
    public void ConvolveComplex(KernelSpectrum spectrum)
    {
        Check(spectrum);
        if (_wide) ConvolveComplex<WideLanes>(spectrum); else ConvolveComplex<PortableLanes>(spectrum);
    }

    private void ConvolveComplex<V>(KernelSpectrum spectrum) where V : struct, ISimdLanes<V>
    {
        TransformComplex<V>();
        Multiply<V>(spectrum, PaddedX);
        InverseTransformComplex<V>();
    }

    /// <summary>
    /// Re + i Im := the DFT of the field on the input region (the whole padded lattice, rows in the transforms' order, as a
    /// <see cref="KernelSpectrum"/>), so that sums of products with spectra can be formed before <see cref="InverseTransformComplex"/>.
    /// </summary>
    public void TransformComplex()
    {
        if (_wide) TransformComplex<WideLanes>(); else TransformComplex<PortableLanes>();
    }

    private void TransformComplex<V>() where V : struct, ISimdLanes<V>
    {
        int mx = PaddedX;
        Split(Ny, (from, to, worker) => { for (int j = from; j < to; j++) { ForwardRow<V>(Re, Im, j * mx, Nx); RowToNatural(Re, Im, j * mx, worker); } });
        ForwardColumns<V>(Re, Im, mx, Ny);
    }

    /// <summary>Re + i Im := the unscaled inverse DFT of the whole padded lattice (as <see cref="TransformComplex"/> leaves it), computed on the input region only.</summary>
    public void InverseTransformComplex()
    {
        if (_wide) InverseTransformComplex<WideLanes>(); else InverseTransformComplex<PortableLanes>();
    }

    private void InverseTransformComplex<V>() where V : struct, ISimdLanes<V>
    {
        int mx = PaddedX;
        InverseColumns<V>(Re, Im, mx, Ny);
        Split(Ny, (from, to, worker) => { for (int j = from; j < to; j++) { RowFromNatural(Re, Im, j * mx, worker); InverseRow<V>(Re, Im, j * mx, Nx); } });
    }

    /// <summary>Re := kernel * Re on the input region, for a real field and a real kernel (Im is scratch).</summary>
    public void ConvolveReal(KernelSpectrum spectrum)
    {
        Check(spectrum);
        if (_wide) ConvolveReal<WideLanes>(spectrum); else ConvolveReal<PortableLanes>(spectrum);
    }

    private void ConvolveReal<V>(KernelSpectrum spectrum) where V : struct, ISimdLanes<V>
    {
        int mx = PaddedX, half = mx / 2, columns = half + 1, pairs = (Ny + 1) / 2;
        Split(pairs, (from, to, worker) => ForwardRowPairs<V>(from, to, _lineRe[worker], _lineIm[worker]));
        ForwardColumns<V>(Re, Im, columns, Ny);
        Multiply<V>(spectrum, columns);
        InverseColumns<V>(Re, Im, columns, Ny);
        Split(pairs, (from, to, worker) => InverseRowPairs<V>(from, to, _lineRe[worker], _lineIm[worker]));
    }

    /// <summary>Rows 2p and 2p + 1 (p in [from, to)) of a real field transformed as one complex row and split into their Hermitian halves.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private void ForwardRowPairs<V>(int from, int to, double[] lr, double[] li) where V : struct, ISimdLanes<V>
    {
        int mx = PaddedX, columns = mx / 2 + 1;
        var at = _rowPosition; var atMinus = _rowConjugatePosition;
        for (int a = 2 * from; a < 2 * to; a += 2)
        {
            int b = a + 1;
            bool pair = b < Ny;
            Array.Copy(Re, a * mx, lr, 0, Nx);
            if (pair) Array.Copy(Re, b * mx, li, 0, Nx); else Array.Clear(li, 0, Nx);
            ForwardRow<V>(lr, li, 0, Nx);
            // X_a[k] = (Z[k] + conj Z[-k]) / 2, X_b[k] = (Z[k] - conj Z[-k]) / 2i (Z in the transform's order: Z[k] at at[k], Z[-k] at atMinus[k])
            var ar = Re.AsSpan(a * mx, columns); var ai = Im.AsSpan(a * mx, columns);
            if (pair)
            {
                var br = Re.AsSpan(b * mx, columns); var bi = Im.AsSpan(b * mx, columns);
                for (int k = 0; k < ar.Length; k++)
                {
                    int plus = at[k], minus = atMinus[k];
                    double zr = lr[plus], zi = li[plus], wr = lr[minus], wi = li[minus];
                    ar[k] = 0.5 * (zr + wr); ai[k] = 0.5 * (zi - wi);
                    br[k] = 0.5 * (zi + wi); bi[k] = -0.5 * (zr - wr);
                }
            }
            else
                for (int k = 0; k < ar.Length; k++)
                {
                    int plus = at[k], minus = atMinus[k];
                    ar[k] = 0.5 * (lr[plus] + lr[minus]); ai[k] = 0.5 * (li[plus] - li[minus]);
                }
        }
    }

    /// <summary>Rows 2p and 2p + 1 (p in [from, to)) back from their Hermitian halves by one complex inverse row transform.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private void InverseRowPairs<V>(int from, int to, double[] lr, double[] li) where V : struct, ISimdLanes<V>
    {
        int mx = PaddedX, half = mx / 2, columns = half + 1;
        var at = _rowPosition; var atMinus = _rowConjugatePosition;
        for (int a = 2 * from; a < 2 * to; a += 2)
        {
            int b = a + 1;
            bool pair = b < Ny;
            // Z[k] = X_a[k] + i X_b[k], with X[-k] = conj X[k] for the upper half, put in the transform's order (Z[k] at at[k], Z[-k] at atMinus[k])
            var xa = Re.AsSpan(a * mx, columns); var ya = Im.AsSpan(a * mx, columns);
            var xb = pair ? Re.AsSpan(b * mx, columns) : _zeroRow; var yb = pair ? Im.AsSpan(b * mx, columns) : _zeroRow;
            lr[at[0]] = xa[0] - yb[0]; li[at[0]] = ya[0] + xb[0];
            lr[at[half]] = xa[half] - yb[half]; li[at[half]] = ya[half] + xb[half];
            for (int k = 1; k < half; k++)
            {
                double ar = xa[k], ai = ya[k], br = xb[k], bi = yb[k];
                int plus = at[k], minus = atMinus[k];
                lr[plus] = ar - bi; li[plus] = ai + br;
                lr[minus] = ar + bi; li[minus] = br - ai;
            }
            InverseRow<V>(lr, li, 0, Nx);
            Array.Copy(lr, 0, Re, a * mx, Nx);
            if (pair) Array.Copy(li, 0, Re, b * mx, Nx);
        }
    }

    /// <summary>A spectrum serves every convolution of the same input region and padded lattice (its layout depends on nothing else).</summary>
    private void Check(KernelSpectrum spectrum)
    {
        var o = spectrum.Owner;
        if (!ReferenceEquals(o, this) && (o.Nx != Nx || o.Ny != Ny || o.PaddedX != PaddedX || o.PaddedY != PaddedY))
            throw new ArgumentException("the spectrum belongs to another convolution lattice", nameof(spectrum));
    }

    /// <summary>body(from, to, worker) over [0, count) in Threads contiguous parts, at once when Threads &gt; 1.</summary>
    private void Split(int count, Action<int, int, int> body)
    {
        int parts = Math.Min(Threads, count);
        if (parts <= 1) { body(0, count, 0); return; }
        Parallel.For(0, parts, new ParallelOptions { MaxDegreeOfParallelism = parts }, p => body((int)((long)count * p / parts), (int)((long)count * (p + 1) / parts), p));
    }

    private void Multiply<V>(KernelSpectrum spectrum, int columns) where V : struct, ISimdLanes<V> =>
        Split(PaddedY, (from, to, _) => MultiplyRows<V>(spectrum, columns, from, to));

    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private void MultiplyRows<V>(KernelSpectrum spectrum, int columns, int from, int to) where V : struct, ISimdLanes<V>
    {
        int mx = PaddedX;
        var sr = spectrum.Re; var si = spectrum.Im;
        int v = V.Count;
        for (int q = from; q < to; q++)
        {
            int i = q * mx, e = i + columns;
            for (; i <= e - v; i += v)
            {
                var xr = V.Load(Re, i); var xi = V.Load(Im, i);
                var yr = V.Load(sr, i); var yi = V.Load(si, i);
                (xr * yr - xi * yi).Store(Re, i);
                (xr * yi + xi * yr).Store(Im, i);
            }
            for (; i < e; i++)
            {
                double xr = Re[i], xi = Im[i];
                Re[i] = xr * sr[i] - xi * si[i];
                Im[i] = xr * si[i] + xi * sr[i];
            }
        }
    }

    /// <summary>Forward DFT of the row at re/im[o .. o + PaddedX), natural in, the transform's order out; entries from <paramref name="nonzero"/> on are taken as zero (any count; below N/2 the first stage is shortened).</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private void ForwardRow<V>(double[] re, double[] im, int o, int nonzero) where V : struct, ISimdLanes<V>
    {
        int n = PaddedX, m = _blockX;
        var c = _stageCos; var s = _stageSin;
        if (_factorX == 3)
        {
            if (nonzero < n) { Array.Clear(re, o + nonzero, n - nonzero); Array.Clear(im, o + nonzero, n - nonzero); }
            ForwardThirdsRow<V>(re, im, o, m);
            for (int block = o; block < o + n; block += m) DifRowStages<V>(re, im, block, m, m / 2, c, s);
            return;
        }
        int h = n / 2;
        if (nonzero <= h)
        {
            // first stage with a zero upper half: a' = a, b' = a w^t
            Twiddle<V>(re, im, o, o + h, nonzero, c, s, h);
            Array.Clear(re, o + nonzero, h - nonzero); Array.Clear(im, o + nonzero, h - nonzero);
            Array.Clear(re, o + h + nonzero, h - nonzero); Array.Clear(im, o + h + nonzero, h - nonzero);
            h >>= 1;
        }
        else if (nonzero < n) { Array.Clear(re, o + nonzero, n - nonzero); Array.Clear(im, o + nonzero, n - nonzero); }   // a circular lattice
        DifRowStages<V>(re, im, o, n, h, c, s);
    }

    /// <summary>Inverse DFT (unscaled) of the row at re/im[o ..), the transform's order in, natural out; only entries below <paramref name="needed"/> are computed in the last stage when that is at most N/2.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private void InverseRow<V>(double[] re, double[] im, int o, int needed) where V : struct, ISimdLanes<V>
    {
        int n = PaddedX, m = _blockX;
        var c = _stageCos; var s = _stageSin;
        if (_factorX == 3)
        {
            for (int block = o; block < o + n; block += m) DitRowStages<V>(re, im, block, m, m, c, s);
            InverseThirdsRow<V>(re, im, o, m, needed);
            return;
        }
        int last = n / 2;
        if (needed > last) { DitRowStages<V>(re, im, o, n, n, c, s); return; }   // a circular lattice reads back more than half
        DitRowStages<V>(re, im, o, n, last, c, s);
        DitRowHalf<V>(re, im, o, o + last, needed, c, s, last);
    }

    /// <summary>Radix-2 decimation-in-frequency stages h, h/2, .., 1 over the sequence at [o, o + length).</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static void DifRowStages<V>(double[] re, double[] im, int o, int length, int h, double[] c, double[] s) where V : struct, ISimdLanes<V>
    {
        bool inRegister = EightPointsInRegister<V>() && h >= 4;
        for (; h >= (inRegister ? 8 : 1); h >>= 1)
            for (int g = o; g < o + length; g += 2 * h) DifRowButterflies<V>(re, im, g, g + h, h, c, s);
        if (inRegister) DifLastThreeStagesInRegister(re, im, o, length, c, s);
    }

    /// <summary>Radix-2 decimation-in-time stages 1, 2, .., below <paramref name="below"/> over the sequence at [o, o + length).</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static void DitRowStages<V>(double[] re, double[] im, int o, int length, int below, double[] c, double[] s) where V : struct, ISimdLanes<V>
    {
        int h = 1;
        if (EightPointsInRegister<V>() && below > 4) { DitFirstThreeStagesInRegister(re, im, o, length, c, s); h = 8; }
        for (; h < below; h <<= 1)
            for (int g = o; g < o + length; g += 2 * h) DitRowButterflies<V>(re, im, g, g + h, h, c, s);
    }

    /// <summary>
    /// The wide path (AVX-512) takes a row's three radix-2 stages of half-length 4, 2 and 1 together, each group of 8 points in one 512-bit
    /// register (lanes exchanged by permutes), where the butterfly loops would run them 4 and then 1 point at a time.
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static bool EightPointsInRegister<V>() where V : struct, ISimdLanes<V> => V.Count >= 8 && Vector512.IsHardwareAccelerated;

    private static readonly Vector512<long> SwapFours = Vector512.Create(4L, 5, 6, 7, 0, 1, 2, 3), SwapTwos = Vector512.Create(2L, 3, 0, 1, 6, 7, 4, 5),
        SwapOnes = Vector512.Create(1L, 0, 3, 2, 5, 4, 7, 6);
    private static readonly Vector512<double> MinusUpperFour = Vector512.Create(1.0, 1, 1, 1, -1, -1, -1, -1), MinusUpperTwos = Vector512.Create(1.0, 1, -1, -1, 1, 1, -1, -1),
        MinusOdd = Vector512.Create(1.0, -1, 1, -1, 1, -1, 1, -1);

    /// <summary>
    /// The forward stages h = 4, 2, 1 of <see cref="DifRowButterflies"/> on each group of 8 at [o, o + length), in a register: the same sums,
    /// differences and twiddle products lane by lane (a = x_t + x_{t+h} as x_{t+h} + x_t, b = x_t - x_{t+h} as x_t + (-1) x_{t+h}, exact;
    /// the sums also times w = 1 + 0i and stage 1 not times its w = 1 + 0i, exact: so the butterflies' numbers, signed zeros aside).
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static void DifLastThreeStagesInRegister(double[] re, double[] im, int o, int length, double[] c, double[] s)
    {
        var w4r = Vector512.Create(1.0, 1, 1, 1, c[4], c[5], c[6], c[7]); var w4i = Vector512.Create(0.0, 0, 0, 0, -s[4], -s[5], -s[6], -s[7]);   // e^{-2 pi i t / 8}
        var w2r = Vector512.Create(1.0, 1, c[2], c[3], 1, 1, c[2], c[3]); var w2i = Vector512.Create(0.0, 0, -s[2], -s[3], 0, 0, -s[2], -s[3]); // e^{-2 pi i t / 4}
        for (int g = o; g < o + length; g += 8)
        {
            var xr = Vector512.Create(re, g); var xi = Vector512.Create(im, g);
            var yr = Vector512.Shuffle(xr, SwapFours) + MinusUpperFour * xr; var yi = Vector512.Shuffle(xi, SwapFours) + MinusUpperFour * xi;
            xr = yr * w4r - yi * w4i; xi = yr * w4i + yi * w4r;
            yr = Vector512.Shuffle(xr, SwapTwos) + MinusUpperTwos * xr; yi = Vector512.Shuffle(xi, SwapTwos) + MinusUpperTwos * xi;
            xr = yr * w2r - yi * w2i; xi = yr * w2i + yi * w2r;
            (Vector512.Shuffle(xr, SwapOnes) + MinusOdd * xr).CopyTo(re, g); (Vector512.Shuffle(xi, SwapOnes) + MinusOdd * xi).CopyTo(im, g);
        }
    }

    /// <summary>
    /// The inverse stages h = 1, 2, 4 of <see cref="DitRowButterflies"/> on each group of 8 at [o, o + length), in a register (the mirror of
    /// <see cref="DifLastThreeStagesInRegister"/>: stage 1's w = 1 + 0i not applied, stages 2 and 4 twiddle their upper lanes by e^{+2 pi i t / 2h}).
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static void DitFirstThreeStagesInRegister(double[] re, double[] im, int o, int length, double[] c, double[] s)
    {
        var w2r = Vector512.Create(1.0, 1, c[2], c[3], 1, 1, c[2], c[3]); var w2i = Vector512.Create(0.0, 0, s[2], s[3], 0, 0, s[2], s[3]);
        var w4r = Vector512.Create(1.0, 1, 1, 1, c[4], c[5], c[6], c[7]); var w4i = Vector512.Create(0.0, 0, 0, 0, s[4], s[5], s[6], s[7]);
        for (int g = o; g < o + length; g += 8)
        {
            var xr = Vector512.Create(re, g); var xi = Vector512.Create(im, g);
            var yr = Vector512.Shuffle(xr, SwapOnes) + MinusOdd * xr; var yi = Vector512.Shuffle(xi, SwapOnes) + MinusOdd * xi;
            xr = yr * w2r - yi * w2i; xi = yr * w2i + yi * w2r;
            yr = Vector512.Shuffle(xr, SwapTwos) + MinusUpperTwos * xr; yi = Vector512.Shuffle(xi, SwapTwos) + MinusUpperTwos * xi;
            xr = yr * w4r - yi * w4i; xi = yr * w4i + yi * w4r;
            (Vector512.Shuffle(xr, SwapFours) + MinusUpperFour * xr).CopyTo(re, g); (Vector512.Shuffle(xi, SwapFours) + MinusUpperFour * xi).CopyTo(im, g);
        }
    }

    /// <summary>The row at o from the transform's order to natural order (the worker's line buffer as scratch).</summary>
    private void RowToNatural(double[] re, double[] im, int o, int worker)
    {
        var sr = _lineRe[worker]; var si = _lineIm[worker];
        Array.Copy(re, o, sr, 0, PaddedX); Array.Copy(im, o, si, 0, PaddedX);
        var frequency = _rowFrequency;
        for (int p = 0; p < frequency.Length; p++) { re[o + frequency[p]] = sr[p]; im[o + frequency[p]] = si[p]; }
    }

    /// <summary>The row at o from natural order to the transform's order (the worker's line buffer as scratch).</summary>
    private void RowFromNatural(double[] re, double[] im, int o, int worker)
    {
        var sr = _lineRe[worker]; var si = _lineIm[worker];
        Array.Copy(re, o, sr, 0, PaddedX); Array.Copy(im, o, si, 0, PaddedX);
        var frequency = _rowFrequency;
        for (int p = 0; p < frequency.Length; p++) { re[o + p] = sr[frequency[p]]; im[o + p] = si[frequency[p]]; }
    }

    /// <summary>
    /// The forward radix-3 stage over the thirds of the row at o (third m long): y_r = sum_j x[t + j m] e^{-2 pi i j r / 3}, stored
    /// times e^{-2 pi i r t / N} at t + r m, so each third's length-m DFT gives X[3 k + r]; SIMD along the row.
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private void ForwardThirdsRow<V>(double[] re, double[] im, int o, int m) where V : struct, ISimdLanes<V>
    {
        if (V.Count > PortableLanes.Count && m < V.Count) { ForwardThirdsRow<PortableLanes>(re, im, o, m); return; }   // shorter than a wide register: the portable width
        var c = _thirdCos; var s = _thirdSin;
        int t = 0, v = V.Count;
        if (m >= v)
        {
            var half = V.Broadcast(0.5); var root = V.Broadcast(HalfRootThree);
            for (; t <= m - v; t += v)
            {
                int a = o + t, b = a + m, d = b + m;
                var ar = V.Load(re, a); var ai = V.Load(im, a);
                var sr = V.Load(re, b) + V.Load(re, d); var si = V.Load(im, b) + V.Load(im, d);
                var dr = root * (V.Load(re, b) - V.Load(re, d)); var di = root * (V.Load(im, b) - V.Load(im, d));
                var tr = ar - half * sr; var ti = ai - half * si;
                (ar + sr).Store(re, a); (ai + si).Store(im, a);
                var yr = tr + di; var yi = ti - dr;                      // y1 = t - i (sqrt 3 / 2)(b - c)
                var wr = V.Load(c, t); var wi = -V.Load(s, t);
                (yr * wr - yi * wi).Store(re, b); (yr * wi + yi * wr).Store(im, b);
                yr = tr - di; yi = ti + dr;                              // y2 = t + i (sqrt 3 / 2)(b - c)
                wr = V.Load(c, m + t); wi = -V.Load(s, m + t);
                (yr * wr - yi * wi).Store(re, d); (yr * wi + yi * wr).Store(im, d);
            }
        }
        for (; t < m; t++)
        {
            int a = o + t, b = a + m, d = b + m;
            double ar = re[a], ai = im[a];
            double sr = re[b] + re[d], si = im[b] + im[d], dr = HalfRootThree * (re[b] - re[d]), di = HalfRootThree * (im[b] - im[d]);
            double tr = ar - 0.5 * sr, ti = ai - 0.5 * si;
            re[a] = ar + sr; im[a] = ai + si;
            double yr = tr + di, yi = ti - dr, wr = c[t], wi = -s[t];
            re[b] = yr * wr - yi * wi; im[b] = yr * wi + yi * wr;
            yr = tr - di; yi = ti + dr; wr = c[m + t]; wi = -s[m + t];
            re[d] = yr * wr - yi * wi; im[d] = yr * wi + yi * wr;
        }
    }

    /// <summary>
    /// The inverse radix-3 stage, the mirror of <see cref="ForwardThirdsRow"/>: with b' = Y_1[t] e^{2 pi i t / N}, c' = Y_2[t] e^{4 pi i t / N},
    /// x[t + j m] = Y_0[t] + b' e^{2 pi i j / 3} + c' e^{4 pi i j / 3}, computed only below <paramref name="needed"/>.
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private void InverseThirdsRow<V>(double[] re, double[] im, int o, int m, int needed) where V : struct, ISimdLanes<V>
    {
        if (V.Count > PortableLanes.Count && Math.Min(m, needed) < V.Count) { InverseThirdsRow<PortableLanes>(re, im, o, m, needed); return; }   // shorter than a wide register: the portable width
        var c = _thirdCos; var s = _thirdSin;
        int count = Math.Min(m, needed), t = 0, v = V.Count;
        var half = V.Broadcast(0.5); var root = V.Broadcast(HalfRootThree);
        for (; t <= count - v; t += v)
        {
            int a = o + t, b = a + m, d = b + m;
            var xr = V.Load(re, b); var xi = V.Load(im, b);
            var wr = V.Load(c, t); var wi = V.Load(s, t);
            var br = xr * wr - xi * wi; var bi = xr * wi + xi * wr;
            xr = V.Load(re, d); xi = V.Load(im, d);
            wr = V.Load(c, m + t); wi = V.Load(s, m + t);
            var cr = xr * wr - xi * wi; var ci = xr * wi + xi * wr;
            var ar = V.Load(re, a); var ai = V.Load(im, a);
            var sr = br + cr; var si = bi + ci; var dr = root * (br - cr); var di = root * (bi - ci);
            var tr = ar - half * sr; var ti = ai - half * si;
            (ar + sr).Store(re, a); (ai + si).Store(im, a);
            if (t + v + m <= needed) { (tr - di).Store(re, b); (ti + dr).Store(im, b); }
            else
                for (int k = 0; k < v && t + k + m < needed; k++) { re[b + k] = tr[k] - di[k]; im[b + k] = ti[k] + dr[k]; }
            if (t + 2 * m < needed)
                for (int k = 0; k < v && t + k + 2 * m < needed; k++) { re[d + k] = tr[k] + di[k]; im[d + k] = ti[k] - dr[k]; }
        }
        for (; t < count; t++)
        {
            int a = o + t, b = a + m, d = b + m;
            double br = re[b] * c[t] - im[b] * s[t], bi = re[b] * s[t] + im[b] * c[t];
            double cr = re[d] * c[m + t] - im[d] * s[m + t], ci = re[d] * s[m + t] + im[d] * c[m + t];
            double ar = re[a], ai = im[a];
            double sr = br + cr, si = bi + ci, dr = HalfRootThree * (br - cr), di = HalfRootThree * (bi - ci);
            double tr = ar - 0.5 * sr, ti = ai - 0.5 * si;
            re[a] = ar + sr; im[a] = ai + si;
            if (t + m < needed) { re[b] = tr - di; im[b] = ti + dr; }      // x[t + m] = t + i (sqrt 3 / 2)(b' - c')
            if (t + 2 * m < needed) { re[d] = tr + di; im[d] = ti - dr; }  // x[t + 2m] = t - i (sqrt 3 / 2)(b' - c')
        }
    }

    /// <summary>x[b + t] = x[a + t] w_t for t &lt; count, w_t = e^{-2 pi i t / 2h} from the stage table (the forward first stage against a zero half), SIMD along the row.</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static void Twiddle<V>(double[] re, double[] im, int a, int b, int count, double[] c, double[] s, int h) where V : struct, ISimdLanes<V>
    {
        if (V.Count > PortableLanes.Count && count < V.Count) { Twiddle<PortableLanes>(re, im, a, b, count, c, s, h); return; }   // shorter than a wide register: the portable width
        int t = 0, v = V.Count;
        for (; t <= count - v; t += v)
        {
            var ar = V.Load(re, a + t); var ai = V.Load(im, a + t);
            var wr = V.Load(c, h + t); var wi = -V.Load(s, h + t);
            (ar * wr - ai * wi).Store(re, b + t); (ar * wi + ai * wr).Store(im, b + t);
        }
        for (; t < count; t++)
        {
            double ar = re[a + t], ai = im[a + t], wr = c[h + t], wi = -s[h + t];
            re[b + t] = ar * wr - ai * wi; im[b + t] = ar * wi + ai * wr;
        }
    }

    /// <summary>For t &lt; h: (x[a + t], x[b + t]) := (sum, (difference) e^{-2 pi i t / 2h}), SIMD along the row where h allows.</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static void DifRowButterflies<V>(double[] re, double[] im, int a, int b, int h, double[] c, double[] s) where V : struct, ISimdLanes<V>
    {
        if (V.Count > PortableLanes.Count && h < V.Count) { DifRowButterflies<PortableLanes>(re, im, a, b, h, c, s); return; }   // shorter than a wide register: the portable width
        int t = 0, v = V.Count;
        if (h >= v)
            for (; t <= h - v; t += v)
            {
                var ar = V.Load(re, a + t); var ai = V.Load(im, a + t);
                var br = V.Load(re, b + t); var bi = V.Load(im, b + t);
                var wr = V.Load(c, h + t); var wi = -V.Load(s, h + t);
                (ar + br).Store(re, a + t); (ai + bi).Store(im, a + t);
                var xr = ar - br; var xi = ai - bi;
                (xr * wr - xi * wi).Store(re, b + t); (xr * wi + xi * wr).Store(im, b + t);
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
    private static void DitRowButterflies<V>(double[] re, double[] im, int a, int b, int h, double[] c, double[] s) where V : struct, ISimdLanes<V>
    {
        if (V.Count > PortableLanes.Count && h < V.Count) { DitRowButterflies<PortableLanes>(re, im, a, b, h, c, s); return; }   // shorter than a wide register: the portable width
        int t = 0, v = V.Count;
        if (h >= v)
            for (; t <= h - v; t += v)
            {
                var ar = V.Load(re, a + t); var ai = V.Load(im, a + t);
                var br = V.Load(re, b + t); var bi = V.Load(im, b + t);
                var wr = V.Load(c, h + t); var wi = V.Load(s, h + t);
                var tr = br * wr - bi * wi; var ti = br * wi + bi * wr;
                (ar + tr).Store(re, a + t); (ai + ti).Store(im, a + t);
                (ar - tr).Store(re, b + t); (ai - ti).Store(im, b + t);
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
    private static void DitRowHalf<V>(double[] re, double[] im, int a, int b, int count, double[] c, double[] s, int h) where V : struct, ISimdLanes<V>
    {
        if (V.Count > PortableLanes.Count && count < V.Count) { DitRowHalf<PortableLanes>(re, im, a, b, count, c, s, h); return; }   // shorter than a wide register: the portable width
        int t = 0, v = V.Count;
        for (; t <= count - v; t += v)
        {
            var br = V.Load(re, b + t); var bi = V.Load(im, b + t);
            var wr = V.Load(c, h + t); var wi = V.Load(s, h + t);
            (V.Load(re, a + t) + br * wr - bi * wi).Store(re, a + t);
            (V.Load(im, a + t) + br * wi + bi * wr).Store(im, a + t);
        }
        for (; t < count; t++)
        {
            double br = re[b + t], bi = im[b + t], wr = c[h + t], wi = s[h + t];
            re[a + t] += br * wr - bi * wi; im[a + t] += br * wi + bi * wr;
        }
    }

    /// <summary>
    /// Forward DFT along every column (first <paramref name="columns"/> of each row), decimation in frequency, output rows
    /// in the transform's order; rows from <paramref name="nonzero"/> on are taken as zero (any count; below PaddedY/2 the first stage is shortened).
    /// </summary>
    private void ForwardColumns<V>(double[] re, double[] im, int columns, int nonzero) where V : struct, ISimdLanes<V> =>
        Split((columns + _strip - 1) / _strip, (from, to, _) => ForwardColumnStrips<V>(re, im, columns, nonzero, from, to));

    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private void ForwardColumnStrips<V>(double[] re, double[] im, int columns, int nonzero, int fromStrip, int toStrip) where V : struct, ISimdLanes<V>
    {
        int n = PaddedY, mx = PaddedX, m = _blockY;
        var c = _colCos; var s = _colSin;
        for (int c0 = fromStrip * _strip; c0 < Math.Min(columns, toStrip * _strip); c0 += _strip)
        {
            int width = Math.Min(_strip, columns - c0);
            if (_factorY == 3)
            {
                for (int t = 0; t < m; t++)
                {
                    int a = t * mx + c0, b = (t + m) * mx + c0, d = (t + 2 * m) * mx + c0;
                    if (t + m >= nonzero) { Array.Clear(re, b, width); Array.Clear(im, b, width); }
                    if (t + 2 * m >= nonzero) { Array.Clear(re, d, width); Array.Clear(im, d, width); }
                    if (t >= nonzero) { Array.Clear(re, a, width); Array.Clear(im, a, width); }
                    ForwardThirdsSegment<V>(re, im, a, b, d, width, c[t], -s[t], c[2 * t], -s[2 * t]);
                }
                for (int block = 0; block < n; block += m) DifColumnStages<V>(re, im, c0, width, block, m, m / 2);
                continue;
            }
            int h = n / 2;
            if (nonzero <= h)
            {
                for (int t = 0; t < h; t++)
                {
                    int a = t * mx + c0, b = (t + h) * mx + c0;
                    if (t < nonzero) TwiddleSegment<V>(re, im, a, b, width, c[t], -s[t]);
                    else { Array.Clear(re, a, width); Array.Clear(im, a, width); Array.Clear(re, b, width); Array.Clear(im, b, width); }
                }
                h >>= 1;
            }
            else
                for (int t = nonzero; t < n; t++) { Array.Clear(re, t * mx + c0, width); Array.Clear(im, t * mx + c0, width); }   // a circular lattice
            DifColumnStages<V>(re, im, c0, width, 0, n, h);
        }
    }

    /// <summary>
    /// Radix-2 decimation-in-frequency stages h, h/2, .., 1 down the rows [first, first + length) of one column strip, two stages
    /// a pass where two remain (the same butterflies on each element in the same order, so the same numbers, with half the loads and stores).
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private void DifColumnStages<V>(double[] re, double[] im, int c0, int width, int first, int length, int h) where V : struct, ISimdLanes<V>
    {
        int n = PaddedY, mx = PaddedX;
        var c = _colCos; var s = _colSin;
        for (; h >= 2; h >>= 2)
        {
            int step = n / (2 * h), q = h / 2;
            for (int g = first; g < first + length; g += 2 * h)
                for (int t = 0; t < q; t++)
                {
                    int r0 = (g + t) * mx + c0, r1 = r0 + q * mx, r2 = r1 + q * mx, r3 = r2 + q * mx;
                    DifButterflyPair<V>(re, im, r0, r1, r2, r3, width, c[t * step], -s[t * step], c[(t + q) * step], -s[(t + q) * step], c[2 * t * step], -s[2 * t * step]);
                }
        }
        if (h == 1)
            for (int g = first; g < first + length; g += 2)
                DifButterfly<V>(re, im, g * mx + c0, (g + 1) * mx + c0, width, c[0], -s[0]);
    }

    /// <summary>Inverse DFT (unscaled) along every column from the transform's row order to natural rows; the last stage computes only rows below <paramref name="needed"/> when that is at most PaddedY/2.</summary>
    private void InverseColumns<V>(double[] re, double[] im, int columns, int needed) where V : struct, ISimdLanes<V> =>
        Split((columns + _strip - 1) / _strip, (from, to, _) => InverseColumnStrips<V>(re, im, columns, needed, from, to));

    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private void InverseColumnStrips<V>(double[] re, double[] im, int columns, int needed, int fromStrip, int toStrip) where V : struct, ISimdLanes<V>
    {
        int n = PaddedY, mx = PaddedX, m = _blockY;
        var c = _colCos; var s = _colSin;
        for (int c0 = fromStrip * _strip; c0 < Math.Min(columns, toStrip * _strip); c0 += _strip)
        {
            int width = Math.Min(_strip, columns - c0);
            if (_factorY == 3)
            {
                for (int block = 0; block < n; block += m) DitColumnStages<V>(re, im, c0, width, block, m, m);
                for (int t = 0; t < Math.Min(m, needed); t++)
                    InverseThirdsSegment<V>(re, im, t * mx + c0, (t + m) * mx + c0, (t + 2 * m) * mx + c0, width, c[t], s[t], c[2 * t], s[2 * t],
                        t + m < needed, t + 2 * m < needed);
                continue;
            }
            int last = n / 2;
            if (needed > last) { DitColumnStages<V>(re, im, c0, width, 0, n, n); continue; }   // a circular lattice reads back more than half
            DitColumnStages<V>(re, im, c0, width, 0, n, last);
            for (int t = 0; t < needed; t++)
                DitHalf<V>(re, im, t * mx + c0, (t + last) * mx + c0, width, c[t], s[t]);
        }
    }

    /// <summary>
    /// Radix-2 decimation-in-time stages 1, 2, .., below <paramref name="below"/> down the rows [first, first + length) of one column
    /// strip, two stages a pass where two remain (the mirror of <see cref="DifColumnStages"/>: the same numbers as one stage a pass).
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private void DitColumnStages<V>(double[] re, double[] im, int c0, int width, int first, int length, int below) where V : struct, ISimdLanes<V>
    {
        int n = PaddedY, mx = PaddedX;
        var c = _colCos; var s = _colSin;
        int h = 1;
        for (; 2 * h < below; h <<= 2)
        {
            int inner = n / (2 * h), outer = n / (4 * h);
            for (int g = first; g < first + length; g += 4 * h)
                for (int t = 0; t < h; t++)
                {
                    int r0 = (g + t) * mx + c0, r1 = r0 + h * mx, r2 = r1 + h * mx, r3 = r2 + h * mx;
                    DitButterflyPair<V>(re, im, r0, r1, r2, r3, width, c[t * inner], s[t * inner], c[t * outer], s[t * outer], c[(t + h) * outer], s[(t + h) * outer]);
                }
        }
        if (h < below)
        {
            int step = n / (2 * h);
            for (int g = first; g < first + length; g += 2 * h)
                for (int t = 0; t < h; t++)
                    DitButterfly<V>(re, im, (g + t) * mx + c0, (g + t + h) * mx + c0, width, c[t * step], s[t * step]);
        }
    }

    /// <summary>The forward radix-3 butterfly over three row segments (as <see cref="ForwardThirdsRow"/>, twiddles w1 on b, w2 on d), SIMD across columns.</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining | MethodImplOptions.AggressiveOptimization)]   // too large to inline: compiled optimised at once
    private static void ForwardThirdsSegment<V>(double[] re, double[] im, int a, int b, int d, int width, double w1r, double w1i, double w2r, double w2i) where V : struct, ISimdLanes<V>
    {
        int k = 0, v = V.Count;
        if (width >= v)
        {
            var half = V.Broadcast(0.5); var root = V.Broadcast(HalfRootThree);
            var v1r = V.Broadcast(w1r); var v1i = V.Broadcast(w1i); var v2r = V.Broadcast(w2r); var v2i = V.Broadcast(w2i);
            for (; k <= width - v; k += v)
            {
                var ar = V.Load(re, a + k); var ai = V.Load(im, a + k);
                var br = V.Load(re, b + k); var bi = V.Load(im, b + k);
                var xr = V.Load(re, d + k); var xi = V.Load(im, d + k);
                var sr = br + xr; var si = bi + xi; var dr = root * (br - xr); var di = root * (bi - xi);
                var tr = ar - half * sr; var ti = ai - half * si;
                (ar + sr).Store(re, a + k); (ai + si).Store(im, a + k);
                var yr = tr + di; var yi = ti - dr;
                (yr * v1r - yi * v1i).Store(re, b + k); (yr * v1i + yi * v1r).Store(im, b + k);
                yr = tr - di; yi = ti + dr;
                (yr * v2r - yi * v2i).Store(re, d + k); (yr * v2i + yi * v2r).Store(im, d + k);
            }
        }
        for (; k < width; k++)
        {
            double ar = re[a + k], ai = im[a + k];
            double sr = re[b + k] + re[d + k], si = im[b + k] + im[d + k], dr = HalfRootThree * (re[b + k] - re[d + k]), di = HalfRootThree * (im[b + k] - im[d + k]);
            double tr = ar - 0.5 * sr, ti = ai - 0.5 * si;
            re[a + k] = ar + sr; im[a + k] = ai + si;
            double yr = tr + di, yi = ti - dr;
            re[b + k] = yr * w1r - yi * w1i; im[b + k] = yr * w1i + yi * w1r;
            yr = tr - di; yi = ti + dr;
            re[d + k] = yr * w2r - yi * w2i; im[d + k] = yr * w2i + yi * w2r;
        }
    }

    /// <summary>The inverse radix-3 butterfly over three row segments (as <see cref="InverseThirdsRow"/>, twiddles w1 on b, w2 on d), writing b and d only where read back.</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining | MethodImplOptions.AggressiveOptimization)]   // too large to inline: compiled optimised at once
    private static void InverseThirdsSegment<V>(double[] re, double[] im, int a, int b, int d, int width, double w1r, double w1i, double w2r, double w2i, bool writeB, bool writeD) where V : struct, ISimdLanes<V>
    {
        int k = 0, v = V.Count;
        if (width >= v)
        {
            var half = V.Broadcast(0.5); var root = V.Broadcast(HalfRootThree);
            var v1r = V.Broadcast(w1r); var v1i = V.Broadcast(w1i); var v2r = V.Broadcast(w2r); var v2i = V.Broadcast(w2i);
            for (; k <= width - v; k += v)
            {
                var xr = V.Load(re, b + k); var xi = V.Load(im, b + k);
                var br = xr * v1r - xi * v1i; var bi = xr * v1i + xi * v1r;
                xr = V.Load(re, d + k); xi = V.Load(im, d + k);
                var cr = xr * v2r - xi * v2i; var ci = xr * v2i + xi * v2r;
                var ar = V.Load(re, a + k); var ai = V.Load(im, a + k);
                var sr = br + cr; var si = bi + ci; var dr = root * (br - cr); var di = root * (bi - ci);
                var tr = ar - half * sr; var ti = ai - half * si;
                (ar + sr).Store(re, a + k); (ai + si).Store(im, a + k);
                if (writeB) { (tr - di).Store(re, b + k); (ti + dr).Store(im, b + k); }
                if (writeD) { (tr + di).Store(re, d + k); (ti - dr).Store(im, d + k); }
            }
        }
        for (; k < width; k++)
        {
            double br = re[b + k] * w1r - im[b + k] * w1i, bi = re[b + k] * w1i + im[b + k] * w1r;
            double cr = re[d + k] * w2r - im[d + k] * w2i, ci = re[d + k] * w2i + im[d + k] * w2r;
            double ar = re[a + k], ai = im[a + k];
            double sr = br + cr, si = bi + ci, dr = HalfRootThree * (br - cr), di = HalfRootThree * (bi - ci);
            double tr = ar - 0.5 * sr, ti = ai - 0.5 * si;
            re[a + k] = ar + sr; im[a + k] = ai + si;
            if (writeB) { re[b + k] = tr - di; im[b + k] = ti + dr; }
            if (writeD) { re[d + k] = tr + di; im[d + k] = ti - dr; }
        }
    }

    /// <summary>x[b..] = x[a..] w over a row segment (the forward first stage against a zero half).</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static void TwiddleSegment<V>(double[] re, double[] im, int a, int b, int width, double wr, double wi) where V : struct, ISimdLanes<V>
    {
        int k = 0, v = V.Count;
        if (width >= v)
        {
            var vwr = V.Broadcast(wr); var vwi = V.Broadcast(wi);
            for (; k <= width - v; k += v)
            {
                var ar = V.Load(re, a + k); var ai = V.Load(im, a + k);
                (ar * vwr - ai * vwi).Store(re, b + k); (ar * vwi + ai * vwr).Store(im, b + k);
            }
        }
        for (; k < width; k++)
        {
            double ar = re[a + k], ai = im[a + k];
            re[b + k] = ar * wr - ai * wi; im[b + k] = ar * wi + ai * wr;
        }
    }

    /// <summary>
    /// Two decimation-in-frequency stages on rows r0..r3 (a quarter of the group apart): (r0, r2) with w1 and (r1, r3) with w2, then
    /// (r0, r1) and (r2, r3) with w3, each pair as <see cref="DifButterfly"/>; SIMD across columns.
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining | MethodImplOptions.AggressiveOptimization)]   // too large to inline: compiled optimised at once
    private static void DifButterflyPair<V>(double[] re, double[] im, int r0, int r1, int r2, int r3, int width,
        double w1r, double w1i, double w2r, double w2i, double w3r, double w3i) where V : struct, ISimdLanes<V>
    {
        int k = 0, v = V.Count;
        if (width >= v)
        {
            var a1r = V.Broadcast(w1r); var a1i = V.Broadcast(w1i);
            var a2r = V.Broadcast(w2r); var a2i = V.Broadcast(w2i);
            var a3r = V.Broadcast(w3r); var a3i = V.Broadcast(w3i);
            for (; k <= width - v; k += v)
            {
                var x0r = V.Load(re, r0 + k); var x0i = V.Load(im, r0 + k);
                var x1r = V.Load(re, r1 + k); var x1i = V.Load(im, r1 + k);
                var x2r = V.Load(re, r2 + k); var x2i = V.Load(im, r2 + k);
                var x3r = V.Load(re, r3 + k); var x3i = V.Load(im, r3 + k);
                var dr = x0r - x2r; var di = x0i - x2i;
                var y0r = x0r + x2r; var y0i = x0i + x2i;
                var y2r = dr * a1r - di * a1i; var y2i = dr * a1i + di * a1r;
                dr = x1r - x3r; di = x1i - x3i;
                var y1r = x1r + x3r; var y1i = x1i + x3i;
                var y3r = dr * a2r - di * a2i; var y3i = dr * a2i + di * a2r;
                (y0r + y1r).Store(re, r0 + k); (y0i + y1i).Store(im, r0 + k);
                dr = y0r - y1r; di = y0i - y1i;
                (dr * a3r - di * a3i).Store(re, r1 + k); (dr * a3i + di * a3r).Store(im, r1 + k);
                (y2r + y3r).Store(re, r2 + k); (y2i + y3i).Store(im, r2 + k);
                dr = y2r - y3r; di = y2i - y3i;
                (dr * a3r - di * a3i).Store(re, r3 + k); (dr * a3i + di * a3r).Store(im, r3 + k);
            }
        }
        for (; k < width; k++)
        {
            double x0r = re[r0 + k], x0i = im[r0 + k], x1r = re[r1 + k], x1i = im[r1 + k];
            double x2r = re[r2 + k], x2i = im[r2 + k], x3r = re[r3 + k], x3i = im[r3 + k];
            double dr = x0r - x2r, di = x0i - x2i;
            double y0r = x0r + x2r, y0i = x0i + x2i, y2r = dr * w1r - di * w1i, y2i = dr * w1i + di * w1r;
            dr = x1r - x3r; di = x1i - x3i;
            double y1r = x1r + x3r, y1i = x1i + x3i, y3r = dr * w2r - di * w2i, y3i = dr * w2i + di * w2r;
            re[r0 + k] = y0r + y1r; im[r0 + k] = y0i + y1i;
            dr = y0r - y1r; di = y0i - y1i;
            re[r1 + k] = dr * w3r - di * w3i; im[r1 + k] = dr * w3i + di * w3r;
            re[r2 + k] = y2r + y3r; im[r2 + k] = y2i + y3i;
            dr = y2r - y3r; di = y2i - y3i;
            re[r3 + k] = dr * w3r - di * w3i; im[r3 + k] = dr * w3i + di * w3r;
        }
    }

    /// <summary>
    /// Two decimation-in-time stages on rows r0..r3 (a quarter of the group apart): (r0, r1) and (r2, r3) with w1, then (r0, r2) with
    /// w2 and (r1, r3) with w3, each pair as <see cref="DitButterfly"/>; SIMD across columns.
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining | MethodImplOptions.AggressiveOptimization)]   // too large to inline: compiled optimised at once
    private static void DitButterflyPair<V>(double[] re, double[] im, int r0, int r1, int r2, int r3, int width,
        double w1r, double w1i, double w2r, double w2i, double w3r, double w3i) where V : struct, ISimdLanes<V>
    {
        int k = 0, v = V.Count;
        if (width >= v)
        {
            var a1r = V.Broadcast(w1r); var a1i = V.Broadcast(w1i);
            var a2r = V.Broadcast(w2r); var a2i = V.Broadcast(w2i);
            var a3r = V.Broadcast(w3r); var a3i = V.Broadcast(w3i);
            for (; k <= width - v; k += v)
            {
                var x0r = V.Load(re, r0 + k); var x0i = V.Load(im, r0 + k);
                var x1r = V.Load(re, r1 + k); var x1i = V.Load(im, r1 + k);
                var x2r = V.Load(re, r2 + k); var x2i = V.Load(im, r2 + k);
                var x3r = V.Load(re, r3 + k); var x3i = V.Load(im, r3 + k);
                var tr = x1r * a1r - x1i * a1i; var ti = x1r * a1i + x1i * a1r;
                var y0r = x0r + tr; var y0i = x0i + ti; var y1r = x0r - tr; var y1i = x0i - ti;
                tr = x3r * a1r - x3i * a1i; ti = x3r * a1i + x3i * a1r;
                var y2r = x2r + tr; var y2i = x2i + ti; var y3r = x2r - tr; var y3i = x2i - ti;
                tr = y2r * a2r - y2i * a2i; ti = y2r * a2i + y2i * a2r;
                (y0r + tr).Store(re, r0 + k); (y0i + ti).Store(im, r0 + k);
                (y0r - tr).Store(re, r2 + k); (y0i - ti).Store(im, r2 + k);
                tr = y3r * a3r - y3i * a3i; ti = y3r * a3i + y3i * a3r;
                (y1r + tr).Store(re, r1 + k); (y1i + ti).Store(im, r1 + k);
                (y1r - tr).Store(re, r3 + k); (y1i - ti).Store(im, r3 + k);
            }
        }
        for (; k < width; k++)
        {
            double x0r = re[r0 + k], x0i = im[r0 + k], x1r = re[r1 + k], x1i = im[r1 + k];
            double x2r = re[r2 + k], x2i = im[r2 + k], x3r = re[r3 + k], x3i = im[r3 + k];
            double tr = x1r * w1r - x1i * w1i, ti = x1r * w1i + x1i * w1r;
            double y1r = x0r - tr, y1i = x0i - ti, y0r = x0r + tr, y0i = x0i + ti;
            tr = x3r * w1r - x3i * w1i; ti = x3r * w1i + x3i * w1r;
            double y3r = x2r - tr, y3i = x2i - ti, y2r = x2r + tr, y2i = x2i + ti;
            tr = y2r * w2r - y2i * w2i; ti = y2r * w2i + y2i * w2r;
            re[r2 + k] = y0r - tr; im[r2 + k] = y0i - ti; re[r0 + k] = y0r + tr; im[r0 + k] = y0i + ti;
            tr = y3r * w3r - y3i * w3i; ti = y3r * w3i + y3i * w3r;
            re[r3 + k] = y1r - tr; im[r3 + k] = y1i - ti; re[r1 + k] = y1r + tr; im[r1 + k] = y1i + ti;
        }
    }

    /// <summary>(a, b) := (a + b, (a - b) w) over a row segment, SIMD across columns.</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static void DifButterfly<V>(double[] re, double[] im, int a, int b, int width, double wr, double wi) where V : struct, ISimdLanes<V>
    {
        int k = 0, v = V.Count;
        if (width >= v)
        {
            var vwr = V.Broadcast(wr); var vwi = V.Broadcast(wi);
            for (; k <= width - v; k += v)
            {
                var ar = V.Load(re, a + k); var ai = V.Load(im, a + k);
                var br = V.Load(re, b + k); var bi = V.Load(im, b + k);
                (ar + br).Store(re, a + k); (ai + bi).Store(im, a + k);
                var xr = ar - br; var xi = ai - bi;
                (xr * vwr - xi * vwi).Store(re, b + k); (xr * vwi + xi * vwr).Store(im, b + k);
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
    private static void DitButterfly<V>(double[] re, double[] im, int a, int b, int width, double wr, double wi) where V : struct, ISimdLanes<V>
    {
        int k = 0, v = V.Count;
        if (width >= v)
        {
            var vwr = V.Broadcast(wr); var vwi = V.Broadcast(wi);
            for (; k <= width - v; k += v)
            {
                var ar = V.Load(re, a + k); var ai = V.Load(im, a + k);
                var br = V.Load(re, b + k); var bi = V.Load(im, b + k);
                var tr = br * vwr - bi * vwi; var ti = br * vwi + bi * vwr;
                (ar + tr).Store(re, a + k); (ai + ti).Store(im, a + k);
                (ar - tr).Store(re, b + k); (ai - ti).Store(im, b + k);
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
    private static void DitHalf<V>(double[] re, double[] im, int a, int b, int width, double wr, double wi) where V : struct, ISimdLanes<V>
    {
        int k = 0, v = V.Count;
        if (width >= v)
        {
            var vwr = V.Broadcast(wr); var vwi = V.Broadcast(wi);
            for (; k <= width - v; k += v)
            {
                var br = V.Load(re, b + k); var bi = V.Load(im, b + k);
                (V.Load(re, a + k) + br * vwr - bi * vwi).Store(re, a + k);
                (V.Load(im, a + k) + br * vwi + bi * vwr).Store(im, a + k);
            }
        }
        for (; k < width; k++)
        {
            double br = re[b + k], bi = im[b + k];
            re[a + k] += br * wr - bi * wi; im[a + k] += br * wi + bi * wr;
        }
    }

    /// <summary>e^{-2 pi i t / n} = cos - i sin for t &lt; n.</summary>
    private static (double[] Cos, double[] Sin) Twiddles(int n)
    {
        var cos = new double[n];
        var sin = new double[n];
        for (int t = 0; t < n; t++) { cos[t] = Math.Cos(2 * Math.PI * t / n); sin[t] = Math.Sin(2 * Math.PI * t / n); }
        return (cos, sin);
    }

    /// <summary>Radix-2 stages of a block of length m: e^{-2 pi i t / 2h} = cos - i sin at [h + t], h &lt; m, t &lt; h.</summary>
    private static (double[] Cos, double[] Sin) StageTwiddles(int m)
    {
        var cos = new double[m];
        var sin = new double[m];
        for (int h = 1; h < m; h <<= 1)
            for (int t = 0; t < h; t++) { cos[h + t] = Math.Cos(Math.PI * t / h); sin[h + t] = Math.Sin(Math.PI * t / h); }
        return (cos, sin);
    }

    /// <summary>The radix-3 stage of a row of length n = 3 m: e^{-2 pi i r t / n} = cos - i sin at (r - 1) m + t, r = 1, 2, t &lt; m (empty for m = 0).</summary>
    private static (double[] Cos, double[] Sin) ThirdTwiddles(int n, int m)
    {
        var cos = new double[2 * m];
        var sin = new double[2 * m];
        for (int r = 1; r <= 2; r++)
            for (int t = 0; t < m; t++) { cos[(r - 1) * m + t] = Math.Cos(2 * Math.PI * r * t / n); sin[(r - 1) * m + t] = Math.Sin(2 * Math.PI * r * t / n); }
        return (cos, sin);
    }

    /// <summary>The natural frequency at each position of a transform of length f m: f bitreverse_m(p mod m) + p / m.</summary>
    private static int[] Frequencies(int factor, int block)
    {
        var frequency = new int[factor * block];
        for (int p = 0; p < frequency.Length; p++) frequency[p] = factor * ReverseBits(p % block, block) + p / block;
        return frequency;
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
