using SlotOpt.Numerics;
using SlotOpt.Plates.Conductors;
using SlotOpt.Plates.Geometry;
using SlotOpt.Plates.Grid;
using SlotOpt.Plates.OwnField;
using SlotOpt.Plates.Sources;

namespace SlotOpt.Tests.Plates.OwnField;

public class ReactionFailureTests
{
    // Non-convergence is never a number: with a 15-iteration budget at v = 5 w the resistance-limited start
    // converges (CG, ~8 iterations) but the coupled GMRES (needs ~30) does not: the Try form returns false with
    // the reason and the throwing form raises NumericalFailureException. AC with a 2-iteration budget: the same.
    [Fact]
    public void Too_few_iterations_is_a_numerical_failure()
    {
        var model = SheetModel.Build(new PlateGeometry(Polygon.Rectangle(-0.1, -0.05, 0.05, 0.05)), new GridOptions { CellSizeM = 0.0025 });
        var op = ReactionOperator.Build(model);
        var sheet = new ConductingSheet(1e7, 1e-3);
        double w = 2 / (Validity.Mu0 * sheet.SheetConductanceS);
        var tight = new ConvergenceCriterion { MaxIterations = 15 };
        var dipole = new MovingDipole(new Vec2(0, 0), 0.01, 1, 5 * w);
        Assert.False(ReactionSolver.TrySolveMoving(op, dipole, sheet, new[] { 0.0 }, tight, out var none, out var reason));
        Assert.Null(none);
        Assert.Contains("coupled moving solve: no convergence", reason);
        Assert.Throws<NumericalFailureException>(() => ReactionSolver.SolveMoving(op, dipole, sheet, new[] { 0.0 }, tight));
        double omega = 8 / (Validity.Mu0 * sheet.SheetConductanceS * 0.05 / 2);
        Assert.Throws<NumericalFailureException>(() => ReactionSolver.SolveAc(op, new UniformAcField(0.01, omega / (2 * Math.PI)), sheet, new ConvergenceCriterion { MaxIterations = 2 }));
    }

    // A pole wholly off the plate induces nothing: zero drag and lift with a note, not an error (tolerance: exactly 0).
    [Fact]
    public void Source_off_the_plate_gives_zero_with_a_note()
    {
        var model = SheetModel.Build(PlateGeometry.Rectangle(0.1, 0.1), new GridOptions { CellSizeM = 0.005 });
        var poles = new MovingPoles(new[] { new Pole(PoleFace.Circle(0.01), new Vec2(0.5, 0.05), 0.5) }, 10);
        var s = ReactionSolver.SolveMoving(ReactionOperator.Build(model), poles, new ConductingSheet(1e7, 1e-3), new[] { 0.0 });
        Assert.Equal(0.0, s.DragN[0]);
        Assert.Equal(0.0, s.LiftN[0]);
        Assert.Contains(s.Notes, n => n.Contains("does not reach"));
    }
}
