using System.Numerics;
using ComplexVector = MathNet.Numerics.LinearAlgebra.Vector<System.Numerics.Complex>;
using MathNet.Numerics.LinearAlgebra;
using SlotOpt.Numerics;
using Vector = MathNet.Numerics.LinearAlgebra.Vector<double>;

namespace SlotOpt.Tests.Numerics;

/// <summary>
/// Conjugate gradients, real and complex GMRES against MathNet.Numerics' dense direct solves (LU
/// with partial pivoting) on small random systems. The iterations stop at a true relative residual of
/// 1e-12; the solution error is then at most cond(A) times that. The matrices are made diagonally dominant
/// so cond(A) stays below about 10 (Gershgorin), and the checks allow 1e-9 relative: loose enough for the
/// condition number, tight enough that a wrong Krylov step (which leaves errors of order 1) cannot pass.
/// </summary>
public class KrylovSolverTests
{
    private static readonly ConvergenceCriterion Tight = new() { RelativeResidual = 1e-12, MaxIterations = 500 };

    private sealed class Identity : IPreconditioner
    {
        public void Apply(ReadOnlySpan<double> r, Span<double> z) => r.CopyTo(z);
    }

    private sealed class Jacobi(double[] diagonal) : IPreconditioner
    {
        public void Apply(ReadOnlySpan<double> r, Span<double> z)
        {
            for (int i = 0; i < r.Length; i++) z[i] = r[i] / diagonal[i];
        }
    }

    /// <summary>A symmetric positive definite CSR matrix: B + B^T of a random sparse B plus a diagonal above its row sums.</summary>
    private static (CsrMatrix Csr, Matrix<double> Dense) RandomSpd(int seed, int n)
    {
        var (_, b) = SparseKernelTests.RandomSparse(new Random(seed), n, n, 0.15);
        var dense = b + b.Transpose();
        for (int i = 0; i < n; i++) dense[i, i] = 1 + dense.Row(i).Enumerate().Sum(Math.Abs);   // strictly diagonally dominant, positive diagonal: SPD
        var rowStart = new int[n + 1];
        var columns = new List<int>();
        var values = new List<double>();
        for (int i = 0; i < n; i++)
        {
            for (int j = 0; j < n; j++)
                if (dense[i, j] != 0) { columns.Add(j); values.Add(dense[i, j]); }
            rowStart[i + 1] = columns.Count;
        }
        return (new CsrMatrix(n, n, rowStart, columns.ToArray(), values.ToArray()), dense);
    }

    [Theory]
    [InlineData(11, 30, false)]
    [InlineData(12, 80, true)]
    public void ConjugateGradientMatchesDenseSolve(int seed, int n, bool jacobi)
    {
        var (a, dense) = RandomSpd(seed, n);
        var random = new Random(seed + 100);
        var b = Enumerable.Range(0, n).Select(_ => 2 * random.NextDouble() - 1).ToArray();
        var expected = dense.Solve(Vector.Build.DenseOfArray(b));
        var x = new double[n];
        IPreconditioner m = jacobi ? new Jacobi(Enumerable.Range(0, n).Select(i => dense[i, i]).ToArray()) : new Identity();
        var report = ConjugateGradient.Solve(a, b, x, m, Tight);
        Assert.Equal(SolveStatus.Converged, report.Status);
        Assert.True(report.RelativeResidual <= 1e-12);
        double scale = expected.AbsoluteMaximum();
        for (int i = 0; i < n; i++) Assert.True(Math.Abs(x[i] - expected[i]) <= 1e-9 * scale, $"x[{i}] = {x[i]}, dense solve {expected[i]}");
    }

    // An indefinite symmetric matrix (diag(1, -1)) must stop with NotPositiveDefinite, not return a number.
    [Fact]
    public void ConjugateGradientReportsIndefiniteOperator()
    {
        var a = new CsrMatrix(2, 2, new[] { 0, 1, 2 }, new[] { 0, 1 }, new[] { 1.0, -1.0 });
        var x = new double[2];
        Assert.False(ConjugateGradient.TrySolve(a, new[] { 1.0, 1.0 }, x, new Identity(), Tight, out var report));
        Assert.Equal(SolveStatus.NotPositiveDefinite, report.Status);
        Assert.Throws<NumericalFailureException>(() => ConjugateGradient.Solve(a, new[] { 1.0, 1.0 }, new double[2], new Identity(), Tight));
    }

    [Fact]
    public void ConjugateGradientReportsIterationLimit()
    {
        var (a, _) = RandomSpd(13, 60);
        var b = Enumerable.Repeat(1.0, 60).ToArray();
        Assert.False(ConjugateGradient.TrySolve(a, b, new double[60], new Identity(), Tight with { MaxIterations = 2 }, out var report));
        Assert.Equal(SolveStatus.IterationLimit, report.Status);
        Assert.Equal(2, report.Iterations);
    }

    [Fact]
    public void ConjugateGradientReportsNonFiniteRightHandSide()
    {
        var (a, _) = RandomSpd(14, 5);
        Assert.False(ConjugateGradient.TrySolve(a, new[] { 1, double.NaN, 0, 0, 0 }, new double[5], new Identity(), Tight, out var report));
        Assert.Equal(SolveStatus.NonFinite, report.Status);
    }

    /// <summary>A random complex non-Hermitian matrix with a dominant diagonal (a + j b, a >= row sum): well conditioned, like the coupled sheet operator.</summary>
    private static Matrix<Complex> RandomComplex(int seed, int n)
    {
        var random = new Random(seed);
        var m = Matrix<Complex>.Build.Dense(n, n);
        for (int i = 0; i < n; i++)
            for (int j = 0; j < n; j++)
                if (i != j && random.NextDouble() < 0.3) m[i, j] = new Complex(2 * random.NextDouble() - 1, 2 * random.NextDouble() - 1);
        for (int i = 0; i < n; i++) m[i, i] = new Complex(1 + m.Row(i).Enumerate().Sum(c => c.Magnitude), 2 * random.NextDouble() - 1);
        return m;
    }

    [Theory]
    [InlineData(21, 40, 60, false)]
    [InlineData(22, 60, 8, true)]      // restart 8 < n: the restarts must carry the solution on
    public void ComplexGmresMatchesDenseLu(int seed, int n, int restart, bool diagonalPreconditioner)
    {
        var a = RandomComplex(seed, n);
        var random = new Random(seed + 100);
        var b = Enumerable.Range(0, n).Select(_ => new Complex(2 * random.NextDouble() - 1, 2 * random.NextDouble() - 1)).ToArray();
        var expected = a.LU().Solve(ComplexVector.Build.DenseOfArray(b));
        int applications = 0;
        ComplexMap apply = (x, y) => { applications++; (a * ComplexVector.Build.DenseOfArray(x)).CopyTo(ComplexVector.Build.Dense(y)); };
        ComplexMap precondition = diagonalPreconditioner
            ? (r, z) => { for (int i = 0; i < r.Length; i++) z[i] = r[i] / a[i, i]; }
            : (r, z) => Array.Copy(r, z, r.Length);
        var x = new Complex[n];
        var report = ComplexGmres.Solve(apply, precondition, b, x, Tight, restart);
        Assert.Equal(SolveStatus.Converged, report.Status);
        double scale = expected.Enumerate().Max(c => c.Magnitude);
        for (int i = 0; i < n; i++) Assert.True((x[i] - expected[i]).Magnitude <= 1e-9 * scale, $"x[{i}] = {x[i]}, dense LU {expected[i]}");
        // from a zero start the first residual is b itself: one product a cycle for the true residual at its end, none at the start
        Assert.Equal(report.Iterations + (report.Iterations + restart - 1) / restart, applications);
    }

    [Fact]
    public void ComplexGmresReportsIterationLimit()
    {
        var a = RandomComplex(23, 40);
        ComplexMap apply = (x, y) => (a * ComplexVector.Build.DenseOfArray(x)).CopyTo(ComplexVector.Build.Dense(y));
        ComplexMap identity = (r, z) => Array.Copy(r, z, r.Length);
        var b = Enumerable.Repeat(Complex.One, 40).ToArray();
        Assert.False(ComplexGmres.TrySolve(apply, identity, b, new Complex[40], Tight with { MaxIterations = 3 }, 60, out var report));
        Assert.Equal(SolveStatus.IterationLimit, report.Status);
        var failure = Assert.Throws<NumericalFailureException>(() => ComplexGmres.Solve(apply, identity, b, new Complex[40], Tight with { MaxIterations = 3 }));
        // the message says why, with the residual in short scientific form and the iterations (our own wording: common practice, no source)
        Assert.Matches(@"no convergence within the iteration limit \(relative residual \d(\.\d)?e-\d+ after 3 iterations\)", failure.Message);
    }

    /// <summary>
    /// The complex GMRES's vector kernels (two complex numbers to a SIMD vector, a scalar tail for an odd count) against MathNet's
    /// ConjugateDotProduct and L2Norm on random vectors of even and odd lengths: 1e-13 relative to |x| |y| (sums of up to 1001 products
    /// in another order: a few hundred ulps at most; a wrong sign or a swapped part is of order 1).
    /// </summary>
    [Theory]
    [InlineData(1)]
    [InlineData(2)]
    [InlineData(7)]
    [InlineData(1001)]
    public void ComplexKernelsMatchMathNet(int n)
    {
        var random = new Random(40 + n);
        Complex Draw() => new(2 * random.NextDouble() - 1, 2 * random.NextDouble() - 1);
        var x = Enumerable.Range(0, n).Select(_ => Draw()).ToArray();
        var y = Enumerable.Range(0, n).Select(_ => Draw()).ToArray();
        var vx = ComplexVector.Build.DenseOfArray(x); var vy = ComplexVector.Build.DenseOfArray(y);
        double scale = vx.L2Norm() * vy.L2Norm();
        var expected = vx.ConjugateDotProduct(vy);   // x^H y
        var dot = ComplexField.Dot(x, y);
        Assert.True((dot - expected).Magnitude <= 1e-13 * scale, $"x^H y = {dot}, MathNet {expected}");
        Assert.Equal(vx.L2Norm(), ComplexField.Norm(x), 1e-13 * vx.L2Norm());
    }

    [Theory]
    [InlineData(31, 40, 60, false)]
    [InlineData(32, 60, 8, true)]      // restart 8 < n: the restarts must carry the solution on
    public void RealGmresMatchesDenseLu(int seed, int n, int restart, bool diagonalPreconditioner)
    {
        // non-symmetric, diagonally dominant: cond below about 10 (Gershgorin), as for the complex case
        var random = new Random(seed);
        var a = Matrix<double>.Build.Dense(n, n);
        for (int i = 0; i < n; i++)
            for (int j = 0; j < n; j++)
                if (i != j && random.NextDouble() < 0.3) a[i, j] = 2 * random.NextDouble() - 1;
        for (int i = 0; i < n; i++) a[i, i] = 1 + a.Row(i).Enumerate().Sum(Math.Abs);
        var b = Enumerable.Range(0, n).Select(_ => 2 * random.NextDouble() - 1).ToArray();
        var expected = a.LU().Solve(Vector.Build.DenseOfArray(b));
        RealMap apply = (x, y) => (a * Vector.Build.DenseOfArray(x)).CopyTo(Vector.Build.Dense(y));
        RealMap precondition = diagonalPreconditioner
            ? (r, z) => { for (int i = 0; i < r.Length; i++) z[i] = r[i] / a[i, i]; }
            : (r, z) => Array.Copy(r, z, r.Length);
        var x = new double[n];
        var report = Gmres.Solve(apply, precondition, b, x, Tight, restart);
        Assert.Equal(SolveStatus.Converged, report.Status);
        double scale = expected.AbsoluteMaximum();
        for (int i = 0; i < n; i++) Assert.True(Math.Abs(x[i] - expected[i]) <= 1e-9 * scale, $"x[{i}] = {x[i]}, dense LU {expected[i]}");
        Assert.False(Gmres.TrySolve(apply, precondition, b, new double[n], Tight with { MaxIterations = 2 }, restart, out var limited));
        Assert.Equal(SolveStatus.IterationLimit, limited.Status);
    }

    /// <summary>
    /// A sequence of right-hand sides solved each from the previous answer with its kept image A x (as the moving own-field sweep
    /// does): every answer matches MathNet's dense LU to 1e-9 relative (the class's tolerance), the returned image is A x of the answer
    /// to rounding (1e-12 relative: one matrix-vector product's rounding), and each solve after the first applies A once less than
    /// the same solve without the image (the first residual comes from the image).
    /// </summary>
    [Fact]
    public void RealGmresWithKeptImageMatchesDenseLu()
    {
        const int n = 40;
        var random = new Random(33);
        var a = Matrix<double>.Build.Dense(n, n);
        for (int i = 0; i < n; i++)
            for (int j = 0; j < n; j++)
                if (i != j && random.NextDouble() < 0.3) a[i, j] = 2 * random.NextDouble() - 1;
        for (int i = 0; i < n; i++) a[i, i] = 1 + a.Row(i).Enumerate().Sum(Math.Abs);
        int applications = 0;
        RealMap apply = (x, y) => { applications++; (a * Vector.Build.DenseOfArray(x)).CopyTo(Vector.Build.Dense(y)); };
        RealMap precondition = (r, z) => { for (int i = 0; i < r.Length; i++) z[i] = r[i] / a[i, i]; };
        var x = new double[n];
        var image = new double[n];
        for (int k = 0; k < 4; k++)
        {
            var b = Enumerable.Range(0, n).Select(i => Math.Sin(0.3 * i + 0.5 * k) + 0.1 * k).ToArray();
            var plain = (double[])x.Clone();
            applications = 0;
            var reference = Gmres.Solve(apply, precondition, b, plain, Tight);
            int withoutImage = applications;
            applications = 0;
            Assert.True(Gmres.TrySolve(apply, precondition, b, x, image, imageHoldsGuess: k > 0, Tight, ComplexGmres.DefaultRestart, out var report));
            Assert.Equal(reference.Iterations, report.Iterations);
            Assert.Equal(k > 0 ? withoutImage - 1 : withoutImage, applications);
            var expected = a.LU().Solve(Vector.Build.DenseOfArray(b));
            double scale = expected.AbsoluteMaximum();
            for (int i = 0; i < n; i++) Assert.True(Math.Abs(x[i] - expected[i]) <= 1e-9 * scale, $"b{k}: x[{i}] = {x[i]}, dense LU {expected[i]}");
            var ax = a * Vector.Build.DenseOfArray(x);
            for (int i = 0; i < n; i++) Assert.True(Math.Abs(image[i] - ax[i]) <= 1e-12 * ax.AbsoluteMaximum(), $"b{k}: image[{i}] = {image[i]}, A x {ax[i]}");
        }
    }
}
