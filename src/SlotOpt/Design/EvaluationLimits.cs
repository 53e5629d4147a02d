using SlotOpt.Design.Limits;
using SlotOpt.Plates.Geometry;
using SlotOpt.Plates.Grid;
using SlotOpt.Tables;

namespace SlotOpt.Design;

/// <summary>
/// How much machine an evaluation may use: threads for the plate solves, memory (checked against the
/// solver's measured bytes per cell before each grid is built) and wall time (<see cref="Deadline"/>: checked between
/// phases and between solves, and inside every iterative solve).
/// </summary>
public sealed record EvaluationLimits
{
    public static readonly EvaluationLimits Default = new();

    /// <summary>Plate geometries solved at once. Results do not depend on it (each solve is independent and single-threaded).</summary>
    public int Threads { get; init; } = Environment.ProcessorCount;

    /// <summary>Memory the solves together may take (bytes); default 4 GiB.</summary>
    public long MaxMemoryBytes { get; init; } = 4L << 30;

    /// <summary>Wall time the evaluation may take (seconds); default one hour.</summary>
    public double MaxSeconds { get; init; } = 3600;

    /// <summary>The wall-time limit of the run in progress; null until a run starts it (<see cref="Started"/>).</summary>
    public RunDeadline? Deadline { get; init; }

    /// <summary>These limits with their deadline running: the caller's, or a new one (owned, and so disposed, by the caller).</summary>
    public EvaluationLimits Started(out RunDeadline? owned)
    {
        owned = Deadline is null ? new RunDeadline(MaxSeconds) : null;
        return owned is null ? this : this with { Deadline = owned };
    }

    /// <summary>
    /// A report is written after the work (`--out`): every estimate checked (<see cref="CheckMemory"/>) includes its bytes
    /// (<see cref="MemoryModel.ReportBytes"/>). The automatic grids' cap (<see cref="CellCap"/>) leaves it out, so that a run chooses the same grid,
    /// and gives the same numbers, with and without a report: a grid at the cap holds MaxMemoryBytes / <see cref="MemoryModel.Margin"/> at most, so
    /// the report still fits under any limit of at least Margin / (Margin - 1) x ReportBytes = 250 MB.
    /// </summary>
    public bool WritesReport { get; init; }

    /// <summary>
    /// Cells one solve may have so that the run fits in MaxMemoryBytes (<see cref="MemoryModel"/>): the screening of a part with
    /// <paramref name="work"/>'s slot geometries (and its thermal, coupled-ranking and turning-disc terms), and the
    /// own-field confirmation at its largest padded lattice (<see cref="MemoryModel.OwnFieldBytesPerCellBound"/>).
    /// </summary>
    public long CellCap(PartWorkload work)
    {
        var geometries = Math.Max(work.Geometries, 1);
        var screening = MemoryModel.CellsWithin(MaxMemoryBytes,
            MemoryModel.ScreeningBytesPerCell(geometries, Threads, work.ThermalOptionsPerGeometry, work.RotatingRateSets) + MemoryModel.RankingBytesPerCell(geometries, Threads, work.TravelPositions));
        var ownField = MemoryModel.CellsWithin(MaxMemoryBytes, MemoryModel.OwnFieldBytesPerCellBound);
        return (long)Math.Min(screening, ownField);
    }

    /// <summary>Throws, before anything is built, when an estimate (<see cref="MemoryModel"/>, with its margin), and the report's bytes when one is written, is over the limit.</summary>
    public void CheckMemory(string what, double estimateBytes, string remedy)
    {
        if (OverLimit(what, estimateBytes) is { } over) throw new ResourceLimitException($"{over}: {remedy} or raise the limit");
    }

    /// <summary>
    /// Why the plate on cells of cellM, solved with its own field (<see cref="MemoryModel.OwnField"/>, the largest of its models) next to the
    /// solve already held on the run's grid (held), would not fit the limit, or null: the grid-error estimate's finer grid
    /// (Plates/DiscretisationError) is checked so before it is built, and falls back with this reason rather than stopping the run.
    /// </summary>
    public string? RefusesGrid(SheetModel held, double cellM)
    {
        var outline = held.Grid.Geometry.Outline;
        var finer = GridSize.Over(outline, cellM);
        var estimate = finer.OwnFieldBytes + GridSize.Over(outline, Math.Max(held.Lattice.Hx, held.Lattice.Hy)).OwnFieldBytes - MemoryModel.WithMargin(0);     // the runtime once
        return OverLimit($"a {Numbers.Of(cellM * 1e3, "mm")} grid ({Numbers.Sig(finer.Cells)} cells) solved with the plate's own field", estimate);
    }

    /// <summary>"what needs about ..., the memory limit is ..." when the estimate (and the report's bytes when one is written) is over the limit, else null.</summary>
    private string? OverLimit(string what, double estimateBytes)
    {
        var total = estimateBytes + (WritesReport ? MemoryModel.Margin * MemoryModel.ReportBytes : 0);
        return total > MaxMemoryBytes
            ? $"{what} needs about {MemoryModel.Words(total)} (estimate with margin{(WritesReport ? ", the report included" : "")}); the memory limit is {MemoryModel.Words(MaxMemoryBytes)} (--max-memory)"
            : null;
    }

    /// <summary>
    /// Throws when an explicit grid of a part with <paramref name="work"/> would not fit in memory (the screening, the ranking of a moving
    /// source with its actual padded lattice, or the own-field confirmation).
    /// </summary>
    public void CheckGrid(string partName, Polygon outline, double? cellSizeM, PartWorkload work)
    {
        if (cellSizeM is not { } h) return;
        var (cells, nodesX, nodesY) = GridSize.Over(outline, h);
        var geometries = Math.Max(work.Geometries, 1);
        var screening = MemoryModel.Screening(cells, geometries, Threads, work.ThermalOptionsPerGeometry, work.TravelPositions, MemoryModel.PaddedCells(nodesX, nodesY) / Math.Max(cells, 1),
            work.RotatingRateSets);
        var estimate = Math.Max(screening, MemoryModel.OwnField(nodesX, nodesY));
        CheckMemory($"part {partName}: a {Numbers.Of(h * 1e3, "mm")} grid ({Numbers.Sig(cells)} cells, {geometries} slot geometries kept, {Math.Min(Threads, geometries)} solved at once)",
            estimate, "choose a larger cell, fewer slot choices or fewer threads");
    }
}
