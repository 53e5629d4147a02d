namespace SlotOpt.Plates.Sources.Magnets;

/// <summary>A flux density in space (tesla): x along the travel, y across it in the plate's plane, z normal to the plate, away from it.</summary>
public readonly record struct FluxDensityVector(double X, double Y, double Z)
{
    public static FluxDensityVector operator +(FluxDensityVector a, FluxDensityVector b) => new(a.X + b.X, a.Y + b.Y, a.Z + b.Z);
    public static FluxDensityVector operator *(double s, FluxDensityVector a) => new(s * a.X, s * a.Y, s * a.Z);
    public double Magnitude => Math.Sqrt(X * X + Y * Y + Z * Z);
}
