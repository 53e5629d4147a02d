using SlotOpt.Plates.Conductors;
using SlotOpt.Plates.Geometry;
using SlotOpt.Plates.Grid;
using SlotOpt.Plates.Sources;

namespace SlotOpt.Runs;

/// <summary>
/// The case one plate file describes (read by the input layer's PlateFileReader), validated and in SI:
/// where it came from, geometry, grid choice, material and thickness, and either an AC source or a moving
/// source (poles or magnets) with the travel offsets to evaluate, or magnets over a turning disc (Rotation), or magnets approaching
/// the plate (Approach); optionally its cooling and temperature limit ([thermal]).
/// <see cref="PlateFileEvaluation"/> solves it.
/// </summary>
public sealed record PlateCase(
    string Path,
    PlateGeometry Geometry,
    GridOptions Grid,
    ConductingSheet Sheet,
    IAcFieldSource? AcSource,
    ITravellingSource? MovingSource,
    IReadOnlyList<double> OffsetsXM,
    string AveragedOver,
    PlateThermalInput? Thermal = null,
    DiscRotation? Rotation = null,
    MagnetApproach? Approach = null);
