namespace SlotOpt.Plates.Geometry;

/// <summary>
/// The plate as the solver sees it, all in metres: an outline, through cut-outs (holes, slots),
/// zero-width cuts, grooves (reduced thickness), zones of other conductivity and an optional
/// conductivity factor map (say, from a temperature map). Everything is relative to one reference
/// sheet conductance, so one solve serves every thickness and material (see <see cref="UnitConductanceSolution"/>).
/// </summary>
public sealed class PlateGeometry
{
    private readonly List<Polygon> _cutouts = new();
    private readonly List<Slot> _slots = new();
    private readonly List<CutLine> _cuts = new();
    private readonly List<Groove> _grooves = new();
    private readonly List<ConductivityZone> _zones = new();
    private readonly List<SlotPattern> _patterns = new();

    public PlateGeometry(Polygon outline) => Outline = outline;

    /// <summary>A b x a rectangle with its lower-left corner at the origin.</summary>
    public static PlateGeometry Rectangle(double widthM, double heightM)
    {
        if (!(widthM > 0) || !(heightM > 0)) throw new InputException($"the plate needs a positive width and height (got {widthM} m x {heightM} m)");
        return new PlateGeometry(Polygon.Rectangle(0, 0, widthM, heightM));
    }

    public Polygon Outline { get; }
    public IReadOnlyList<Polygon> Cutouts => _cutouts;
    public IReadOnlyList<Slot> Slots => _slots;
    public IReadOnlyList<CutLine> Cuts => _cuts;
    public IReadOnlyList<Groove> Grooves => _grooves;
    public IReadOnlyList<ConductivityZone> Zones => _zones;
    public IReadOnlyList<SlotPattern> Patterns => _patterns;

    /// <summary>Conductivity relative to the reference at a point (1 when null), evaluated at cell centres.</summary>
    public Func<Vec2, double>? ConductivityFactorAt { get; set; }

    public PlateGeometry AddCutout(Polygon hole) { _cutouts.Add(hole); return this; }
    public PlateGeometry AddCut(CutLine cut) { _cuts.Add(cut); return this; }
    public PlateGeometry AddZone(ConductivityZone zone)
    {
        if (!(zone.Factor >= 0) || !double.IsFinite(zone.Factor)) throw new InputException($"a conductivity factor must be a finite number >= 0 (got {zone.Factor})");
        _zones.Add(zone);
        return this;
    }

    public PlateGeometry AddPattern(SlotPattern pattern)
    {
        _patterns.Add(pattern);
        _slots.AddRange(pattern.Slots);
        _grooves.AddRange(pattern.Grooves);
        return this;
    }

    /// <summary>
    /// A copy with every feature of this plate whose conductivity factor is this plate's times factorAt
    /// (say, from a temperature map); this plate is left as it is.
    /// </summary>
    public PlateGeometry WithConductivityFactor(Func<Vec2, double> factorAt)
    {
        var copy = new PlateGeometry(Outline);
        copy._cutouts.AddRange(_cutouts);
        copy._cuts.AddRange(_cuts);
        copy._zones.AddRange(_zones);
        copy._patterns.AddRange(_patterns);
        copy._slots.AddRange(_slots);
        copy._grooves.AddRange(_grooves);
        var own = ConductivityFactorAt;
        copy.ConductivityFactorAt = own is null ? factorAt : p => own(p) * factorAt(p);
        return copy;
    }

    public (Vec2 Min, Vec2 Max) Bounds => Outline.Bounds;

    /// <summary>
    /// Width L of the widest current loop, for the AC magnetic Reynolds number mu0 sigma t omega L / 2:
    /// the outline's smaller side, or, when slot patterns are present, the widest strip they leave
    /// (the slots break the larger loops). An estimate for the validity warning, not for the loss.
    /// </summary>
    public double CharacteristicWidthM
    {
        get
        {
            var (a, b) = Bounds;
            double w = Math.Min(b.X - a.X, b.Y - a.Y);
            var through = _patterns.Where(p => p.Slots.Count > 0).ToList();
            return through.Count == 0 ? w : Math.Min(w, through.Max(p => p.StripWidthM));
        }
    }
}
