namespace SlotOpt.Plates.Geometry;

/// <summary>
/// A straight through-slot of a given width around its centre line (metres). Its area is removed
/// from the cells it covers; when it is narrower than two cells its centre line is also merged as a
/// zero-width cut (see <see cref="CutLine"/>, <see cref="NodeRegions"/>), so a slot narrower than a
/// cell still breaks the current path instead of leaving partly filled cells that would bridge it.
/// </summary>
public sealed record Slot(Vec2 Start, Vec2 End, double WidthM)
{
    public Polygon ToPolygon()
    {
        var d = End - Start;
        double len = d.Length;
        if (!(len > 0)) throw new InputException("a slot needs a positive length");
        if (!(WidthM > 0)) throw new InputException($"a slot needs a positive width (got {WidthM} m)");
        var n = new Vec2(-d.Y / len * WidthM / 2, d.X / len * WidthM / 2);
        return new Polygon(new[] { Start - n, End - n, End + n, Start + n });
    }

    public CutLine CentreLine => new(Start, End);
}
