using SlotOpt.Reports.Json;

namespace SlotOpt.Cli;

/// <summary>
/// `slotopt plate --json`: the model and why, loss and drag (per source position when it moves), current density,
/// the grid-error estimate (relative) and its method (three-grid, three-grid-order-unconfirmed or two-grid: Plates/DiscretisationError), validity figures, the solver's reproducible effort (no wall times), and the temperature keys when the file has [thermal]
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
}

/// <summary>One speed of a turning disc: torque, the force along the magnets' path (drag_n = torque over their radius), loss and the model that made them.</summary>
public sealed record DiscSpeedJson(
    double RotationSpeedRpm,
    [property: System.Text.Json.Serialization.JsonPropertyName("torque_n_m")] double TorqueNM,
    double DragN,
    double LossW,
    string Model);
