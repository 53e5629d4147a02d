using SlotOpt.Plates.Geometry;
using SlotOpt.Plates.ResistanceLimited;
using SlotOpt.Plates.Sources;

namespace SlotOpt.Design;

/// <summary>Over which travel the drag of a moving source is averaged.</summary>
public enum TravelAverage
{
    /// <summary>Positions spread over one slot pitch (the drag of a long slotted plate repeats with it).</summary>
    SlotPitch,
    /// <summary>Positions from the poles entering the plate to leaving it.</summary>
    Pass,
}

/// <summary>
/// What drives the eddy currents in a plate: an AC field (uniform or mapped), or poles moving past it
/// at a speed, evaluated at several travel offsets whose mean gives the drag.
/// </summary>
public sealed record PlateExcitation(IAcFieldSource? Ac, double FrequencyHz, MovingPoles? Moving, TravelAverage Average, int Positions)
{
    public bool IsMoving => Moving is not null;
    public double SpeedMPerS => Moving?.SpeedMPerS ?? 0;

    public static PlateExcitation AcField(IAcFieldSource source, double frequencyHz) => new(source, frequencyHz, null, TravelAverage.SlotPitch, 0);

    public static PlateExcitation MovingSource(MovingPoles poles, TravelAverage average, int positions) => new(null, 0, poles, average, positions);

    /// <summary>
    /// The travel offsets to evaluate: over one slot pitch (the window a slotted plate's drag repeats
    /// over; for a solid plate, whose drag on a long plate does not depend on the offset, any window
    /// serves and the caller passes the one its slotted options use, else the poles' own length), or
    /// across the whole pass of the poles over the plate.
    /// </summary>
    public IReadOnlyList<double> Offsets(Polygon outline, double? windowM)
    {
        var poles = Moving ?? throw new InvalidOperationException("offsets belong to moving sources");
        if (Average == TravelAverage.Pass)
        {
            var (min, max) = outline.Bounds;
            var (rowMin, rowMax) = poles.ExtentX;
            return Positions == 1 ? [0.0] : MovingSweepSolution.OffsetsAcross(min.X - rowMax, max.X - rowMin, Positions);
        }
        return MovingSweepSolution.OffsetsOverPitch(windowM ?? poles.ExtentX.MaxXM - poles.ExtentX.MinXM, Positions);
    }
}
