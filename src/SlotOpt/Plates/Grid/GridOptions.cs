using SlotOpt.Plates.Geometry;

namespace SlotOpt.Plates.Grid;

/// <summary>
/// How the grid is chosen. With no cell size the cell is the smallest of (feature width / cells it needs
/// across) over the geometry's features (<see cref="GeometryFeatures"/>) and the source's
/// (<see cref="SourceFeatures"/>: poles and pole gaps), coarsened (with a warning) if that would exceed
/// MaxAutoCells. An explicit cell that gives a feature fewer cells than it needs is a warning naming the
/// feature; one beyond MaxCells is refused with the memory estimate.
/// </summary>
public sealed record GridOptions
{
    public double? CellSizeM { get; init; }
    /// <summary>Cells across a conducting strip or ligament: the 5-point scheme's error there is a few per cent at 8 (common practice, no source; measured in SlottedPlateTests).</summary>
    public int MinCellsAcrossNarrowestFeature { get; init; } = 8;
    /// <summary>
    /// Cells across a cut-out: with 2 at least one whole cell column lies inside it, so it cuts the current path instead of being
    /// bridged by partly covered cells; 4, so that the grid-error estimate's grid of twice the cell (DiscretisationError) still has 2.
    /// </summary>
    public int MinCellsAcrossCutout { get; init; } = 4;
    /// <summary>Cells across a pole's face (its edges carry the moving source's line sources; see MovingPoleTests for the measured error).</summary>
    public int MinCellsAcrossPole { get; init; } = 8;
    /// <summary>Cells across the gap between neighbouring poles, so the opposite edges' line sources do not share a cell.</summary>
    public int MinCellsAcrossPoleGap { get; init; } = 4;
    /// <summary>Widths the source brings (poles, pole gaps), resolved like the geometry's.</summary>
    public IReadOnlyList<GridFeature> SourceFeatures { get; init; } = Array.Empty<GridFeature>();
    /// <summary>Automatic grids stop here: about 1.1 M cells, roughly 0.25 GB with the solver (see <see cref="BytesPerCellEstimate"/>).</summary>
    public long MaxAutoCells { get; init; } = 1100 * 1000;
    /// <summary>Hard limit for explicit cell sizes: about 4.2 M cells, roughly 0.9 GB.</summary>
    public long MaxCells { get; init; } = 4200 * 1000;

    /// <summary>
    /// Memory of grid, operator, multigrid hierarchy and Krylov vectors per cell while one plate is built and solved:
    /// the peak working-set growth of the sheets bench (SheetsBench, comb-slotted plate, 2026-12-02, CG on the node lattice),
    /// 196-233 bytes per unknown from 512² to 2048² (841 MB at 2048²), of which about 145 stay retained with the solved model.
    /// </summary>
    public const double BytesPerCellEstimate = 240;

    public int CellsAcross(GridFeatureKind kind) => kind switch
    {
        GridFeatureKind.ConductingStrip => MinCellsAcrossNarrowestFeature,
        GridFeatureKind.Cutout => MinCellsAcrossCutout,
        GridFeatureKind.Pole => MinCellsAcrossPole,
        _ => MinCellsAcrossPoleGap,
    };
}
