using SlotOpt.Design.SolidParts;
using SlotOpt.Input.Toml;

namespace SlotOpt.Input;

/// <summary>
/// The one reader of a disc and its radial slots, for both file kinds: [plate] of plate files and [[parts]] of problem files
/// (shape = "disc" with diameter and optional bore), [[slots]] of plate files and [[parts.slots]] of problem files with
/// pattern = "radial": count, width, from (inner radius), to (outer radius, default through the rim). A plate file gives one
/// value each; a problem file's family may list several of each (every combination is an option).
/// </summary>
public static class DiscReader
{
    /// <summary>What a radial slot table says, before it is checked against the disc.</summary>
    public sealed record RadialTable(IReadOnlyList<long> Counts, IReadOnlyList<double> WidthsM, IReadOnlyList<double> FromsM, IReadOnlyList<double>? TosM);

    /// <summary>One radial slot layout with its width.</summary>
    public sealed record RadialOption(RadialSlots Ring, double WidthM);

    /// <summary>The disc of a table with shape = "disc" (diameter, bore); null after an error (recorded on the section).</summary>
    public static DiscShape? Read(TomlSection t)
    {
        if (t.Has("outline") || t.Has("width") || t.Has("height")) t.Error("shape", "a disc is given by its diameter (and bore), not by outline, width or height");
        var diameter = t.PositiveQuantity("diameter", QuantityKind.Length, required: true);
        var bore = t.PositiveQuantity("bore", QuantityKind.Length, required: false);
        if (diameter is { } d && bore >= d) { t.Error("bore", "must be smaller than the diameter"); return null; }
        return diameter is { } dd ? DiscShape.FromDiameters(dd, bore) : null;
    }

    /// <summary>The keys of a radial slot table (the caller reads its own keys and rejects unknown ones, then calls <see cref="Check"/>); null after an error.</summary>
    /// <param name="shapeTable">Where the file says shape = "disc" ("[plate]", "the part"), for the error when it does not.</param>
    public static RadialTable? ReadKeys(TomlSection t, DiscShape? disc, bool oneValueEach, string shapeTable = "[plate]")
    {
        if (disc is null) t.Error("pattern", $"\"radial\" slots need a disc: {shapeTable} shape = \"disc\"");
        IReadOnlyList<long>? counts;
        IReadOnlyList<double>? widths, froms, tos;
        if (oneValueEach)
        {
            counts = t.OptionalInteger("count", 1, 720) is { } c ? [c] : null;
            if (counts is null && !t.Has("count")) t.Error("count", "missing: the number of radial slots");
            widths = t.PositiveQuantity("width", QuantityKind.Length, required: true) is { } w ? [w] : null;
            froms = t.PositiveQuantity("from", QuantityKind.Length, required: true) is { } f ? [f] : null;
            tos = t.PositiveQuantity("to", QuantityKind.Length, required: false) is { } o ? [o] : null;
        }
        else
        {
            counts = t.IntegerList("count", 1, 720, required: false);
            if (counts is null && !t.Has("count")) t.Error("count", "missing: the number of radial slots");
            widths = Positive(t, "width", t.QuantityList("width", QuantityKind.Length, required: true));
            froms = Positive(t, "from", t.QuantityList("from", QuantityKind.Length, required: true));
            tos = Positive(t, "to", t.QuantityList("to", QuantityKind.Length, required: false));
        }
        return counts is null || widths is null || froms is null ? null : new RadialTable(counts, widths, froms, tos);
    }

    /// <summary>
    /// Every layout of the table checked against the disc, in file order (count, then from, to, width); null at the first that does not fit
    /// (the error names the key): the slots must end outside their start, start inside the rim and outside the bore, and fit round the inner radius.
    /// </summary>
    public static IReadOnlyList<RadialOption>? Check(TomlSection t, DiscShape disc, RadialTable table)
    {
        var options = new List<RadialOption>();
        foreach (var count in table.Counts)
        foreach (var from in table.FromsM)
        foreach (var to in table.TosM?.Select(v => (double?)v) ?? [null])
        foreach (var width in table.WidthsM)
        {
            double outer = to ?? disc.RadiusM + width;                                      // through the rim: past it by a slot width
            if (!(outer > from)) { t.Error("to", "must be larger than from"); return null; }
            if (from >= disc.RadiusM) { t.Error("from", "starts the slots beyond the disc's rim"); return null; }
            if (count * width >= 2 * Math.PI * from) { t.Error("width", $"{count} slots of this width do not fit round the inner radius"); return null; }
            if (from <= disc.BoreRadiusM) { t.Error("from", "starts the slots inside the bore: leave a ligament between them"); return null; }
            options.Add(new RadialOption(new RadialSlots((int)count, from, to), width));
        }
        return options;
    }

    private static IReadOnlyList<double>? Positive(TomlSection t, string key, IReadOnlyList<double>? values)
    {
        if (values is not null && values.Any(v => !(v > 0))) { t.Error(key, "every value must be positive"); return null; }
        return values;
    }
}
