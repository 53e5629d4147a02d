namespace SlotOpt.Plates.Geometry;

/// <summary>
/// The widths of a plate geometry the grid must resolve: the outline's smaller side, each slot pattern's
/// strip and ligament, each cut-out's width, and the conducting ligaments between cut-outs, cuts,
/// slots and the outline (the shortest distance between their boundaries, zero where they touch).
/// </summary>
public static class GeometryFeatures
{
    /// <summary>
    /// Boundaries closer than this fraction of the plate's larger side count as touching (a cut-out from the edge,
    /// a circle tangent to it): the slivers beside a touching point carry no current loop worth resolving. Common practice, no source.
    /// </summary>
    public const double TouchingFraction = 1e-3;

    public static IReadOnlyList<GridFeature> Of(PlateGeometry geometry)
    {
        var features = new List<GridFeature>();
        var (a, b) = geometry.Bounds;
        features.Add(new GridFeature(GridFeatureKind.ConductingStrip, "the plate's smaller side", Math.Min(b.X - a.X, b.Y - a.Y)));
        for (int k = 0; k < geometry.Patterns.Count; k++)
        {
            var p = geometry.Patterns[k];
            string which = geometry.Patterns.Count == 1 ? "the slot pattern" : $"slot pattern {k + 1}";
            features.Add(new GridFeature(GridFeatureKind.ConductingStrip, $"the strip between slots of {which}", p.StripWidthM));
            features.Add(new GridFeature(GridFeatureKind.ConductingStrip, $"the ligament beyond the slots of {which}", p.LigamentM));
        }
        var outline = Chain(geometry.Outline.Vertices, closed: true);
        var removed = new List<(string Name, Vec2[] Chain, bool Closed)>();
        for (int k = 0; k < geometry.Cutouts.Count; k++)
        {
            var hole = geometry.Cutouts[k];
            string name = $"cut-out {k + 1}";
            features.Add(new GridFeature(GridFeatureKind.Cutout, name, Width(hole)));
            removed.Add((name, Chain(hole.Vertices, closed: true), true));
        }
        for (int k = 0; k < geometry.Cuts.Count; k++)
            removed.Add(($"cut {k + 1}", new[] { geometry.Cuts[k].Start, geometry.Cuts[k].End }, false));
        int explicitCount = removed.Count;
        if (explicitCount == 0) return features;
        for (int k = 0; k < geometry.Slots.Count; k++)
            removed.Add(($"slot {k + 1}", Chain(geometry.Slots[k].ToPolygon().Vertices, closed: true), true));
        double touching = TouchingFraction * Math.Max(b.X - a.X, b.Y - a.Y);
        for (int i = 0; i < explicitCount; i++)
        {
            double edge = Distance(removed[i].Chain, outline);
            if (edge <= touching) edge = InteriorVertexDistance(removed[i].Chain, outline, touching);   // from the edge it touches to the far side
            if (edge > touching && edge < double.MaxValue) features.Add(new GridFeature(GridFeatureKind.ConductingStrip, $"the ligament between {removed[i].Name} and the plate's edge", edge));
            double gap = double.MaxValue;
            string nearest = "";
            for (int j = 0; j < removed.Count; j++)
            {
                if (j == i) continue;
                double d = Distance(removed[i].Chain, removed[j].Chain);
                if (d > touching && d < gap) { gap = d; nearest = removed[j].Name; }
            }
            if (gap < double.MaxValue) features.Add(new GridFeature(GridFeatureKind.ConductingStrip, $"the ligament between {removed[i].Name} and {nearest}", gap));
        }
        return features;
    }

    /// <summary>
    /// A width no larger than the polygon's narrowest: 2 A / P, the width of a long strip, half the side of a
    /// square, the radius of a circle (for a convex shape A &lt;= w D and P &gt;= 2 D, D its diameter, so 2 A / P &lt;= w).
    /// </summary>
    public static double Width(Polygon polygon)
    {
        double perimeter = 0;
        var v = polygon.Vertices;
        for (int i = 0, j = v.Count - 1; i < v.Count; j = i++) perimeter += (v[i] - v[j]).Length;
        return 2 * polygon.Area / perimeter;
    }

    /// <summary>Shortest distance to the outline from the vertices that do not touch it (a cut-out from the edge: its ligament to the far side).</summary>
    private static double InteriorVertexDistance(Vec2[] chain, Vec2[] outline, double touching)
    {
        double best = double.MaxValue;
        foreach (var p in chain)
        {
            double d = double.MaxValue;
            for (int k = 0; k + 1 < outline.Length; k++) d = Math.Min(d, PointToSegment(p, outline[k], outline[k + 1]));
            if (d > touching) best = Math.Min(best, d);
        }
        return best;
    }

    private static Vec2[] Chain(IReadOnlyList<Vec2> vertices, bool closed) =>
        closed ? vertices.Append(vertices[0]).ToArray() : vertices.ToArray();

    /// <summary>Shortest distance between two polylines (zero where they cross), their bounding boxes first.</summary>
    private static double Distance(Vec2[] p, Vec2[] q)
    {
        double best = double.MaxValue;
        for (int i = 0; i + 1 < p.Length; i++)
            for (int j = 0; j + 1 < q.Length; j++)
            {
                if (BoxGap(p[i], p[i + 1], q[j], q[j + 1]) >= best) continue;
                best = Math.Min(best, SegmentDistance(p[i], p[i + 1], q[j], q[j + 1]));
                if (best == 0) return 0;
            }
        return best;
    }

    private static double BoxGap(Vec2 a0, Vec2 a1, Vec2 b0, Vec2 b1)
    {
        double dx = Math.Max(0, Math.Max(Math.Min(a0.X, a1.X) - Math.Max(b0.X, b1.X), Math.Min(b0.X, b1.X) - Math.Max(a0.X, a1.X)));
        double dy = Math.Max(0, Math.Max(Math.Min(a0.Y, a1.Y) - Math.Max(b0.Y, b1.Y), Math.Min(b0.Y, b1.Y) - Math.Max(a0.Y, a1.Y)));
        return Math.Sqrt(dx * dx + dy * dy);
    }

    private static double SegmentDistance(Vec2 a0, Vec2 a1, Vec2 b0, Vec2 b1)
    {
        if (Crosses(a0, a1, b0, b1)) return 0;
        return Math.Min(Math.Min(PointToSegment(a0, b0, b1), PointToSegment(a1, b0, b1)), Math.Min(PointToSegment(b0, a0, a1), PointToSegment(b1, a0, a1)));
    }

    private static double Cross(Vec2 o, Vec2 a, Vec2 b) => (a.X - o.X) * (b.Y - o.Y) - (a.Y - o.Y) * (b.X - o.X);

    private static bool Crosses(Vec2 a0, Vec2 a1, Vec2 b0, Vec2 b1)
    {
        double d1 = Cross(b0, b1, a0), d2 = Cross(b0, b1, a1), d3 = Cross(a0, a1, b0), d4 = Cross(a0, a1, b1);
        return ((d1 > 0 && d2 < 0) || (d1 < 0 && d2 > 0)) && ((d3 > 0 && d4 < 0) || (d3 < 0 && d4 > 0));
    }

    private static double PointToSegment(Vec2 p, Vec2 s0, Vec2 s1)
    {
        var d = s1 - s0;
        double len2 = d.X * d.X + d.Y * d.Y;
        double t = len2 > 0 ? Math.Clamp(((p.X - s0.X) * d.X + (p.Y - s0.Y) * d.Y) / len2, 0, 1) : 0;
        return (p - (s0 + t * d)).Length;
    }
}
