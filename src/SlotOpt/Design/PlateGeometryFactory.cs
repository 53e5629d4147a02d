using SlotOpt.Plates.Geometry;

namespace SlotOpt.Design;

/// <summary>Builds the solver geometry of a plate outline with one slot choice (or none).</summary>
public static class PlateGeometryFactory
{
    /// <exception cref="InputException">The pattern does not fit the outline (the message says why).</exception>
    public static (PlateGeometry Geometry, SlotPattern? Pattern) Build(Polygon outline, SlotChoice? slots)
    {
        var geometry = new PlateGeometry(outline);
        if (slots is null) return (geometry, null);
        var pattern = slots.Pattern switch
        {
            SlotPatternKind.Comb => SlotPatterns.Comb(outline, slots.Edge, slots.PitchM, slots.DepthM, slots.WidthM),
            SlotPatternKind.Alternating => SlotPatterns.Alternating(outline, slots.Edge, slots.PitchM, slots.DepthM, slots.WidthM),
            SlotPatternKind.EnclosedSlits => SlotPatterns.EnclosedSlits(outline, slots.Edge, slots.PitchM, slots.DepthM, slots.WidthM),
            SlotPatternKind.Grooves => SlotPatterns.GrooveComb(outline, slots.Edge, slots.PitchM, slots.DepthM, slots.WidthM, slots.RemainingThicknessFraction ?? 0.5),
            _ => throw new ArgumentOutOfRangeException(nameof(slots), slots.Pattern, "unknown slot pattern"),
        };
        geometry.AddPattern(pattern);
        return (geometry, pattern);
    }
}
