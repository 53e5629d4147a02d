using System.Diagnostics;
using SlotOpt.Plates.Geometry;
using SlotOpt.Plates.Grid;

namespace SlotOpt.Design;

/// <summary>
/// How much machine an evaluation may use: threads for the plate solves, memory (checked against the
/// solver's measured bytes per cell before each grid is built) and wall time (checked between solves).
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

    /// <summary>Cells one grid may have so that Threads grids fit in MaxMemoryBytes.</summary>
    public long MaxCellsPerSolve => (long)(MaxMemoryBytes / (GridOptions.BytesPerCellEstimate * Math.Max(Threads, 1)));

    /// <summary>Throws when the estimated memory of an explicit grid exceeds the limit.</summary>
    public void CheckGrid(string partName, Polygon outline, double? cellSizeM)
    {
        if (cellSizeM is not { } h) return;
        var (min, max) = outline.Bounds;
        var cells = Math.Ceiling((max.X - min.X) / h) * Math.Ceiling((max.Y - min.Y) / h);
        if (cells > MaxCellsPerSolve)
            throw new ResourceLimitException(
                $"part {partName}: a {h * 1e3:G4} mm grid needs {cells:E2} cells, about {Bytes(cells * GridOptions.BytesPerCellEstimate * Threads)} for {Threads} solves at once; " +
                $"the memory limit is {Bytes(MaxMemoryBytes)} (--max-memory): choose a larger cell, fewer threads or a higher limit");
    }

    private static string Bytes(double bytes) => bytes >= 1e9 ? $"{bytes / 1e9:F1} GB" : $"{bytes / 1e6:F1} MB";

    /// <summary>Throws when the evaluation has run past its wall-time limit.</summary>
    public void CheckTime(Stopwatch clock, int done, int total)
    {
        if (clock.Elapsed.TotalSeconds > MaxSeconds)
            throw new ResourceLimitException($"the evaluation passed its time limit of {MaxSeconds:0.#} s (--time-limit) after {done} of {total} plate solves; raise the limit or coarsen the grid");
    }
}
