using SlotOpt.Plates.Geometry;

namespace SlotOpt.Plates.Sources.Magnets;

/// <summary>One magnet over the plate: its centre in the plate's plane (metres) and its polarity (+1 as built, -1 turned over).</summary>
public sealed record MagnetPlacement(IPermanentMagnet Magnet, Vec2 Centre, int Polarity)
{
    public double Sign => Polarity >= 0 ? 1 : -1;
}
