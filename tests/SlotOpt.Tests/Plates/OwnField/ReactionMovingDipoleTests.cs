using SlotOpt.Plates.Conductors;
using SlotOpt.Plates.Geometry;
using SlotOpt.Plates.Grid;
using SlotOpt.Plates.OwnField;
using Xunit.Abstractions;

namespace SlotOpt.Tests.Plates.OwnField;

/// <summary>
/// A normal magnetic dipole moving at height h over a wide thin sheet, steady state, against the
/// thin-sheet closed forms of Reitz (J. Appl. Phys. 41:2067, 1970), re-derived from the thin-sheet reflection coefficient R = i s / (1 + i s), s = (v/w) cos phi:
/// w = 2/(mu0 sigma t), F_L = F0 [1 - w/sqrt(v^2 + w^2)], F_D = (w/v) F_L, F0 = 3 mu0 m^2/(32 pi h^4),
/// drag peak at v = 1.27202 w with F_D,max = 0.30028 F0.
/// The plate reaches 20 h behind the source (the wake), 8 h ahead and 8 h to each side.
/// </summary>
public class ReactionMovingDipoleTests(ITestOutputHelper output)
{
    private const double HeightM = 0.01;
    private static readonly ConductingSheet Sheet = new(1e7, 1e-3);
    private static readonly double W = 2 / (Validity.Mu0 * Sheet.SheetConductanceS);   // receding-image speed, 159 m/s

    private static ReactionOperator Operator(int cellsPerHeight)
    {
        var plate = new PlateGeometry(Polygon.Rectangle(-20 * HeightM, -8 * HeightM, 8 * HeightM, 8 * HeightM));
        return ReactionOperator.Build(SheetModel.Build(plate, new GridOptions { CellSizeM = HeightM / cellsPerHeight }));
    }

    private (double Lift, double Drag, double LowDrag) Forces(ReactionOperator op, double speedOverW)
    {
        var dipole = new MovingDipole(new Vec2(0, 0), HeightM, 1.0, speedOverW * W);
        var s = ReactionSolver.SolveMoving(op, dipole, Sheet, new[] { 0.0 });
        Assert.True(s.MaxRelativeResidual <= 1e-8);
        output.WriteLine($"  v/w {speedOverW}, {op.Model.Unknowns} unknowns: {s.Iterations[0]} GMRES iterations, residual {s.MaxRelativeResidual:E1}");
        double f0 = dipole.ImageForceN;
        return (s.LiftN[0] / f0, s.DragN[0] / f0, s.ResistanceLimitedDragN[0] / f0);
    }

    // Lift and drag at v/w = 0.5, 1, 2, 5 (Reitz 1970 closed forms F_L = F0 (1 - w / sqrt(v^2 + w^2)), F_D = (w/v) F_L: 3-D lift 0.10557, 0.29289, 0.55279,
    // 0.80388; drag 0.21115, 0.29289, 0.27639, 0.16078). The grid error is second order (measured: the
    // drag error at v/w = 5 falls from 7.2 % at 5 cells per h to 2.8 % at 8, ratio 2.56 = (8/5)^2), so the
    // values are Richardson-extrapolated from 4 and 8 cells per height, (4 F_8 - F_4)/3.
    // Tolerance 1 %: measured after extrapolation within 0.4 % (the 8-cell values alone are up to 2.8 % off);
    // the plate's finite size and the Richardson remainder account for the rest.
    // Also lift/drag = v/w (Davis's ratio, Saslow 1992), same tolerance; and the shape: drag rises to the
    // peak and falls, lift rises monotonically toward the image force F0.
    [Fact]
    public void Lift_and_drag_follow_Reitz_from_low_to_high_speed()
    {
        var coarse = Operator(4);
        var fine = Operator(8);
        var speeds = new[] { 0.5, 1, 2, 5 };
        var lift = new double[speeds.Length];
        var drag = new double[speeds.Length];
        for (int k = 0; k < speeds.Length; k++)
        {
            var (l4, d4, _) = Forces(coarse, speeds[k]);
            var (l8, d8, _) = Forces(fine, speeds[k]);
            lift[k] = (4 * l8 - l4) / 3;
            drag[k] = (4 * d8 - d4) / 3;
            double v = speeds[k];
            double reitzLift = 1 - 1 / Math.Sqrt(1 + v * v), reitzDrag = reitzLift / v;
            output.WriteLine($"v/w {v}: lift {lift[k]:F5} (8 cells {l8:F5}) Reitz {reitzLift:F5} ({lift[k] / reitzLift - 1:P2}); drag {drag[k]:F5} (8 cells {d8:F5}) Reitz {reitzDrag:F5} ({drag[k] / reitzDrag - 1:P2}); lift/drag {lift[k] / drag[k]:F4}");
            Assert.InRange(lift[k] / reitzLift - 1, -0.01, 0.01);
            Assert.InRange(drag[k] / reitzDrag - 1, -0.01, 0.01);
            Assert.InRange(lift[k] / drag[k] / v - 1, -0.01, 0.01);
        }
        Assert.True(drag[0] < drag[1] && drag[1] > drag[2] && drag[2] > drag[3], "drag rises, peaks near v = w, falls");
        Assert.True(lift[0] < lift[1] && lift[1] < lift[2] && lift[2] < lift[3] && lift[3] < 1, "lift rises toward F0");
    }

    // The drag peak: a parabola in ln v through v/w = 1, 1.27202, 1.6, each drag Richardson-extrapolated from
    // 4 and 8 cells per height. Reitz: peak at v = 1.27202 w, F_D,max = 0.30028 F0. Tolerances: speed 2 %
    // (the drag is flat at its peak: a 0.1 % error in one sample moves the vertex by about 1 %; the parabola
    // through the exact curve at these samples itself peaks at 1.2741 w, 0.2 % high), height 1 %.
    [Fact]
    public void Drag_peaks_near_1_27_w()
    {
        var coarse = Operator(4);
        var fine = Operator(8);
        var v = new[] { 1.0, 1.27202, 1.6 };
        var d = v.Select(s => (4 * Forces(fine, s).Drag - Forces(coarse, s).Drag) / 3).ToArray();
        var x = v.Select(s => Math.Log(s)).ToArray();
        // Newton form p(x) = d0 + d01 (x - x0) + a (x - x0)(x - x1); vertex where p'(x) = d01 + a (2x - x0 - x1) = 0
        double d01 = (d[1] - d[0]) / (x[1] - x[0]), d12 = (d[2] - d[1]) / (x[2] - x[1]);
        double a = (d12 - d01) / (x[2] - x[0]);
        double xPeak = (x[0] + x[1]) / 2 - d01 / (2 * a);
        double peak = d[0] + d01 * (xPeak - x[0]) + a * (xPeak - x[0]) * (xPeak - x[1]);
        double vPeak = Math.Exp(xPeak);
        output.WriteLine($"drag {string.Join(", ", d.Select(t => t.ToString("F5")))}; peak at v/w = {vPeak:F4} (Reitz 1.27202), F_D,max/F0 = {peak:F5} (Reitz 0.30028)");
        Assert.True(a < 0, "the drag has a maximum between w and 1.6 w");
        Assert.InRange(vPeak / 1.27202 - 1, -0.02, 0.02);
        Assert.InRange(peak / 0.30028 - 1, -0.01, 0.01);
    }

    // Low-speed limit: the coupled drag tends to the resistance-limited drag of the same source and grid.
    // Reitz's form gives F_D / F_D,low = (2/e^2)(1 - 1/sqrt(1 + e^2)) = 1 - 3 e^2/4 + ..., e = v/w (Reitz 1970,
    // expanded here). Asserted: below 1 % difference at e = 0.01 (theory 7.5e-5), and at e = 0.1 the
    // shortfall 1 - F/F_low within 20 % of the theory's 0.0074 (a second-order effect: the grid and the
    // 1e-8 solver residual are far below it).
    [Fact]
    public void Low_speed_limit_matches_the_resistance_limited_solver()
    {
        var op = Operator(4);
        var (_, d1, low1) = Forces(op, 0.01);
        var (_, d2, low2) = Forces(op, 0.1);
        double shortfall = 1 - d2 / low2, theory = 1 - 2 / (0.1 * 0.1) * (1 - 1 / Math.Sqrt(1.01));
        output.WriteLine($"e = 0.01: coupled/low {d1 / low1:F7}; e = 0.1: shortfall {shortfall:E3}, theory {theory:E3}");
        Assert.InRange(Math.Abs(d1 / low1 - 1), 0, 0.01);
        Assert.InRange(shortfall / theory - 1, -0.2, 0.2);
    }
}
