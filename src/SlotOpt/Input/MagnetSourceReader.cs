using System.Globalization;
using SlotOpt.Input.Toml;
using SlotOpt.Plates.Geometry;
using SlotOpt.Plates.Sources.Magnets;
using SlotOpt.Plates.Sources.Rotation;
using SlotOpt.Runs;

namespace SlotOpt.Input;

/// <summary>
/// The magnet keys of a [source] kind = "magnets" table, shared by its motions: the magnet (shape = "cuboid" with length along the
/// path and width across | "cylinder" with diameter; height, magnetised along it, normal to the plate; remanence), a row along x
/// (x, y of the first centre, default the row centred on the plate; count; pitch centre to centre; polarity = "alternating" | "same"),
/// and, for plate files, motion = "rotation" (a ring at radius over a disc, rotation_speed in rpm; count magnets, pitch the arc
/// length between centres, default evenly round; positions: disc angles over one slot pitch) or "approach" (the row moving straight
/// toward the plate at speed; gap, or gaps = [...] for the force against the gap).
/// </summary>
public static class MagnetSourceReader
{
    /// <summary>Sintered NdFeB, the strongest permanent-magnet material, reaches about 1.5 T (common practice, no source): more is a mistake.</summary>
    private const double LargestRemanenceT = 1.6;

    public static IPermanentMagnet? Magnet(TomlSection s)
    {
        var shape = s.OptionalChoice("shape", ["cuboid", "cylinder"]);
        if (shape is null && !s.Has("shape")) s.Error("shape", "missing: \"cuboid\" or \"cylinder\"");
        var height = s.PositiveQuantity("height", QuantityKind.Length, required: true);
        var remanence = s.PositiveQuantity("remanence", QuantityKind.FluxDensity, required: true);
        if (remanence > LargestRemanenceT)
            s.Error("remanence", string.Create(CultureInfo.InvariantCulture, $"{remanence:0.###} T is beyond any permanent-magnet material (sintered NdFeB reaches about 1.5 T)"));
        double? length = null, width = null, diameter = null;
        if (shape == "cuboid")
        {
            length = s.PositiveQuantity("length", QuantityKind.Length, required: true);
            width = s.PositiveQuantity("width", QuantityKind.Length, required: true);
        }
        else if (shape == "cylinder") diameter = s.PositiveQuantity("diameter", QuantityKind.Length, required: true);
        if (height is null || remanence is null || remanence > LargestRemanenceT) return null;
        return shape switch
        {
            "cuboid" when length is { } l && width is { } w => s.Guard<IPermanentMagnet>("length", () => new CuboidMagnet(l, w, height.Value, remanence.Value)),
            "cylinder" when diameter is { } d => s.Guard<IPermanentMagnet>("diameter", () => new CylinderMagnet(d, height.Value, remanence.Value)),
            _ => null,
        };
    }

    /// <summary>The row of magnets along x over the plate (count, pitch, polarity, x, y); null after an error.</summary>
    public static MagnetArray? Row(TomlSection s, IPermanentMagnet? magnet, double? gapM, Polygon? outline)
    {
        var count = (int)(s.OptionalInteger("count", 1, 1000) ?? 1);
        var pitch = s.PositiveQuantity("pitch", QuantityKind.Length, required: count > 1);
        var polarity = Polarity(s);
        var x = s.OptionalQuantity("x", QuantityKind.Length);
        var y = s.OptionalQuantity("y", QuantityKind.Length);
        if (magnet is null || gapM is null || outline is null || (count > 1 && pitch is null)) return null;
        if (count > 1 && pitch < 2 * magnet.HalfLengthXM)
        {
            s.Error("pitch", string.Create(CultureInfo.InvariantCulture, $"is smaller than the magnet ({2 * magnet.HalfLengthXM * 1e3:0.###} mm along the travel): neighbouring magnets would overlap"));
            return null;
        }
        var (min, max) = outline.Bounds;
        var rowLength = (count - 1) * (pitch ?? 0);
        var first = new Vec2(x ?? (min.X + max.X) / 2 - rowLength / 2, y ?? (min.Y + max.Y) / 2);
        if (first.Y - magnet.HalfWidthYM > max.Y || first.Y + magnet.HalfWidthYM < min.Y)
        {
            s.Error("y", "puts the magnets' path entirely off the plate");
            return null;
        }
        return s.Guard("count", () => MagnetArray.Row(magnet, first, count, pitch ?? 0, polarity, gapM.Value));
    }

    private static MagnetPolarity Polarity(TomlSection s) =>
        s.OptionalChoice("polarity", ["alternating", "same"]) == "same" ? MagnetPolarity.Same : MagnetPolarity.Alternating;

    /// <summary>The motion a plate file's magnets make: "linear" (null here: the caller reads the sliding source), "rotation" or "approach".</summary>
    public static string Motion(TomlSection s) => s.OptionalChoice("motion", ["linear", "rotation", "approach"]) ?? "linear";

    /// <summary>
    /// A ring of magnets over a turning disc (motion = "rotation"): radius of their centres, rotation_speed (rpm, a number), count,
    /// pitch (arc length between centres at the radius, default evenly round), polarity, gap; positions = disc angles spread over
    /// anglePeriodRad (one slot pitch of a slotted disc; a solid disc needs one).
    /// </summary>
    public static DiscRotation? Rotation(TomlSection s, Vec2? axis, double? discRadiusM, double? anglePeriodRad)
    {
        if (axis is null) s.Error("motion", "\"rotation\" needs a disc: [plate] shape = \"disc\" with its diameter");
        var magnet = Magnet(s);
        var gap = s.PositiveQuantity("gap", QuantityKind.Length, required: true);
        var radius = s.PositiveQuantity("radius", QuantityKind.Length, required: true);
        var rpm = s.OptionalNumber("rotation_speed");
        if (rpm is null && !s.Has("rotation_speed")) s.Error("rotation_speed", "missing: the disc's speed in revolutions per minute (a number)");
        else if (rpm is not null && !(rpm > 0 && rpm <= 1e6)) s.Error("rotation_speed", "must be a positive number of revolutions per minute, at most 1e6");
        var count = (int)(s.OptionalInteger("count", 1, 1000) ?? 1);
        var pitch = s.PositiveQuantity("pitch", QuantityKind.Length, required: false);
        var polarity = Polarity(s);
        var positions = (int)(s.OptionalInteger("positions", 1, 10_000) ?? DiscAngles.DefaultPositions(anglePeriodRad));
        if (radius is { } r && discRadiusM is { } a && r >= a) s.Error("radius", string.Create(CultureInfo.InvariantCulture, $"puts the magnets' centres ({r * 1e3:0.###} mm) beyond the disc's rim ({a * 1e3:0.###} mm)"));
        if (magnet is null || gap is null || radius is null || rpm is not (> 0 and <= 1e6) || axis is null || discRadiusM is null || radius >= discRadiusM) return null;
        double pitchRad = pitch is { } p ? p / radius.Value : 2 * Math.PI / count;
        double omega = RotationalSpeed.RadPerSFromRpm(rpm.Value);
        var ring = s.Guard<RotatingSource>(pitch is null ? "count" : "pitch", () => new RotatingMagnets(magnet, radius.Value, count, pitchRad, polarity, gap.Value, axis.Value, omega));
        if (ring is null) return null;
        var angles = DiscAngles.Spread(anglePeriodRad, positions);
        var over = anglePeriodRad is null ? (positions == 1 ? "one angle" : $"{positions} angles round the disc")
            : string.Create(CultureInfo.InvariantCulture, $"one slot pitch ({anglePeriodRad.Value * 180 / Math.PI:0.##} deg, {positions} angles)");
        return new DiscRotation(ring, angles, over);
    }

    /// <summary>The row moving straight toward the plate (motion = "approach"): speed, and gap or gaps = [...] (the force against the gap).</summary>
    public static MagnetApproach? Approach(TomlSection s, Polygon? outline)
    {
        var magnet = Magnet(s);
        var speed = s.PositiveQuantity("speed", QuantityKind.Speed, required: true);
        IReadOnlyList<double>? gaps = null;
        if (s.Has("gap") && s.Has("gaps")) s.Error("gaps", "give either gap or gaps, not both");
        else if (s.Has("gaps"))
        {
            gaps = s.QuantityList("gaps", QuantityKind.Length, required: true);
            if (gaps is not null && gaps.Any(g => !(g > 0))) { s.Error("gaps", "every gap must be positive"); gaps = null; }
            else if (gaps is { Count: 0 }) { s.Error("gaps", "needs at least one gap"); gaps = null; }
        }
        else if (s.PositiveQuantity("gap", QuantityKind.Length, required: true) is { } one) gaps = [one];
        var array = Row(s, magnet, gaps?[0], outline);
        if (array is null || speed is null || gaps is null) return null;
        return new MagnetApproach(array, speed.Value, gaps);
    }
}
