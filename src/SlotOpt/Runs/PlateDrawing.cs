using SlotOpt.Plates.Geometry;

namespace SlotOpt.Runs;

/// <summary>The lines a plot draws of a plate geometry (metres): the outline, each through slot and cut-out (a bore, a hole: Slots), and each groove, as closed point lists.</summary>
public sealed record PlateDrawing(IReadOnlyList<Vec2> Outline, IReadOnlyList<IReadOnlyList<Vec2>> Slots, IReadOnlyList<IReadOnlyList<Vec2>> Grooves)
{
    public static PlateDrawing Of(PlateGeometry geometry) => new(
        geometry.Outline.Vertices.ToList(),
        geometry.Slots.Select(s => (IReadOnlyList<Vec2>)s.ToPolygon().Vertices.ToList()).Concat(geometry.Cutouts.Select(c => (IReadOnlyList<Vec2>)c.Vertices.ToList())).ToList(),
        geometry.Grooves.Select(g => (IReadOnlyList<Vec2>)g.Area.Vertices.ToList()).ToList());
}
