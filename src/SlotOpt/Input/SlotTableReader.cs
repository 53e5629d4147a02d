using SlotOpt.Design.SolidParts;
using SlotOpt.Design;
using SlotOpt.Input.Toml;
using SlotOpt.Plates.Geometry;

namespace SlotOpt.Input;

/// <summary>
/// The one reader of a slot table, for both file kinds: [[parts.slots]] families and the [parts.current]
/// slots of problem files, [[slots]] of plate files. The same keys and defaults everywhere:
/// <code>
/// pattern              required: "comb" | "alternating" | "enclosed" | "grooves"
/// edge                 "bottom" | "top" | "left" | "right"; default "bottom"
/// pitch, width         lengths (a family may list several)
/// depth                length from the edge; "length" instead for "enclosed" slits
/// remaining_thickness_fraction  grooves only, required: the fraction of thickness left under them, between 0 and 1
/// </code>
/// A width must be narrower than the pitch, and a slot must not cut through the plate. The caller reads
/// its own keys (processes, offset) and then rejects unknown keys.
/// </summary>
public static class SlotTableReader
{
    public const string DefaultEdgeWord = "bottom";

    /// <summary>What one slot table says; a fixed slot pattern has one value in each list.</summary>
    public sealed record SlotTable(
        SlotPatternKind Pattern,
        PlateEdge Edge,
        IReadOnlyList<double> PitchesM,
        IReadOnlyList<double> ExtentsM,
        IReadOnlyList<double> WidthsM,
        double? RemainingThicknessFraction)
    {
        /// <summary>The one slot choice of a fixed slot pattern.</summary>
        public SlotChoice Single => new(Pattern, Edge, PitchesM[0], ExtentsM[0], WidthsM[0], RemainingThicknessFraction);
    }

    /// <param name="outline">The plate the slots are cut in, for the cut-through check (null when it did not read).</param>
    /// <param name="oneValueEach">A fixed slot pattern (one pitch, extent and width) rather than a family to choose from.</param>
    /// <returns>The table, or null when a key is missing or wrong (the errors are recorded on the section).</returns>
    public static SlotTable? Read(TomlSection t, Polygon? outline, bool oneValueEach)
    {
        var patternWord = t.OptionalChoice("pattern", SlotPatternCatalog.FileWords.ToArray());
        if (patternWord is null && !t.Has("pattern")) t.Error("pattern", $"missing: one of {string.Join(", ", SlotPatternCatalog.FileWords)}");
        var shape = patternWord is null ? null : SlotPatternCatalog.FromFileWord(patternWord);
        var edge = SlotPatternCatalog.Edge(t.OptionalChoice("edge", SlotPatternCatalog.EdgeWords.ToArray()) ?? DefaultEdgeWord);
        var extentKey = shape?.ExtentKey ?? "depth";
        var pitches = Lengths(t, "pitch", oneValueEach);
        var extents = Lengths(t, extentKey, oneValueEach);
        var widths = Lengths(t, "width", oneValueEach);
        t.AcceptOldName("remaining_thickness", "remaining_thickness_fraction");
        var remaining = t.OptionalNumber("remaining_thickness_fraction");

        if (pitches is not null && widths is not null && widths.Max() >= pitches.Min())
            t.Error("width", $"the widest slot ({widths.Max() * 1e3:0.###} mm) is not narrower than the smallest pitch ({pitches.Min() * 1e3:0.###} mm): nothing would be left between slots");
        var grooves = shape?.Kind == SlotPatternKind.Grooves;
        if (grooves && remaining is not (> 0 and < 1)) t.Error("remaining_thickness_fraction", "grooves need remaining_thickness_fraction between 0 and 1 (the fraction of thickness left under them)");
        if (shape is not null && !grooves && remaining is not null) t.Error("remaining_thickness_fraction", "only grooves take remaining_thickness_fraction");
        if (outline is not null && extents is not null)
        {
            var (min, max) = outline.Bounds;
            var across = edge is PlateEdge.Bottom or PlateEdge.Top ? max.Y - min.Y : max.X - min.X;
            if (extents.Max() >= across) t.Error(extentKey, $"the deepest slot ({extents.Max() * 1e3:0.###} mm) cuts right through the plate ({across * 1e3:0.###} mm across): the plate would fall apart");
        }
        if (shape is null || pitches is null || extents is null || widths is null || (grooves && remaining is not (> 0 and < 1))) return null;
        return new SlotTable(shape.Kind, edge, pitches, extents, widths, grooves ? remaining : null);
    }

    /// <summary>A required positive length, or (for a family) one or a list of them.</summary>
    private static IReadOnlyList<double>? Lengths(TomlSection t, string key, bool oneValue)
    {
        if (oneValue) return t.PositiveQuantity(key, QuantityKind.Length, required: true) is { } one ? [one] : null;
        var list = t.QuantityList(key, QuantityKind.Length, required: true);
        if (list is not null && list.Any(v => !(v > 0))) { t.Error(key, "every value must be positive"); return null; }
        return list;
    }
}
