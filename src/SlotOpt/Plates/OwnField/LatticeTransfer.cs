using System.Numerics;
using System.Runtime.CompilerServices;
using SlotOpt.Plates.Grid;

namespace SlotOpt.Plates.OwnField;

/// <summary>
/// Bilinear transfer between the unknowns of two sheet models of one plate, a fine and a coarse lattice (any cell sizes: each
/// fine node takes the bilinear weights of the four nodes of the coarse cell it lies in, coarse nodes outside the plate
/// contributing nothing). Values (stream function): <see cref="ProlongAdd"/> is P, a fine unknown being the mean over its nodes
/// (a merged region's value is the same at all of them); <see cref="Restrict"/> is P^T, the Galerkin restriction of a residual.
/// Fluxes (R u, one number per basis function): a merged unknown's flux is the sum over its nodes' hats, so
/// <see cref="ProlongFluxAdd"/> sums its nodes' interpolated values instead of averaging them.
/// </summary>
internal sealed class LatticeTransfer
{
    /// <summary>Fine unknown of each plate node taking part, its four coarse unknowns (-1: none) and their bilinear weights.</summary>
    private readonly int[] _fineUnknown;
    private readonly int[] _coarseUnknown;
    private readonly double[] _weight;
    /// <summary>1 / (nodes of the fine unknown): the mean over a merged region's nodes.</summary>
    private readonly double[] _valueShare;
    /// <summary>Row sums of P^T (P^T applied to ones): the weights of <see cref="Average"/>.</summary>
    private readonly double[] _coarseWeight;

    public int FineUnknowns => _valueShare.Length;
    public int CoarseUnknowns => _coarseWeight.Length;
    public long Bytes => 4L * (_fineUnknown.Length + _coarseUnknown.Length) + 8L * (_weight.Length + _valueShare.Length + _coarseWeight.Length);

    public LatticeTransfer(SheetModel fine, SheetModel coarse)
    {
        var lf = fine.Lattice; var lc = coarse.Lattice;
        var mapF = fine.Regions.NodeUnknown; var mapC = coarse.Regions.NodeUnknown;
        var nodes = new List<int>();
        for (int n = 0; n < mapF.Length; n++) if (mapF[n] >= 0) nodes.Add(n);
        _fineUnknown = new int[nodes.Count];
        _coarseUnknown = new int[4 * nodes.Count];
        _weight = new double[4 * nodes.Count];
        var count = new int[fine.Unknowns];
        for (int k = 0; k < nodes.Count; k++)
        {
            int n = nodes[k], u = mapF[n];
            _fineUnknown[k] = u;
            count[u]++;
            double gx = (lf.NodeX(n % lf.NodesX) - lc.X0) / lc.Hx, gy = (lf.NodeY(n / lf.NodesX) - lc.Y0) / lc.Hy;
            int i0 = Math.Clamp((int)Math.Floor(gx), 0, lc.Nx - 1), j0 = Math.Clamp((int)Math.Floor(gy), 0, lc.Ny - 1);
            double tx = Math.Clamp(gx - i0, 0, 1), ty = Math.Clamp(gy - j0, 0, 1);
            for (int q = 0; q < 4; q++)
            {
                int di = q & 1, dj = q >> 1;
                _coarseUnknown[4 * k + q] = mapC[(j0 + dj) * lc.NodesX + i0 + di];
                _weight[4 * k + q] = (di == 0 ? 1 - tx : tx) * (dj == 0 ? 1 - ty : ty);   // bilinear weight of coarse node (i0 + di, j0 + dj)
            }
        }
        _valueShare = count.Select(c => c > 0 ? 1.0 / c : 0).ToArray();
        _coarseWeight = new double[coarse.Unknowns];
        for (int k = 0; k < _fineUnknown.Length; k++)
            for (int q = 0; q < 4; q++)
                if (_coarseUnknown[4 * k + q] is var c && c >= 0) _coarseWeight[c] += _weight[4 * k + q] * _valueShare[_fineUnknown[k]];
    }

    /// <summary>fine += P coarse (values).</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public void ProlongAdd(ReadOnlySpan<Complex> coarse, Span<Complex> fine) => Interpolate(coarse, fine, 1, perValue: true);

    /// <summary>fine += factor * (coarse values interpolated to the nodes, summed per unknown): fluxes.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public void ProlongFluxAdd(ReadOnlySpan<Complex> coarse, Span<Complex> fine, Complex factor) => Interpolate(coarse, fine, factor, perValue: false);

    /// <summary>coarse = P^T fine.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public void Restrict(ReadOnlySpan<Complex> fine, Span<Complex> coarse)
    {
        coarse.Clear();
        for (int k = 0; k < _fineUnknown.Length; k++)
        {
            int u = _fineUnknown[k];
            Complex x = fine[u] * _valueShare[u];
            for (int q = 4 * k; q < 4 * k + 4; q++)
                if (_coarseUnknown[q] is var c && c >= 0) coarse[c] += _weight[q] * x;
        }
    }

    /// <summary>coarse = (P^T fine) / (P^T 1): a weighted mean of the fine values around each coarse node (0 where no fine node reaches).</summary>
    public void Average(ReadOnlySpan<Complex> fine, Span<Complex> coarse)
    {
        Restrict(fine, coarse);
        for (int c = 0; c < coarse.Length; c++) coarse[c] = _coarseWeight[c] > 0 ? coarse[c] / _coarseWeight[c] : Complex.Zero;
    }

    private void Interpolate(ReadOnlySpan<Complex> coarse, Span<Complex> fine, Complex factor, bool perValue)
    {
        for (int k = 0; k < _fineUnknown.Length; k++)
        {
            Complex s = Complex.Zero;
            for (int q = 4 * k; q < 4 * k + 4; q++)
                if (_coarseUnknown[q] is var c && c >= 0) s += _weight[q] * coarse[c];
            int u = _fineUnknown[k];
            fine[u] += (perValue ? _valueShare[u] : 1) * factor * s;
        }
    }
}
