using SlotOpt.Tables;
using SlotOpt.Runs;

namespace SlotOpt.Reports.Plots;

/// <summary>
/// Every plot of one plate report, drawn from the numbers the plate evaluation computed (<see cref="PlateFigures"/>): the
/// curve of the case's motion (damping force against gap, drag along the travel, or torque against disc angle, where the
/// evaluation has more than one travel position or angle), the curve
/// against speed where there is one, and the current-density map.
/// </summary>
public sealed record PlateReportFigures(Figure? Motion, Figure? Speed, Figure CurrentDensity)
{
    public const string CurrentDensityStem = "current-density";

    public IEnumerable<Figure> All => new[] { Motion, Speed, CurrentDensity }.OfType<Figure>();

    public static PlateReportFigures Of(PlateFigures f, string plateName, bool sourceMoves)
    {
        // a curve over disc angles or travel positions needs more than one of them (a solid disc is solved at one angle)
        Figure? motion = f.Approach is { } approach ? ApproachForcePlot.Build(approach, f.Model)
            : f.DiscAngle is { AnglesRad.Count: > 1 } disc ? PositionCurvePlot.DiscAngle(disc, f.Model)
            : f.Travel is { PositionsM.Count: > 1 } travel ? PositionCurvePlot.Travel(travel, f.Model)
            : null;
        var speed = f.Speed is { } curve ? SpeedCurvePlot.Build(curve) : null;
        var when = f.Approach is not null ? "at the first gap"
            : f.DiscAngle is not null ? "at the disc angle with the largest loss"
            : sourceMoves ? "at the travel position with the largest loss"
            : "its amplitude in the AC field";
        var map = CurrentDensityPlot.BuildSingle(CurrentDensityStem, $"Current density: {plateName}",
            $"{plateName}: current density {when}\npeak {Numbers.CurrentDensity(f.PeakCurrentDensityAPerM2)} ({f.MapModel} model)",
            $"The current density in the plate {when}, on the plate's own coordinates; from the {f.MapModel} model (it neglects the currents' own field, so where that field matters it overstates the currents). "
            + "Metal with no current takes the scale's zero colour; slots are drawn white with a black edge, grooves with a grey edge.",
            f.Map, f.Drawing, f.PeakCurrentDensityAPerM2);
        return new PlateReportFigures(motion, speed, map);
    }
}
