using SlotOpt.Plates.Geometry;

namespace SlotOpt.Design.SolidParts;

/// <summary>
/// A flat disc (a plate of shape "disc" in plate and problem files): its centre in the plate's plane, rim radius and bore radius
/// (0: no bore). Centred at (d/2, d/2) so that it lies in the first quadrant as a rectangle from the origin would.
/// </summary>
public sealed record DiscShape(Vec2 Centre, double RadiusM, double BoreRadiusM)
{
    /// <summary>The disc of a file: diameter and optional bore diameter, centred at (d/2, d/2).</summary>
    public static DiscShape FromDiameters(double diameterM, double? boreM) => new(new Vec2(diameterM / 2, diameterM / 2), diameterM / 2, (boreM ?? 0) / 2);

    public Polygon Outline => Polygon.Circle(Centre, RadiusM);

    /// <summary>The disc's solver geometry: the rim, less the bore when it has one.</summary>
    public PlateGeometry Geometry()
    {
        var geometry = new PlateGeometry(Outline);
        if (BoreRadiusM > 0) geometry.AddCutout(Polygon.Circle(Centre, BoreRadiusM));
        return geometry;
    }

    /// <summary>
    /// Count radial slots of a width evenly round the disc, from the inner radius to the outer (null: through the rim, past it by a slot
    /// width, an open slot), the first along +x: they cut the current loops a ring of magnets drives round the disc. The pitch is the arc
    /// between slot centres at the inner radius, the strip what is left of it; the ligament the uncut ring inside (and outside) the slots.
    /// The caller has checked that the slots fit (<see cref="RadialSlots"/>).
    /// </summary>
    public SlotPattern Cut(RadialSlots ring, double widthM)
    {
        double outer = ring.ToM ?? RadiusM + widthM;
        var slots = Enumerable.Range(0, ring.Count).Select(k =>
        {
            double a = 2 * Math.PI * k / ring.Count;
            var u = new Vec2(Math.Cos(a), Math.Sin(a));
            return new Slot(Centre + ring.FromM * u, Centre + outer * u, widthM);
        }).ToList();
        double pitchAtInner = 2 * Math.PI * ring.FromM / ring.Count;
        double ligament = ring.ToM is null ? ring.FromM - BoreRadiusM : Math.Min(ring.FromM - BoreRadiusM, RadiusM - outer);
        if (ring.ToM is { } o && o >= RadiusM) ligament = ring.FromM - BoreRadiusM;
        return new SlotPattern(slots, [], pitchAtInner, pitchAtInner - widthM, ligament);
    }
}

/// <summary>Radial slots on a disc: how many, from which radius, to which (null: through the rim). Their width is the slot choice's.</summary>
public sealed record RadialSlots(int Count, double FromM, double? ToM)
{
    /// <summary>The angle over which a slotted disc's torque repeats (radians).</summary>
    public double PitchRad => 2 * Math.PI / Count;
}
