using SlotOpt.Design;
using SlotOpt.Plates.Geometry;

namespace SlotOpt.Input;

/// <summary>The words problem and plate files use for slot patterns and plate edges, both ways.</summary>
public static class SlotWords
{
    public static readonly IReadOnlyList<string> Patterns = ["comb", "alternating", "enclosed", "grooves"];
    public static readonly IReadOnlyList<string> Edges = ["bottom", "top", "left", "right"];

    public static SlotPatternKind Pattern(string word) => word switch
    {
        "alternating" => SlotPatternKind.Alternating,
        "enclosed" => SlotPatternKind.EnclosedSlits,
        "grooves" => SlotPatternKind.Grooves,
        "comb" => SlotPatternKind.Comb,
        _ => throw new ArgumentOutOfRangeException(nameof(word), word, "not a slot pattern word"),
    };

    public static PlateEdge Edge(string word) => word switch
    {
        "top" => PlateEdge.Top,
        "left" => PlateEdge.Left,
        "right" => PlateEdge.Right,
        "bottom" => PlateEdge.Bottom,
        _ => throw new ArgumentOutOfRangeException(nameof(word), word, "not a plate edge word"),
    };

    public static string Word(SlotPatternKind kind) => Patterns[kind switch
    {
        SlotPatternKind.Comb => 0,
        SlotPatternKind.Alternating => 1,
        SlotPatternKind.EnclosedSlits => 2,
        SlotPatternKind.Grooves => 3,
        _ => throw new ArgumentOutOfRangeException(nameof(kind)),
    }];

    public static string Word(PlateEdge edge) => edge.ToString().ToLowerInvariant();

    /// <summary>The key of a slot's extent: an enclosed slit has a length, the others a depth from their edge.</summary>
    public static string ExtentKey(string? patternWord) => patternWord == "enclosed" ? "length" : "depth";
}
