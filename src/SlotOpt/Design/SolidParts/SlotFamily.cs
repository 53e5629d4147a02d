using SlotOpt.Plates.Geometry;

namespace SlotOpt.Design.SolidParts;

/// <summary>The kinds of slot pattern a plate can be given (see Plates/Geometry/SlotPatterns).</summary>
public enum SlotPatternKind
{
    Comb,
    Alternating,
    EnclosedSlits,
    Grooves,
}

/// <summary>
/// One family of slot patterns for a plate: the pattern kind and edge, the pitches, depths and widths
/// to try, and the processes that may cut it. For grooves, the fraction of thickness left under them.
/// </summary>
public sealed record SlotFamily(
    SlotPatternKind Pattern,
    PlateEdge Edge,
    IReadOnlyList<double> PitchesM,
    IReadOnlyList<double> DepthsM,
    IReadOnlyList<double> WidthsM,
    IReadOnlyList<string> Processes,
    double? RemainingThicknessFraction)
{
    public long OptionCount => (long)PitchesM.Count * DepthsM.Count * WidthsM.Count * Processes.Count;
}

/// <summary>One slot pattern with its numbers fixed.</summary>
public sealed record SlotChoice(SlotPatternKind Pattern, PlateEdge Edge, double PitchM, double DepthM, double WidthM, double? RemainingThicknessFraction);
