using SlotOpt.Sheets;

namespace SlotOpt.Problems;

/// <summary>
/// One plate described in a plate file (TOML, see <see cref="PlateFileReader"/>), validated and in SI:
/// geometry, grid choice, material and thickness, and either an AC source or moving poles with the
/// travel offsets to evaluate.
/// </summary>
public sealed record PlateFile(
    string Path,
    PlateGeometry Geometry,
    GridOptions Grid,
    Conductor Conductor,
    IAcFieldSource? AcSource,
    MovingPoles? MovingSource,
    IReadOnlyList<double> OffsetsXM,
    string AveragedOver);
