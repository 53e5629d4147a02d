using SlotOpt.Plates.Geometry;

namespace SlotOpt.Design.SolidParts;

/// <summary>Builds the solver geometry of a plate outline with one slot choice (or none).</summary>
public static class PlateGeometryFactory
{
    /// <exception cref="InputException">The pattern does not fit the outline (the message says why).</exception>
    public static (PlateGeometry Geometry, SlotPattern? Pattern) Build(Polygon outline, SlotChoice? slots)
    {
        var geometry = new PlateGeometry(outline);
        if (slots is null) return (geometry, null);
        var pattern = SlotPatternCatalog.Cut(outline, slots);
        geometry.AddPattern(pattern);
        return (geometry, pattern);
    }
}
