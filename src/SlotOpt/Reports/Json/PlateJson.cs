using SlotOpt.Plates;
using SlotOpt.Plates.Sources.Rotation;
using SlotOpt.Runs;

namespace SlotOpt.Reports.Json;

/// <summary>
/// The machine-readable form of one plate (`slotopt plate --json` prints it; the plate report's result.json is the same document): the model and why, loss and drag (per source position when it moves), current density,
/// the grid-error estimate (relative) and its method (three-grid, three-grid-order-unconfirmed, two-grid or finer-grid: Plates/DiscretisationError), validity figures, the solver's reproducible effort (no wall times), and the temperature keys when the file has [thermal]
/// (temperature_limit_exceeded only when it sets a limit).
/// Absent values are left out, never written as null.
/// </summary>
public sealed record PlateJson(
    string File,
    string Model,
    string ModelReason,
    double LossW,
    double? DragN,
    double? DiscretisationError,
    string? GridErrorMethod,
    string? AveragedOver,
    IReadOnlyList<double> PositionsM,
    IReadOnlyList<double> DragPerPositionN,
    IReadOnlyList<double> LossPerPositionW,
    double PeakCurrentDensityAPerM2,
    double RmsCurrentDensityAPerM2,
    double ReynoldsNumber,
    double? ThicknessToSkinDepth,
    double SheetConductanceS,
    int Unknowns,
    int Iterations,
    double RelativeResidual,
    double? TemperatureRiseMaxK,
    double? TemperatureRiseMeanK,
    double? HottestTemperatureK,
    IReadOnlyList<double>? HottestPointM,
    double? AmbientK,
    double? ConvectionCoefficientWPerM2k,
    double? HeatConvectedW,
    double? HeatRadiatedW,
    double? HeatToEdgesW,
    double? ResistivityTemperatureK,
    IReadOnlyList<double>? ResistivityTemperatureRangeK,
    int? CouplingIterations,
    bool? TemperatureLimitExceeded,
    IReadOnlyList<string> Warnings,
    IReadOnlyList<string> Notes) : VersionedJson
{
    /// <summary>A turning disc: the braking torque (drag_n is then the force along the magnets' path, torque over their radius).</summary>
    [System.Text.Json.Serialization.JsonPropertyName("torque_n_m")]
    public double? TorqueNM { get; init; }
    public double? RotationSpeedRpm { get; init; }
    /// <summary>Magnets approaching: their speed, and the damping force (opposing the approach, normal to the plate) at each gap.</summary>
    public double? ApproachSpeedMPerS { get; init; }
    public IReadOnlyList<double>? ApproachGapsM { get; init; }
    public IReadOnlyList<double>? ApproachForceN { get; init; }
    /// <summary>thick-slab: the speeds of the drag/lift curve (m/s), drag and lift on the magnets (N), loss in the block (W), the quadrature's relative error estimate.</summary>
    public IReadOnlyList<double>? SlabSpeedsMPerS { get; init; }
    public IReadOnlyList<double>? SlabDragN { get; init; }
    public IReadOnlyList<double>? SlabLiftN { get; init; }
    public IReadOnlyList<double>? SlabLossW { get; init; }
    public double? SlabQuadratureError { get; init; }
    /// <summary>A turning disc with --speeds: torque against speed (the model per point) and the peak when the speeds bracket it.</summary>
    public IReadOnlyList<DiscSpeedJson>? TorqueCurve { get; init; }
    public DiscSpeedJson? TorquePeak { get; init; }

    /// <summary>The document of an evaluated plate file.</summary>
    public static PlateJson From(PlateFileEvaluation e)
    {
        var r = e.Result;
        var heating = e.Heating;
        var t = heating?.Temperature;
        var limit = e.Case.Thermal?.Limit;
        return new PlateJson(
            e.Case.Path,
            ReactionModelChoice.Name(e.Choice.Kind),
            e.Choice.Reason,
            e.LossW,
            e.MeanDragN,
            e.GridError?.Relative,
            e.GridError?.MethodName,
            e.Case.MovingSource is null && e.Case.Rotation is null ? null : e.Case.AveragedOver,
            e.OffsetsXM,
            e.DragPerOffsetN,
            e.LossPerOffsetW,
            r.PeakCurrentDensityAPerM2,
            r.RmsCurrentDensityAPerM2,
            r.Validity.ReynoldsNumber,
            r.Validity.ThicknessToSkinDepth,
            e.Case.Sheet.SheetConductanceS,
            r.Unknowns,
            e.TotalIterations,
            e.RelativeResidual,
            t?.MaxRiseK,
            t?.MeanRiseK,
            t?.HottestK,
            t is null ? null : [t.HottestXM, t.HottestYM],
            t?.AmbientK,
            t?.ConvectionCoefficientWPerM2K,
            t?.ConvectedW,
            t?.RadiatedW,
            t?.EdgeW,
            heating?.LossWeightedTemperatureK,
            heating is null ? null : [heating.ResistivityMinK, heating.ResistivityMaxK],
            heating?.CouplingIterations,
            t is not null && limit is { IsSet: true } ? limit.Breach(t) is not null : null,
            r.Validity.Warnings,
            r.Notes)
        {
            TorqueNM = e.TorqueNm,
            RotationSpeedRpm = e.Case.Rotation is { } rotation ? RotationalSpeed.RpmFromRadPerS(rotation.Source.AngularSpeedRadPerS) : null,
            ApproachSpeedMPerS = e.Case.Approach?.SpeedMPerS,
            ApproachGapsM = e.ApproachCurve?.Select(p => p.GapM).ToList(),
            ApproachForceN = e.ApproachCurve?.Select(p => p.ForceN).ToList(),
            SlabSpeedsMPerS = e.SlabSpeedCurve?.Select(f => f.SpeedMPerS).ToList(),
            SlabDragN = e.SlabSpeedCurve?.Select(f => f.DragN).ToList(),
            SlabLiftN = e.SlabSpeedCurve?.Select(f => f.LiftN).ToList(),
            SlabLossW = e.SlabSpeedCurve?.Select(f => f.LossW).ToList(),
            SlabQuadratureError = e.SlabSpeedCurve?.Max(f => f.RelativeErrorEstimate),
            TorqueCurve = e.SpeedCurve?.Points.Select(p => DiscSpeed(p, e)).ToList(),
            TorquePeak = e.SpeedCurve?.Peak is { } peak ? DiscSpeed(peak, e) : null,
        };
    }

    private static DiscSpeedJson DiscSpeed(DiscSpeedPoint p, PlateFileEvaluation e) =>
        new(p.Rpm, p.TorqueNm, p.TorqueNm / e.Case.Rotation!.Source.SourceRadiusM, p.LossW, p.Model);
}

/// <summary>One speed of a turning disc: torque, the force along the magnets' path (drag_n = torque over their radius), loss and the model that made them.</summary>
public sealed record DiscSpeedJson(
    double RotationSpeedRpm,
    [property: System.Text.Json.Serialization.JsonPropertyName("torque_n_m")] double TorqueNM,
    double DragN,
    double LossW,
    string Model);
