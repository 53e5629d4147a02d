using System.Numerics;
using System.Runtime.CompilerServices;
using SlotOpt.Numerics;
using SlotOpt.Plates.Grid;

namespace SlotOpt.Plates.OwnField;

/// <summary>
/// The eddy currents' own field as a linear operator on the stream-function unknowns of one
/// <see cref="SheetModel"/>: (R psi)_m = flux (Wb) through basis function m of the field of the dipole
/// layer psi (see <see cref="ReactionKernel"/> for the physics and the sign), and the convected form
/// (Dx R psi)_m, the central x-difference of R psi (for a source moving along x).
/// Applied by FFT on a lattice zero-padded to at least 2 n - 1 in each direction (2 n - 2 across the motion for Dx R, whose kernel is even in y; n = interior nodes:
/// the lattice's border nodes are always outside, psi = 0), so the convolution is linear, not circular
/// (the finite, slotted plate is exact up to discretisation), O(N log N) per application.
/// A merged region (hole, cut) is one unknown whose basis is the sum of its nodes' hats: its row
/// is the flux through the hole. Not thread-safe (one work buffer); build one per thread. The kernel and its spectra
/// depend only on the lattice (cell sizes and node counts), not on the plate's outline or slots, so operators on one
/// lattice share them (<see cref="LatticeSpectra"/>): every slot pattern of a run's part costs one kernel and one spectrum.
/// </summary>
public sealed partial class ReactionOperator
{
    private readonly int[] _nodeUnknown;
    /// <summary>Per interior lattice node (in padded-lattice order of the input region): its unknown, or -1 outside.</summary>
    private readonly int[] _interiorUnknown;
    private readonly PaddedConvolution _convolution;
    /// <summary>The lattice of Dx R's product: the same as R's, or fewer rows where Dx R's kernel, even in y, needs only 2 n - 2 of them.</summary>
    private readonly PaddedConvolution _convectedConvolution;
    private readonly LatticeSpectra _shared;
    private readonly KernelSpectrum _spectrumR;

    private CoarseOwnFieldLevel? _coarseLevel;
    private bool _coarseLevelBuilt;
    private PaddedConvolution? _factorConvolution;

    public SheetModel Model { get; }
    public ReactionKernel Kernel { get; }
    public int PaddedX => _convolution.PaddedX;
    public int PaddedY => _convolution.PaddedY;
    /// <summary>The FFT lattices of the moving solve: Dx R's exact product and the preconditioner's circular factor (<see cref="FactorConvolution"/>).</summary>
    public (int X, int Y) ConvectedLattice => (_convectedConvolution.PaddedX, _convectedConvolution.PaddedY);
    public (int X, int Y) FactorLattice => (FactorConvolution.PaddedX, FactorConvolution.PaddedY);
    /// <summary>Bytes held: the FFT lattices' buffers (R's; Dx R's where it has fewer rows; the moving preconditioner's, at most half R's area, once built), the kernel spectra built so far and the AC coarse level once built.</summary>
    public long Bytes => _convolution.Bytes + (ReferenceEquals(_convectedConvolution, _convolution) ? 0 : _convectedConvolution.Bytes) + (_factorConvolution?.Bytes ?? 0) + _shared.Bytes + 4L * _interiorUnknown.Length + (_coarseLevel?.Bytes ?? 0);

    private ReactionOperator(SheetModel model, PaddedConvolution convolution, PaddedConvolution convectedConvolution, LatticeSpectra shared)
    {
        Model = model;
        Kernel = shared.Kernel;
        _convolution = convolution;
        _convectedConvolution = convectedConvolution;
        _shared = shared;
        _spectrumR = shared.R;
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
        int convectedY = PaddedConvolution.EvenPaddedLength(iy);
        var convected = convectedY == convolution.PaddedY ? convolution : new PaddedConvolution(ix, iy, convolution.PaddedX, convectedY, threads);
        return new ReactionOperator(model, convolution, convected, LatticeSpectra.For(l, convolution));
    }

    /// <summary>
    /// The plate on a coarser lattice for the AC solves' two-grid preconditioner (<see cref="TwoLevelAcPreconditioner"/>), built on first
    /// use and kept (it depends only on the geometry); null when the lattice is too small for one (the V-cycle alone then).
    /// </summary>
    internal CoarseOwnFieldLevel? CoarseLevel
    {
        get
        {
            if (!_coarseLevelBuilt) { _coarseLevel = CoarseOwnFieldLevel.For(this); _coarseLevelBuilt = true; }
            return _coarseLevel;
        }
    }

    /// <summary>The smallest 2^k or 3 x 2^k at least 2 n (so at least 2 n - 1: linear, not circular, convolution of n samples with a kernel of 2 n - 1 taps).</summary>
    public static int PaddedLength(int n) => PaddedConvolution.PaddedLength(n);

    /// <summary>y = R u (webers per ampere of psi times u): the flux of the layer u through each unknown's basis.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
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
    public void ApplyDxR(ReadOnlySpan<double> u, Span<double> y) => ApplyReal(u, y, SpectrumDxR(), _convectedConvolution);

    private KernelSpectrum SpectrumDxR() => _shared.DxR(_convectedConvolution);

    /// <summary>
    /// The free-lattice factor Phi = A^ / (A^ + c S^) of the coupled operator A + c R (or A + c Dx R when convected),
    /// with A^ = 2 (hy/hx)(1 - cos theta_x) + 2 (hx/hy)(1 - cos theta_y) the 5-point symbol of A at unit conductance and
    /// S^ the reaction spectrum: A^-1 Phi inverts the coupled operator exactly on an unbounded uniform sheet, so
    /// it is the coupled preconditioner's spectral part (boundaries and holes are left to the Krylov method). The convected factor lives on
    /// <see cref="FactorConvolution"/> (a smaller, circular lattice), the other on the exact product's.
    /// </summary>
    internal KernelSpectrum CoupledFactor(Complex coefficient, bool convected)
    {
        var l = Model.Lattice;
        var spectrum = convected ? _shared.DxROnFactorLattice(FactorConvolution) : _spectrumR;
        double rx = l.Hy / l.Hx, ry = l.Hx / l.Hy;
        int mx = spectrum.Owner.PaddedX, my = spectrum.Owner.PaddedY;
        return spectrum.Map((p, q, s) =>
        {
            double a = 2 * rx * (1 - Math.Cos(2 * Math.PI * p / mx)) + 2 * ry * (1 - Math.Cos(2 * Math.PI * q / my));
            return a == 0 ? Complex.One : a / (a + coefficient * s);
        });
    }

    /// <summary>y = the padded-lattice multiplier applied to a real u (node values of the unknowns, results summed per unknown); the multiplier must map real fields to real fields.</summary>
    internal void ApplyMultiplier(ReadOnlySpan<double> u, Span<double> y, KernelSpectrum multiplier) =>
        ApplyReal(u, y, multiplier, SameLattice(multiplier.Owner, _convolution) ? _convolution : FactorConvolution);

    /// <summary>
    /// The lattice of the convected preconditioner's factor Phi (<see cref="FactorLength"/>): circular, not padded for a linear convolution,
    /// since Phi is a preconditioner (its wrap-around changes only the iteration count; the outer true residual decides the answer).
    /// </summary>
    internal PaddedConvolution FactorConvolution =>
        _factorConvolution ??= new PaddedConvolution(_convolution.Nx, _convolution.Ny, Math.Min(FactorLength(_convolution.Nx, 1), PaddedX),
            Math.Min(FactorLength(_convolution.Ny, 1.5), PaddedY), _convolution.Threads);

    /// <summary>
    /// The smallest 2^k or 3 x 2^k at least margin x n: margin 1 along the motion (x) and 1.5 across it (y). Measured (moving pole at v = w over
    /// the bench's 0.8 x 0.2 m plate, 50 offsets, GMRES iterations a position): 4 mm cells (199 x 49 interior nodes, exact product 512 x 128):
    /// the factor on 512 x 128, 256 x 128 and 256 x 96 10.0, on 256 x 64 10.6; 2 mm cells (399 x 99): 1024 x 256, 512 x 256 and 512 x 192 11.1,
    /// 512 x 128 11.8. A wrap-around across the motion costs iterations below about 1.5 n, one along it does not.
    /// </summary>
    internal static int FactorLength(int n, double margin) => PaddedConvolution.TransformLength((int)Math.Ceiling(margin * n));

    private static bool SameLattice(PaddedConvolution a, PaddedConvolution b) => a.Nx == b.Nx && a.Ny == b.Ny && a.PaddedX == b.PaddedX && a.PaddedY == b.PaddedY;

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
        Gather(y, c);
    }

    /// <summary>Index on the padded lattice of lattice node n (interior node (i, j) at (i - 1, j - 1)); -1 on the border.</summary>
    internal int PaddedIndex(int n)
    {
        var l = Model.Lattice;
        int i = n % l.NodesX, j = n / l.NodesX;
        return i == 0 || j == 0 || i == l.NodesX - 1 || j == l.NodesY - 1 ? -1 : (j - 1) * PaddedX + i - 1;
    }

    private void ApplyReal(ReadOnlySpan<double> u, Span<double> y, KernelSpectrum spectrum) => ApplyReal(u, y, spectrum, _convolution);

    private void ApplyReal(ReadOnlySpan<double> u, Span<double> y, KernelSpectrum spectrum, PaddedConvolution c)
    {
        var re = c.Re;
        int ix = c.Nx, iy = c.Ny, mx = c.PaddedX;
        var map = _interiorUnknown;
        for (int j = 0, n = 0; j < iy; j++)
            for (int p = j * mx, end = p + ix; p < end; p++, n++)
                re[p] = map[n] is var k && k >= 0 ? u[k] : 0;
        c.ConvolveReal(spectrum);
        Gather(y, c);
    }

    /// <summary>y_k = sum of the convolved field over unknown k's nodes (the transpose of the node replication: merged rows add up).</summary>
    private void Gather(Span<double> y, PaddedConvolution c)
    {
        var re = c.Re;
        int ix = c.Nx, iy = c.Ny, mx = c.PaddedX;
        var map = _interiorUnknown;
        y.Clear();
        for (int j = 0, n = 0; j < iy; j++)
            for (int p = j * mx, end = p + ix; p < end; p++, n++)
                if (map[n] is var k && k >= 0) y[k] += re[p];
    }
}

/// <summary>
/// The reaction kernel of one lattice (cell sizes, interior node counts) and its spectra R and Dx R on the padded lattice, shared
/// by every <see cref="ReactionOperator"/> built on that lattice while any of them lives (weakly held here, so an unused entry is
/// the garbage collector's). Read-only once built; Dx R is built on first use under a lock. The numbers do not depend on sharing:
/// a spectrum is the same computation whichever operator's convolution makes it (and for any worker count).
/// </summary>
internal sealed class LatticeSpectra
{
    private static readonly Dictionary<(double Hx, double Hy, int Nx, int Ny), WeakReference<LatticeSpectra>> Live = new();
    private readonly object _gate = new();
    private KernelSpectrum? _dxR, _factorDxR;

    public ReactionKernel Kernel { get; }
    public KernelSpectrum R { get; }
    public long Bytes => R.Bytes + (_dxR?.Bytes ?? 0) + (_factorDxR?.Bytes ?? 0);

    private LatticeSpectra(ReactionKernel kernel, KernelSpectrum r)
    {
        Kernel = kernel;
        R = r;
    }

    /// <summary>The spectra of the lattice l (interior nodes as the convolution's input region), built with convolution if no live operator holds them.</summary>
    public static LatticeSpectra For(CellLattice l, PaddedConvolution convolution)
    {
        var key = (l.Hx, l.Hy, convolution.Nx, convolution.Ny);
        lock (Live)
        {
            if (Live.TryGetValue(key, out var weak) && weak.TryGetTarget(out var live)) return live;
            foreach (var dead in Live.Where(e => !e.Value.TryGetTarget(out _)).Select(e => e.Key).ToList()) Live.Remove(dead);
        }
        int ix = convolution.Nx, iy = convolution.Ny;
        // one extra offset in x for the central difference of the convected form
        var kernel = ReactionKernel.Build(l.Hx, l.Hy, ix, iy - 1);
        var built = new LatticeSpectra(kernel, convolution.Spectrum(ix - 1, iy - 1, (dx, dy) => kernel[dx, dy]));
        lock (Live)
        {
            if (Live.TryGetValue(key, out var weak) && weak.TryGetTarget(out var first)) return first;   // another thread built it meanwhile: one copy
            Live[key] = new WeakReference<LatticeSpectra>(built);
            return built;
        }
    }

    /// <summary>The spectrum of Dx R, (Dx R)(d) = (R(dx + 1, dy) - R(dx - 1, dy)) / (2 hx): odd in dx, so Dx R is skew-symmetric; even in dy, so its lattice may have 2 n - 2 rows.</summary>
    public KernelSpectrum DxR(PaddedConvolution convolution)
    {
        lock (_gate)
        {
            if (_dxR is null)
            {
                double h2 = 2 * Kernel.Hx;
                var kernel = Kernel;
                _dxR = convolution.Spectrum(convolution.Nx - 1, convolution.Ny - 1, (dx, dy) => (kernel[dx + 1, dy] - kernel[dx - 1, dy]) / h2, evenInY: true);
            }
            return _dxR;
        }
    }

    /// <summary>
    /// Dx R on the convected preconditioner's lattice (<see cref="ReactionOperator.FactorConvolution"/>, circular): the kernel's offsets
    /// wrapped and summed, whose DFT is Dx R's exact symbol sampled at that lattice's frequencies. Built on first use under a lock.
    /// </summary>
    public KernelSpectrum DxROnFactorLattice(PaddedConvolution convolution)
    {
        lock (_gate)
        {
            if (_factorDxR is null)
            {
                double h2 = 2 * Kernel.Hx;
                var kernel = Kernel;
                _factorDxR = convolution.Spectrum(convolution.Nx - 1, convolution.Ny - 1, (dx, dy) => (kernel[dx + 1, dy] - kernel[dx - 1, dy]) / h2);
            }
            return _factorDxR;
        }
    }
}
