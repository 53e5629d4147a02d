using SlotOpt.Plates;
using SlotOpt.Plates.Geometry;
using SlotOpt.Plates.Grid;
using SlotOpt.Plates.Sources;

namespace SlotOpt.Input;

/// <summary>
/// One plate described in a plate file (TOML, see <see cref="PlateFileReader"/>), validated and in SI:
/// geometry, grid choice, material and thickness, and either an AC source or moving poles with the
/// travel offsets to evaluate; optionally the [thermal] section.
/// </summary>
public sealed record PlateFile(
    string Path,
    PlateGeometry Geometry,
    GridOptions Grid,
    ConductingSheet Sheet,
    IAcFieldSource? AcSource,
    MovingPoles? MovingSource,
    IReadOnlyList<double> OffsetsXM,
    string AveragedOver,
    PlateThermalInput? Thermal = null);
