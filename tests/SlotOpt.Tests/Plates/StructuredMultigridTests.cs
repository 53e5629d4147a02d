using SlotOpt.Numerics;
using SlotOpt.Plates.Geometry;
using SlotOpt.Plates.Grid;
using SlotOpt.Plates.Sources;

namespace SlotOpt.Tests.Plates;

/// <summary>
/// The structured black-box multigrid preconditioner (J. E. Dendy, "Black box multigrid", J. Comput.
/// Phys. 48 (1982) 366–386) on the reference plates of the torsion and slotted-plate checks. The
/// reference solution is conjugate gradients with the Jacobi (diagonal) preconditioner (R. Barrett et
/// al., "Templates for the Solution of Linear Systems", SIAM, 1994, sections 2.3.1 and 3.1): slow but
/// free of any coarsening, so with both solved far below the production tolerance a coarsening error
/// (a lost slot, hole or jump) could only show as a slow solve, never as a different answer, and the
/// answers must agree. (Before it was removed, the reference multigrid on CSR this solver replaced
/// agreed with it to 1.3e-13 or better on the same plates.)
/// </summary>
public class StructuredMultigridTests
{
    /// <summary>Residual target for the comparison: 1e-12 relative (the floor of rounding on these grids is about 5e-13) leaves an error of at most cond(A) 1e-12 in psi.</summary>
    private static readonly ConvergenceCriterion Tight = new() { RelativeResidual = 1e-12, MaxIterations = 200 };
    private static readonly ConvergenceCriterion TightReference = new() { RelativeResidual = 1e-12, MaxIterations = 50000 };

    private sealed class Jacobi(CsrMatrix a) : IPreconditioner
    {
        private readonly double[] _inverseDiagonal = Enumerable.Range(0, a.Rows).Select(i =>
        {
            for (int k = a.RowStart[i]; k < a.RowStart[i + 1]; k++) if (a.ColumnIndex[k] == i) return 1 / a.Value[k];
            throw new InvalidOperationException($"row {i} has no diagonal");
        }).ToArray();

        public void Apply(ReadOnlySpan<double> r, Span<double> z)
        {
            for (int i = 0; i < r.Length; i++) z[i] = _inverseDiagonal[i] * r[i];
        }
    }

    public static TheoryData<string> Plates => new() { "rectangle", "hollow circle", "thin ring", "comb", "enclosed slits", "grooves", "zone" };

    private static (PlateGeometry Geometry, double CellM) Plate(string name)
    {
        switch (name)
        {
            case "rectangle": return (PlateGeometry.Rectangle(0.2, 0.1), 0.1 / 64);                                   // TorsionAnalogyTests, b/a = 2
            case "hollow circle":                                                                                      // one hole: a merged unknown
                return (new PlateGeometry(Polygon.Circle(new Vec2(0, 0), 1, 2048)).AddCutout(Polygon.Circle(new Vec2(0, 0), 0.5, 1024)), 2.0 / 256);
            case "thin ring":
                return (new PlateGeometry(Polygon.Circle(new Vec2(0, 0), 1.0, 2048)).AddCutout(Polygon.Circle(new Vec2(0, 0), 0.9, 2048)), 2.0 / 256);
            case "comb":
            {
                var g = PlateGeometry.Rectangle(1, 1);
                g.AddPattern(SlotPatterns.Comb(g.Outline, PlateEdge.Bottom, 0.2, 0.6, 0.01));
                return (g, 1.0 / 200);
            }
            case "enclosed slits":                                                                                     // slits narrower than a cell: merged cuts
            {
                var g = PlateGeometry.Rectangle(1, 1);
                g.AddPattern(SlotPatterns.EnclosedSlits(g.Outline, PlateEdge.Bottom, 0.2, 0.6, 0.01));
                return (g, 1.0 / 200);
            }
            case "grooves":                                                                                            // conductance jump 2:1
            {
                var g = PlateGeometry.Rectangle(0.4, 0.2);
                g.AddPattern(SlotPatterns.GrooveComb(g.Outline, PlateEdge.Bottom, 0.05, 0.18, 0.01, 0.5));
                return (g, 0.4 / 320);
            }
            case "zone":                                                                                               // conductivity jump 50:1
            {
                var g = PlateGeometry.Rectangle(0.3, 0.1);
                g.AddPattern(SlotPatterns.Alternating(g.Outline, PlateEdge.Bottom, 0.05, 0.07, 0.005));
                g.AddZone(new ConductivityZone(Polygon.Rectangle(0.1, -1, 0.2, 1), 50));
                return (g, 0.1 / 64);
            }
            default: throw new ArgumentOutOfRangeException(nameof(name));
        }
    }

    private static double[] RightHandSide(SheetModel model)
    {
        var l = model.Lattice;
        var re = new double[l.NodeCount];
        var im = new double[l.NodeCount];
        new UniformAcField(1, 50).Integrate(l, 0, re, im);
        var b = model.RightHandSide(re);
        return b.Any(v => v != 0) ? b : model.RightHandSide(im);
    }

    // Agreement 1e-10 relative in psi (2-norm) and in the loss psi^T A psi: both solves stop at a
    // relative residual of 1e-12, so each solution is within cond(A) 1e-12 of the exact one (cond(A) grows
    // as the square of the nodes across, about 1e5 here; measured: 5e-12 at worst, the hollow circle's loss, 1e-13 or better on the plates without a hole).
    [Theory]
    [MemberData(nameof(Plates))]
    public void Structured_multigrid_and_Jacobi_reference_give_the_same_solution(string plate)
    {
        var (geometry, cell) = Plate(plate);
        var model = SheetModel.Build(geometry, new GridOptions { CellSizeM = cell });
        var b = RightHandSide(model);
        var structured = new double[model.Unknowns];
        var reference = new double[model.Unknowns];
        var rs = model.Solve(b, structured, Tight);   // the production path: CG on the lattice operator
        var rr = ConjugateGradient.Solve(model.Operator.Matrix, b, reference, new Jacobi(model.Operator.Matrix), TightReference);
        double diff = 0, norm = 0;
        for (int i = 0; i < b.Length; i++) { diff += (structured[i] - reference[i]) * (structured[i] - reference[i]); norm += reference[i] * reference[i]; }
        double relative = Math.Sqrt(diff / norm);
        Assert.True(relative <= 1e-10, $"{plate}: |psi_structured - psi_reference| / |psi_reference| = {relative:E2} ({rs.Iterations} and {rr.Iterations} iterations)");
        double ls = model.LossPerSiemens(structured), lr = model.LossPerSiemens(reference);
        Assert.InRange(ls / lr - 1, -1e-10, 1e-10);
    }

    // Convergence rate: black-box multigrid as a CG preconditioner reduces the residual by at least 10x
    // per iteration on these plates (Dendy 1982 reports V-cycle factors about 0.1 for discontinuous
    // diffusion); asserted: 1e-8 in at most 12 iterations (measured 8 to 10). A failure means the
    // coarsening lost the slots, holes or jumps.
    [Theory]
    [MemberData(nameof(Plates))]
    public void Structured_multigrid_reaches_the_production_tolerance_in_few_iterations(string plate)
    {
        var (geometry, cell) = Plate(plate);
        var model = SheetModel.Build(geometry, new GridOptions { CellSizeM = cell });
        var b = RightHandSide(model);
        var psi = new double[model.Unknowns];
        var report = model.Solve(b, psi, ConvergenceCriterion.Default);
        Assert.InRange(report.Iterations, 1, 12);
    }

    // The lattice operator (A = E^T L E applied edge by edge) against the assembled CSR matrix of the same
    // operator: the same sums in another order, so equal to rounding, 1e-13 relative to |A| |x| (glue edges
    // inside merged regions add exactly 0: both ends carry the same value).
    [Theory]
    [MemberData(nameof(Plates))]
    public void Lattice_operator_equals_the_assembled_matrix(string plate)
    {
        var (geometry, cell) = Plate(plate);
        var model = SheetModel.Build(geometry, new GridOptions { CellSizeM = cell });
        var random = new Random(11);
        var x = Enumerable.Range(0, model.Unknowns).Select(_ => random.NextDouble() - 0.5).ToArray();
        var lattice = new double[model.Unknowns];
        var csr = new double[model.Unknowns];
        model.Multigrid.Operator.Multiply(x, lattice);
        var a = model.Operator.Matrix;
        a.Multiply(x, csr);
        var absolute = new double[model.Unknowns];
        for (int i = 0; i < a.Rows; i++)
            for (int k = a.RowStart[i]; k < a.RowStart[i + 1]; k++) absolute[i] += Math.Abs(a.Value[k] * x[a.ColumnIndex[k]]);
        for (int i = 0; i < a.Rows; i++) Assert.True(Math.Abs(lattice[i] - csr[i]) <= 1e-13 * absolute[i], $"{plate}: row {i}: {lattice[i]} vs {csr[i]}");
    }

    // The lattice residual r = b - A x against b minus the assembled CSR matrix's product: each entry is b minus a row summed in
    // another order, so equal to rounding, 1e-13 relative to |b| + |A| |x| (as above; a region's row is its nodes' rows summed).
    [Theory]
    [MemberData(nameof(Plates))]
    public void Lattice_residual_equals_the_assembled_matrix(string plate)
    {
        var (geometry, cell) = Plate(plate);
        var model = SheetModel.Build(geometry, new GridOptions { CellSizeM = cell });
        var random = new Random(12);
        var x = Enumerable.Range(0, model.Unknowns).Select(_ => random.NextDouble() - 0.5).ToArray();
        var b = Enumerable.Range(0, model.Unknowns).Select(_ => random.NextDouble() - 0.5).ToArray();
        var lattice = new double[model.Unknowns];
        var csr = new double[model.Unknowns];
        model.Multigrid.Operator.Residual(b, x, lattice);
        var a = model.Operator.Matrix;
        a.Multiply(x, csr);
        for (int i = 0; i < a.Rows; i++)
        {
            double absolute = Math.Abs(b[i]);
            for (int k = a.RowStart[i]; k < a.RowStart[i + 1]; k++) absolute += Math.Abs(a.Value[k] * x[a.ColumnIndex[k]]);
            Assert.True(Math.Abs(lattice[i] - (b[i] - csr[i])) <= 1e-13 * absolute, $"{plate}: row {i}: {lattice[i]} vs {b[i] - csr[i]}");
        }
    }

    // The production solve (conjugate gradients run on the lattice, fused passes, a merged region at its first node) against the
    // generic ConjugateGradient (Barrett et al. 1994, Figure 2.5) with the same operator and V-cycle in the unknowns' numbering:
    // the same iteration in another summation order, so after the same 5 iterations (stopped short of convergence, so every step
    // counts) the iterates agree to rounding amplified by the few steps: asserted 1e-10 relative. The V-cycle's output is rounded
    // to single precision, so where the two orders differ in the last bit of r a node's z can differ by one single-precision
    // unit (6e-8); the final residuals (1e-4 to 1e-6 of |b| after 5 steps, so they magnify any difference of the iterates) are
    // asserted to agree to 1e-6 relative (measured 2.5e-8 at worst, the enclosed slits).
    [Theory]
    [InlineData("hollow circle")]
    [InlineData("enclosed slits")]
    [InlineData("zone")]
    public void Lattice_conjugate_gradients_follow_the_generic_iteration(string plate)
    {
        var (geometry, cell) = Plate(plate);
        var model = SheetModel.Build(geometry, new GridOptions { CellSizeM = cell });
        var b = RightHandSide(model);
        var five = new ConvergenceCriterion { RelativeResidual = 1e-14, MaxIterations = 5 };
        var lattice = new double[model.Unknowns];
        var generic = new double[model.Unknowns];
        Assert.False(model.TrySolve(b, lattice, five, out var rl));
        Assert.False(ConjugateGradient.TrySolve(model.Multigrid.Operator, b, generic, model.Multigrid, five, out var rg));
        Assert.Equal(SolveStatus.IterationLimit, rl.Status);
        Assert.Equal(rg.Iterations, rl.Iterations);
        double diff = 0, norm = 0;
        for (int i = 0; i < b.Length; i++) { diff += (lattice[i] - generic[i]) * (lattice[i] - generic[i]); norm += generic[i] * generic[i]; }
        Assert.True(Math.Sqrt(diff / norm) <= 1e-10, $"{plate}: iterates differ by {Math.Sqrt(diff / norm):E2}");
        Assert.InRange(rl.RelativeResidual / rg.RelativeResidual - 1, -1e-6, 1e-6);
    }

    // CG needs a symmetric preconditioner: z1 . r2 = r1 . z2 for z = M^-1 r, to rounding (with one sweep a side on the upper
    // levels and a forward-backward pair a side below, each level's post-smoother must be the transpose of its pre-smoother). The cycle runs in single precision
    // (unit roundoff 6e-8, a few hundred operations per unknown), so asserted 1e-6 relative (measured 2.5e-7 at worst, the
    // enclosed slits; 1e-12 held with the cycle in double). Conjugate gradients tolerate this: the iteration counts and the
    // 1e-10 agreement with the reference above are unchanged (G. H. Golub and Q. Ye, "Inexact preconditioned conjugate gradient
    // method with inner-outer iteration", SIAM J. Sci. Comput. 21 (1999) 1305, bound the effect of a preconditioner that varies by
    // a small relative amount from step to step).
    [Theory]
    [InlineData("hollow circle")]
    [InlineData("enclosed slits")]
    public void Preconditioner_is_symmetric(string plate)
    {
        var (geometry, cell) = Plate(plate);
        var model = SheetModel.Build(geometry, new GridOptions { CellSizeM = cell });
        var random = new Random(7);
        var r1 = Enumerable.Range(0, model.Unknowns).Select(_ => random.NextDouble() - 0.5).ToArray();
        var r2 = Enumerable.Range(0, model.Unknowns).Select(_ => random.NextDouble() - 0.5).ToArray();
        var z1 = new double[model.Unknowns];
        var z2 = new double[model.Unknowns];
        Assert.True(model.Multigrid.LevelCount >= 4, $"{plate}: {model.Multigrid.LevelCount} levels; the check needs the levels with the symmetric sweep pair (2 and below) and a coarsest below them");
        model.Multigrid.Apply(r1, z1);
        model.Multigrid.Apply(r2, z2);
        double a = ConjugateGradient.Dot(z1, r2), c = ConjugateGradient.Dot(r1, z2);
        Assert.InRange(a / c - 1, -1e-6, 1e-6);
    }

    // The coarse operators are the Galerkin products A_c = P^T A P of Dendy's operator-dependent prolongation (J. E. Dendy, "Black
    // box multigrid", J. Comput. Phys. 48 (1982) 366-386, section 3), checked entry by entry against MathNet.Numerics' dense product
    // of the same P (the stored single-precision weights) and A, for the first coarsening (5-point to 9-point: the loop-free path for
    // interior coarse nodes and the patch loop at the lattice's edges) and the second (9-point to 9-point), on odd and even lattices
    // with random couplings over two decades, a slot of couplings 1e-6 and a 100:1 jump. Tolerance 1e-12 of the largest coarse entry:
    // each entry is a sum of at most 81 products, so the two orders of summation differ by a few 1e-16 of it.
    [Theory]
    [InlineData(13, 11)]
    [InlineData(12, 10)]
    public void Coarse_stencils_are_the_Galerkin_product_of_the_prolongation(int nx, int ny)
    {
        var fine = SlottedLattice(nx, ny);
        var first = BlackBoxCoarsening.Coarsen(fine);
        var second = BlackBoxCoarsening.Coarsen(first);
        AssertGalerkin(fine, first);
        AssertGalerkin(first, second);

        static void AssertGalerkin(StencilLevel f, StencilLevel c)
        {
            var build = MathNet.Numerics.LinearAlgebra.Matrix<double>.Build;
            var a = build.Dense(f.Nodes, f.Nodes);
            for (int j = 0; j < f.Ny; j++)
                for (int i = 0; i < f.Nx; i++)
                    for (int dj = -1; dj <= 1; dj++)
                        for (int di = -1; di <= 1; di++)
                            if (i + di >= 0 && i + di < f.Nx && j + dj >= 0 && j + dj < f.Ny)
                                a[j * f.Nx + i, (j + dj) * f.Nx + i + di] = f.Entry(i, j, di, dj);
            var prolongation = Prolongation(f, c);
            var galerkin = prolongation.Transpose() * a * prolongation;
            double tolerance = 1e-12 * galerkin.Enumerate().Max(Math.Abs);
            for (int K = 0; K < c.Nodes; K++)
                for (int L = 0; L < c.Nodes; L++)
                {
                    int di = L % c.Nx - K % c.Nx, dj = L / c.Nx - K / c.Nx;
                    double stored = Math.Abs(di) <= 1 && Math.Abs(dj) <= 1 ? c.Entry(K % c.Nx, K / c.Nx, di, dj) : 0;
                    Assert.True(Math.Abs(stored - galerkin[K, L]) <= tolerance,
                        $"{f.Nx} x {f.Ny} -> {c.Nx} x {c.Ny}: entry ({K}, {L}) stored {stored:R}, P^T A P {galerkin[K, L]:R}");
                }
        }
    }

    /// <summary>The prolongation from <paramref name="c"/> to <paramref name="f"/> as a dense matrix of the stored single-precision weights (fine nodes by coarse nodes).</summary>
    internal static MathNet.Numerics.LinearAlgebra.Matrix<double> Prolongation(StencilLevel f, StencilLevel c)
    {
        var prolongation = MathNet.Numerics.LinearAlgebra.Matrix<double>.Build.Dense(f.Nodes, c.Nodes);
        for (int J = 0; J < c.Ny; J++)
            for (int I = 0; I < c.Nx; I++)
            {
                int k = J * c.Nx + I;
                void Weight(int i, int j, int coarseI, int coarseJ, double w)
                {
                    if (i < f.Nx && j < f.Ny && coarseI < c.Nx && coarseJ < c.Ny) prolongation[j * f.Nx + i, coarseJ * c.Nx + coarseI] = w;
                }
                Weight(2 * I, 2 * J, I, J, 1);
                Weight(2 * I + 1, 2 * J, I, J, c.XLow![k]); Weight(2 * I + 1, 2 * J, I + 1, J, c.XHigh![k]);
                Weight(2 * I, 2 * J + 1, I, J, c.YLow![k]); Weight(2 * I, 2 * J + 1, I, J + 1, c.YHigh![k]);
                Weight(2 * I + 1, 2 * J + 1, I, J, c.CentreSW![k]); Weight(2 * I + 1, 2 * J + 1, I + 1, J, c.CentreSE![k]);
                Weight(2 * I + 1, 2 * J + 1, I, J + 1, c.CentreNW![k]); Weight(2 * I + 1, 2 * J + 1, I + 1, J + 1, c.CentreNE![k]);
            }
        return prolongation;
    }

    /// <summary>A 5-point lattice with random couplings over two decades, a slot of couplings 1e-6 from the bottom up and a 100:1 jump (invented test data: the checks against it compare two computations of the same quantity).</summary>
    internal static StencilLevel SlottedLattice(int nx, int ny)
    {
        var random = new Random(7);
        var fine = new StencilLevel(nx, ny, ninePoint: false);
        for (int j = 0; j < ny; j++)
            for (int i = 0; i < nx; i++)
            {
                int p = j * nx + i;
                fine.Centre[p] += 0.01 * random.NextDouble();
                foreach (var (q, isWest) in new[] { (p - 1, true), (p - nx, false) })
                {
                    if (isWest ? i == 0 : j == 0) continue;
                    double g = Math.Pow(10, 2 * random.NextDouble() - 1);
                    if (isWest && i == nx / 2 && j < ny - 3) g = 1e-6;   // the slot: x-edges cut from the bottom up
                    if (i > 2 * nx / 3) g *= 100;                         // the jump
                    if (isWest) fine.West[p] = -g; else fine.South[p] = -g;
                    fine.Centre[p] += g; fine.Centre[q] += g;
                }
            }
        return fine;
    }

    // The prolongation weights against Dendy's formulas (J. E. Dendy, "Black box multigrid", J. Comput. Phys. 48 (1982) 366-386,
    // section 3; spelled out in BlackBoxCoarsening's summary), recomputed here from the stencil entries in double, for the first
    // (5-point) and second (9-point) coarsening of the slotted lattice, at every fine node whose coarse neighbours all lie on the
    // lattice. The centre weights take the stored line weights, as the code and the Galerkin check above do. Tolerance: one unit of
    // single precision (2^-23 relative), the rounding of the stored weight, which the code forms as a product with the reciprocal of
    // the shared denominator (a double rounding more than the quotient, far below that unit).
    [Theory]
    [InlineData(13, 11)]
    [InlineData(12, 10)]
    public void Prolongation_weights_follow_Dendys_formulas(int nx, int ny)
    {
        var fine = SlottedLattice(nx, ny);
        var first = BlackBoxCoarsening.Coarsen(fine);
        AssertWeights(fine, first);
        var second = BlackBoxCoarsening.Coarsen(first);
        AssertWeights(first, second);

        static void AssertWeights(StencilLevel f, StencilLevel c)
        {
            int checkedNodes = 0;
            for (int J = 0; J + 1 < c.Ny; J++)
                for (int I = 0; I + 1 < c.Nx; I++)
                {
                    int k = J * c.Nx + I, i = 2 * I + 1, j = 2 * J + 1;
                    if (i >= f.Nx || j >= f.Ny) continue;
                    double A(int x, int y, int di, int dj) => f.Entry(x, y, di, dj);
                    // between coarse nodes in x: fine node (i, 2J)
                    double d = A(i, 2 * J, 0, 0) + A(i, 2 * J, 0, -1) + A(i, 2 * J, 0, 1);
                    Near(-(A(i, 2 * J, -1, 0) + A(i, 2 * J, -1, -1) + A(i, 2 * J, -1, 1)) / d, c.XLow![k], "x low");
                    Near(-(A(i, 2 * J, 1, 0) + A(i, 2 * J, 1, -1) + A(i, 2 * J, 1, 1)) / d, c.XHigh![k], "x high");
                    // between coarse nodes in y: fine node (2I, j)
                    d = A(2 * I, j, 0, 0) + A(2 * I, j, -1, 0) + A(2 * I, j, 1, 0);
                    Near(-(A(2 * I, j, 0, -1) + A(2 * I, j, -1, -1) + A(2 * I, j, 1, -1)) / d, c.YLow![k], "y low");
                    Near(-(A(2 * I, j, 0, 1) + A(2 * I, j, -1, 1) + A(2 * I, j, 1, 1)) / d, c.YHigh![k], "y high");
                    // a coarse cell's centre: fine node (i, j), its line neighbours' stored weights towards each corner
                    double centre = A(i, j, 0, 0);
                    Near(-(A(i, j, -1, -1) + A(i, j, -1, 0) * c.YLow[k] + A(i, j, 0, -1) * c.XLow[k]) / centre, c.CentreSW![k], "centre SW");
                    Near(-(A(i, j, 1, -1) + A(i, j, 1, 0) * c.YLow[k + 1] + A(i, j, 0, -1) * c.XHigh[k]) / centre, c.CentreSE![k], "centre SE");
                    Near(-(A(i, j, -1, 1) + A(i, j, -1, 0) * c.YHigh[k] + A(i, j, 0, 1) * c.XLow[k + c.Nx]) / centre, c.CentreNW![k], "centre NW");
                    Near(-(A(i, j, 1, 1) + A(i, j, 1, 0) * c.YHigh[k + 1] + A(i, j, 0, 1) * c.XHigh[k + c.Nx]) / centre, c.CentreNE![k], "centre NE");
                    checkedNodes++;
                }
            Assert.True(checkedNodes >= (c.Nx - 2) * (c.Ny - 2), $"{f.Nx} x {f.Ny}: only {checkedNodes} coarse cells checked");

            void Near(double expected, float stored, string kind) =>
                Assert.True(Math.Abs(stored - expected) <= Math.Pow(2, -23) * Math.Abs(expected) + 1e-30, $"{f.Nx} x {f.Ny}, {kind}: stored {stored:R}, Dendy's formula {expected:R}");
        }
    }

    // Band Cholesky (coarsest level) against MathNet.Numerics' dense Cholesky on a 5 x 7 lattice Laplacian with
    // random positive couplings, numbered with a half-bandwidth of 6: agreement 1e-12 relative (both backward stable,
    // condition number below 1e3).
    [Fact]
    public void Band_Cholesky_matches_MathNet_dense_Cholesky()
    {
        int nx = 5, ny = 7, n = nx * ny;
        var random = new Random(3);
        var a = new double[n, n];
        for (int j = 0; j < ny; j++)
            for (int i = 0; i < nx; i++)
            {
                int p = j * nx + i;
                a[p, p] += 0.1;
                foreach (var (di, dj) in new[] { (1, 0), (0, 1), (1, 1), (-1, 1) })
                {
                    int ii = i + di, jj = j + dj;
                    if (ii < 0 || ii >= nx || jj >= ny) continue;
                    int q = jj * nx + ii;
                    double w = 0.5 + random.NextDouble();
                    a[p, q] = a[q, p] = -w;
                    a[p, p] += w; a[q, q] += w;
                }
            }
        var band = new BandCholesky(n, nx + 1, (i, j) => a[i, j]);
        var b = Enumerable.Range(0, n).Select(i => Math.Sin(i + 1.0)).ToArray();
        var x = (double[])b.Clone();
        band.Solve(x);
        var reference = MathNet.Numerics.LinearAlgebra.Matrix<double>.Build.DenseOfArray(a).Cholesky()
            .Solve(MathNet.Numerics.LinearAlgebra.Vector<double>.Build.DenseOfArray(b));
        for (int i = 0; i < n; i++) Assert.InRange(x[i] - reference[i], -1e-12 * reference.L2Norm(), 1e-12 * reference.L2Norm());
    }

    // The V-cycle runs in single precision (normal range 1.2e-38 to 3.4e38); the stencil and every right-hand side are scaled by
    // powers of two before they are rounded, so a matrix in units far outside that range solves as well as one near 1. A 30 x 25
    // lattice Laplacian with random couplings over two decades, a positive diagonal shift and an identity row, scaled by 1e-45
    // and by 1e45 (both beyond single precision), solved to a relative residual of 1e-10, against MathNet.Numerics' dense LU:
    // agreement 1e-7 relative (cond(A) is below 1e3 here, so the solve's error is at most 1e-7), in the same number of
    // iterations as at scale 1 (2 levels: 750 nodes coarsen once before the band Cholesky).
    [Theory]
    [InlineData(1e-45)]
    [InlineData(1e45)]
    public void Single_precision_cycle_keeps_matrices_of_any_scale(double scale)
    {
        int nx = 30, ny = 25, n = nx * ny;
        var random = new Random(5);
        var map = Enumerable.Range(0, n).Select(p => p == 0 ? -1 : p - 1).ToArray();   // node 0 held: an identity row
        var west = new double[n + nx + 1];
        var south = new double[n + nx + 1];
        var shift = new double[n - 1];
        for (int p = 0; p < n; p++)
        {
            if (map[p] < 0) continue;
            shift[map[p]] = 0.01 * random.NextDouble();
            if (p % nx > 0 && map[p - 1] >= 0) west[p] = Math.Pow(10, 2 * random.NextDouble() - 1);
            if (p >= nx && map[p - nx] >= 0) south[p] = Math.Pow(10, 2 * random.NextDouble() - 1);
        }
        var dense = new double[n - 1, n - 1];
        for (int p = 0; p < n; p++)
        {
            int u = map[p];
            if (u < 0) continue;
            dense[u, u] += shift[u];
            foreach (var (q, g) in new[] { (p - 1, west[p]), (p - nx, south[p]) })
            {
                if (g == 0) continue;
                int v = map[q];
                dense[u, u] += g; dense[v, v] += g; dense[u, v] -= g; dense[v, u] -= g;
            }
        }
        var b = Enumerable.Range(0, n - 1).Select(i => Math.Sin(0.37 * i + 1)).ToArray();
        var reference = MathNet.Numerics.LinearAlgebra.Matrix<double>.Build.DenseOfArray(dense).LU()
            .Solve(MathNet.Numerics.LinearAlgebra.Vector<double>.Build.DenseOfArray(b));
        var criterion = new ConvergenceCriterion { RelativeResidual = 1e-10, MaxIterations = 100 };
        int Solve(double s, double[] x)
        {
            var diagonal = new double[n - 1];
            for (int u = 0; u < n - 1; u++) diagonal[u] = s * dense[u, u];
            var mg = StructuredMultigrid.ForNodeStencil(nx, ny, map, west, south, s, diagonal);
            Assert.Equal(2, mg.LevelCount);
            var sb = b.Select(v => s * v).ToArray();   // (s A) x = s b has the same solution
            Assert.True(mg.TrySolve(sb, x, criterion, out var report), report.Reason);
            return report.Iterations;
        }
        var x1 = new double[n - 1];
        var xs = new double[n - 1];
        int unitIterations = Solve(1, x1), scaledIterations = Solve(scale, xs);
        Assert.Equal(unitIterations, scaledIterations);
        double error = Math.Sqrt(Enumerable.Range(0, n - 1).Sum(i => (xs[i] - reference[i]) * (xs[i] - reference[i]))) / reference.L2Norm();
        Assert.True(error <= 1e-7, $"scale {scale:E0}: |x - x_LU| / |x_LU| = {error:E2}");
    }
}
