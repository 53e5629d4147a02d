using System.Numerics;
using System.Runtime.CompilerServices;
using System.Runtime.InteropServices;
using SlotOpt.Plates.Grid;

namespace SlotOpt.Plates.OwnField;

/// <summary>
/// Bilinear transfer between the unknowns of two sheet models of one plate, a fine and a coarse lattice (any cell sizes: each
/// fine node takes the bilinear weights of the four nodes of the coarse cell it lies in, coarse nodes outside the plate
/// contributing nothing). Values (stream function): <see cref="ProlongAdd"/> is P, a fine unknown being the mean over its nodes
/// (a merged region's value is the same at all of them); P^T (in <see cref="RestrictAndAverage"/>) is the Galerkin restriction of a residual.
/// Fluxes (R u, one number per basis function): a merged unknown's flux is the sum over its nodes' hats, so
/// <see cref="ProlongFluxAdd"/> sums its nodes' interpolated values instead of averaging them. Fine vectors are held as their
/// real and imaginary parts (the form the multigrid and the sheet operator take), coarse ones as complex numbers.
/// P^T is stored by coarse rows, so the restriction gathers (no scattered adds) and forms a residual's restriction and a
/// value's weighted mean in one pass.
/// </summary>
internal sealed class LatticeTransfer
{
    /// <summary>Fine unknown of each plate node taking part, its four coarse unknowns and their bilinear weights (a coarse node off the plate: unknown 0, weight 0).</summary>
    private readonly int[] _fineUnknown;
    private readonly int[] _coarseUnknown;
    private readonly double[] _weight;
    /// <summary>1 / (nodes of the fine unknown): the mean over a merged region's nodes.</summary>
    private readonly double[] _valueShare;
    /// <summary>P^T by coarse rows: row c holds fine unknowns _rowFine[_rowStart[c].._rowStart[c + 1]) with weights _rowWeight.</summary>
    private readonly int[] _rowStart, _rowFine;
    private readonly double[] _rowWeight;
    /// <summary>1 / (row sums of P^T) (P^T applied to ones; 0 where no fine node reaches): the scale of <see cref="RestrictAndAverage"/>'s mean.</summary>
    private readonly double[] _inverseRowSum;

    public int FineUnknowns => _valueShare.Length;
    public int CoarseUnknowns => _inverseRowSum.Length;
    public long Bytes => 4L * (_fineUnknown.Length + _coarseUnknown.Length + _rowStart.Length + _rowFine.Length)
        + 8L * (_weight.Length + _valueShare.Length + _rowWeight.Length + _inverseRowSum.Length);

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
                int di = q & 1, dj = q >> 1, c = mapC[(j0 + dj) * lc.NodesX + i0 + di];
                _coarseUnknown[4 * k + q] = Math.Max(c, 0);
                _weight[4 * k + q] = c < 0 ? 0 : (di == 0 ? 1 - tx : tx) * (dj == 0 ? 1 - ty : ty);   // bilinear weight of coarse node (i0 + di, j0 + dj)
            }
        }
        _valueShare = count.Select(c => c > 0 ? 1.0 / c : 0).ToArray();

        // P^T by rows (counting sort of the nonzero weights by coarse unknown): entry (c, u) = weight(k, c) / (nodes of u) for each
        // node k of u, a merged unknown's nodes as separate entries of one row (their sum is its entry)
        _rowStart = new int[coarse.Unknowns + 1];
        for (int q = 0; q < _weight.Length; q++) if (_weight[q] != 0) _rowStart[_coarseUnknown[q] + 1]++;
        for (int c = 0; c < coarse.Unknowns; c++) _rowStart[c + 1] += _rowStart[c];
        _rowFine = new int[_rowStart[^1]];
        _rowWeight = new double[_rowStart[^1]];
        var next = _rowStart[..^1];
        for (int k = 0; k < _fineUnknown.Length; k++)
            for (int q = 4 * k; q < 4 * k + 4; q++)
                if (_weight[q] != 0)
                {
                    int u = _fineUnknown[k], e = next[_coarseUnknown[q]]++;
                    _rowFine[e] = u;
                    _rowWeight[e] = _weight[q] * _valueShare[u];
                }
        _inverseRowSum = new double[coarse.Unknowns];
        for (int c = 0; c < coarse.Unknowns; c++)
        {
            double sum = 0;
            for (int e = _rowStart[c]; e < _rowStart[c + 1]; e++) sum += _rowWeight[e];
            _inverseRowSum[c] = sum > 0 ? 1 / sum : 0;
        }
    }

    /// <summary>fine += P coarse (values).</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public void ProlongAdd(ReadOnlySpan<Complex> coarse, Span<double> fineRe, Span<double> fineIm) => Interpolate(coarse, fineRe, fineIm, 1, perValue: true);

    /// <summary>fine += factor * (coarse values interpolated to the nodes, summed per unknown): fluxes.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public void ProlongFluxAdd(ReadOnlySpan<Complex> coarse, Span<double> fineRe, Span<double> fineIm, Complex factor) => Interpolate(coarse, fineRe, fineIm, factor, perValue: false);

    /// <summary>
    /// In one pass: restricted = P^T r, and mean = (P^T z) / (P^T 1), a weighted mean of the fine values z around each coarse node
    /// (0 where no fine node reaches).
    /// </summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public void RestrictAndAverage(ReadOnlySpan<double> rRe, ReadOnlySpan<double> rIm, ReadOnlySpan<double> zRe, ReadOnlySpan<double> zIm,
        Span<Complex> restricted, Span<Complex> mean)
    {
        int fine = FineUnknowns;
        if (rRe.Length < fine || rIm.Length < fine || zRe.Length < fine || zIm.Length < fine) throw new ArgumentException("one value per fine unknown");
        if (restricted.Length != CoarseUnknowns || mean.Length != CoarseUnknowns) throw new ArgumentException("one value per coarse unknown");
        ref double w = ref MemoryMarshal.GetArrayDataReference(_rowWeight);
        ref int f = ref MemoryMarshal.GetArrayDataReference(_rowFine);
        ref double rr = ref MemoryMarshal.GetReference(rRe), ri = ref MemoryMarshal.GetReference(rIm);
        ref double zr = ref MemoryMarshal.GetReference(zRe), zi = ref MemoryMarshal.GetReference(zIm);
        for (int c = 0; c < restricted.Length; c++)
        {
            double ar = 0, ai = 0, br = 0, bi = 0;
            for (int e = _rowStart[c]; e < _rowStart[c + 1]; e++)
            {
                double we = Unsafe.Add(ref w, e); int u = Unsafe.Add(ref f, e);   // u < FineUnknowns by construction
                ar += we * Unsafe.Add(ref rr, u); ai += we * Unsafe.Add(ref ri, u); br += we * Unsafe.Add(ref zr, u); bi += we * Unsafe.Add(ref zi, u);
            }
            restricted[c] = new Complex(ar, ai);
            mean[c] = new Complex(br * _inverseRowSum[c], bi * _inverseRowSum[c]);
        }
    }

    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private void Interpolate(ReadOnlySpan<Complex> coarse, Span<double> fineRe, Span<double> fineIm, Complex factor, bool perValue)
    {
        if (coarse.Length != CoarseUnknowns) throw new ArgumentException("one value per coarse unknown", nameof(coarse));
        if (fineRe.Length < FineUnknowns || fineIm.Length < FineUnknowns) throw new ArgumentException("one value per fine unknown");
        ref double w = ref MemoryMarshal.GetArrayDataReference(_weight);
        ref int cu = ref MemoryMarshal.GetArrayDataReference(_coarseUnknown);
        ref int fu = ref MemoryMarshal.GetArrayDataReference(_fineUnknown);
        ref double share = ref MemoryMarshal.GetArrayDataReference(_valueShare);
        ref Complex cr = ref MemoryMarshal.GetReference(coarse);
        ref double fr = ref MemoryMarshal.GetReference(fineRe), fi = ref MemoryMarshal.GetReference(fineIm);
        double re = factor.Real, im = factor.Imaginary;
        for (int k = 0; k < _fineUnknown.Length; k++)
        {
            double sr = 0, si = 0;
            for (int q = 4 * k; q < 4 * k + 4; q++)   // the coarse unknowns are < CoarseUnknowns by construction
            {
                double wq = Unsafe.Add(ref w, q); var v = Unsafe.Add(ref cr, Unsafe.Add(ref cu, q));
                sr += wq * v.Real; si += wq * v.Imaginary;
            }
            int u = Unsafe.Add(ref fu, k);
            double s = perValue ? Unsafe.Add(ref share, u) : 1;
            Unsafe.Add(ref fr, u) += s * (re * sr - im * si);
            Unsafe.Add(ref fi, u) += s * (re * si + im * sr);
        }
    }
}
