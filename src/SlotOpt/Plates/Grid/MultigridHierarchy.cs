using MathNet.Numerics.LinearAlgebra;
using MathNet.Numerics.LinearAlgebra.Factorization;
using SlotOpt.Numerics;

namespace SlotOpt.Plates.Grid;

/// <summary>
/// Algebraic (CSR) multigrid V-cycle preconditioner for node-based operators on the plate lattice other than the
/// sheet operator (which has the structured <see cref="StructuredMultigrid"/>): today the plate's temperature operator
/// (Plates/Thermal). Moving that operator onto stencils would let it use the structured multigrid too. Coarse lattices keep every other node
/// in x and y (plus the last one); the prolongation P is operator-dependent (see
/// <see cref="MultigridInterpolation"/>), except that a merged region (a hole, a slot, a cut) is carried to every coarser level as one unknown by
/// injection, and any coarse node lying in such a region maps to it; nodes fixed at psi = 0 drop
/// out. Coarse operators are Galerkin products A_c = P^T A P, so slots and holes survive
/// coarsening and the V-cycle stays symmetric positive definite (W. L. Briggs, V. E. Henson,
/// S. F. McCormick, "A Multigrid Tutorial", 2nd ed., SIAM, 2000, ch. 8 on variational coarsening).
/// Smoothing: one forward Gauss–Seidel sweep before and one backward after the coarse correction
/// (symmetric, as CG needs); the coarsest level is solved by MathNet.Numerics' dense Cholesky factorisation.
/// Built once per geometry and reused for every source and source position.
/// </summary>
public sealed class MultigridHierarchy : IPreconditioner
{
    /// <summary>Stop coarsening at this many unknowns (dense Cholesky below).</summary>
    public const int CoarsestUnknowns = 400;
    private readonly List<MultigridLevel> _levels;
    private readonly Cholesky<double> _coarsest;
    private readonly Vector<double> _coarseB;
    private readonly Vector<double> _coarseX;

    private MultigridHierarchy(List<MultigridLevel> levels, Cholesky<double> coarsest)
    {
        _levels = levels;
        _coarsest = coarsest;
        _coarseB = Vector<double>.Build.Dense(levels[^1].Unknowns);
        _coarseX = Vector<double>.Build.Dense(levels[^1].Unknowns);
    }

    public int LevelCount => _levels.Count;
    /// <summary>Bytes held beyond the fine operator itself (coarse operators, transfers, vectors, coarse factor).</summary>
    public long Bytes => _levels.Sum(l => l.Bytes) - _levels[0].A.Bytes + 8L * _coarsest.Factor.RowCount * _coarsest.Factor.ColumnCount + _levels.Skip(1).Sum(l => 4L * l.NodeUnknown.Length);

    /// <summary>
    /// The hierarchy for any symmetric positive definite operator whose unknowns sit on the nodes of the
    /// lattice (nodeUnknown: unknown per node, -1 where the value is fixed or absent), such as the plate's
    /// temperature operator; isMerged marks unknowns that stand for several nodes (none for temperature).
    /// </summary>
    public static MultigridHierarchy Build(CsrMatrix matrix, CellLattice lattice, int[] nodeUnknown, bool[] isMerged)
    {
        var fine = new MultigridLevel
        {
            A = matrix,
            NodesX = lattice.NodesX,
            NodesY = lattice.NodesY,
            NodeUnknown = nodeUnknown,
            IsMerged = isMerged,
        };
        var levels = new List<MultigridLevel> { fine };
        var current = fine;
        while (current.Unknowns > CoarsestUnknowns && current.NodesX > 3 && current.NodesY > 3)
        {
            var coarse = Coarsen(current);
            if (coarse.Unknowns > 0.8 * current.Unknowns) break;   // coarsening stalls (very many merged regions): stop here
            levels.Add(coarse);
            current = coarse;
        }
        foreach (var level in levels)
        {
            level.X = new double[level.Unknowns];
            level.B = new double[level.Unknowns];
            level.Work = new double[level.Unknowns];
        }
        if (current.Unknowns > 6000)
            throw new NumericalFailureException($"multigrid coarsening stalled at {current.Unknowns} unknowns (too many separate holes or cuts for the coarse solver)");
        return new MultigridHierarchy(levels, CoarseFactor(current.A));
    }

    /// <summary>Cholesky factor A = L L^T of the coarsest operator, dense (at most a few thousand unknowns).</summary>
    private static Cholesky<double> CoarseFactor(CsrMatrix a)
    {
        var dense = Matrix<double>.Build.Dense(a.Rows, a.Rows);
        for (int i = 0; i < a.Rows; i++)
            for (int k = a.RowStart[i]; k < a.RowStart[i + 1]; k++)
                dense[i, a.ColumnIndex[k]] = a.Value[k];
        try
        {
            return dense.Cholesky();
        }
        catch (ArgumentException)
        {
            throw new NumericalFailureException($"coarse sheet operator is not positive definite ({a.Rows} unknowns)");
        }
    }

    public void Apply(ReadOnlySpan<double> r, Span<double> z)
    {
        var top = _levels[0];
        r.CopyTo(top.B);
        Cycle(0);
        top.X.AsSpan().CopyTo(z);
    }

    private void Cycle(int k)
    {
        var level = _levels[k];
        if (k == _levels.Count - 1)
        {
            level.B.AsSpan().CopyTo(_coarseB.AsArray());
            _coarsest.Solve(_coarseB, _coarseX);
            _coarseX.AsArray().AsSpan().CopyTo(level.X);
            return;
        }
        Array.Clear(level.X);
        GaussSeidel(level.A, level.B, level.X, forward: true);
        level.A.Residual(level.B, level.X, level.Work);
        var coarse = _levels[k + 1];
        coarse.R!.Multiply(level.Work, coarse.B);
        Cycle(k + 1);
        coarse.P!.MultiplyAdd(coarse.X, level.X);
        GaussSeidel(level.A, level.B, level.X, forward: false);
    }

    private static void GaussSeidel(CsrMatrix a, double[] b, double[] x, bool forward)
    {
        var rs = a.RowStart; var ci = a.ColumnIndex; var v = a.Value;
        int n = a.Rows;
        for (int t = 0; t < n; t++)
        {
            int i = forward ? t : n - 1 - t;
            double s = b[i], d = 0;
            for (int k = rs[i], e = rs[i + 1]; k < e; k++)
            {
                int c = ci[k];
                if (c == i) d = v[k];
                else s -= v[k] * x[c];
            }
            x[i] = s / d;
        }
    }

    private static MultigridLevel Coarsen(MultigridLevel f)
    {
        var (cx, wx) = AxisCoarsening(f.NodesX);
        var (cy, wy) = AxisCoarsening(f.NodesY);
        int ncx = cx.Length, ncy = cy.Length;
        // coarse unknowns: first one per merged fine region, then one per coarse node in a plain fine node
        var mergedToCoarse = new int[f.Unknowns];
        Array.Fill(mergedToCoarse, -1);
        int next = 0;
        for (int u = 0; u < f.Unknowns; u++) if (f.IsMerged[u]) mergedToCoarse[u] = next++;
        int mergedCount = next;
        var coarseNodeUnknown = new int[ncx * ncy];
        for (int J = 0; J < ncy; J++)
            for (int I = 0; I < ncx; I++)
            {
                int u = f.NodeUnknown[cy[J] * f.NodesX + cx[I]];
                coarseNodeUnknown[J * ncx + I] = u < 0 ? -1 : f.IsMerged[u] ? mergedToCoarse[u] : next++;
            }
        var isMerged = new bool[next];
        for (int u = 0; u < mergedCount; u++) isMerged[u] = true;

        var plainNode = new int[f.Unknowns];
        for (int node = 0; node < f.NodeUnknown.Length; node++)
        {
            int u = f.NodeUnknown[node];
            if (u >= 0 && !f.IsMerged[u]) plainNode[u] = node;
        }
        var ctx = new MultigridInterpolation(f, wx, wy, coarseNodeUnknown, ncx, mergedToCoarse, plainNode);
        // stage 1: merged regions, coarse-coincident nodes and edge nodes (at most 2 entries each)
        var firstCol = new int[2 * f.Unknowns];
        var firstVal = new double[2 * f.Unknowns];
        var firstCount = new byte[f.Unknowns];
        for (int u = 0; u < f.Unknowns; u++)
            if (!ctx.IsCentre(u)) firstCount[u] = (byte)ctx.FirstStage(u, firstCol.AsSpan(2 * u, 2), firstVal.AsSpan(2 * u, 2));
        // stage 2: cell-centre nodes from their neighbours' rows; then write P
        var rowStart = new int[f.Unknowns + 1];
        var col = new List<int>(f.Unknowns * 9 / 4 + 16);     // bilinear-like rows average 2.25 entries
        var val = new List<double>(f.Unknowns * 9 / 4 + 16);
        Span<int> bc = stackalloc int[MultigridInterpolation.MaxEntries];
        Span<double> bw = stackalloc double[MultigridInterpolation.MaxEntries];
        for (int u = 0; u < f.Unknowns; u++)
        {
            int count;
            if (!ctx.IsCentre(u))
            {
                count = firstCount[u];
                for (int q = 0; q < count; q++) { bc[q] = firstCol[2 * u + q]; bw[q] = firstVal[2 * u + q]; }
            }
            else count = ctx.Centre(u, firstCol, firstVal, firstCount, bc, bw);
            for (int a = 1; a < count; a++)
                for (int b = a; b > 0 && bc[b - 1] > bc[b]; b--) { (bc[b - 1], bc[b]) = (bc[b], bc[b - 1]); (bw[b - 1], bw[b]) = (bw[b], bw[b - 1]); }
            for (int q = 0; q < count; q++) if (bw[q] != 0) { col.Add(bc[q]); val.Add(bw[q]); }
            rowStart[u + 1] = col.Count;
        }
        var p = new CsrMatrix(f.Unknowns, next, rowStart, col.ToArray(), val.ToArray());
        var r = p.Transpose();
        var ac = CsrMatrix.GalerkinProduct(r, f.A, p);
        return new MultigridLevel { A = ac, NodesX = ncx, NodesY = ncy, NodeUnknown = coarseNodeUnknown, IsMerged = isMerged, P = p, R = r };
    }

    /// <summary>Coarse nodes at even fine indices and the last; each fine index gets its 1 or 2 coarse neighbours with linear weights.</summary>
    private static (int[] Coarse, (int Index, double Weight)[][] Weights) AxisCoarsening(int fineNodes)
    {
        var coarse = new List<int>();
        for (int i = 0; i < fineNodes; i += 2) coarse.Add(i);
        if (coarse[^1] != fineNodes - 1) coarse.Add(fineNodes - 1);
        var weights = new (int, double)[fineNodes][];
        for (int i = 0; i < fineNodes; i++)
        {
            int c = coarse.BinarySearch(i);
            if (c >= 0) weights[i] = new[] { (c, 1.0) };
            else
            {
                int hi = ~c, lo = hi - 1;
                double t = (double)(i - coarse[lo]) / (coarse[hi] - coarse[lo]);
                weights[i] = new[] { (lo, 1 - t), (hi, t) };
            }
        }
        return (coarse.ToArray(), weights);
    }
}
