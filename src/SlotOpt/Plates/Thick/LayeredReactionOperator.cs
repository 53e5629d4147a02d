using System.Numerics;
using SlotOpt.Numerics;
using SlotOpt.Plates.Grid;
using SlotOpt.Plates.OwnField;

namespace SlotOpt.Plates.Thick;

/// <summary>
/// A thick plate as a stack of L thin layers of thickness dz = t / L, layer l at depth (l + 1/2) dz below the
/// top face, each with the plate's in-plane geometry (slots through the full thickness). Layer m's dipole
/// layer psi_m sends through layer l's basis the flux R^(|l - m|) psi_m, with R^(s) the mutual-inductance
/// kernel between layers s dz apart (<see cref="ReactionKernel"/>; in Fourier space the in-plane kernel
/// times e^{-|k| s dz}). Applied by FFT: L forward transforms, L^2 spectral products, L inverse transforms.
/// Currents are in-plane in every layer (no vertical current): right for a plate wide against its thickness.
/// </summary>
public sealed class LayeredReactionOperator
{
    private readonly Complex[][] _spectra;   // by separation s = 0..L-1
    private readonly Complex[][] _transformed;
    private readonly Complex[] _accumulate;
    private readonly Fft2D _fft;
    private readonly int[] _nodeUnknown;

    public SheetModel Model { get; }
    public ReactionOperator Plane { get; }
    public int Layers { get; }
    public double ThicknessM { get; }
    public double LayerThicknessM => ThicknessM / Layers;

    private LayeredReactionOperator(SheetModel model, ReactionOperator plane, int layers, double thicknessM, Complex[][] spectra)
    {
        Model = model;
        Plane = plane;
        Layers = layers;
        ThicknessM = thicknessM;
        _spectra = spectra;
        int size = plane.PaddedX * plane.PaddedY;
        _transformed = Enumerable.Range(0, layers).Select(_ => new Complex[size]).ToArray();
        _accumulate = new Complex[size];
        _fft = new Fft2D(plane.PaddedY, plane.PaddedX);
        _nodeUnknown = model.Regions.NodeUnknown;
    }

    public static LayeredReactionOperator Build(SheetModel model, int layers, double thicknessM, ReactionOperator? plane = null)
    {
        if (layers < 1) throw new InputException($"a layered plate needs at least one layer (got {layers})");
        if (!(thicknessM > 0) || !double.IsFinite(thicknessM)) throw new InputException($"the plate thickness must be positive (got {thicknessM} m)");
        plane ??= ReactionOperator.Build(model);
        var l = model.Lattice;
        int kx = l.NodesX - 3, ky = l.NodesY - 3;
        var spectra = new Complex[layers][];
        for (int s = 0; s < layers; s++)
        {
            var kernel = s == 0 ? plane.Kernel : ReactionKernel.Build(l.Hx, l.Hy, kx, ky, s * thicknessM / layers);
            spectra[s] = ReactionOperator.Spectrum(plane.PaddedX, plane.PaddedY, kx, ky, (dx, dy) => kernel[dx, dy]);
        }
        return new LayeredReactionOperator(model, plane, layers, thicknessM, spectra);
    }

    /// <summary>y = R u for the stacked vector u (layer l's unknowns at l * N .. (l + 1) * N - 1).</summary>
    public void Apply(Complex[] u, Complex[] y)
    {
        int n = Model.Unknowns;
        for (int layer = 0; layer < Layers; layer++)
        {
            var t = _transformed[layer];
            Array.Clear(t);
            for (int node = 0; node < _nodeUnknown.Length; node++)
            {
                int k = _nodeUnknown[node];
                if (k >= 0) t[Plane.PaddedIndex(node)] = u[layer * n + k];
            }
            _fft.Forward(t);
        }
        Array.Clear(y);
        for (int layer = 0; layer < Layers; layer++)
        {
            Array.Clear(_accumulate);
            for (int m = 0; m < Layers; m++)
            {
                var s = _spectra[Math.Abs(layer - m)];
                var t = _transformed[m];
                for (int i = 0; i < _accumulate.Length; i++) _accumulate[i] += s[i] * t[i];
            }
            _fft.Inverse(_accumulate);
            for (int node = 0; node < _nodeUnknown.Length; node++)
            {
                int k = _nodeUnknown[node];
                if (k >= 0) y[layer * n + k] += _accumulate[Plane.PaddedIndex(node)];
            }
        }
    }
}
