using System.Numerics;
using MathNet.Numerics.LinearAlgebra;
using SlotOpt.Numerics;
using SlotOpt.Plates.Conductors;
using SlotOpt.Plates.Geometry;
using SlotOpt.Plates.Grid;
using SlotOpt.Plates.OwnField;
using SlotOpt.Plates.Sources;

namespace SlotOpt.Tests.Plates.OwnField;

/// <summary>
/// The coupled solves (real FFTs, preconditioned GMRES, warm starts) against the same discrete system assembled
/// densely and solved by MathNet.Numerics' LU (the general-purpose dense reference): the sheet operator A from its
/// CSR assembly, R and Dx R summed node pair by node pair from the kernel (merged hole rows add up), the right-hand
/// side from the source as the solver forms it. A 60 x 40 mm plate with a hole (one merged unknown), 4 mm cells.
/// The solves run to a relative residual of 1e-12; the solution then agrees with LU to cond x 1e-12, and the checks allow
/// 1e-9 relative (condition numbers measured with MathNet: 80 for the AC system, 106 for the moving one, 107 unknowns).
/// A warm start from a nearby conductivity's or speed's solution must give the same answer to that tolerance and save
/// iterations (measured 13 against 14 for both).
/// </summary>
public class ReactionDenseReferenceTests
{
    private static readonly ConvergenceCriterion Tight = new() { RelativeResidual = 1e-12, MaxIterations = 500 };

    private static SheetModel Model()
    {
        var plate = new PlateGeometry(Polygon.Rectangle(-0.03, -0.02, 0.03, 0.02));
        plate.AddCutout(Polygon.Rectangle(-0.012, -0.008, 0.004, 0.008));
        return SheetModel.Build(plate, new GridOptions { CellSizeM = 0.004 });
    }

    /// <summary>Sum over node pairs (m, n) of kernel(i_m - i_n, j_m - j_n), into the rows and columns of their unknowns.</summary>
    private static Matrix<double> Dense(SheetModel model, Func<int, int, double> kernel)
    {
        var map = model.Regions.NodeUnknown;
        int nx = model.Lattice.NodesX;
        var r = Matrix<double>.Build.Dense(model.Unknowns, model.Unknowns);
        for (int m = 0; m < map.Length; m++)
            if (map[m] >= 0)
                for (int n = 0; n < map.Length; n++)
                    if (map[n] >= 0) r[map[m], map[n]] += kernel(m % nx - n % nx, m / nx - n / nx);
        return r;
    }

    private static Matrix<double> SheetMatrix(SheetModel model)
    {
        var a = model.Operator.Matrix;
        var d = Matrix<double>.Build.Dense(a.Rows, a.Rows);
        for (int i = 0; i < a.Rows; i++)
            for (int k = a.RowStart[i]; k < a.RowStart[i + 1]; k++) d[i, a.ColumnIndex[k]] += a.Value[k];
        return d;
    }

    private static double RelativeDifference(IEnumerable<Complex> x, IEnumerable<Complex> reference)
    {
        var a = x.ToArray(); var b = reference.ToArray();
        return Math.Sqrt(a.Zip(b, (p, q) => (p - q).Magnitude * (p - q).Magnitude).Sum() / b.Sum(q => q.Magnitude * q.Magnitude));
    }

    [Fact]
    public void Ac_solve_cold_and_warm_started_matches_dense_LU()
    {
        var model = Model();
        var reaction = ReactionOperator.Build(model);
        IAcFieldSource source = new UniformAcField(0.01, 400);
        var conductor = new ConductingSheet(5.8e7, 2e-3);   // beta = omega mu0 G a / 2 about 8 on this plate: strongly screened
        double g = conductor.SheetConductanceS, omega = 2 * Math.PI * source.FrequencyHz;
        var l = model.Lattice;
        var re = new double[l.NodeCount]; var im = new double[l.NodeCount];
        source.Integrate(l, re, im);
        var bRe = model.RightHandSide(re); var bIm = model.RightHandSide(im);
        var b = MathNet.Numerics.LinearAlgebra.Vector<Complex>.Build.Dense(model.Unknowns, i => new Complex(bRe[i], bIm[i]));
        var a = SheetMatrix(model).ToComplex();
        var r = Dense(model, (dx, dy) => reaction.Kernel[dx, dy]).ToComplex();
        var expected = (a + new Complex(0, omega * g) * r).LU().Solve(b);

        var cold = ReactionSolver.SolveAc(reaction, source, conductor, Tight);
        Assert.True(RelativeDifference(cold.U, expected) < 1e-9, $"cold start: {RelativeDifference(cold.U, expected):E2}");
        var other = ReactionSolver.SolveAc(reaction, source, new ConductingSheet(5.5e7, 2e-3), Tight);
        var warm = ReactionSolver.SolveAc(reaction, source, conductor, Tight, other.U);
        Assert.True(RelativeDifference(warm.U, expected) < 1e-9, $"warm start: {RelativeDifference(warm.U, expected):E2}");
        Assert.True(warm.Iterations < cold.Iterations, $"warm {warm.Iterations} against cold {cold.Iterations} iterations");
        Assert.Equal(cold.LossW, warm.LossW, cold.LossW * 1e-9);
    }

    /// <summary>
    /// The two-grid preconditioner of the AC solve (<see cref="TwoLevelAcPreconditioner"/>, here with a lattice twice as coarse, where the
    /// hole is a merged region on both lattices): GMRES with it to a relative residual of 1e-13 must give the dense LU solution to
    /// cond x 1e-13 (cond 80), so 1e-10 relative is allowed (measured 1e-14 after 13 iterations). A preconditioner changes the iterations, never the answer.
    /// </summary>
    [Fact]
    public void Ac_solve_with_the_two_grid_preconditioner_matches_dense_LU()
    {
        var model = Model();
        var reaction = ReactionOperator.Build(model);
        IAcFieldSource source = new UniformAcField(0.01, 400);
        var conductor = new ConductingSheet(5.8e7, 2e-3);
        double g = conductor.SheetConductanceS, omega = 2 * Math.PI * source.FrequencyHz;
        var l = model.Lattice;
        var re = new double[l.NodeCount]; var im = new double[l.NodeCount];
        source.Integrate(l, re, im);
        var bRe = model.RightHandSide(re); var bIm = model.RightHandSide(im);
        var b = MathNet.Numerics.LinearAlgebra.Vector<Complex>.Build.Dense(model.Unknowns, i => new Complex(bRe[i], bIm[i]));
        var a = SheetMatrix(model).ToComplex();
        var r = Dense(model, (dx, dy) => reaction.Kernel[dx, dy]).ToComplex();
        var expected = (a + new Complex(0, omega * g) * r).LU().Solve(b);

        var level = CoarseOwnFieldLevel.Build(model, 2)!;
        Assert.Contains(true, level.Model.Regions.IsMerged);
        var op = CoupledOperator.Ac(model, reaction, omega, g);
        var twoGrid = new TwoLevelAcPreconditioner(model, level, omega, g);
        var u = new Complex[model.Unknowns];
        var report = ComplexGmres.Solve(op.Apply, twoGrid.Apply, b.ToArray(), u, new ConvergenceCriterion { RelativeResidual = 1e-13, MaxIterations = 500 });
        Assert.True(RelativeDifference(u, expected) < 1e-10, $"two-grid: {RelativeDifference(u, expected):E2} after {report.Iterations} iterations");
        Assert.True(twoGrid.InnerIterations > 0);
    }

    [Fact]
    public void Moving_solve_cold_and_warm_started_matches_dense_LU()
    {
        var model = Model();
        var reaction = ReactionOperator.Build(model);
        var conductor = new ConductingSheet(5.8e7, 1e-3);
        double g = conductor.SheetConductanceS, w = 2 / (Validity.Mu0 * g), hx = model.Lattice.Hx;
        var poles = new MovingPoles(new[] { new Pole(PoleFace.Circle(0.008), new Vec2(0, 0), 0.5) }, 2 * w);
        var node = new double[model.Lattice.NodeCount];
        poles.IntegrateRate(model.Lattice, 0.0, node);
        var b = MathNet.Numerics.LinearAlgebra.Vector<double>.Build.DenseOfArray(model.RightHandSide(node));
        var dxr = Dense(model, (dx, dy) => (reaction.Kernel[dx + 1, dy] - reaction.Kernel[dx - 1, dy]) / (2 * hx));
        var expected = (SheetMatrix(model) - poles.SpeedMPerS * g * dxr).LU().Solve(b);
        static IEnumerable<Complex> C(IEnumerable<double> x) => x.Select(v => new Complex(v, 0));

        var cold = ReactionSolver.SolveMoving(reaction, poles, conductor, new[] { 0.0 }, Tight);
        Assert.True(RelativeDifference(C(cold.FirstU), C(expected)) < 1e-9, $"cold start: {RelativeDifference(C(cold.FirstU), C(expected)):E2}");
        var slower = ReactionSolver.SolveMoving(reaction, new MovingPoles(poles.Poles, 1.8 * w), conductor, new[] { 0.0 }, Tight);
        var warm = ReactionSolver.SolveMoving(reaction, poles, conductor, new[] { 0.0 }, Tight, slower.FirstU);
        Assert.True(RelativeDifference(C(warm.FirstU), C(expected)) < 1e-9, $"warm start: {RelativeDifference(C(warm.FirstU), C(expected)):E2}");
        Assert.True(warm.Iterations[0] < cold.Iterations[0], $"warm {warm.Iterations[0]} against cold {cold.Iterations[0]} iterations");
    }

    /// <summary>
    /// A sweep of three offsets: after the first, each GMRES starts from the previous offset's solution with its image under the
    /// coupled operator kept from the previous solve (no application for the first residual). The last offset's u must match the
    /// dense LU solve of its own system to 1e-9 (the class's tolerance), and 1 and 2 FFT workers must give the same numbers bit for bit.
    /// </summary>
    [Fact]
    public void Moving_sweep_with_kept_images_matches_dense_LU_and_is_the_same_for_two_workers()
    {
        var model = Model();
        var reaction = ReactionOperator.Build(model);
        var conductor = new ConductingSheet(5.8e7, 1e-3);
        double g = conductor.SheetConductanceS, w = 2 / (Validity.Mu0 * g), hx = model.Lattice.Hx;
        var poles = new MovingPoles(new[] { new Pole(PoleFace.Circle(0.008), new Vec2(0, 0), 0.5) }, w);
        var offsets = new[] { -0.004, 0.0, 0.004 };
        var node = new double[model.Lattice.NodeCount];
        poles.IntegrateRate(model.Lattice, offsets[^1], node);
        var b = MathNet.Numerics.LinearAlgebra.Vector<double>.Build.DenseOfArray(model.RightHandSide(node));
        var dxr = Dense(model, (dx, dy) => (reaction.Kernel[dx + 1, dy] - reaction.Kernel[dx - 1, dy]) / (2 * hx));
        var expected = (SheetMatrix(model) - poles.SpeedMPerS * g * dxr).LU().Solve(b);
        static IEnumerable<Complex> C(IEnumerable<double> x) => x.Select(v => new Complex(v, 0));

        var sweep = ReactionSolver.SolveMoving(reaction, poles, conductor, offsets, Tight);
        Assert.True(RelativeDifference(C(sweep.U), C(expected)) < 1e-9, $"last offset: {RelativeDifference(C(sweep.U), C(expected)):E2}");
        var twoWorkers = ReactionSolver.SolveMoving(ReactionOperator.Build(model, 2), poles, conductor, offsets, Tight);
        Assert.Equal(sweep.U, twoWorkers.U);
        Assert.Equal(sweep.LossW, twoWorkers.LossW);
        Assert.Equal(sweep.LiftN, twoWorkers.LiftN);
    }

    // Operators on one lattice share the kernel and its spectra (ReactionOperator's LatticeSpectra); each must still apply R
    // and Dx R restricted to its own plate, and a lattice with the same node counts but other cell sizes must get its own
    // kernel. Checked against the dense node-pair sums as above, to 1e-12 relative (the FFT's rounding is about 1e-15 here;
    // a spectrum of the wrong lattice is off by order 1: the kernel scales with the cell size).
    [Fact]
    public void Operators_sharing_a_lattice_each_apply_their_own_plate_and_other_cell_sizes_do_not_share()
    {
        var holed = Model();
        var plain = SheetModel.Build(new PlateGeometry(Polygon.Rectangle(-0.03, -0.02, 0.03, 0.02)), new GridOptions { CellSizeM = 0.004 });
        var half = SheetModel.Build(new PlateGeometry(Polygon.Rectangle(-0.015, -0.01, 0.015, 0.01)), new GridOptions { CellSizeM = 0.002 });
        Assert.Equal(holed.Lattice.NodeCount, half.Lattice.NodeCount);
        var operators = new[] { holed, plain, half }.Select(m => ReactionOperator.Build(m)).ToArray();
        foreach (var reaction in operators)
        {
            var model = reaction.Model;
            var random = new Random(model.Unknowns);
            var u = Enumerable.Range(0, model.Unknowns).Select(_ => random.NextDouble() - 0.5).ToArray();
            var uVector = MathNet.Numerics.LinearAlgebra.Vector<double>.Build.Dense(u);
            double h2 = 2 * model.Lattice.Hx;
            var own = ReactionKernel.Build(model.Lattice.Hx, model.Lattice.Hy, model.Lattice.NodesX, model.Lattice.NodesY);
            var expectedR = Dense(model, (dx, dy) => own[dx, dy]) * uVector;
            var expectedDxR = Dense(model, (dx, dy) => (own[dx + 1, dy] - own[dx - 1, dy]) / h2) * uVector;
            var r = new double[model.Unknowns]; var dxR = new double[model.Unknowns];
            reaction.ApplyR(u, r);
            reaction.ApplyDxR(u, dxR);
            double errorR = (MathNet.Numerics.LinearAlgebra.Vector<double>.Build.Dense(r) - expectedR).L2Norm() / expectedR.L2Norm();
            double errorDxR = (MathNet.Numerics.LinearAlgebra.Vector<double>.Build.Dense(dxR) - expectedDxR).L2Norm() / expectedDxR.L2Norm();
            Assert.True(errorR < 1e-12, $"R on {model.Unknowns} unknowns, cells {model.Lattice.Hx} m: {errorR:E2}");
            Assert.True(errorDxR < 1e-12, $"Dx R on {model.Unknowns} unknowns, cells {model.Lattice.Hx} m: {errorDxR:E2}");
        }
    }
}
