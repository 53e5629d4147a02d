using SlotOpt.Plates.Conductors;
using SlotOpt.Plates.Geometry;
using SlotOpt.Plates.Grid;
using SlotOpt.Plates.OwnField;
using SlotOpt.Plates.Sources.Magnets;
using Xunit.Abstractions;

namespace SlotOpt.Tests.Plates.Magnets;

/// <summary>
/// The magnets' closed-form dBz/dz (<see cref="SlidingMagnets.IntegrateLiftField"/>, LiftField.NormalGradient) through the
/// thin-sheet solver with the eddy currents' own field.
/// </summary>
public class MagnetReactionLiftTests(ITestOutputHelper output)
{
    // Over a wide thin sheet lift / drag = v / w, w = 2 / (mu0 sigma t), for any source (W. M. Saslow, "Maxwell's theory of eddy currents
    // in thin conducting sheets, and applications to electromagnetic shielding and MAGLEV", Am. J. Phys. 60(8) (1992) 693-711,
    // Davis's ratio): per Fourier mode the thin-sheet reflection coefficient is R = i s / (1 + i s), s = (v / w) kx / |k|; the mode's drag
    // goes with Im R kx = s kx / (1 + s^2), its lift with Re R |k| = s^2 |k| / (1 + s^2) (same factor |Bz^|^2), so every mode has
    // lift / drag = s |k| / kx = v / w (derived here from the reflection coefficient).
    // A 20 mm square magnet 5 mm above a plate reaching 10 sides behind it (the wake) and 4 ahead and to each side, v = w.
    // The grid error is second order (measured at v = w: 0.98059 at 2 mm cells, 0.99500 at 1 mm: errors 1.9 % and 0.50 %, factor 3.9),
    // so the ratio is Richardson-extrapolated from 2 and 1 mm cells, (4 r_1 - r_2) / 3 (measured 0.99980).
    // Tolerance 1 %: the finite plate and the Richardson remainder.
    [Fact]
    public void Lift_over_drag_is_speed_over_receding_image_speed()
    {
        var sheet = new ConductingSheet(1e7, 1e-3);
        double w = 2 / (Validity.Mu0 * sheet.SheetConductanceS);   // 159 m/s
        var magnet = new CuboidMagnet(0.02, 0.02, 0.01, 1.2);
        var source = new SlidingMagnets(new MagnetArray(new[] { new MagnetPlacement(magnet, new Vec2(0, 0), 1) }, 0.005), w);
        var plate = new PlateGeometry(Polygon.Rectangle(-0.2, -0.08, 0.08, 0.08));
        double Ratio(double cell)
        {
            var s = ReactionSolver.SolveMoving(ReactionOperator.Build(SheetModel.Build(plate, new GridOptions { CellSizeM = cell })), source, sheet, new[] { 0.0 });
            Assert.InRange(s.MaxRelativeResidual, 0, 1e-8);
            Assert.True(s.LiftN[0] > 0, "the sheet repels the magnet");
            return s.LiftN[0] / s.DragN[0];
        }
        double coarse = Ratio(0.002), fine = Ratio(0.001), extrapolated = (4 * fine - coarse) / 3;
        output.WriteLine($"lift/drag at v = w: {coarse:F5} (2 mm), {fine:F5} (1 mm), extrapolated {extrapolated:F5}");
        Assert.InRange(extrapolated - 1, -0.01, 0.01);
    }
}
