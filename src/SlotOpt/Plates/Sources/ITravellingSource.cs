using SlotOpt.Plates.Geometry;

namespace SlotOpt.Plates.Sources;

/// <summary>
/// A moving source as the run path takes it (poles or magnets travelling along +x): besides what the solvers
/// read (<see cref="IMovingSheetSource"/>), its extent along the travel (for the offsets of a pass), its
/// smallest length along the travel (the loop length of the moving magnetic Reynolds number, for the model
/// choice), the widths the grid must resolve, the same source at another speed (for the drag-speed sweep) and
/// its description in words.
/// </summary>
public interface ITravellingSource : IMovingSheetSource
{
    /// <summary>Extent in x of the source at offset zero (metres).</summary>
    (double MinXM, double MaxXM) ExtentX { get; }
    /// <summary>The smallest source length along the travel (metres).</summary>
    double LoopLengthXM { get; }
    IReadOnlyList<GridFeature> GridFeatures { get; }
    ITravellingSource AtSpeed(double speedMPerS);
    /// <summary>What moves, in words ("4 poles", "6 magnets 20 x 10 x 5 mm at 2 mm").</summary>
    string Words { get; }
}
