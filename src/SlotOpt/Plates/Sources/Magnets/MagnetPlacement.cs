using SlotOpt.Plates.Geometry;

namespace SlotOpt.Plates.Sources.Magnets;

/// <summary>One magnet over the plate: its centre in the plate's plane (metres) and its polarity (+1 as built, -1 turned over).</summary>
public sealed record MagnetPlacement
{
    public MagnetPlacement(IPermanentMagnet magnet, Vec2 centre, int polarity)
    {
        if (polarity is not (1 or -1)) throw new InputException($"a magnet's polarity is +1 or -1 (got {polarity})");
        if (!double.IsFinite(centre.X) || !double.IsFinite(centre.Y)) throw new InputException("a magnet's position is not finite");
        Magnet = magnet;
        Centre = centre;
        Polarity = polarity;
    }

    public IPermanentMagnet Magnet { get; }
    public Vec2 Centre { get; }
    public int Polarity { get; }
    public double Sign => Polarity;
}
