using SlotOpt.Sheets;
using Tomlyn.Syntax;

namespace SlotOpt.Problems;

/// <summary>
/// Reads a plate file (TOML). Every error names file:line and key; unknown keys and tables are
/// errors; all errors are reported together. Schema (quantities as strings with units or plain SI):
/// <code>
/// [plate]      width, height (rectangle from the origin) | outline = [[x, y], ...];
///              thickness; resistivity | conductivity (S/m); relative_permeability (optional, skin depth only)
/// [grid]       cell (optional); min_cells_across_strip (optional, default 8)
/// [[cutout]]   shape = "rectangle" (x, y lower-left, width, height) | "circle" (x, y centre, radius) | "polygon" (points)
/// [[slots]]    pattern = "comb" | "alternating" | "enclosed" | "grooves"; edge = "bottom" | "top" | "left" | "right";
///              pitch, depth (length for "enclosed"), width, offset (optional), remaining_thickness (grooves, 0..1)
/// [[cut]]      from = [x, y], to = [x, y]   (zero-width kerf)
/// [source]     kind = "uniform_ac": peak, frequency, phase_deg (optional)
///              kind = "field_map": file (CSV x_m,y_m,amplitude_t,phase_deg, relative to the plate file), frequency
///              kind = "moving_poles": pole = "circle" (radius) | "rectangle" (pole_width, pole_height);
///              flux_density, speed, x, y (first pole centre at offset 0), count (default 1), pole_pitch (count > 1),
///              positions (default 8), average = "slot_pitch" (default with slots) | "pass"
/// </code>
/// </summary>
public static class PlateFileReader
{
    private static readonly string[] TopTables = { "plate", "grid", "source" };
    private static readonly string[] TableArrays = { "cutout", "slots", "cut" };

    public static PlateFile Read(string path)
    {
        if (!File.Exists(path)) throw new InputException($"{path}: file not found");
        return Parse(File.ReadAllText(path), path);
    }

    public static PlateFile Parse(string text, string path)
    {
        var doc = Tomlyn.Parsing.SyntaxParser.Parse(text, path);
        if (doc.HasErrors)
            throw new InputException(doc.Diagnostics.Select(d => $"{path}:{d.Span.Start.Line + 1}:{d.Span.Start.Column + 1}: {d.Message}"));
        var errors = new List<string>();
        foreach (var kv in doc.KeyValues)
            errors.Add($"{path}:{kv.Span.Start.Line + 1}: key '{kv.Key?.ToString().Trim()}': unknown top-level key; keys belong in [plate], [grid], [source], [[cutout]], [[slots]] or [[cut]]");
        var tables = new Dictionary<string, PlateFileTable>();
        var arrays = TableArrays.ToDictionary(n => n, _ => new List<PlateFileTable>());
        foreach (var t in doc.Tables)
        {
            string name = t.Name?.ToString().Trim() ?? "";
            int line = t.Span.Start.Line + 1;
            var table = new PlateFileTable(path, name, line, t.Items, errors);
            if (t is TableArraySyntax)
            {
                if (arrays.TryGetValue(name, out var list)) list.Add(table);
                else errors.Add($"{path}:{line}: [[{name}]]: unknown table array; expected one of: {string.Join(", ", TableArrays.Select(a => $"[[{a}]]"))}");
            }
            else if (!TopTables.Contains(name)) errors.Add($"{path}:{line}: [{name}]: unknown table; expected one of: {string.Join(", ", TopTables.Select(a => $"[{a}]"))}");
            else if (!tables.TryAdd(name, table)) errors.Add($"{path}:{line}: [{name}]: table given twice");
        }
        if (!tables.TryGetValue("plate", out var plate)) { errors.Add($"{path}:1: missing table [plate]"); throw new InputException(errors); }
        if (!tables.TryGetValue("source", out var source)) { errors.Add($"{path}:1: missing table [source]"); throw new InputException(errors); }

        var (geometry, conductor) = ReadPlate(plate, errors);
        var grid = tables.TryGetValue("grid", out var g) ? ReadGrid(g) : new GridOptions();
        if (geometry is not null)
        {
            foreach (var c in arrays["cutout"]) Guard(c, "shape", errors, () => ReadCutout(c, geometry));
            foreach (var s in arrays["slots"]) Guard(s, "pattern", errors, () => ReadSlots(s, geometry));
            foreach (var c in arrays["cut"]) Guard(c, "from", errors, () => ReadCut(c, geometry));
        }
        IAcFieldSource? ac = null;
        MovingPoles? moving = null;
        IReadOnlyList<double> offsets = Array.Empty<double>();
        string averagedOver = "";
        if (geometry is not null)
            Guard(source, "kind", errors, () => (ac, moving, offsets, averagedOver) = ReadSource(source, geometry, path, errors));
        if (errors.Count > 0 || geometry is null || conductor is null) throw new InputException(errors);
        return new PlateFile(path, geometry, grid, conductor, ac, moving, offsets, averagedOver);
    }

    /// <summary>Runs a reader step; an InputException from the engine's own checks is filed against the table's key.</summary>
    private static void Guard(PlateFileTable table, string key, List<string> errors, Action step)
    {
        try { step(); }
        catch (InputException e) { errors.Add($"{table.Where(key)}: {e.Message}"); }
    }

    private static (PlateGeometry?, Conductor?) ReadPlate(PlateFileTable t, List<string> errors)
    {
        PlateGeometry? geometry = null;
        if (t.Has("outline"))
        {
            var points = t.Points("outline", true);
            if (t.Has("width") || t.Has("height")) t.ErrorAt("outline", "give either outline or width and height, not both");
            if (points is not null)
            {
                try { geometry = new PlateGeometry(new Polygon(points.Select(p => new Vec2(p.X, p.Y)))); }
                catch (InputException e) { t.ErrorAt("outline", e.Message); }
            }
        }
        else
        {
            var w = t.Quantity("width", QuantityKind.Length, true);
            var h = t.Quantity("height", QuantityKind.Length, true);
            if (w is not null && h is not null)
            {
                if (!(w > 0)) t.ErrorAt("width", "must be positive");
                else if (!(h > 0)) t.ErrorAt("height", "must be positive");
                else geometry = PlateGeometry.Rectangle(w.Value, h.Value);
            }
        }
        var thickness = t.Quantity("thickness", QuantityKind.Length, true);
        double? sigma = null;
        if (t.Has("resistivity") && t.Has("conductivity")) t.ErrorAt("conductivity", "give either resistivity or conductivity, not both");
        else if (t.Has("resistivity"))
        {
            var rho = t.Quantity("resistivity", QuantityKind.Resistivity, true);
            if (rho is not null) { if (rho > 0) sigma = 1 / rho; else t.ErrorAt("resistivity", "must be positive"); }
        }
        else if (t.Has("conductivity"))
        {
            sigma = t.Number("conductivity", true, "conductivity in S/m, e.g. \"24.9e6\"");
            if (sigma is not null && !(sigma > 0)) { t.ErrorAt("conductivity", "must be positive"); sigma = null; }
        }
        else t.Missing("resistivity", "resistivity such as \"0.0401 uOhm m\", or conductivity in S/m");
        var mur = t.Number("relative_permeability", false, "relative permeability >= 1") ?? 1;
        t.ReportUnknownKeys(new[] { "width", "height", "outline", "thickness", "resistivity", "conductivity", "relative_permeability" });
        Conductor? conductor = null;
        if (thickness is not null && sigma is not null)
        {
            if (!(thickness > 0)) t.ErrorAt("thickness", $"must be positive (got {thickness} m)");
            else if (!(mur >= 1)) t.ErrorAt("relative_permeability", "must be >= 1");
            else conductor = new Conductor(sigma.Value, thickness.Value, mur);
        }
        return (geometry, conductor);
    }

    private static GridOptions ReadGrid(PlateFileTable t)
    {
        var cell = t.Quantity("cell", QuantityKind.Length, false);
        var min = t.Integer("min_cells_across_strip", false, "cells across the narrowest strip, at least 2");
        t.ReportUnknownKeys(new[] { "cell", "min_cells_across_strip" });
        if (cell is not null && !(cell > 0)) t.ErrorAt("cell", "must be a positive length");
        if (min is not null && min < 2) t.ErrorAt("min_cells_across_strip", "must be at least 2");
        return new GridOptions { CellSizeM = cell is > 0 ? cell : null, MinCellsAcrossNarrowestFeature = min is >= 2 ? min.Value : 8 };
    }

    private static void ReadCutout(PlateFileTable t, PlateGeometry geometry)
    {
        var shape = t.String("shape", true, "\"rectangle\", \"circle\" or \"polygon\"");
        switch (shape)
        {
            case "rectangle":
            {
                var x = t.Quantity("x", QuantityKind.Length, true); var y = t.Quantity("y", QuantityKind.Length, true);
                var w = t.Quantity("width", QuantityKind.Length, true); var h = t.Quantity("height", QuantityKind.Length, true);
                t.ReportUnknownKeys(new[] { "shape", "x", "y", "width", "height" });
                if (x is not null && y is not null && w is not null && h is not null)
                    geometry.AddCutout(Polygon.Rectangle(x.Value, y.Value, x.Value + w.Value, y.Value + h.Value));
                break;
            }
            case "circle":
            {
                var x = t.Quantity("x", QuantityKind.Length, true); var y = t.Quantity("y", QuantityKind.Length, true);
                var r = t.Quantity("radius", QuantityKind.Length, true);
                t.ReportUnknownKeys(new[] { "shape", "x", "y", "radius" });
                if (x is not null && y is not null && r is not null) geometry.AddCutout(Polygon.Circle(new Vec2(x.Value, y.Value), r.Value));
                break;
            }
            case "polygon":
            {
                var points = t.Points("points", true);
                t.ReportUnknownKeys(new[] { "shape", "points" });
                if (points is not null) geometry.AddCutout(new Polygon(points.Select(p => new Vec2(p.X, p.Y))));
                break;
            }
            case null: break;
            default: t.ErrorAt("shape", $"unknown shape \"{shape}\"; expected \"rectangle\", \"circle\" or \"polygon\""); break;
        }
    }

    private static void ReadSlots(PlateFileTable t, PlateGeometry geometry)
    {
        var pattern = t.String("pattern", true, "\"comb\", \"alternating\", \"enclosed\" or \"grooves\"");
        var edgeText = t.String("edge", true, "\"bottom\", \"top\", \"left\" or \"right\"");
        var pitch = t.Quantity("pitch", QuantityKind.Length, true);
        bool enclosed = pattern == "enclosed";
        var depth = t.Quantity(enclosed ? "length" : "depth", QuantityKind.Length, true);
        var width = t.Quantity("width", QuantityKind.Length, true);
        var offset = t.Quantity("offset", QuantityKind.Length, false);
        double? remaining = pattern == "grooves" ? t.Number("remaining_thickness", true, "remaining thickness fraction under the groove, 0 to 1") : null;
        var allowed = new List<string> { "pattern", "edge", "pitch", "width", "offset", enclosed ? "length" : "depth" };
        if (pattern == "grooves") allowed.Add("remaining_thickness");
        t.ReportUnknownKeys(allowed);
        PlateEdge? edge = edgeText switch { "bottom" => PlateEdge.Bottom, "top" => PlateEdge.Top, "left" => PlateEdge.Left, "right" => PlateEdge.Right, null => null, _ => null };
        if (edgeText is not null && edge is null) t.ErrorAt("edge", $"unknown edge \"{edgeText}\"; expected \"bottom\", \"top\", \"left\" or \"right\"");
        if (pattern is null || edge is null || pitch is null || depth is null || width is null) return;
        var o = geometry.Outline;
        SlotPattern? made = pattern switch
        {
            "comb" => SlotPatterns.Comb(o, edge.Value, pitch.Value, depth.Value, width.Value, offset),
            "alternating" => SlotPatterns.Alternating(o, edge.Value, pitch.Value, depth.Value, width.Value, offset),
            "enclosed" => SlotPatterns.EnclosedSlits(o, edge.Value, pitch.Value, depth.Value, width.Value, offset),
            "grooves" when remaining is not null => SlotPatterns.GrooveComb(o, edge.Value, pitch.Value, depth.Value, width.Value, remaining.Value, offset),
            "grooves" => null,
            _ => null,
        };
        if (made is null && pattern != "grooves") t.ErrorAt("pattern", $"unknown pattern \"{pattern}\"; expected \"comb\", \"alternating\", \"enclosed\" or \"grooves\"");
        if (made is not null) geometry.AddPattern(made);
    }

    private static void ReadCut(PlateFileTable t, PlateGeometry geometry)
    {
        var from = t.Point("from", true);
        var to = t.Point("to", true);
        t.ReportUnknownKeys(new[] { "from", "to" });
        if (from is not null && to is not null) geometry.AddCut(new CutLine(new Vec2(from.Value.X, from.Value.Y), new Vec2(to.Value.X, to.Value.Y)));
    }

    private static (IAcFieldSource?, MovingPoles?, IReadOnlyList<double>, string) ReadSource(PlateFileTable t, PlateGeometry geometry, string path, List<string> errors)
    {
        var kind = t.String("kind", true, "\"uniform_ac\", \"field_map\" or \"moving_poles\"");
        switch (kind)
        {
            case "uniform_ac":
            {
                var peak = t.Quantity("peak", QuantityKind.FluxDensity, true);
                var f = t.Quantity("frequency", QuantityKind.Frequency, true);
                var phase = t.Number("phase_deg", false, "phase in degrees") ?? 0;
                t.ReportUnknownKeys(new[] { "kind", "peak", "frequency", "phase_deg" });
                if (f is not null && !(f > 0)) { t.ErrorAt("frequency", "must be positive"); return default; }
                return peak is null || f is null ? default : (new UniformAcField(peak.Value, f.Value, phase * Math.PI / 180), null, Array.Empty<double>(), "");
            }
            case "field_map":
            {
                var file = t.String("file", true, "CSV file with columns x_m,y_m,amplitude_t,phase_deg");
                var f = t.Quantity("frequency", QuantityKind.Frequency, true);
                t.ReportUnknownKeys(new[] { "kind", "file", "frequency" });
                if (file is null || f is null) return default;
                if (!(f > 0)) { t.ErrorAt("frequency", "must be positive"); return default; }
                string full = System.IO.Path.IsPathRooted(file) ? file : System.IO.Path.Combine(System.IO.Path.GetDirectoryName(System.IO.Path.GetFullPath(path)) ?? ".", file);
                try { return (PlateFileFieldMap.Read(full, f.Value), null, Array.Empty<double>(), ""); }
                catch (InputException e) { t.ErrorAt("file", e.Message); return default; }
            }
            case "moving_poles":
                return ReadMovingPoles(t, geometry);
            case null:
                return default;
            default:
                t.ErrorAt("kind", $"unknown source kind \"{kind}\"; expected \"uniform_ac\", \"field_map\" or \"moving_poles\"");
                return default;
        }
    }

    private static (IAcFieldSource?, MovingPoles?, IReadOnlyList<double>, string) ReadMovingPoles(PlateFileTable t, PlateGeometry geometry)
    {
        var pole = t.String("pole", true, "\"circle\" or \"rectangle\"");
        PoleFace? face = null;
        var keys = new List<string> { "kind", "pole", "flux_density", "speed", "x", "y", "count", "pole_pitch", "positions", "average" };
        if (pole == "circle")
        {
            keys.Add("radius");
            var r = t.Quantity("radius", QuantityKind.Length, true);
            if (r is not null) face = PoleFace.Circle(r.Value);
        }
        else if (pole == "rectangle")
        {
            keys.AddRange(new[] { "pole_width", "pole_height" });
            var w = t.Quantity("pole_width", QuantityKind.Length, true);
            var h = t.Quantity("pole_height", QuantityKind.Length, true);
            if (w is not null && h is not null) face = PoleFace.Rectangle(w.Value, h.Value);
        }
        else if (pole is not null) t.ErrorAt("pole", $"unknown pole shape \"{pole}\"; expected \"circle\" or \"rectangle\"");
        var b = t.Quantity("flux_density", QuantityKind.FluxDensity, true);
        var v = t.Quantity("speed", QuantityKind.Speed, true);
        var x = t.Quantity("x", QuantityKind.Length, true);
        var y = t.Quantity("y", QuantityKind.Length, true);
        int count = t.Integer("count", false, "number of poles in the row") ?? 1;
        var polePitch = t.Quantity("pole_pitch", QuantityKind.Length, count > 1);
        int positions = t.Integer("positions", false, "number of travel positions") ?? 8;
        var slotPitch = geometry.Patterns.Count > 0 ? (double?)geometry.Patterns[0].PitchM : null;
        var average = t.String("average", false, "\"slot_pitch\" or \"pass\"") ?? (slotPitch is null ? "pass" : "slot_pitch");
        t.ReportUnknownKeys(keys);
        if (positions < 1) { t.ErrorAt("positions", "must be at least 1"); return default; }
        if (average is not ("slot_pitch" or "pass")) { t.ErrorAt("average", $"unknown average \"{average}\"; expected \"slot_pitch\" or \"pass\""); return default; }
        if (average == "slot_pitch" && slotPitch is null) { t.ErrorAt("average", "\"slot_pitch\" needs a [[slots]] pattern"); return default; }
        if (face is null || b is null || v is null || x is null || y is null || (count > 1 && polePitch is null)) return default;
        var poles = MovingPoles.Row(face, new Vec2(x.Value, y.Value), count, polePitch ?? 0, b.Value, v.Value);
        IReadOnlyList<double> offsets;
        string over;
        if (average == "slot_pitch")
        {
            offsets = MovingSweepSolution.OffsetsOverPitch(slotPitch!.Value, positions);
            over = $"one slot pitch ({slotPitch.Value * 1e3:G4} mm, {positions} positions)";
        }
        else
        {
            // from the row's leading edge at the plate's left edge to its trailing edge at the right edge
            var (min, max) = geometry.Bounds;
            var (rowMin, rowMax) = poles.ExtentX;
            offsets = positions == 1 ? new[] { 0.0 } : MovingSweepSolution.OffsetsAcross(min.X - rowMax, max.X - rowMin, positions);
            over = positions == 1 ? "one position (offset 0)" : $"the pass over the plate ({positions} positions)";
        }
        return (null, poles, offsets, over);
    }
}
