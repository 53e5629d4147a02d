using System.Numerics;
using SlotOpt.Numerics;
using SlotOpt.Plates.Grid;

namespace SlotOpt.Plates.OwnField;

/// <summary>
/// The eddy currents' own field as a linear operator on the stream-function unknowns of one
/// <see cref="SheetModel"/>: (R psi)_m = flux (Wb) through basis function m of the field of the dipole
/// layer psi (see <see cref="ReactionKernel"/> for the physics and the sign), and the convected form
/// (Dx R psi)_m, the central x-difference of R psi (for a source moving along x).
/// Applied by FFT on a lattice zero-padded to at least 2 n - 1 in each direction (n = interior nodes:
/// the lattice's border nodes are always outside, psi = 0), so the convolution is linear, not circular
/// (the finite, slotted plate is exact up to discretisation), O(N log N) per application.
/// A merged region (hole, cut) is one unknown whose basis is the sum of its nodes' hats: its row
/// is the flux through the hole. Not thread-safe (one work buffer); build one per thread.
/// </summary>
public sealed class ReactionOperator
{
    private readonly int[] _nodeUnknown;
    private readonly Complex[] _spectrumR;
    private Complex[]? _spectrumDxR;
    private readonly Complex[] _work;
    private readonly Fft2D _fft;

    public SheetModel Model { get; }
    public ReactionKernel Kernel { get; }
    public int PaddedX { get; }
    public int PaddedY { get; }

    private ReactionOperator(SheetModel model, ReactionKernel kernel, int mx, int my, Complex[] spectrumR)
    {
        Model = model;
        Kernel = kernel;
        PaddedX = mx;
        PaddedY = my;
        _spectrumR = spectrumR;
        _nodeUnknown = model.Regions.NodeUnknown;
        _work = new Complex[mx * my];
        _fft = new Fft2D(my, mx);
    }

    public static ReactionOperator Build(SheetModel model)
    {
        var l = model.Lattice;
        int ix = l.NodesX - 2, iy = l.NodesY - 2;           // interior nodes: the border is outside (NodeRegions)
        int mx = PaddedLength(ix), my = PaddedLength(iy);
        // one extra offset in x for the central difference of the convected form
        var kernel = ReactionKernel.Build(l.Hx, l.Hy, ix, iy - 1);
        var spectrum = Spectrum(mx, my, ix - 1, iy - 1, (dx, dy) => kernel[dx, dy]);
        return new ReactionOperator(model, kernel, mx, my, spectrum);
    }

    /// <summary>The smallest power of two at least 2 n - 1 (linear, not circular, convolution of n samples with a kernel of 2 n - 1 taps).</summary>
    public static int PaddedLength(int n)
    {
        int m = 1;
        while (m < 2 * n - 1) m <<= 1;
        return m;
    }

    /// <summary>y = R u (webers per ampere of psi times u): the flux of the layer u through each unknown's basis.</summary>
    public void ApplyR(ReadOnlySpan<Complex> u, Span<Complex> y) => Apply(u, y, _spectrumR);

    /// <summary>y = Dx R u: the central x-difference (per metre) of R u, the convected reaction flux of a source moving along x.</summary>
    public void ApplyDxR(ReadOnlySpan<Complex> u, Span<Complex> y) => Apply(u, y, SpectrumDxR());

    private Complex[] SpectrumDxR()
    {
        if (_spectrumDxR is null)
        {
            var l = Model.Lattice;
            double h2 = 2 * l.Hx;
            // (Dx R)(d) = (R(dx + 1, dy) - R(dx - 1, dy)) / (2 hx): odd in dx, so Dx R is skew-symmetric
            _spectrumDxR = Spectrum(PaddedX, PaddedY, l.NodesX - 3, l.NodesY - 3, (dx, dy) => (Kernel[dx + 1, dy] - Kernel[dx - 1, dy]) / h2);
        }
        return _spectrumDxR;
    }

    /// <summary>
    /// The free-lattice factor Phi = A^ / (A^ + c S^) of the coupled operator A + c R (or A + c Dx R when convected),
    /// with A^ = 2 (hy/hx)(1 - cos theta_x) + 2 (hx/hy)(1 - cos theta_y) the 5-point symbol of A at unit conductance and
    /// S^ the reaction spectrum: A^-1 Phi inverts the coupled operator exactly on an unbounded uniform sheet, so
    /// it is the coupled preconditioner's spectral part (boundaries and holes are left to the Krylov method).
    /// </summary>
    internal Complex[] CoupledFactor(Complex coefficient, bool convected)
    {
        var l = Model.Lattice;
        var spectrum = convected ? SpectrumDxR() : _spectrumR;
        double rx = l.Hy / l.Hx, ry = l.Hx / l.Hy;
        var factor = new Complex[spectrum.Length];
        for (int q = 0; q < PaddedY; q++)
            for (int p = 0; p < PaddedX; p++)
            {
                double a = 2 * rx * (1 - Math.Cos(2 * Math.PI * p / PaddedX)) + 2 * ry * (1 - Math.Cos(2 * Math.PI * q / PaddedY));
                int i = q * PaddedX + p;
                factor[i] = a == 0 ? Complex.One : a / (a + coefficient * spectrum[i]);
            }
        return factor;
    }

    /// <summary>y = the padded-lattice multiplier applied to u (node values of the unknowns, results summed per unknown).</summary>
    internal void ApplyMultiplier(ReadOnlySpan<Complex> u, Span<Complex> y, Complex[] multiplier) => Apply(u, y, multiplier);

    /// <summary>
    /// R applied to a field given on the lattice's interior nodes (not restricted to the plate), returned per
    /// unknown: y_m = (mu0/2) &lt;phi_m, |k| b&gt; for b = sum_n b_n phi_n. Used for the lift of a source whose field
    /// is given only in the sheet's plane (dBz/dz = |k| Bz for a source above the sheet); the field beyond the
    /// lattice's interior is left out, so the source should lie over the plate's bounding box.
    /// </summary>
    public void ApplyRToNodeField(ReadOnlySpan<double> nodeValues, Span<double> y)
    {
        Array.Clear(_work);
        for (int n = 0; n < nodeValues.Length; n++)
            if (PaddedIndex(n) is var p && p >= 0) _work[p] = nodeValues[n];
        Convolve(_spectrumR);
        y.Clear();
        for (int n = 0; n < _nodeUnknown.Length; n++)
        {
            int u = _nodeUnknown[n];
            if (u >= 0) y[u] += _work[PaddedIndex(n)].Real;
        }
    }

    /// <summary>Index on the padded lattice of lattice node n (interior node (i, j) at (i - 1, j - 1)); -1 on the border.</summary>
    internal int PaddedIndex(int n)
    {
        var l = Model.Lattice;
        int i = n % l.NodesX, j = n / l.NodesX;
        return i == 0 || j == 0 || i == l.NodesX - 1 || j == l.NodesY - 1 ? -1 : (j - 1) * PaddedX + i - 1;
    }

    private void Apply(ReadOnlySpan<Complex> u, Span<Complex> y, Complex[] spectrum)
    {
        Array.Clear(_work);
        for (int n = 0; n < _nodeUnknown.Length; n++)
        {
            int k = _nodeUnknown[n];
            if (k >= 0) _work[PaddedIndex(n)] = u[k];
        }
        Convolve(spectrum);
        y.Clear();
        for (int n = 0; n < _nodeUnknown.Length; n++)
        {
            int k = _nodeUnknown[n];
            if (k >= 0) y[k] += _work[PaddedIndex(n)];   // transpose of the node replication: merged rows add up
        }
    }

    /// <summary>Circular convolution of the work buffer with the kernel whose spectrum is given (Matlab convention: forward unscaled, inverse 1/N).</summary>
    private void Convolve(Complex[] spectrum)
    {
        _fft.Forward(_work);
        for (int i = 0; i < _work.Length; i++) _work[i] *= spectrum[i];
        _fft.Inverse(_work);
    }

    /// <summary>DFT of the kernel placed with wrap-around at offsets |dx| &lt;= kx, |dy| &lt;= ky on the padded lattice.</summary>
    internal static Complex[] Spectrum(int mx, int my, int kx, int ky, Func<int, int, double> kernel)
    {
        var a = new Complex[mx * my];
        for (int dy = -ky; dy <= ky; dy++)
            for (int dx = -kx; dx <= kx; dx++)
                a[((dy + my) % my) * mx + (dx + mx) % mx] = kernel(dx, dy);
        new Fft2D(my, mx).Forward(a);
        return a;
    }
}
