using SlotOpt.Plates.Geometry;

namespace SlotOpt.Design.SolidParts;

/// <summary>
/// One kind of slot pattern, in one row: its word in problem and plate files, its words in descriptions,
/// the file key of a slot's extent (an enclosed slit has a length, the others a depth from their edge),
/// and the generator that cuts it into an outline (Plates/Geometry/SlotPatterns).
/// </summary>
public sealed record SlotPatternShape(
    SlotPatternKind Kind,
    string FileWord,
    string Words,
    string ExtentKey,
    Func<Polygon, SlotChoice, double?, SlotPattern> Cut);

/// <summary>
/// The one place that maps a slot pattern kind to its generator and its words, and a plate edge to its
/// word. A new slot family is one new SlotPatternKind and one row here.
/// </summary>
public static class SlotPatternCatalog
{
    public static readonly IReadOnlyList<SlotPatternShape> All =
    [
        new(SlotPatternKind.Comb, "comb", "comb", "depth",
            (outline, s, offset) => SlotPatterns.Comb(outline, s.Edge, s.PitchM, s.DepthM, s.WidthM, offset)),
        new(SlotPatternKind.Alternating, "alternating", "alternating", "depth",
            (outline, s, offset) => SlotPatterns.Alternating(outline, s.Edge, s.PitchM, s.DepthM, s.WidthM, offset)),
        new(SlotPatternKind.EnclosedSlits, "enclosed", "enclosed slits", "length",
            (outline, s, offset) => SlotPatterns.EnclosedSlits(outline, s.Edge, s.PitchM, s.DepthM, s.WidthM, offset)),
        new(SlotPatternKind.Grooves, "grooves", "grooves", "depth",
            (outline, s, offset) => SlotPatterns.GrooveComb(outline, s.Edge, s.PitchM, s.DepthM, s.WidthM,
                s.RemainingThicknessFraction ?? throw new ArgumentException("grooves need the fraction of thickness left under them", nameof(s)), offset)),
    ];

    public static readonly IReadOnlyList<string> FileWords = All.Select(s => s.FileWord).ToList();

    /// <summary>The edge words of both file kinds, in the order files list them.</summary>
    public static readonly IReadOnlyList<string> EdgeWords = ["bottom", "top", "left", "right"];

    public static SlotPatternShape Of(SlotPatternKind kind) =>
        All.FirstOrDefault(s => s.Kind == kind) ?? throw new ArgumentOutOfRangeException(nameof(kind), kind, "no row for this slot pattern kind");

    /// <summary>The shape a file word names, or null for a word that names none.</summary>
    public static SlotPatternShape? FromFileWord(string word) => All.FirstOrDefault(s => s.FileWord == word);

    public static PlateEdge Edge(string word) => word switch
    {
        "bottom" => PlateEdge.Bottom,
        "top" => PlateEdge.Top,
        "left" => PlateEdge.Left,
        "right" => PlateEdge.Right,
        _ => throw new ArgumentOutOfRangeException(nameof(word), word, "not a plate edge word"),
    };

    public static string Word(PlateEdge edge) => edge.ToString().ToLowerInvariant();

    /// <summary>Cuts one slot choice into an outline (offsetM: the first slot's centre from the low end of the edge; null centres the pattern).</summary>
    /// <exception cref="InputException">The pattern does not fit the outline (the message says why).</exception>
    public static SlotPattern Cut(Polygon outline, SlotChoice slots, double? offsetM = null) => Of(slots.Pattern).Cut(outline, slots, offsetM);
}
