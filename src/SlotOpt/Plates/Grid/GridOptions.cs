namespace SlotOpt.Plates.Grid;

/// <summary>
/// How the grid is chosen. With no cell size the cell is the narrowest feature divided by
/// MinCellsAcrossNarrowestFeature, coarsened (with a warning) if that would exceed MaxAutoCells.
/// An explicit cell size beyond MaxCells is refused with the memory estimate.
/// </summary>
public sealed record GridOptions
{
    public double? CellSizeM { get; init; }
    public int MinCellsAcrossNarrowestFeature { get; init; } = 8;
    /// <summary>Automatic grids stop here: about 1.1 M cells, roughly 0.3 GB with the solver (see <see cref="BytesPerCellEstimate"/>).</summary>
    public long MaxAutoCells { get; init; } = 1100 * 1000;
    /// <summary>Hard limit for explicit cell sizes: about 4.2 M cells, roughly 1.3 GB.</summary>
    public long MaxCells { get; init; } = 4200 * 1000;

    /// <summary>Memory of grid, operator, multigrid hierarchy and Krylov vectors per cell, measured by the bench (see SheetsBench).</summary>
    public const double BytesPerCellEstimate = 300;
}
