using SlotOpt.Plates.Geometry;

namespace SlotOpt.Design.SolidParts;

/// <summary>The kinds of slot pattern a plate can be given (see Plates/Geometry/SlotPatterns).</summary>
public enum SlotPatternKind
{
    Comb,
    Alternating,
    EnclosedSlits,
    Grooves,
    /// <summary>Radial slots round a disc (<see cref="DiscShape.Cut"/>; not in <see cref="SlotPatternCatalog"/>, which cuts from an edge).</summary>
    Radial,
}

/// <summary>
/// One family of slot patterns for a plate: the pattern kind and edge, the pitches, depths and widths
/// to try, and the processes that may cut it. For grooves, the fraction of thickness left under them. Radial slots on a disc list
/// their layouts (count, from, to) in Rings and their widths in WidthsM; their pitch and depth follow from each layout (<see cref="SlotChoice.RadialOn"/>).
/// </summary>
public sealed record SlotFamily(
    SlotPatternKind Pattern,
    PlateEdge Edge,
    IReadOnlyList<double> PitchesM,
    IReadOnlyList<double> DepthsM,
    IReadOnlyList<double> WidthsM,
    IReadOnlyList<string> Processes,
    double? RemainingThicknessFraction,
    IReadOnlyList<RadialSlots>? Rings = null)
{
    public long OptionCount => Rings is { } rings
        ? (long)rings.Count * WidthsM.Count * Processes.Count
        : (long)PitchesM.Count * DepthsM.Count * WidthsM.Count * Processes.Count;
}

/// <summary>One slot pattern with its numbers fixed. Radial slots carry their layout in Radial; their PitchM is the arc between slot centres at the
/// inner radius and DepthM their radial length (for the report's columns).</summary>
public sealed record SlotChoice(SlotPatternKind Pattern, PlateEdge Edge, double PitchM, double DepthM, double WidthM, double? RemainingThicknessFraction,
    RadialSlots? Radial = null)
{
    /// <summary>Radial slots of one layout and width on a disc.</summary>
    public static SlotChoice RadialOn(DiscShape disc, RadialSlots ring, double widthM) =>
        new(SlotPatternKind.Radial, PlateEdge.Bottom, 2 * Math.PI * ring.FromM / ring.Count, (ring.ToM ?? disc.RadiusM + widthM) - ring.FromM, widthM, null, ring);
}
