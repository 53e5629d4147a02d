using SlotOpt.Plates.Geometry;

namespace SlotOpt.Design.SolidParts;

/// <summary>Builds the solver geometry of a plate outline with one slot choice (or none).</summary>
public static class PlateGeometryFactory
{
    /// <summary>The part's geometry with one slot choice: a disc (its bore, radial slots) or an outline with slots cut from an edge.</summary>
    /// <exception cref="InputException">The pattern does not fit the outline (the message says why).</exception>
    public static (PlateGeometry Geometry, SlotPattern? Pattern) Build(PlatePart part, SlotChoice? slots)
    {
        if (part.Disc is not { } disc) return Build(part.Outline, slots);
        var geometry = disc.Geometry();
        if (slots is null) return (geometry, null);
        var pattern = disc.Cut(slots.Radial ?? throw new InputException($"part {part.Name}: a disc takes radial slots only"), slots.WidthM);
        geometry.AddPattern(pattern);
        return (geometry, pattern);
    }

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
