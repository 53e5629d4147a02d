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
/// times e^{-|k| s dz}). Applied by FFT on the plane's zero-padded lattice (<see cref="PaddedConvolution"/>): L forward
/// transforms, L^2 spectral products, L inverse transforms.
/// Currents are in-plane in every layer (no vertical current): right for a plate wide against its thickness.
/// </summary>
public sealed class LayeredReactionOperator
{
    private readonly PaddedConvolution _convolution;
    private readonly KernelSpectrum[] _spectra;   // by separation s = 0..L-1
    private readonly double[][] _transformedRe, _transformedIm;
    private readonly int[] _interiorUnknown;      // per interior lattice node (row-major): its unknown, or -1 outside

    public SheetModel Model { get; }
    public ReactionOperator Plane { get; }
    public int Layers { get; }
    public double ThicknessM { get; }
    public double LayerThicknessM => ThicknessM / Layers;

    private LayeredReactionOperator(SheetModel model, ReactionOperator plane, int layers, double thicknessM, PaddedConvolution convolution, KernelSpectrum[] spectra)
    {
        Model = model;
        Plane = plane;
        Layers = layers;
        ThicknessM = thicknessM;
        _convolution = convolution;
        _spectra = spectra;
        int size = convolution.PaddedX * convolution.PaddedY;
        _transformedRe = Enumerable.Range(0, layers).Select(_ => new double[size]).ToArray();
        _transformedIm = Enumerable.Range(0, layers).Select(_ => new double[size]).ToArray();
        var l = model.Lattice;
        var nodeUnknown = model.Regions.NodeUnknown;
        _interiorUnknown = new int[convolution.Nx * convolution.Ny];
        for (int j = 0; j < convolution.Ny; j++)
            for (int i = 0; i < convolution.Nx; i++) _interiorUnknown[j * convolution.Nx + i] = nodeUnknown[(j + 1) * l.NodesX + i + 1];
    }

    public static LayeredReactionOperator Build(SheetModel model, int layers, double thicknessM, ReactionOperator? plane = null)
    {
        if (layers < 1) throw new InputException($"a layered plate needs at least one layer (got {layers})");
        if (!(thicknessM > 0) || !double.IsFinite(thicknessM)) throw new InputException($"the plate thickness must be positive (got {thicknessM} m)");
        plane ??= ReactionOperator.Build(model);
        var l = model.Lattice;
        int kx = l.NodesX - 3, ky = l.NodesY - 3;           // interior nodes less one: the border is outside (as the plane's operator)
        var convolution = new PaddedConvolution(kx + 1, ky + 1);
        var spectra = new KernelSpectrum[layers];
        for (int s = 0; s < layers; s++)
        {
            var kernel = s == 0 ? plane.Kernel : ReactionKernel.Build(l.Hx, l.Hy, kx, ky, s * thicknessM / layers);
            spectra[s] = convolution.Spectrum(kx, ky, (dx, dy) => kernel[dx, dy]);
        }
        return new LayeredReactionOperator(model, plane, layers, thicknessM, convolution, spectra);
    }

    /// <summary>y = R u for the stacked vector u (layer l's unknowns at l * N .. (l + 1) * N - 1).</summary>
    public void Apply(Complex[] u, Complex[] y)
    {
        int n = Model.Unknowns;
        var c = _convolution;
        var re = c.Re; var im = c.Im;
        int nx = c.Nx, ny = c.Ny, mx = c.PaddedX;
        var map = _interiorUnknown;
        for (int layer = 0; layer < Layers; layer++)
        {
            for (int j = 0, node = 0; j < ny; j++)
                for (int p = j * mx, end = p + nx; p < end; p++, node++)
                {
                    int k = map[node];
                    if (k >= 0) { re[p] = u[layer * n + k].Real; im[p] = u[layer * n + k].Imaginary; } else { re[p] = 0; im[p] = 0; }
                }
            c.TransformComplex();
            Array.Copy(re, _transformedRe[layer], re.Length);
            Array.Copy(im, _transformedIm[layer], im.Length);
        }
        Array.Clear(y);
        for (int layer = 0; layer < Layers; layer++)
        {
            // the layer's flux in Fourier space: sum over source layers m of R^(|layer - m|)^ times psi_m^
            Array.Clear(re); Array.Clear(im);
            for (int m = 0; m < Layers; m++)
            {
                var s = _spectra[Math.Abs(layer - m)];
                double[] sr = s.Re, si = s.Im, tr = _transformedRe[m], ti = _transformedIm[m];
                for (int i = 0; i < re.Length; i++)
                {
                    re[i] += sr[i] * tr[i] - si[i] * ti[i];
                    im[i] += sr[i] * ti[i] + si[i] * tr[i];
                }
            }
            c.InverseTransformComplex();
            for (int j = 0, node = 0; j < ny; j++)
                for (int p = j * mx, end = p + nx; p < end; p++, node++)
                    if (map[node] is var k && k >= 0) y[layer * n + k] += new Complex(re[p], im[p]);   // merged rows add up
        }
    }
}
