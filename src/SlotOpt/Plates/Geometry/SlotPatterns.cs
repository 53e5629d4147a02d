namespace SlotOpt.Plates.Geometry;

/// <summary>
/// Generators for the usual slot patterns, placed on the bounding box of the plate outline.
/// Positions run along the edge from its low-coordinate end (left for Bottom/Top, bottom for
/// Left/Right). offsetM is the centre of the first slot from that end; null centres the pattern.
/// </summary>
public static class SlotPatterns
{
    /// <summary>Slots from one edge: pitch, depth into the plate, width.</summary>
    public static SlotPattern Comb(Polygon outline, PlateEdge edge, double pitchM, double depthM, double widthM, double? offsetM = null)
    {
        var box = Box.Of(outline);
        Check(box, edge, pitchM, depthM, widthM);
        var slots = Positions(box.Along(edge), pitchM, widthM, offsetM).Select(s => box.SlotFrom(edge, s, depthM, widthM)).ToList();
        return new SlotPattern(slots, Array.Empty<Groove>(), pitchM, pitchM - widthM, box.Across(edge) - depthM);
    }

    /// <summary>Slots from an edge and the opposite edge in turn (first from <paramref name="edge"/>), one pitch apart.</summary>
    public static SlotPattern Alternating(Polygon outline, PlateEdge edge, double pitchM, double depthM, double widthM, double? offsetM = null)
    {
        var box = Box.Of(outline);
        Check(box, edge, pitchM, depthM, widthM);
        var opposite = edge switch { PlateEdge.Bottom => PlateEdge.Top, PlateEdge.Top => PlateEdge.Bottom, PlateEdge.Left => PlateEdge.Right, _ => PlateEdge.Left };
        var slots = Positions(box.Along(edge), pitchM, widthM, offsetM)
            .Select((s, k) => box.SlotFrom(k % 2 == 0 ? edge : opposite, s, depthM, widthM)).ToList();
        // the current meanders between neighbours one pitch apart; beyond each slot end a ligament of (across - depth)
        return new SlotPattern(slots, Array.Empty<Groove>(), pitchM, pitchM - widthM, box.Across(edge) - depthM);
    }

    /// <summary>
    /// Enclosed slits crossing the plate from <paramref name="edge"/>'s direction, centred on the
    /// plate's mid-line, of the given length, not touching either edge.
    /// </summary>
    public static SlotPattern EnclosedSlits(Polygon outline, PlateEdge edge, double pitchM, double lengthM, double widthM, double? offsetM = null)
    {
        var box = Box.Of(outline);
        Check(box, edge, pitchM, lengthM, widthM);
        double across = box.Across(edge);
        if (lengthM >= across) throw new InputException($"an enclosed slit ({lengthM} m) must be shorter than the plate across it ({across} m)");
        double start = (across - lengthM) / 2;
        var slots = Positions(box.Along(edge), pitchM, widthM, offsetM).Select(s => box.SlotInside(edge, s, start, start + lengthM, widthM)).ToList();
        return new SlotPattern(slots, Array.Empty<Groove>(), pitchM, pitchM - widthM, start);
    }

    /// <summary>Grooves from one edge that leave remainingThicknessFraction of the thickness under them.</summary>
    public static SlotPattern GrooveComb(Polygon outline, PlateEdge edge, double pitchM, double depthM, double widthM, double remainingThicknessFraction, double? offsetM = null)
    {
        var box = Box.Of(outline);
        Check(box, edge, pitchM, depthM, widthM);
        if (!(remainingThicknessFraction > 0 && remainingThicknessFraction < 1))
            throw new InputException($"a groove's remaining thickness fraction must lie between 0 and 1 (got {remainingThicknessFraction})");
        var grooves = Positions(box.Along(edge), pitchM, widthM, offsetM)
            .Select(s => new Groove(box.SlotFrom(edge, s, depthM, widthM).ToPolygon(), remainingThicknessFraction)).ToList();
        return new SlotPattern(Array.Empty<Slot>(), grooves, pitchM, pitchM - widthM, box.Across(edge) - depthM);
    }

    private static void Check(Box box, PlateEdge edge, double pitchM, double depthM, double widthM)
    {
        if (!(pitchM > 0) || !(depthM > 0) || !(widthM > 0))
            throw new InputException($"slot pitch, depth and width must be positive (got {pitchM}, {depthM}, {widthM} m)");
        if (widthM >= pitchM) throw new InputException($"slot width {widthM} m is not smaller than the pitch {pitchM} m: nothing would be left between slots");
        if (widthM >= box.Along(edge)) throw new InputException($"slot width {widthM} m is wider than the plate edge ({box.Along(edge)} m)");
        if (depthM >= box.Across(edge)) throw new InputException($"slot depth {depthM} m cuts right through the plate ({box.Across(edge)} m across)");
    }

    /// <summary>Slot centres along an edge of length L: offset + k pitch, each slot wholly on the edge.</summary>
    private static IEnumerable<double> Positions(double lengthM, double pitchM, double widthM, double? offsetM)
    {
        double first = offsetM ?? CentredFirst(lengthM, pitchM, widthM);
        if (first - widthM / 2 < 0 || first + widthM / 2 > lengthM)
            throw new InputException($"the first slot (centre {first} m, width {widthM} m) does not lie on the edge of {lengthM} m");
        for (double s = first; s + widthM / 2 <= lengthM + 1e-12 * lengthM; s += pitchM) yield return s;
    }

    /// <summary>Centre the pattern: as many slots as fit with at least half a pitch of plate beyond the outer ones.</summary>
    private static double CentredFirst(double lengthM, double pitchM, double widthM)
    {
        int count = Math.Max(1, (int)Math.Floor(lengthM / pitchM));
        return (lengthM - (count - 1) * pitchM) / 2;
    }

    private readonly record struct Box(double X0, double Y0, double X1, double Y1)
    {
        public static Box Of(Polygon p) { var (a, b) = p.Bounds; return new Box(a.X, a.Y, b.X, b.Y); }

        public double Along(PlateEdge e) => e is PlateEdge.Bottom or PlateEdge.Top ? X1 - X0 : Y1 - Y0;
        public double Across(PlateEdge e) => e is PlateEdge.Bottom or PlateEdge.Top ? Y1 - Y0 : X1 - X0;

        /// <summary>A slot entering from the edge at position s; it starts a little outside so it opens the edge cleanly.</summary>
        public Slot SlotFrom(PlateEdge e, double s, double depthM, double widthM)
        {
            double outside = 0.01 * Across(e);
            return e switch
            {
                PlateEdge.Bottom => new Slot(new Vec2(X0 + s, Y0 - outside), new Vec2(X0 + s, Y0 + depthM), widthM),
                PlateEdge.Top => new Slot(new Vec2(X0 + s, Y1 + outside), new Vec2(X0 + s, Y1 - depthM), widthM),
                PlateEdge.Left => new Slot(new Vec2(X0 - outside, Y0 + s), new Vec2(X0 + depthM, Y0 + s), widthM),
                _ => new Slot(new Vec2(X1 + outside, Y0 + s), new Vec2(X1 - depthM, Y0 + s), widthM),
            };
        }

        public Slot SlotInside(PlateEdge e, double s, double from, double to, double widthM) => e switch
        {
            PlateEdge.Bottom or PlateEdge.Top => new Slot(new Vec2(X0 + s, Y0 + from), new Vec2(X0 + s, Y0 + to), widthM),
            _ => new Slot(new Vec2(X0 + from, Y0 + s), new Vec2(X0 + to, Y0 + s), widthM),
        };
    }
}
