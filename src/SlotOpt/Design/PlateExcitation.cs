using SlotOpt.Sheets;

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
    /// The travel offsets for one slot choice. A solid plate averaged "over a slot pitch" uses the widest
    /// pitch among the part's families (or the pole's length of travel, with none): a long solid plate's
    /// drag does not depend on the offset, so any window gives the same mean.
    /// </summary>
    public IReadOnlyList<double> OffsetsFor(SlotChoice? slots, Polygon outline, IReadOnlyList<SlotFamily> families)
    {
        var poles = Moving ?? throw new InvalidOperationException("offsets belong to moving sources");
        if (Average == TravelAverage.Pass)
        {
            var (min, max) = outline.Bounds;
            var (rowMin, rowMax) = poles.ExtentX;
            return Positions == 1 ? [0.0] : MovingSweepSolution.OffsetsAcross(min.X - rowMax, max.X - rowMin, Positions);
        }
        var window = slots?.PitchM
            ?? (families.Count > 0 ? families.SelectMany(f => f.PitchesM).Max() : poles.ExtentX.MaxXM - poles.ExtentX.MinXM);
        return MovingSweepSolution.OffsetsOverPitch(window, Positions);
    }
}
