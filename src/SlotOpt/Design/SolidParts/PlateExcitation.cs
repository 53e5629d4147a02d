using SlotOpt.Plates.Geometry;
using SlotOpt.Plates.ResistanceLimited;
using SlotOpt.Plates.Sources;
using SlotOpt.Plates.Sources.Rotation;

namespace SlotOpt.Design.SolidParts;

/// <summary>Over which travel the drag of a moving source is averaged.</summary>
public enum TravelAverage
{
    /// <summary>Positions spread over one slot pitch (the drag of a long slotted plate repeats with it).</summary>
    SlotPitch,
    /// <summary>Positions from the poles entering the plate to leaving it.</summary>
    Pass,
}

/// <summary>
/// What drives the eddy currents in a plate: exactly one of an AC field (uniform or mapped), poles moving
/// past it at a speed, or a disc turning under fixed magnets. A closed family: the private constructor admits only the three cases below.
/// </summary>
public abstract record PlateExcitation
{
    private PlateExcitation() { }

    public bool IsMoving => this is Moving;

    /// <summary>An AC field of one frequency over the plate; <paramref name="FieldMapFile"/> names the field-map file it was read from, if any (for the report).</summary>
    public sealed record AcField(IAcFieldSource Source, double FrequencyHz, string? FieldMapFile = null) : PlateExcitation;

    /// <summary>Poles or magnets moving past the plate, evaluated at several travel offsets whose mean gives the drag.</summary>
    public sealed record Moving(ITravellingSource Source, TravelAverage Average, int Positions) : PlateExcitation
    {
        public double SpeedMPerS => Source.SpeedMPerS;

        /// <summary>
        /// The travel offsets to evaluate: over one slot pitch (the window a slotted plate's drag repeats
        /// over; for a solid plate, whose drag on a long plate does not depend on the offset, any window
        /// serves and the caller passes the one its slotted options use, else the source's own length), or
        /// across the whole pass of the source over the plate.
        /// </summary>
        public IReadOnlyList<double> Offsets(Polygon outline, double? windowM)
        {
            if (Average == TravelAverage.Pass)
            {
                var (min, max) = outline.Bounds;
                var (rowMin, rowMax) = Source.ExtentX;
                return Positions == 1 ? [0.0] : MovingSweepSolution.OffsetsAcross(min.X - rowMax, max.X - rowMin, Positions);
            }
            return MovingSweepSolution.OffsetsOverPitch(windowM ?? Source.ExtentX.MaxXM - Source.ExtentX.MinXM, Positions);
        }
    }

    /// <summary>
    /// A disc turning under fixed magnets (motion = "rotation"): the ring at its speed, and how many disc angles the torque is averaged
    /// over (null: the plate file's default, one for a solid disc, eight for a slotted one). A slotted disc's angles spread over one slot
    /// pitch (its torque repeats with it), a solid disc's round the whole turn, as in plate files.
    /// </summary>
    public sealed record Turning(RotatingSource Source, int? Positions) : PlateExcitation
    {
        public double AngularSpeedRadPerS => Source.AngularSpeedRadPerS;
        /// <summary>The disc's speed in revolutions per minute.</summary>
        public double Rpm => RotationalSpeed.RpmFromRadPerS(Source.AngularSpeedRadPerS);
        /// <summary>The speed of the disc under the magnets' centres, v = omega r (the speed of the magnetic Reynolds number).</summary>
        public double PathSpeedMPerS => Source.AngularSpeedRadPerS * Source.SourceRadiusM;

        /// <summary>The disc angles of one slot layout (null: the solid disc): positions spread evenly from 0 over one slot pitch, or round the turn.</summary>
        public IReadOnlyList<double> Angles(RadialSlots? ring) => DiscAngles.Spread(ring?.PitchRad, Positions);
    }
}
