using MathNet.Numerics.LinearAlgebra;
using SlotOpt.Numerics;
using SlotOpt.Plates.Conductors;
using SlotOpt.Plates.Geometry;
using SlotOpt.Plates.Grid;
using SlotOpt.Plates.OwnField;
using SlotOpt.Plates.ReducedBasis;
using SlotOpt.Plates.Sources;
using Xunit.Abstractions;

namespace SlotOpt.Tests.Plates.ReducedBasis;

/// <summary>
/// The reduced-basis moving solve against the same discrete system (A - v G Dx R) u = -s assembled densely and solved by
/// MathNet.Numerics' LU (the general-purpose dense reference), on a 60 x 40 mm plate with a hole (one merged unknown) and a
/// comb slot, 4 mm cells, two rectangular poles; and its bounds and the resistance-limited upper bound on the same plate.
/// </summary>
public class MovingReducedBasisTests(ITestOutputHelper output)
{
    private static readonly ConvergenceCriterion Tight = new() { RelativeResidual = 1e-12, MaxIterations = 500 };
    private static readonly double[] Offsets = [0.0, 0.005, 0.011];

    private static SheetModel Model()
    {
        var plate = new PlateGeometry(Polygon.Rectangle(-0.03, -0.02, 0.03, 0.02));
        plate.AddCutout(Polygon.Rectangle(-0.012, -0.008, 0.004, 0.008));
        return SheetModel.Build(plate, new GridOptions { CellSizeM = 0.004 });
    }

    private static MovingPoles Poles(double speed) => MovingPoles.Row(PoleFace.Rectangle(0.01, 0.016), new Vec2(-0.01, 0.002), 2, 0.014, 0.4, speed);

    /// <summary>G (u^T A u + edge) from the dense LU solution at one offset.</summary>
    private static double DenseLoss(SheetModel model, ReactionOperator reaction, MovingPoles poles, ConductingSheet sheet, double offset)
    {
        var map = model.Regions.NodeUnknown;
        int nx = model.Lattice.NodesX;
        double hx = model.Lattice.Hx, g = sheet.SheetConductanceS;
        var dxr = Matrix<double>.Build.Dense(model.Unknowns, model.Unknowns);
        for (int m = 0; m < map.Length; m++)
            if (map[m] >= 0)
                for (int n = 0; n < map.Length; n++)
                    if (map[n] >= 0) dxr[map[m], map[n]] += (reaction.Kernel[m % nx - n % nx + 1, m / nx - n / nx] - reaction.Kernel[m % nx - n % nx - 1, m / nx - n / nx]) / (2 * hx);
        var a = model.Operator.Matrix;
        var dense = Matrix<double>.Build.Dense(a.Rows, a.Rows);
        for (int i = 0; i < a.Rows; i++)
            for (int k = a.RowStart[i]; k < a.RowStart[i + 1]; k++) dense[i, a.ColumnIndex[k]] += a.Value[k];
        var node = new double[model.Lattice.NodeCount];
        poles.IntegrateRate(model.Lattice, offset, node);
        var u = (dense - poles.SpeedMPerS * g * dxr).LU().Solve(Vector<double>.Build.DenseOfArray(model.RightHandSide(node)));
        return g * (u.DotProduct(dense * u) + poles.SubCellEdgeLossPerSiemens(model.Grid, offset));
    }

    // One basis, built at one speed, serves two conductors and three speeds (0.3 w to 3 w): the loss at each offset agrees with
    // the dense LU solution of the same discrete system. The basis stops when its exact residual bound is below 1e-12 relative, so the
    // solution agrees to cond x 1e-12 (the moving system's condition number on this plate is about 1e2, as MathNet measures it for the
    // same plate in ReactionDenseReferenceTests); 1e-9 relative on the loss leaves margin for the inner multigrid solves at 1e-12.
    [Theory]
    [InlineData(5.8e7, 1e-3, 0.3)]
    [InlineData(5.8e7, 1e-3, 3.0)]
    [InlineData(2.5e7, 6e-3, 1.0)]
    public void Loss_matches_the_dense_LU_solution_at_every_offset(double sigma, double thickness, double speedOverW)
    {
        var model = Model();
        var reaction = ReactionOperator.Build(model);
        var sheet = new ConductingSheet(sigma, thickness);
        double w = 2 / (Validity.Mu0 * sheet.SheetConductanceS);
        var basis = MovingReducedBasis.Start(reaction, Poles(1.0), Offsets, Tight);
        basis.Solve(new ConductingSheet(sigma * 0.7, thickness), 1.0);                          // another conductor first: the basis is shared
        var solution = basis.Solve(sheet, speedOverW * w);
        for (int k = 0; k < Offsets.Length; k++)
        {
            var expected = DenseLoss(model, reaction, Poles(speedOverW * w), sheet, Offsets[k]);
            Assert.True(Math.Abs(solution.LossW[k] - expected) <= 1e-9 * expected, $"offset {Offsets[k]}: {solution.LossW[k]} against {expected}");
            Assert.Equal(solution.LossW[k] / (speedOverW * w), solution.DragN[k], 1e-12 * solution.DragN[k]);
        }
    }

    // The same answer as the GMRES own-field solver (ReactionSolver, itself checked against Reitz 1970 and the dense LU), lift included:
    // both stop at a relative residual of 1e-12 here, so 1e-8 relative allows for the conditioning of the lift's projection.
    [Fact]
    public void Drag_and_lift_match_the_GMRES_own_field_solver()
    {
        var model = Model();
        var reaction = ReactionOperator.Build(model);
        var sheet = new ConductingSheet(3.5e7, 4e-3);
        double w = 2 / (Validity.Mu0 * sheet.SheetConductanceS);
        var reduced = MovingReducedBasis.Start(reaction, Poles(w), Offsets, Tight).Solve(sheet, 1.5 * w);
        var gmres = ReactionSolver.SolveMoving(reaction, Poles(1.5 * w), sheet, Offsets, Tight);
        for (int k = 0; k < Offsets.Length; k++)
        {
            Assert.Equal(gmres.DragN[k], reduced.DragN[k], 1e-8 * gmres.DragN[k]);
            Assert.Equal(gmres.LiftN[k], reduced.LiftN[k], 1e-8 * Math.Abs(gmres.LiftN[k]));
            Assert.Equal(gmres.ResistanceLimitedDragN[k], reduced.ResistanceLimitedDragN[k], 1e-9 * gmres.ResistanceLimitedDragN[k]);
        }
    }

    // The screening bounds: the one-node Gauss rule below and the Gauss-Radau rule with a node at 0 above the converged loss
    // (G. H. Golub and G. Meurant, Matrices, Moments and Quadrature with Applications, Princeton 2010, Theorems 6.3 and 6.4, for the
    // completely monotone 1/(1 + c^2 x)); and the resistance-limited loss above both (Dx R skew-symmetric, so |(I - c K) x| >= |x|).
    // The rules are strict inequalities for c > 0; 1e-12 relative allows for rounding of the converged value.
    [Theory]
    [InlineData(0.1)]
    [InlineData(0.3)]
    [InlineData(1.0)]
    [InlineData(4.0)]
    public void Two_step_bounds_bracket_the_converged_loss_and_the_screen_bounds_it_from_above(double speedOverW)
    {
        var model = Model();
        var reaction = ReactionOperator.Build(model);
        var sheet = new ConductingSheet(3.5e7, 4e-3);
        double v = speedOverW * 2 / (Validity.Mu0 * sheet.SheetConductanceS);
        var basis = MovingReducedBasis.Start(reaction, Poles(v), Offsets, Tight);
        var (lower, upper) = basis.LossBounds(sheet, v);
        var exact = basis.Solve(sheet, v);
        double screen = exact.ResistanceLimitedDragN.Average() * v;
        Assert.True(lower <= exact.MeanLossW * (1 + 1e-12), $"Gauss {lower} above the loss {exact.MeanLossW}");
        Assert.True(upper >= exact.MeanLossW * (1 - 1e-12), $"Gauss-Radau {upper} below the loss {exact.MeanLossW}");
        Assert.True(upper <= screen * (1 + 1e-12), $"Gauss-Radau {upper} above the screen {screen}");
        Assert.True(exact.MeanLossW < screen, $"coupled {exact.MeanLossW} not below the screen {screen}");
    }

    // The loss-only stopping bound (ArnoldiPosition.RelativeLossError: the projection's residual bound times its adjoint problem's, the
    // adjoint-weighted estimate of a quadratic output, R. Becker and R. Rannacher, Acta Numerica 10 (2001) 1-102) holds at every basis size from
    // 1 to 14 steps: the dense LU loss of the same discrete system (MathNet) minus the projected loss is at most the bound times the projected
    // loss. The inner multigrid solves stop at 1e-12 (Tight), so the Arnoldi relation the bound assumes holds to about that; 1e-10 of the loss
    // is allowed for it. At 14 steps the bound must also be below the solution's own bound squared times 10 (it is about its square: what lets a
    // loss-only solve stop at about half the steps); both rules fail if the bound is wrong in sign or order.
    [Theory]
    [InlineData(0.3)]
    [InlineData(1.0)]
    [InlineData(3.0)]
    public void Loss_error_bound_holds_at_every_basis_size(double speedOverW)
    {
        var model = Model();
        var reaction = ReactionOperator.Build(model);
        var sheet = new ConductingSheet(3.5e7, 4e-3);
        double g = sheet.SheetConductanceS, v = speedOverW * 2 / (Validity.Mu0 * g), c = v * g;
        var poles = Poles(v);
        double offset = Offsets[1];
        double expected = DenseLoss(model, reaction, poles, sheet, offset);
        var node = new double[model.Lattice.NodeCount];
        poles.IntegrateRate(model.Lattice, offset, node);
        var u0 = new double[model.Unknowns];
        Assert.True(model.TrySolve(model.RightHandSide(node), u0, Tight, out _));
        double edge = poles.SubCellEdgeLossPerSiemens(model.Grid, offset);
        var position = new ArnoldiPosition(model, u0, edge);
        var applied = new double[model.Unknowns];
        for (int steps = 1; steps <= 14 && !position.Exhausted; steps++)
        {
            reaction.ApplyDxR(position.V[^1], applied);
            Assert.True(position.Extend(applied, Tight, out var failure), failure);
            var projection = position.Project(c);
            double bound = position.RelativeLossError(c, projection);
            double projected = g * position.Beta * position.Beta * projection.Y.DotProduct(projection.Y);
            double actual = Math.Abs(expected - (projected + g * edge));
            output.WriteLine($"{steps} steps: loss error {actual / projected:E2}, loss bound {bound:E2}, solution bound {projection.RelativeError:E2}");
            Assert.True(actual <= bound * projected + 1e-10 * expected, $"{steps} steps: loss error {actual / projected:E3} above its bound {bound:E3}");
            if (steps == 14) Assert.True(bound <= 10 * projection.RelativeError * projection.RelativeError, $"loss bound {bound:E3} against the solution's {projection.RelativeError:E3}");
        }
    }

    // A loss-only solve (withLift false) at the default criterion (1e-8) stops on the loss bound and agrees with the dense LU loss within 2e-8:
    // the bound's 1e-8 plus the inner multigrid solves at 1e-8 relative residual, which perturb the loss to first order by about that.
    [Fact]
    public void Loss_only_solve_meets_the_dense_LU_loss_at_the_default_criterion()
    {
        var model = Model();
        var reaction = ReactionOperator.Build(model);
        var sheet = new ConductingSheet(3.5e7, 4e-3);
        double v = 2 / (Validity.Mu0 * sheet.SheetConductanceS);
        var basis = MovingReducedBasis.Start(reaction, Poles(v), Offsets);
        var solution = basis.Solve(sheet, v, withLift: false);
        Assert.InRange(solution.MaxRelativeResidual, 0, 1e-8);
        for (int k = 0; k < Offsets.Length; k++)
        {
            double expected = DenseLoss(model, reaction, Poles(v), sheet, Offsets[k]);
            Assert.True(Math.Abs(solution.LossW[k] - expected) <= 2e-8 * expected, $"offset {Offsets[k]}: {solution.LossW[k]} against {expected}");
        }
    }

    // The AC basis (AcReducedBasis) against the GMRES own-field solver (ReactionSolver.SolveAc, checked against MathNet's dense LU in
    // ReactionDenseReferenceTests) on the same plate in a uniform 50 Hz field, for three conductors from one basis (Rm from 0.1 to 10):
    // both stop at a relative residual of 1e-12, so the losses agree to 1e-9 relative; the screen's loss bounds both from above.
    [Fact]
    public void Ac_basis_matches_the_GMRES_own_field_solver_for_every_conductor()
    {
        var model = Model();
        var reaction = ReactionOperator.Build(model);
        var source = new UniformAcField(0.01, 50);
        var basis = AcReducedBasis.Start(reaction, source, Tight);
        foreach (var sheet in new[] { new ConductingSheet(3.5e7, 2e-3), new ConductingSheet(5.8e7, 2e-2), new ConductingSheet(1.4e6, 5e-3) })
        {
            var reduced = basis.Solve(sheet);
            var gmres = ReactionSolver.SolveAc(reaction, source, sheet, Tight);
            Assert.Equal(gmres.LossW, reduced.LossW, 1e-9 * gmres.LossW);
            Assert.Equal(gmres.ResistanceLimitedLossW, reduced.ResistanceLimitedLossW, 1e-9 * gmres.ResistanceLimitedLossW);
            Assert.True(reduced.LossW < reduced.ResistanceLimitedLossW);
        }
    }
}
