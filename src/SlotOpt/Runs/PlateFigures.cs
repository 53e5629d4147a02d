using SlotOpt.Plates;
using SlotOpt.Plates.ResistanceLimited;
using SlotOpt.Plates.Sources.Rotation;

namespace SlotOpt.Runs;

/// <summary>
/// Every number the plate report (`slotopt plate FILE --out DIR`) shows, taken from one <see cref="PlateFileEvaluation"/>:
/// the model that made them and its grid-error estimate, the current-density map with the plate's outline and slots, and
/// the curve of the case's motion: damping force against gap (approach), drag against travel position (a sliding source),
/// torque against disc angle (a turning disc); a curve against speed where one was computed; and with [thermal] the
/// plate's temperature and whether it breaks the file's limit. The map is always the resistance-limited one (MapModel).
/// </summary>
public sealed record PlateFigures(
    string Model,
    string ModelReason,
    double? GridErrorRelative,
    string? GridErrorWords,
    string MapModel,
    CurrentDensityMap Map,
    double PeakCurrentDensityAPerM2,
    PlateDrawing Drawing,
    ApproachCurve? Approach,
    TravelCurve? Travel,
    DiscAngleCurve? DiscAngle,
    SpeedCurve? Speed,
    PlateTemperatureFigures? Temperature)
{
    public static PlateFigures Of(PlateFileEvaluation e)
    {
        var speed = SpeedCurveOf(e);
        var approach = e.ApproachCurve is { } points ? new ApproachCurve(points, e.Case.Approach!.SpeedMPerS) : null;
        TravelCurve? travel = null;
        DiscAngleCurve? disc = null;
        if (e.Case.Rotation is { } rotation)
        {
            // the evaluation gives the force along the magnets' path, F = T / R; the torque is that force times R
            var radiusM = rotation.Source.SourceRadiusM;
            disc = new DiscAngleCurve(rotation.AnglesRad, e.DragPerOffsetN.Select(f => f * radiusM).ToList(), e.TorqueNm!.Value,
                RotationalSpeed.RpmFromRadPerS(rotation.Source.AngularSpeedRadPerS), e.Case.AveragedOver);
        }
        else if (e.Case.MovingSource is not null && e.MeanDragN is { } meanDrag)
            travel = new TravelCurve(e.OffsetsXM, e.DragPerOffsetN, e.LossPerOffsetW, meanDrag, e.Case.MovingSource.SpeedMPerS, e.Case.AveragedOver);
        var grid = e.GridError;
        var temperature = e.Heating?.Temperature is { } t && e.Case.Thermal is { } thermal
            ? new PlateTemperatureFigures(t.AmbientK, t.HottestK, t.MeanRiseK, thermal.Limit.IsSet ? thermal.Limit.Breach(t) : null, thermal.Limit.IsSet)
            : null;
        return new PlateFigures(ReactionModelChoice.Name(e.Choice.Kind), e.Choice.Reason, grid?.Relative, grid?.Description,
            ReactionModelChoice.Name(SheetModelKind.ResistanceLimited), e.Result.Map, e.Result.PeakCurrentDensityAPerM2, PlateDrawing.Of(e.Case.Geometry),
            approach, travel, disc, speed, temperature);
    }

    /// <summary>
    /// The curve against speed the evaluation computed, if any: a turning disc's torque against speed (--speeds, the model per point and the
    /// peak the search found), or the thick slab's drag against speed.
    /// </summary>
    private static SpeedCurve? SpeedCurveOf(PlateFileEvaluation e)
    {
        if (e.SpeedCurve is { } disc)
        {
            static SpeedCurvePoint Point(DiscSpeedPoint p) => new(p.Rpm, p.TorqueNm, p.Model);
            var points = disc.Points.Concat(disc.PeakSearch).DistinctBy(p => p.AngularSpeedRadPerS).OrderBy(p => p.AngularSpeedRadPerS).Select(Point).ToList();   // the sweep and the peak search's solves
            return new SpeedCurve("rotation speed", "rpm", "braking torque", "N m", points, disc.Peak is { } peak ? Point(peak) : null);
        }
        if (e.SlabSpeedCurve is { Count: > 0 } slab)
        {
            var points = slab.Select(f => new SpeedCurvePoint(f.SpeedMPerS, f.DragN, ReactionModelChoice.Name(SheetModelKind.ThickSlab))).ToList();
            var top = points.IndexOf(points.MaxBy(p => p.Value)!);
            return new SpeedCurve("speed", "m/s", "drag", "N", points, top > 0 && top < points.Count - 1 ? points[top] : null);
        }
        return null;
    }
}

/// <summary>The plate's steady temperature with [thermal]: ambient, hottest point, mean rise (kelvin), and the breach of the file's limit (null: within it, or no limit set).</summary>
public sealed record PlateTemperatureFigures(double AmbientK, double HottestK, double MeanRiseK, string? Breach, bool LimitSet)
{
    public double MaxRiseK => HottestK - AmbientK;
}

/// <summary>Magnets approaching the plate at SpeedMPerS: the damping force (and the loss) at each gap.</summary>
public sealed record ApproachCurve(IReadOnlyList<GapPoint> Points, double SpeedMPerS);

/// <summary>A source sliding over the plate: drag and loss at each travel position (metres along x) over the averaged length, and the mean drag.</summary>
public sealed record TravelCurve(IReadOnlyList<double> PositionsM, IReadOnlyList<double> DragN, IReadOnlyList<double> LossW, double MeanDragN, double SpeedMPerS, string AveragedOver);

/// <summary>A disc turning under fixed magnets: the braking torque at each disc angle (radians) over the averaged pitch, its mean, and the speed.</summary>
public sealed record DiscAngleCurve(IReadOnlyList<double> AnglesRad, IReadOnlyList<double> TorqueNm, double MeanTorqueNm, double SpeedRpm, string AveragedOver);

/// <summary>
/// A force or torque against speed, neutral in what it measures so that any sweep can feed the plot: the speed's name and
/// unit ("rotation speed", "rpm"), the value's ("torque", "N m"), the points (in those units) each with the model that made
/// it, and the peak where the curve has one inside its range (null when the value still rises at the last speed).
/// </summary>
public sealed record SpeedCurve(string SpeedName, string SpeedUnit, string ValueName, string ValueUnit, IReadOnlyList<SpeedCurvePoint> Points, SpeedCurvePoint? Peak);

/// <summary>One point of a <see cref="SpeedCurve"/>: the speed and the value in the curve's units, and the model that made the value.</summary>
public sealed record SpeedCurvePoint(double Speed, double Value, string Model);
