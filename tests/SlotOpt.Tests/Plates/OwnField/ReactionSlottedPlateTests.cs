using SlotOpt.Plates.Conductors;
using SlotOpt.Plates.Geometry;
using SlotOpt.Plates.Grid;
using SlotOpt.Plates.OwnField;
using SlotOpt.Plates.Sources;
using Xunit.Abstractions;

namespace SlotOpt.Tests.Plates.OwnField;

public class ReactionSlottedPlateTests(ITestOutputHelper output)
{
    // Timoshenko & Goodier, Theory of Elasticity, 3rd ed., 1970, ch. 10, rectangle series: cutting a strip lengthwise into n strips multiplies the resistance-limited loss by
    // about 1/n^2, "valid only when the plate thickness and the strip width are both << delta"; inductance-limited
    // plates gain much less from slotting. Here a 200 mm x 50 mm plate cut into 4 strips by 3 lengthwise cuts, in a
    // uniform AC field, at beta = omega mu0 G w / 2 = 0.05 (w = 50 mm, resistance-limited) and 20 (screened).
    // At beta = 0.05 the slotted/solid ratio is the torsion-series value F_w(1/16) / (n^2 F_w(1/4)) = 0.07127 with
    // F_w(a/b) = 1 - 0.630249 a/b (the asymptote of the T&G rectangle series, J_t = F_w a^3 b / 3); tolerance 3 % (the cut lines are merged node
    // chains, measured -1.5 %; the reaction field at beta = 0.05 changes the loss by 1e-4). At beta = 20 the ratio is
    // more than 3 times larger (slotting helps much less; measured 0.70), the solid plate's loss is screened below
    // 1/3 of its resistance-limited value, and each strip is screened less than the solid plate.
    [Fact]
    public void Slots_help_less_when_the_plate_screens_the_field()
    {
        var solid = PlateGeometry.Rectangle(0.2, 0.05);
        var slotted = PlateGeometry.Rectangle(0.2, 0.05);
        for (int c = 1; c < 4; c++) slotted.AddCut(new CutLine(new Vec2(-0.01, c * 0.0125), new Vec2(0.21, c * 0.0125)));
        var options = new GridOptions { CellSizeM = 0.05 / 32 };
        var solidOp = ReactionOperator.Build(SheetModel.Build(solid, options));
        var slottedOp = ReactionOperator.Build(SheetModel.Build(slotted, options));
        double g = 1e4, tau = Validity.Mu0 * g * 0.05 / 2;
        var conductor = new ConductingSheet(1e7, g / 1e7);
        var ratios = new List<double>();
        foreach (double beta in new[] { 0.05, 20 })
        {
            var field = new UniformAcField(0.01, beta / tau / (2 * Math.PI));
            var a = ReactionSolver.SolveAc(solidOp, field, conductor);
            var b = ReactionSolver.SolveAc(slottedOp, field, conductor);
            ratios.Add(b.LossW / a.LossW);
            output.WriteLine($"beta {beta}: slotted/solid {b.LossW / a.LossW:F4}; solid screened to {a.LossRatio:F4}, slotted to {b.LossRatio:F4}; GMRES {a.Iterations}/{b.Iterations}");
            if (beta > 1)
            {
                Assert.True(a.LossRatio < 1.0 / 3, "the solid plate screens the field");
                Assert.True(b.LossRatio > a.LossRatio, "each strip is screened less than the solid plate");
            }
        }
        double series = (1 - 0.630249 / 16) / (16 * (1 - 0.630249 / 4));
        Assert.InRange(ratios[0] / series - 1, -0.03, 0.03);
        Assert.True(ratios[1] > 3 * ratios[0], $"slotting helps much less when screened ({ratios[1]:F4} vs {ratios[0]:F4})");
    }
}
