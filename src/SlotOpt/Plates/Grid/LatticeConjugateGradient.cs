using System.Runtime.CompilerServices;
using System.Runtime.InteropServices;
using SlotOpt.Numerics;

namespace SlotOpt.Plates.Grid;

/// <summary>
/// Preconditioned conjugate gradients (R. Barrett et al., "Templates for the Solution of Linear Systems",
/// SIAM, 1994, section 2.3.1, Figure 2.5) for the sheet operator with the structured multigrid, the same
/// iteration and stopping rule as <see cref="ConjugateGradient"/> but run on the node lattice itself, so no
/// step gathers or scatters through the node-to-unknown map. A vector of unknowns is held on the padded
/// lattice with each unknown at its node, a merged region's at the first of its nodes (its representative)
/// and 0 at the region's other nodes and the outside: inner products over the lattice are then the
/// unknowns' inner products. The V-cycle reads the residual r where it is and writes the preconditioned
/// residual z into the finest level's iterate (single precision: the preconditioner's output is rounded
/// there, see <see cref="StencilLevel"/>; r, x, p, q and every inner product stay double). The next direction
/// p = z + beta p, the operator and the dot product p.Ap share one pass over the lattice (p updated a row ahead), as do the updates of x and r and |r|;
/// r.z is summed by the cycle's last sweep as it writes z. The iteration
/// runs on b / |b| and psi / |b| (|b| rounded to a power of two, so the scaling is exact), which keeps the
/// single-precision cycle within a few decades of 1 whatever the units; the stopping rule is relative.
/// </summary>
internal static class LatticeConjugateGradient
{
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public static bool TrySolve(StructuredMultigrid mg, ReadOnlySpan<double> b, Span<double> psi, ConvergenceCriterion criterion, out SolveReport report)
    {
        double normB = ConjugateGradient.Norm(b);
        if (normB == 0)
        {
            psi.Clear();
            report = new SolveReport(SolveStatus.Converged, 0, 0);
            return true;
        }
        if (!double.IsFinite(normB)) { report = new SolveReport(SolveStatus.NonFinite, 0, double.NaN); return false; }
        var top = mg.Finest;
        int length = top.X.Length;
        var z = top.X;                 // preconditioned residual
        var r = new double[length];   // no vector of its own for the scaled b: the true residual rebuilds it in r (one vector less of fresh memory)
        var x = new double[length];
        var p = new double[length];
        var q = new double[length];
        double scale = Math.ScaleB(1, -Math.ILogB(normB));
        bool cold = !psi.ContainsAnyExcept(0.0);
        mg.Operator.ToLattice(psi, x, scale);
        normB *= scale;
        if (cold) mg.Operator.ToLattice(b, r, scale);   // r = b - A 0, without applying A
        else TrueResidual(mg, b, scale, x, q, r);
        double target = criterion.RelativeResidual * normB;
        double start = Math.Sqrt(Dot(r, r, top.Pad, top.Nodes));
        int iterations = 0;
        try
        {
            while (true)
            {
                double rel = Math.Sqrt(Dot(r, r, top.Pad, top.Nodes));
                if (rel <= target)
                {
                    double trueNorm = Math.Sqrt(TrueResidual(mg, b, scale, x, q, r));
                    if (trueNorm <= target) { report = new SolveReport(SolveStatus.Converged, iterations, trueNorm / normB); return true; }
                }
                if (iterations >= criterion.MaxIterations)
                {
                    report = new SolveReport(SolveStatus.IterationLimit, iterations, Math.Sqrt(TrueResidual(mg, b, scale, x, q, r)) / normB);
                    return false;
                }
                // (re)start: p = z = M^-1 r (beta 0; p holds zeros or the last finite direction)
                double rz = mg.CycleInPlace(r);
                double beta = 0;
                while (iterations < criterion.MaxIterations)
                {
                    criterion.ThrowIfCancelled();
                    double pq = mg.Operator.NextDirectionAndMultiply(p, z, beta, q);   // p = z + beta p, q = A p
                    if (!double.IsFinite(pq) || !double.IsFinite(rz))
                    {
                        report = new SolveReport(SolveStatus.NonFinite, iterations, Math.Sqrt(Dot(r, r, top.Pad, top.Nodes)) / normB);
                        return false;
                    }
                    if (!(pq > 0))
                    {
                        report = new SolveReport(SolveStatus.NotPositiveDefinite, iterations, Math.Sqrt(Dot(r, r, top.Pad, top.Nodes)) / normB);
                        return false;
                    }
                    double alpha = rz / pq;
                    double rn = Math.Sqrt(UpdateSolutionAndResidual(x, r, p, q, alpha, top.Pad, top.Nodes));
                    iterations++;
                    if (!double.IsFinite(rn) || rn > criterion.DivergenceFactor * Math.Max(start, normB))
                    {
                        report = new SolveReport(double.IsFinite(rn) ? SolveStatus.Diverged : SolveStatus.NonFinite, iterations, rn / normB);
                        return false;
                    }
                    if (rn <= target) break;
                    double rzNew = mg.CycleInPlace(r);
                    beta = rzNew / rz;
                    rz = rzNew;
                }
            }
        }
        finally { mg.Operator.FromLattice(x, psi, 1 / scale); }
    }

    /// <summary>r = scale b - A x on the lattice (b in the unknowns' numbering, q as scratch); returns |r|^2.</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static double TrueResidual(StructuredMultigrid mg, ReadOnlySpan<double> b, double scale, double[] x, double[] q, double[] r)
    {
        mg.Operator.MultiplyOnLattice(x, q);
        mg.Operator.ToLattice(b, r, scale);
        for (int i = 0; i < r.Length; i++) r[i] -= q[i];
        return Dot(r, r, mg.Finest.Pad, mg.Finest.Nodes);
    }

    /// <summary>a . b over [from, from + count), in four interleaved partial sums (so the additions do not wait on one another).</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static double Dot(double[] a, double[] b, int from, int count)
    {
        ref double ar = ref MemoryMarshal.GetArrayDataReference(a);
        ref double br = ref MemoryMarshal.GetArrayDataReference(b);
        double s0 = 0, s1 = 0, s2 = 0, s3 = 0;
        int i = from, end = from + count;
        for (; i + 3 < end; i += 4)
        {
            s0 += Unsafe.Add(ref ar, i) * Unsafe.Add(ref br, i);
            s1 += Unsafe.Add(ref ar, i + 1) * Unsafe.Add(ref br, i + 1);
            s2 += Unsafe.Add(ref ar, i + 2) * Unsafe.Add(ref br, i + 2);
            s3 += Unsafe.Add(ref ar, i + 3) * Unsafe.Add(ref br, i + 3);
        }
        for (; i < end; i++) s0 += Unsafe.Add(ref ar, i) * Unsafe.Add(ref br, i);
        return (s0 + s1) + (s2 + s3);
    }

    /// <summary>x += alpha p, r -= alpha q in one pass; returns |r|^2 (four interleaved partial sums, as <see cref="Dot"/>).</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static double UpdateSolutionAndResidual(double[] x, double[] r, double[] p, double[] q, double alpha, int from, int count)
    {
        ref double xr = ref MemoryMarshal.GetArrayDataReference(x);
        ref double rr = ref MemoryMarshal.GetArrayDataReference(r);
        ref double pr = ref MemoryMarshal.GetArrayDataReference(p);
        ref double qr = ref MemoryMarshal.GetArrayDataReference(q);
        double s0 = 0, s1 = 0, s2 = 0, s3 = 0;
        int i = from, end = from + count;
        for (; i + 3 < end; i += 4)
        {
            s0 += Step(ref xr, ref rr, ref pr, ref qr, alpha, i);
            s1 += Step(ref xr, ref rr, ref pr, ref qr, alpha, i + 1);
            s2 += Step(ref xr, ref rr, ref pr, ref qr, alpha, i + 2);
            s3 += Step(ref xr, ref rr, ref pr, ref qr, alpha, i + 3);
        }
        for (; i < end; i++) s0 += Step(ref xr, ref rr, ref pr, ref qr, alpha, i);
        return (s0 + s1) + (s2 + s3);

        // one entry: x_i += alpha p_i, r_i -= alpha q_i; returns r_i^2
        [MethodImpl(MethodImplOptions.AggressiveInlining)]
        static double Step(ref double xr, ref double rr, ref double pr, ref double qr, double alpha, int i)
        {
            Unsafe.Add(ref xr, i) += alpha * Unsafe.Add(ref pr, i);
            double v = Unsafe.Add(ref rr, i) - alpha * Unsafe.Add(ref qr, i);
            Unsafe.Add(ref rr, i) = v;
            return v * v;
        }
    }
}
