using MathNet.Numerics.LinearAlgebra;
using SlotOpt.Numerics;
using Vector = MathNet.Numerics.LinearAlgebra.Vector<double>;

namespace SlotOpt.Tests.Numerics;

/// <summary>
/// GMRES with a recycled space (<see cref="RecycledGmres"/>) against MathNet.Numerics' dense LU with partial pivoting, on a sequence of
/// right-hand sides for one random non-symmetric matrix. The matrix is strictly diagonally dominant by rows with a dominance margin of
/// 1 + n/2 over the off-diagonal sum, so cond(A) stays small (Gershgorin: every eigenvalue's distance from the origin is at least the margin);
/// the solves stop at a true relative residual of 1e-13, so the error is at most cond(A) 1e-13, and the check allows 1e-10 of the largest entry:
/// loose enough for that, tight enough that a wrong projection or update (errors of order 1) cannot pass.
/// </summary>
public class RecycledGmresTests
{
    private static readonly ConvergenceCriterion Tight = new() { RelativeResidual = 1e-13, MaxIterations = 500 };

    private static Matrix<double> RandomNonSymmetric(int seed, int n)
    {
        var random = new Random(seed);
        var a = Matrix<double>.Build.Dense(n, n, (_, _) => random.NextDouble() < 0.3 ? 2 * random.NextDouble() - 1 : 0);
        for (int i = 0; i < n; i++) a[i, i] = 1 + n / 2.0 + a.Row(i).Enumerate().Where((_, j) => j != i).Sum(Math.Abs);
        return a;
    }

    private static RealMap Map(Matrix<double> a) => (x, y) => a.Multiply(Vector.Build.DenseOfArray(x)).CopyTo(Vector.Build.Dense(y));

    [Theory]
    [InlineData(21, 40, 0, 8)]      // no kept space: plain GMRES
    [InlineData(22, 60, 12, 8)]     // a small space: cycles dropped oldest first, restarts inside a solve
    [InlineData(23, 60, 60, 60)]
    public void Sequence_of_right_hand_sides_matches_the_dense_solve(int seed, int n, int capacity, int restart)
    {
        var a = RandomNonSymmetric(seed, n);
        var diagonal = Enumerable.Range(0, n).Select(i => a[i, i]).ToArray();
        var gmres = new RecycledGmres(Map(a), (r, z) => { for (int i = 0; i < n; i++) z[i] = r[i] / diagonal[i]; }, n, capacity, restart);
        var random = new Random(seed + 100);
        var x = new double[n];
        var b0 = Enumerable.Range(0, n).Select(_ => 2 * random.NextDouble() - 1).ToArray();
        for (int k = 0; k < 6; k++)
        {
            // each right-hand side a perturbation of the first, as the travel positions of a moving source are
            var b = b0.Select(v => v + 0.3 * (2 * random.NextDouble() - 1)).ToArray();
            var expected = a.LU().Solve(Vector.Build.DenseOfArray(b));
            Assert.True(gmres.TrySolve(b, x, null, false, Tight, out var report), report.Reason);
            Assert.True(report.RelativeResidual <= 1e-13);
            Assert.InRange(gmres.Kept, 0, capacity);
            double scale = expected.AbsoluteMaximum();
            for (int i = 0; i < n; i++) Assert.True(Math.Abs(x[i] - expected[i]) <= 1e-10 * scale, $"solve {k}: x[{i}] = {x[i]}, dense LU {expected[i]}");
        }
    }

    // A right-hand side in the span of the earlier ones is met by the projection onto the kept space alone (A U = C, C^T C = I: the
    // minimal-residual start is the answer), confirmed on the true residual without a Krylov step: 0 iterations. Exact in exact
    // arithmetic; the 1e-10 criterion leaves room for the rounding of A U = C.
    [Fact]
    public void Right_hand_side_in_the_kept_space_needs_no_iteration()
    {
        const int n = 50;
        var a = RandomNonSymmetric(31, n);
        var gmres = new RecycledGmres(Map(a), (r, z) => Array.Copy(r, z, n), n);
        var criterion = new ConvergenceCriterion { RelativeResidual = 1e-10 };
        var random = new Random(32);
        var b1 = Enumerable.Range(0, n).Select(_ => random.NextDouble()).ToArray();
        var b2 = Enumerable.Range(0, n).Select(_ => random.NextDouble()).ToArray();
        Assert.True(gmres.TrySolve(b1, new double[n], null, false, criterion, out var first));
        Assert.True(first.Iterations > 0);
        Assert.True(gmres.TrySolve(b2, new double[n], null, false, criterion, out _));
        var x = new double[n];
        Assert.True(gmres.TrySolve(b1.Zip(b2, (p, q) => 2 * p - q).ToArray(), x, null, false, criterion, out var third));
        Assert.Equal(0, third.Iterations);
        Assert.True(third.RelativeResidual <= 1e-10);
    }

    // NaN in the right-hand side stops with NonFinite, not a number.
    [Fact]
    public void Non_finite_right_hand_side_is_reported()
    {
        var a = RandomNonSymmetric(41, 10);
        var gmres = new RecycledGmres(Map(a), (r, z) => Array.Copy(r, z, 10), 10);
        var b = new double[10];
        b[3] = double.NaN;
        Assert.False(gmres.TrySolve(b, new double[10], null, false, Tight, out var report));
        Assert.Equal(SolveStatus.NonFinite, report.Status);
    }
}
