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
public sealed partial class ReactionOperator
{
    private readonly int[] _nodeUnknown;
    /// <summary>Per interior lattice node (in padded-lattice order of the input region): its unknown, or -1 outside.</summary>
    private readonly int[] _interiorUnknown;
    private readonly PaddedConvolution _convolution;
    private readonly KernelSpectrum _spectrumR;
    private KernelSpectrum? _spectrumDxR;

    public SheetModel Model { get; }
    public ReactionKernel Kernel { get; }
    public int PaddedX => _convolution.PaddedX;
    public int PaddedY => _convolution.PaddedY;
    /// <summary>Bytes held: the padded lattice's buffers and the kernel spectra built so far.</summary>
    public long Bytes => _convolution.Bytes + _spectrumR.Bytes + (_spectrumDxR?.Bytes ?? 0) + 4L * _interiorUnknown.Length;

    private ReactionOperator(SheetModel model, ReactionKernel kernel, PaddedConvolution convolution, KernelSpectrum spectrumR)
    {
        Model = model;
        Kernel = kernel;
        _convolution = convolution;
        _spectrumR = spectrumR;
        _nodeUnknown = model.Regions.NodeUnknown;
        var l = model.Lattice;
        int ix = l.NodesX - 2, iy = l.NodesY - 2;
        _interiorUnknown = new int[ix * iy];
        for (int j = 0; j < iy; j++)
            for (int i = 0; i < ix; i++) _interiorUnknown[j * ix + i] = _nodeUnknown[(j + 1) * l.NodesX + i + 1];
    }

    /// <param name="threads">workers for each FFT (rows and column strips split between them; the results are the same for any count)</param>
    public static ReactionOperator Build(SheetModel model, int threads = 1)
    {
        var l = model.Lattice;
        int ix = l.NodesX - 2, iy = l.NodesY - 2;           // interior nodes: the border is outside (NodeRegions)
        var convolution = new PaddedConvolution(ix, iy, threads);
        // one extra offset in x for the central difference of the convected form
        var kernel = ReactionKernel.Build(l.Hx, l.Hy, ix, iy - 1);
        var spectrum = convolution.Spectrum(ix - 1, iy - 1, (dx, dy) => kernel[dx, dy]);
        return new ReactionOperator(model, kernel, convolution, spectrum);
    }

    /// <summary>The smallest 2^k or 3 x 2^k at least 2 n (so at least 2 n - 1: linear, not circular, convolution of n samples with a kernel of 2 n - 1 taps).</summary>
    public static int PaddedLength(int n) => PaddedConvolution.PaddedLength(n);

    /// <summary>y = R u (webers per ampere of psi times u): the flux of the layer u through each unknown's basis.</summary>
    public void ApplyR(ReadOnlySpan<Complex> u, Span<Complex> y)
    {
        var c = _convolution;
        var re = c.Re; var im = c.Im;
        int ix = c.Nx, iy = c.Ny, mx = c.PaddedX;
        var map = _interiorUnknown;
        for (int j = 0, n = 0; j < iy; j++)
            for (int p = j * mx, end = p + ix; p < end; p++, n++)
            {
                int k = map[n];
                if (k >= 0) { re[p] = u[k].Real; im[p] = u[k].Imaginary; } else { re[p] = 0; im[p] = 0; }
            }
        c.ConvolveComplex(_spectrumR);
        y.Clear();
        for (int j = 0, n = 0; j < iy; j++)
            for (int p = j * mx, end = p + ix; p < end; p++, n++)
                if (map[n] is var k && k >= 0) y[k] += new Complex(re[p], im[p]);   // transpose of the node replication: merged rows add up
    }

    /// <summary>y = R u for a real u.</summary>
    public void ApplyR(ReadOnlySpan<double> u, Span<double> y) => ApplyReal(u, y, _spectrumR);

    /// <summary>y = Dx R u: the central x-difference (per metre) of R u, the convected reaction flux of a source moving along x (real: R's kernel is real).</summary>
    public void ApplyDxR(ReadOnlySpan<double> u, Span<double> y) => ApplyReal(u, y, SpectrumDxR());

    private KernelSpectrum SpectrumDxR()
    {
        if (_spectrumDxR is null)
        {
            var l = Model.Lattice;
            double h2 = 2 * l.Hx;
            // (Dx R)(d) = (R(dx + 1, dy) - R(dx - 1, dy)) / (2 hx): odd in dx, so Dx R is skew-symmetric
            _spectrumDxR = _convolution.Spectrum(l.NodesX - 3, l.NodesY - 3, (dx, dy) => (Kernel[dx + 1, dy] - Kernel[dx - 1, dy]) / h2);
        }
        return _spectrumDxR;
    }

    /// <summary>
    /// The free-lattice factor Phi = A^ / (A^ + c S^) of the coupled operator A + c R (or A + c Dx R when convected),
    /// with A^ = 2 (hy/hx)(1 - cos theta_x) + 2 (hx/hy)(1 - cos theta_y) the 5-point symbol of A at unit conductance and
    /// S^ the reaction spectrum: A^-1 Phi inverts the coupled operator exactly on an unbounded uniform sheet, so
    /// it is the coupled preconditioner's spectral part (boundaries and holes are left to the Krylov method).
    /// </summary>
    internal KernelSpectrum CoupledFactor(Complex coefficient, bool convected)
    {
        var l = Model.Lattice;
        var spectrum = convected ? SpectrumDxR() : _spectrumR;
        double rx = l.Hy / l.Hx, ry = l.Hx / l.Hy;
        int mx = PaddedX, my = PaddedY;
        return spectrum.Map((p, q, s) =>
        {
            double a = 2 * rx * (1 - Math.Cos(2 * Math.PI * p / mx)) + 2 * ry * (1 - Math.Cos(2 * Math.PI * q / my));
            return a == 0 ? Complex.One : a / (a + coefficient * s);
        });
    }

    /// <summary>y = the padded-lattice multiplier applied to a real u (node values of the unknowns, results summed per unknown); the multiplier must map real fields to real fields.</summary>
    internal void ApplyMultiplier(ReadOnlySpan<double> u, Span<double> y, KernelSpectrum multiplier) => ApplyReal(u, y, multiplier);

    /// <summary>
    /// R applied to a field given on the lattice's interior nodes (not restricted to the plate), returned per
    /// unknown: y_m = (mu0/2) &lt;phi_m, |k| b&gt; for b = sum_n b_n phi_n. Used for the lift of a source whose field
    /// is given only in the sheet's plane (dBz/dz = |k| Bz for a source above the sheet); the field beyond the
    /// lattice's interior is left out, so the source should lie over the plate's bounding box.
    /// </summary>
    public void ApplyRToNodeField(ReadOnlySpan<double> nodeValues, Span<double> y)
    {
        var c = _convolution;
        var re = c.Re;
        int ix = c.Nx, iy = c.Ny, mx = c.PaddedX, nodesX = Model.Lattice.NodesX;
        for (int j = 0; j < iy; j++) nodeValues.Slice((j + 1) * nodesX + 1, ix).CopyTo(re.AsSpan(j * mx, ix));
        c.ConvolveReal(_spectrumR);
        Gather(y);
    }

    /// <summary>Index on the padded lattice of lattice node n (interior node (i, j) at (i - 1, j - 1)); -1 on the border.</summary>
    internal int PaddedIndex(int n)
    {
        var l = Model.Lattice;
        int i = n % l.NodesX, j = n / l.NodesX;
        return i == 0 || j == 0 || i == l.NodesX - 1 || j == l.NodesY - 1 ? -1 : (j - 1) * PaddedX + i - 1;
    }

    private void ApplyReal(ReadOnlySpan<double> u, Span<double> y, KernelSpectrum spectrum)
    {
        var c = _convolution;
        var re = c.Re;
        int ix = c.Nx, iy = c.Ny, mx = c.PaddedX;
        var map = _interiorUnknown;
        for (int j = 0, n = 0; j < iy; j++)
            for (int p = j * mx, end = p + ix; p < end; p++, n++)
                re[p] = map[n] is var k && k >= 0 ? u[k] : 0;
        c.ConvolveReal(spectrum);
        Gather(y);
    }

    /// <summary>y_k = sum of the convolved field over unknown k's nodes (the transpose of the node replication: merged rows add up).</summary>
    private void Gather(Span<double> y)
    {
        var re = _convolution.Re;
        int ix = _convolution.Nx, iy = _convolution.Ny, mx = _convolution.PaddedX;
        var map = _interiorUnknown;
        y.Clear();
        for (int j = 0, n = 0; j < iy; j++)
            for (int p = j * mx, end = p + ix; p < end; p++, n++)
                if (map[n] is var k && k >= 0) y[k] += re[p];
    }
}
