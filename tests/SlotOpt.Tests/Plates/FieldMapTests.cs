using System.Numerics;
using SlotOpt.Plates.Geometry;
using SlotOpt.Plates.Grid;
using SlotOpt.Plates.ResistanceLimited;
using SlotOpt.Plates.Sources;

namespace SlotOpt.Tests.Plates;

public class FieldMapTests
{
    private static double Loss(Complex[] values)
    {
        // 200 x 100 mm plate; map columns at x = -10, 90, 110, 210 mm (mirror-symmetric about x = 100 mm)
        var xs = new[] { -0.01, 0.09, 0.11, 0.21 };
        var ys = new[] { -0.01, 0.11 };
        var map = new FieldMap(xs, ys, values, 50);
        var model = SheetModel.Build(PlateGeometry.Rectangle(0.2, 0.1), new GridOptions { CellSizeM = 0.002 });
        return ResistanceLimitedSolver.SolveAc(model, map).LossW(1);
    }

    // Field amplitude 1 on the left half and j (same amplitude, 90 degrees later) on the right half: the real
    // and imaginary parts are separate real problems, and the time average of two quadrature components has
    // no cross term, so P = P_left + P_right, each the time-averaged loss of that half's field alone
    // (common practice, no source). The plate's mirror symmetry gives P_left = P_right. In phase, the cross
    // term adds: P_in_phase > P_left + P_right. Tolerance 1e-6 relative: each solve converges to 1e-8.
    [Fact]
    public void Quadrature_halves_add_their_losses()
    {
        Complex one = Complex.One, j = Complex.ImaginaryOne, zero = Complex.Zero;
        double quadrature = Loss(new[] { one, one, j, j, one, one, j, j });
        double left = Loss(new[] { one, one, zero, zero, one, one, zero, zero });
        double right = Loss(new[] { zero, zero, one, one, zero, zero, one, one });
        Assert.InRange(quadrature / (left + right) - 1, -1e-6, 1e-6);
        Assert.InRange(left / right - 1, -1e-6, 1e-6);
        double inPhase = Loss(new[] { one, one, one, one, one, one, one, one });
        Assert.True(inPhase > 1.01 * quadrature, $"in phase {inPhase:E4} vs quadrature {quadrature:E4}");
    }
}
