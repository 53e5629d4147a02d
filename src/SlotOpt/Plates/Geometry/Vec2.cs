namespace SlotOpt.Plates.Geometry;

/// <summary>A point or vector in the plate plane, metres.</summary>
public readonly record struct Vec2(double X, double Y)
{
    public static Vec2 operator +(Vec2 a, Vec2 b) => new(a.X + b.X, a.Y + b.Y);
    public static Vec2 operator -(Vec2 a, Vec2 b) => new(a.X - b.X, a.Y - b.Y);
    public static Vec2 operator *(double s, Vec2 a) => new(s * a.X, s * a.Y);
    public double Length => Math.Sqrt(X * X + Y * Y);
}
