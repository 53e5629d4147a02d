using SlotOpt.Design.SolidParts;
using SlotOpt.Design;
using SlotOpt.Input.Toml;
using SlotOpt.Plates.Conductors;
using SlotOpt.Plates.Geometry;
using SlotOpt.Plates.Grid;
using SlotOpt.Runs;
using SlotOpt.Tables;

namespace SlotOpt.Input;

/// <summary>
/// Reads a plate file (TOML) for `slotopt plate`: one plate, one material and thickness, one source.
/// Every error names file:line and key; unknown keys and tables are errors; all are reported together.
/// Schema (quantities as strings with units or plain SI; source keys as in problem files, see
/// <see cref="PlateSourceReader"/>):
/// <code>
/// [plate]      width, height (rectangle from the origin) | outline = [[x, y], ...] | shape = "disc" with diameter and bore (optional; centred at (d/2, d/2));
///              thickness; resistivity | conductivity (S/m); relative_permeability (optional, skin depth only)
/// [grid]       cell (optional); min_cells_across_strip (optional, default 8)
/// [[cutout]]   shape = "rectangle" (x, y lower-left, width, height) | "circle" (x, y centre, radius) | "polygon" (points)
/// [[slots]]    the keys of <see cref="SlotTableReader"/> (as in problem files; edge defaults to "bottom"), one value each,
///              and offset (optional: the first slot's centre from the low end of the edge); on a disc pattern = "radial" with
///              count, width, from (inner radius), to (outer radius, default through the rim)
/// [[cut]]      from = [x, y], to = [x, y]   (zero-width kerf)
/// [source]     kind = "uniform_ac" | "field_map" | "moving_poles" | "magnets" (average defaults to "slot_pitch" with slots, else "pass");
///              magnets with motion = "rotation" (over a disc) or "approach": <see cref="MagnetSourceReader"/>
/// [thermal]    optional: plate temperature with the resistivity at the local temperature (see <see cref="ThermalReader"/>)
/// </code>
/// </summary>
public static class PlateFileReader
{
    public static PlateCase Read(string path)
    {
        var text = InputFile.ReadAllText(path, "plate file");
        return Parse(text, path);
    }

    public static PlateCase Parse(string text, string path)
    {
        var errors = new InputErrors();
        var root = new TomlSection(TomlDocumentReader.Read(text, path, errors), "", path, errors);
        errors.ThrowIfAny();
        var plate = root.RequiredTable("plate");
        var (geometry, conductor, disc) = plate is null ? (null, null, null) : ReadPlate(plate);
        var gridSection = root.OptionalTable("grid");
        var grid = gridSection is null ? new GridOptions() : ReadGrid(gridSection);
        if (gridSection is not null && geometry is not null) PlatePartReader.CheckCellCount(gridSection, grid.CellSizeM, geometry.Outline);
        var cutouts = root.TableArray("cutout", required: false);
        int radialSlots = 0;
        var slots = root.TableArray("slots", required: false);
        var cuts = root.TableArray("cut", required: false);
        if (geometry is not null)
        {
            foreach (var c in cutouts) ReadCutout(c, geometry);
            foreach (var s in slots) radialSlots += ReadSlots(s, geometry, disc);
            foreach (var c in cuts) ReadCut(c, geometry);
        }
        var sourceSection = root.RequiredTable("source");
        PlateExcitation? excitation = null;
        DiscRotation? rotation = null;
        MagnetApproach? approach = null;
        var motion = sourceSection is not null && sourceSection.OptionalString("kind") == "magnets" ? MagnetSourceReader.Motion(sourceSection) : "linear";
        if (sourceSection is not null && geometry is not null && motion == "rotation")
        {
            rotation = MagnetSourceReader.Rotation(sourceSection, disc?.Centre, disc?.RadiusM, radialSlots > 0 ? 2 * Math.PI / radialSlots : null);
            sourceSection.RejectUnknownKeys();
        }
        else if (sourceSection is not null && geometry is not null && motion == "approach")
        {
            approach = MagnetSourceReader.Approach(sourceSection, geometry.Outline);
            sourceSection.RejectUnknownKeys();
        }
        else if (sourceSection is not null && geometry is not null)
        {
            var baseDirectory = Path.GetDirectoryName(Path.GetFullPath(path)) ?? ".";
            excitation = PlateSourceReader.Read(sourceSection, geometry.Outline, baseDirectory, geometry.Patterns.Count > 0 ? TravelAverage.SlotPitch : TravelAverage.Pass);
            if (excitation is PlateExcitation.Moving { Average: TravelAverage.SlotPitch } && geometry.Patterns.Count == 0)
                sourceSection.Error("average", "\"slot_pitch\" needs a [[slots]] pattern");
        }
        var thermalSection = root.OptionalTable("thermal");
        var thermal = thermalSection is null || geometry is null ? null
            : ThermalReader.Read(thermalSection, geometry.Bounds.Max.X - geometry.Bounds.Min.X, geometry.Bounds.Max.Y - geometry.Bounds.Min.Y);
        if (disc is not null && motion != "rotation" && radialSlots > 0 && sourceSection is not null)
            sourceSection.Error("kind", "radial slots are for a turning disc: motion = \"rotation\"");
        if (thermalSection is not null && motion != "linear") thermalSection.Error("cooling", $"[thermal] is for plates under sliding sources and AC fields, not motion = \"{motion}\"");
        root.RejectUnknownKeys();
        errors.ThrowIfAny();
        if (geometry is null || conductor is null || (excitation is null && rotation is null && approach is null)) throw new InputException($"{path}: the plate file is incomplete");
        if (rotation is not null) return new PlateCase(path, geometry, grid, conductor, null, null, [], rotation.AveragedOver, null, Rotation: rotation);
        if (approach is not null) return new PlateCase(path, geometry, grid, conductor, null, null, [], "the approach", null, Approach: approach);

        var moving = excitation as PlateExcitation.Moving;
        var offsets = moving is null ? (IReadOnlyList<double>)[] : moving.Offsets(geometry.Outline, geometry.Patterns.Count > 0 ? geometry.Patterns[0].PitchM : null);
        var over = moving is null ? ""
            : moving.Average == TravelAverage.SlotPitch
                ? $"one slot pitch ({Numbers.Of(geometry.Patterns[0].PitchM * 1e3, "mm")}, {moving.Positions} positions)"
                : moving.Positions == 1 ? "one position (offset 0)" : $"the pass over the plate ({moving.Positions} positions)";
        return new PlateCase(path, geometry, grid, conductor, (excitation as PlateExcitation.AcField)?.Source, moving?.Source, offsets, over, thermal);
    }

    private static (PlateGeometry?, ConductingSheet?, DiscShape?) ReadPlate(TomlSection t)
    {
        PlateGeometry? geometry = null;
        DiscShape? disc = null;
        var shape = t.OptionalChoice("shape", ["rectangle", "disc"]) ?? "rectangle";
        if (shape == "disc")
        {
            disc = DiscReader.Read(t);
            geometry = disc?.Geometry();
        }
        else if (t.Has("outline"))
        {
            if (t.Has("width") || t.Has("height")) t.Error("outline", "give either outline or width and height, not both");
            var points = t.PointList("outline");
            if (points is not null) geometry = t.Guard("outline", () => new PlateGeometry(new Polygon(points.Select(p => new Vec2(p.X, p.Y)))));
        }
        else
        {
            var w = t.PositiveQuantity("width", QuantityKind.Length, required: true);
            var h = t.PositiveQuantity("height", QuantityKind.Length, required: true);
            if (w is { } width && h is { } height) geometry = PlateGeometry.Rectangle(width, height);
        }
        var thickness = t.PositiveQuantity("thickness", QuantityKind.Length, required: true);
        double? sigma = null;
        if (t.Has("resistivity") && t.Has("conductivity")) t.Error("conductivity", "give either resistivity or conductivity, not both");
        else if (t.Has("resistivity")) sigma = 1 / t.PositiveQuantity("resistivity", QuantityKind.Resistivity, required: true);
        else if (t.Has("conductivity"))
        {
            sigma = t.PositiveQuantity("conductivity", QuantityKind.Conductivity, required: true);
        }
        else t.Error("resistivity", "missing: a resistivity such as \"0.0401 uOhm m\", or conductivity in S/m");
        var mur = t.OptionalNumber("relative_permeability") ?? 1;
        if (!(mur >= 1)) t.Error("relative_permeability", "must be 1 or more");
        t.RejectUnknownKeys();
        var conductor = thickness is { } th && sigma is { } s && mur >= 1 ? t.Guard("thickness", () => new ConductingSheet(s, th, mur)) : null;
        return (geometry, conductor, disc);
    }

    private static GridOptions ReadGrid(TomlSection t)
    {
        var cell = t.PositiveQuantity("cell", QuantityKind.Length, required: false);
        var min = t.OptionalInteger("min_cells_across_strip", 2, 1000);
        t.RejectUnknownKeys();
        return new GridOptions { CellSizeM = cell, MinCellsAcrossNarrowestFeature = (int)(min ?? 8) };
    }

    private static void ReadCutout(TomlSection t, PlateGeometry geometry)
    {
        var shape = t.OptionalChoice("shape", ["rectangle", "circle", "polygon"]);
        if (shape is null && !t.Has("shape")) t.Error("shape", "missing: \"rectangle\", \"circle\" or \"polygon\"");
        Polygon? hole = null;
        switch (shape)
        {
            case "rectangle":
            {
                var x = t.RequiredQuantity("x", QuantityKind.Length);
                var y = t.RequiredQuantity("y", QuantityKind.Length);
                var w = t.PositiveQuantity("width", QuantityKind.Length, required: true);
                var h = t.PositiveQuantity("height", QuantityKind.Length, required: true);
                if (x is { } x0 && y is { } y0 && w is { } width && h is { } height) hole = t.Guard("x", () => Polygon.Rectangle(x0, y0, x0 + width, y0 + height));
                break;
            }
            case "circle":
            {
                var x = t.RequiredQuantity("x", QuantityKind.Length);
                var y = t.RequiredQuantity("y", QuantityKind.Length);
                var r = t.PositiveQuantity("radius", QuantityKind.Length, required: true);
                if (x is { } cx && y is { } cy && r is { } radius) hole = t.Guard("radius", () => Polygon.Circle(new Vec2(cx, cy), radius));
                break;
            }
            case "polygon":
            {
                var points = t.PointList("points");
                if (points is null && !t.Has("points")) t.Error("points", "missing: at least three [x, y] points");
                if (points is not null) hole = t.Guard("points", () => new Polygon(points.Select(p => new Vec2(p.X, p.Y))));
                break;
            }
        }
        t.RejectUnknownKeys();
        if (hole is not null) geometry.AddCutout(hole);
    }

    /// <returns>The number of radial slots read (0 for any other pattern).</returns>
    private static int ReadSlots(TomlSection t, PlateGeometry geometry, DiscShape? disc)
    {
        if (t.OptionalString("pattern") == "radial") return ReadRadialSlots(t, geometry, disc);
        var table = SlotTableReader.Read(t, geometry.Outline, oneValueEach: true);
        var offset = t.OptionalQuantity("offset", QuantityKind.Length);
        t.RejectUnknownKeys();
        if (table is null) return 0;
        var made = t.Guard("pattern", () => SlotPatternCatalog.Cut(geometry.Outline, table.Single, offset));
        if (made is not null) geometry.AddPattern(made);
        return 0;
    }

    /// <summary>Radial slots round a disc (<see cref="DiscReader"/>, one value each): they cut the current loops a ring of magnets drives round the disc.</summary>
    private static int ReadRadialSlots(TomlSection t, PlateGeometry geometry, DiscShape? disc)
    {
        var table = DiscReader.ReadKeys(t, disc, oneValueEach: true);
        t.RejectUnknownKeys();
        if (disc is null || table is null || DiscReader.Check(t, disc, table) is not [var slots]) return 0;
        geometry.AddPattern(disc.Cut(slots.Ring, slots.WidthM));
        return slots.Ring.Count;
    }

    private static void ReadCut(TomlSection t, PlateGeometry geometry)
    {
        var from = t.Point("from");
        var to = t.Point("to");
        t.RejectUnknownKeys();
        if (from is { } a && to is { } b) geometry.AddCut(new CutLine(new Vec2(a.X, a.Y), new Vec2(b.X, b.Y)));
    }
}
