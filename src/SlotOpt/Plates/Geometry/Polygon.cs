namespace SlotOpt.Plates.Geometry;

/// <summary>
/// A simple closed polygon in the plate plane (metres), stored counter-clockwise. Circles and
/// ellipses are inscribed polygons with enough sides that their area is within 1e-4 of the curve's.
/// </summary>
public sealed class Polygon
{
    public IReadOnlyList<Vec2> Vertices { get; }

    public Polygon(IEnumerable<Vec2> vertices)
    {
        var v = vertices.ToList();
        if (v.Count < 3) throw new InputException("a polygon needs at least 3 vertices");
        foreach (var p in v)
            if (!double.IsFinite(p.X) || !double.IsFinite(p.Y)) throw new InputException("a polygon vertex is not a finite number");
        if (SignedArea(v) < 0) v.Reverse();
        if (Math.Abs(SignedArea(v)) == 0) throw new InputException("a polygon has zero area");
        Vertices = v;
    }

    /// <summary>Area (m^2) by the shoelace formula.</summary>
    public double Area => SignedArea(Vertices);

    public (Vec2 Min, Vec2 Max) Bounds
    {
        get
        {
            double x0 = double.MaxValue, y0 = double.MaxValue, x1 = double.MinValue, y1 = double.MinValue;
            foreach (var p in Vertices) { x0 = Math.Min(x0, p.X); y0 = Math.Min(y0, p.Y); x1 = Math.Max(x1, p.X); y1 = Math.Max(y1, p.Y); }
            return (new Vec2(x0, y0), new Vec2(x1, y1));
        }
    }

    public static Polygon Rectangle(double x0, double y0, double x1, double y1)
    {
        if (!(x1 > x0) || !(y1 > y0)) throw new InputException($"a rectangle needs positive width and height (got {x1 - x0} m x {y1 - y0} m)");
        return new Polygon(new[] { new Vec2(x0, y0), new Vec2(x1, y0), new Vec2(x1, y1), new Vec2(x0, y1) });
    }

    /// <summary>Inscribed regular polygon; 512 sides put the area within 2.5e-5 of pi r^2 (area ratio = sin(2pi/n) n/(2pi)).</summary>
    public static Polygon Circle(Vec2 centre, double radiusM, int sides = 512) => Ellipse(centre, radiusM, radiusM, sides);

    public static Polygon Ellipse(Vec2 centre, double semiAxisXM, double semiAxisYM, int sides = 512)
    {
        if (!(semiAxisXM > 0) || !(semiAxisYM > 0)) throw new InputException("a circle or ellipse needs a positive radius");
        if (sides < 8) throw new InputException("a circle or ellipse needs at least 8 sides");
        return new Polygon(Enumerable.Range(0, sides).Select(k =>
        {
            double a = 2 * Math.PI * k / sides;
            return new Vec2(centre.X + semiAxisXM * Math.Cos(a), centre.Y + semiAxisYM * Math.Sin(a));
        }));
    }

    /// <summary>Equilateral triangle of side s with its base on y = y0 starting at x0.</summary>
    public static Polygon EquilateralTriangle(double x0, double y0, double sideM) =>
        new(new[] { new Vec2(x0, y0), new Vec2(x0 + sideM, y0), new Vec2(x0 + sideM / 2, y0 + sideM * Math.Sqrt(3) / 2) });

    private static double SignedArea(IReadOnlyList<Vec2> v)
    {
        double s = 0;
        for (int i = 0, j = v.Count - 1; i < v.Count; j = i++) s += (v[j].X - v[i].X) * (v[j].Y + v[i].Y);
        return s / 2;
    }
}
