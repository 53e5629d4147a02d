using System.Runtime.CompilerServices;
using System.Runtime.InteropServices;
using System.Runtime.Intrinsics;
using SlotOpt.Numerics;
using SlotOpt.Plates.Grid;

namespace SlotOpt.Plates.Thermal;

/// <summary>
/// Preconditioned conjugate gradients (R. Barrett et al., "Templates for the Solution of Linear Systems", SIAM, 1994, section 2.3.1,
/// Figure 2.5) for the <see cref="ThermalOperator"/> on the node lattice, with the multigrid cycling on the lattice vectors
/// themselves (<see cref="StructuredMultigrid.ApplyOnLattice"/>: one unknown per node, r read in place, z left in the cycle's
/// single-precision iterate with its scale and read from there, r . z from the cycle's last pass). The vectors live across the steps of the temperature solver's
/// iteration, whose steps change only the diagonal and the right-hand side: the solution <see cref="X"/> and its residual
/// <see cref="R"/> (= <see cref="B"/> - A X) stay, so a step starts warm from the last rise with the residual updated for the change
/// (<see cref="Update"/>, one pass without the stencil) instead of recomputed. Operator and p . Ap share one pass, as do the updates
/// of x and r and |r|. Stopping: the relative residual |r| / |b| at most the criterion's; with <c>confirm</c> the true residual is
/// recomputed then and the iteration restarts from it when it misses (as <see cref="ConjugateGradient"/>); without, the recursive
/// residual stands (a step that only points the way; the last step confirms). Not for concurrent solves.
/// </summary>
public sealed class ThermalConjugateGradient
{
    private readonly ThermalOperator _a;
    private readonly int _pad;
    private readonly double[] _diagonal, _x, _r, _b, _p, _q;

    public ThermalConjugateGradient(ThermalOperator a)
    {
        _a = a;
        _pad = a.Pad;
        _diagonal = a.DiagonalWPerK;
        int length = a.LatticeLength;
        _x = new double[length];
        _r = new double[length];
        _b = new double[length];
        _p = new double[length];
        _q = new double[length];
    }

    /// <summary>The solution (the starting guess before a solve), on the padded lattice.</summary>
    public double[] X => _x;
    /// <summary>The right-hand side on the padded lattice (0 at nodes without an unknown).</summary>
    public double[] B => _b;
    /// <summary>The residual B - A X: set by <see cref="StartResidual"/>, kept by the solve and <see cref="Update"/>.</summary>
    public double[] R => _r;

    /// <summary>R = B - A X (one operator pass); returns |R|^2 and max |R|.</summary>
    public (double Squared, double Largest) StartResidual() => _a.Residual(B, X, R);

    /// <summary>Node p's diagonal and right-hand side change to the given values, and R follows: r += (b' - b) - (d' - d) x, exact
    /// as far as rounding goes (the conduction, the rest of the row, did not move).</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public void Update(int node, double diagonal, double rightHandSide)
    {
        int q = _pad + node;
        _r[q] += (rightHandSide - _b[q]) - (diagonal - _diagonal[node]) * _x[q];
        _diagonal[node] = diagonal;
        _b[q] = rightHandSide;
    }

    /// <summary>|R|, |B| and max |R| (the multigrid's scaling of R).</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]   // a few calls a run, each with long loops: optimised from the first
    public (double Residual, double RightHandSide, double Largest) Norms()
    {
        double rr = 0, bb = 0, largest = 0;
        for (int i = 0; i < R.Length; i++) { rr += R[i] * R[i]; bb += B[i] * B[i]; largest = Math.Max(largest, Math.Abs(R[i])); }
        return (Math.Sqrt(rr), Math.Sqrt(bb), largest);
    }

    /// <summary>Solves from X and R (R = B - A X on entry) until |R| &lt;= criterion |B|; see the type's summary for <paramref name="confirm"/>.
    /// <paramref name="norms"/>: |R|, |B| and max |R| as <see cref="Norms"/> gives them, when the caller's pass has them (else computed here).</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public bool TrySolve(StructuredMultigrid m, ConvergenceCriterion criterion, bool confirm, out SolveReport report,
        (double Residual, double RightHandSide, double Largest)? norms = null)
    {
        var (start, normB, largest) = norms ?? Norms();
        var x = X; var r = R; var p = _p; var q = _q;
        if (normB == 0)
        {
            Array.Clear(x);
            Array.Clear(r);
            report = new SolveReport(SolveStatus.Converged, 0, 0);
            return true;
        }
        if (!double.IsFinite(normB) || !double.IsFinite(start)) { report = new SolveReport(SolveStatus.NonFinite, 0, double.NaN); return false; }
        double target = criterion.RelativeResidual * normB;
        double rn = start;
        int iterations = 0;
        while (true)
        {
            if (rn <= target)
            {
                if (!confirm) { report = new SolveReport(SolveStatus.Converged, iterations, rn / normB); return true; }
                (double squared, largest) = _a.Residual(B, x, r);
                double trueNorm = Math.Sqrt(squared);
                if (trueNorm <= target) { report = new SolveReport(SolveStatus.Converged, iterations, trueNorm / normB); return true; }
                rn = trueNorm;
            }
            if (iterations >= criterion.MaxIterations)
            {
                report = new SolveReport(SolveStatus.IterationLimit, iterations, Math.Sqrt(_a.Residual(B, x, r).Squared) / normB);
                return false;
            }
            // (re)start: p = z = M^-1 r
            double rz = m.ApplyOnLattice(r, largest, out var z, out double zScale);
            Array.Clear(p);   // then p = zScale z + 0 p with its product in one pass (0 times an old direction that is not finite would not be 0)
            double pq = _a.MultiplyNextDirection(z, zScale, 0, p, q);
            while (iterations < criterion.MaxIterations)
            {
                criterion.ThrowIfCancelled();
                if (!double.IsFinite(pq) || !double.IsFinite(rz)) { report = new SolveReport(SolveStatus.NonFinite, iterations, rn / normB); return false; }
                if (!(pq > 0)) { report = new SolveReport(SolveStatus.NotPositiveDefinite, iterations, rn / normB); return false; }
                double alpha = rz / pq;
                (double squared, largest) = UpdateSolutionAndResidual(x, r, p, q, alpha);
                rn = Math.Sqrt(squared);
                iterations++;
                if (!double.IsFinite(rn) || rn > criterion.DivergenceFactor * Math.Max(start, normB))
                {
                    report = new SolveReport(double.IsFinite(rn) ? SolveStatus.Diverged : SolveStatus.NonFinite, iterations, rn / normB);
                    return false;
                }
                if (rn <= target) break;
                double rzNew = m.ApplyOnLattice(r, largest, out z, out zScale);
                double beta = rzNew / rz;
                rz = rzNew;
                pq = _a.MultiplyNextDirection(z, zScale, beta, p, q);
            }
        }
    }

    /// <summary>x += alpha p, r -= alpha q in one pass, four entries at a time; returns |r|^2 and max |r| (the multigrid's scaling of r).</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static (double Squared, double Largest) UpdateSolutionAndResidual(double[] x, double[] r, double[] p, double[] q, double alpha)
    {
        int length = x.Length;
        if (r.Length != length || p.Length != length || q.Length != length) throw new ArgumentException("vectors of one length");
        ref double xs = ref MemoryMarshal.GetArrayDataReference(x);
        ref double rs = ref MemoryMarshal.GetArrayDataReference(r);
        ref double ps = ref MemoryMarshal.GetArrayDataReference(p);
        ref double qs = ref MemoryMarshal.GetArrayDataReference(q);
        var step = Vector256.Create(alpha);
        var squares = Vector256<double>.Zero;
        var largestBlock = Vector256<double>.Zero;
        int i = 0;
        for (; i + Vector256<double>.Count <= length; i += Vector256<double>.Count)
        {
            (Vector256.LoadUnsafe(ref xs, (nuint)i) + step * Vector256.LoadUnsafe(ref ps, (nuint)i)).StoreUnsafe(ref xs, (nuint)i);
            var v = Vector256.LoadUnsafe(ref rs, (nuint)i) - step * Vector256.LoadUnsafe(ref qs, (nuint)i);
            v.StoreUnsafe(ref rs, (nuint)i);
            squares += v * v;
            largestBlock = Vector256.Max(largestBlock, Vector256.Abs(v));
        }
        double squared = Vector256.Sum(squares), largest = 0;
        for (int e = 0; e < Vector256<double>.Count; e++) largest = Math.Max(largest, largestBlock[e]);
        for (; i < length; i++)
        {
            x[i] += alpha * p[i];
            double v = r[i] - alpha * q[i];
            r[i] = v;
            squared += v * v;
            largest = Math.Max(largest, Math.Abs(v));
        }
        return (squared, largest);
    }
}
