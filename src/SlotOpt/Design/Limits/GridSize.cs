using SlotOpt.Plates.Geometry;

namespace SlotOpt.Design.Limits;

/// <summary>
/// The cells and nodes a grid of square cells lays over an outline's bounding box, known before the grid is built: the counts the memory
/// estimates take (clamped, so that an absurdly small cell cannot overflow them).
/// </summary>
public readonly record struct GridSize(long Cells, int NodesX, int NodesY)
{
    public static GridSize Over(Polygon outline, double cellM)
    {
        var (min, max) = outline.Bounds;
        var (nx, ny) = (Math.Ceiling((max.X - min.X) / cellM), Math.Ceiling((max.Y - min.Y) / cellM));
        return new((long)Math.Min(nx * ny, long.MaxValue / 2), (int)Math.Min(nx + 1, int.MaxValue / 4), (int)Math.Min(ny + 1, int.MaxValue / 4));
    }

    /// <summary>The plate on this grid solved with its own field (<see cref="MemoryModel.OwnField"/>).</summary>
    public double OwnFieldBytes => MemoryModel.OwnField(NodesX, NodesY);
}
