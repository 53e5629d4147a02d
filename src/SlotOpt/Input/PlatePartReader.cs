using SlotOpt.Design.SolidParts;
using SlotOpt.Design;
using SlotOpt.Input.Toml;
using SlotOpt.Materials;
using SlotOpt.Plates.Geometry;
using SlotOpt.Plates.Grid;
using SlotOpt.Tables;

namespace SlotOpt.Input;

/// <summary>
/// Reads a [[parts]] table of kind "plate": the outline (width and height, or outline = [[x, y], ...]),
/// candidate thicknesses and materials, processes for the outline, limits, [parts.source],
/// [[parts.slots]] families (the keys of <see cref="SlotTableReader"/>, lists allowed, plus processes) and
/// [parts.current] (its slots table one value each) and [parts.thermal] (cooling and temperature limit, <see cref="ThermalReader.ReadPart"/>). Key names follow the single-plate file of `slotopt plate`.
/// </summary>
public static class PlatePartReader
{
    public static PlatePart? Read(TomlSection s, MaterialLibrary library, ManufacturingSettings shop, string baseDirectory)
    {
        var name = s.RequiredString("name");
        s.OptionalString("kind");
        var outline = ReadOutline(s);
        var thicknesses = s.QuantityList("thicknesses", QuantityKind.Length, required: true);
        if (thicknesses is not null)
            foreach (var t in thicknesses.Where(t => !(t > 0))) s.Error("thicknesses", $"a thickness must be positive, got {t} m");
        var materials = ReadMaterials(s, library);
        var processes = ReadProcesses(s, "processes", shop) ?? ["laser"];
        var temperature = s.OptionalQuantity("temperature", QuantityKind.Temperature) ?? Conductor.RoomTemperatureK;
        if (!(temperature > 0)) s.Error("temperature", "is below absolute zero");
        var maxDrag = s.PositiveQuantity("max_drag", QuantityKind.Force, required: false);
        var minDragN = s.PositiveQuantity("min_drag", QuantityKind.Force, required: false);
        var minDragSpeed = s.PositiveQuantity("min_drag_speed", QuantityKind.Speed, required: false);
        var maxLoss = s.PositiveQuantity("max_loss", QuantityKind.Power, required: false);
        var minLigament = s.PositiveQuantity("min_ligament", QuantityKind.Length, required: false) ?? 0;
        var grid = s.OptionalTable("grid");
        var cell = grid?.PositiveQuantity("cell", QuantityKind.Length, required: false);
        grid?.RejectUnknownKeys();
        if (grid is not null && outline is not null) CheckCellCount(grid, cell, outline);
        var sourceSection = s.RequiredTable("source");
        var excitation = sourceSection is null ? null : PlateSourceReader.Read(sourceSection, outline, baseDirectory);
        var families = s.TableArray("slots", required: false).Select(f => ReadFamily(f, shop, processes, outline)).OfType<SlotFamily>().ToList();
        var current = ReadCurrent(s.OptionalTable("current"), library, shop, outline);
        var thermalSection = s.OptionalTable("thermal");
        PartThermal? thermal = null;
        if (thermalSection is not null && outline is not null)
        {
            var (min, max) = outline.Bounds;
            thermal = ThermalReader.ReadPart(thermalSection, max.X - min.X, max.Y - min.Y, materials);
        }
        var lossKind = LossKindWords.Read(s);
        s.RejectUnknownKeys();

        if (maxDrag is not null && excitation is { IsMoving: false }) s.Error("max_drag", "a drag limit needs a moving source ([parts.source] kind = \"moving_poles\" or \"magnets\")");
        MinimumDrag? minDrag = null;
        if (minDragSpeed is not null && minDragN is null) s.Error("min_drag_speed", "names the speed of a min_drag: give min_drag as well");
        if (minDragN is { } force && excitation is PlateExcitation.Moving moving)
        {
            var speed = minDragSpeed ?? moving.SpeedMPerS;
            minDrag = new MinimumDrag(force, speed);
            if (maxDrag is { } limit && speed == moving.SpeedMPerS && force > limit)
                s.Error("min_drag", $"{force:0.###} N is above max_drag ({limit:0.###} N) at the same speed: no option can meet both");
        }
        else if (minDragN is not null && excitation is { IsMoving: false })
            s.Error("min_drag", "a minimum drag needs a moving source ([parts.source] kind = \"moving_poles\" or \"magnets\")");
        if (thicknesses is not null && outline is not null)
        {
            var (min, max) = outline.Bounds;
            var smaller = Math.Min(max.X - min.X, max.Y - min.Y);
            foreach (var t in thicknesses.Where(t => t > smaller / 5))
                s.Warn("thicknesses", $"{t * 1e3:0.###} mm is not thin against the plate ({smaller * 1e3:0.#} mm across): the thin-plate model assumes thickness << width");
        }
        if (name is null || outline is null || thicknesses is null || materials.Count == 0 || excitation is null) return null;
        return new PlatePart(name, s.Line, temperature, maxLoss, outline, thicknesses, materials, excitation, families, processes,
            maxDrag, minLigament, cell, current, thermal, minDrag) { DeclaredLossKind = lossKind };
    }

    private static Polygon? ReadOutline(TomlSection s)
    {
        if (s.Has("outline"))
        {
            var points = s.PointList("outline");
            if (points is null) return null;
            return s.Guard("outline", () => new Polygon(points.Select(p => new Vec2(p.X, p.Y))));
        }
        var width = s.PositiveQuantity("width", QuantityKind.Length, required: true);
        var height = s.PositiveQuantity("height", QuantityKind.Length, required: true);
        return width is { } w && height is { } h ? s.Guard("width", () => Polygon.Rectangle(0, 0, w, h)) : null;
    }

    private static List<string> ReadMaterials(TomlSection s, MaterialLibrary library)
    {
        var names = s.StringList("materials", required: true) ?? [];
        RejectDuplicates(s, "materials", names);
        var valid = new List<string>();
        foreach (var m in names)
        {
            if (library.TryGetConductor(m, out var conductor)) valid.Add(conductor.Name);
            else s.Error("materials", $"unknown conductor \"{m}\"{NameSuggestion.DidYouMean(m, library.Conductors.Select(c => c.Name))}; `slotopt materials` lists them");
        }
        return valid;
    }

    private static List<string>? ReadProcesses(TomlSection s, string key, ManufacturingSettings shop)
    {
        var names = s.StringList(key, required: false);
        if (names is null) return null;
        RejectDuplicates(s, key, names);
        var valid = new List<string>();
        foreach (var p in names)
        {
            if (shop.Processes.ContainsKey(p)) valid.Add(p);
            else s.Error(key, $"unknown process \"{p}\"{NameSuggestion.DidYouMean(p, shop.Processes.Keys)}; known: {string.Join(", ", shop.Processes.Keys)}");
        }
        return valid;
    }

    /// <summary>An explicit cell beyond the solver's hard limit of cells (<see cref="GridOptions.MaxCells"/>), refused where it is written.</summary>
    internal static void CheckCellCount(TomlSection grid, double? cellM, Polygon outline)
    {
        if (cellM is not { } h) return;
        var (min, max) = outline.Bounds;
        var cells = Math.Ceiling((max.X - min.X) / h) * Math.Ceiling((max.Y - min.Y) / h);
        var limit = new GridOptions().MaxCells;
        if (cells > limit)
            grid.Error("cell", string.Create(System.Globalization.CultureInfo.InvariantCulture,
                $"a {h * 1e3:G4} mm cell needs {cells:E2} cells over the plate's {(max.X - min.X) * 1e3:G4} x {(max.Y - min.Y) * 1e3:G4} mm; the limit is {limit:N0} cells: choose a larger cell"));
    }

    /// <summary>A name listed twice would be evaluated twice and counted twice by the selection: refused where it is written.</summary>
    internal static void RejectDuplicates(TomlSection s, string key, IReadOnlyList<string> names)
    {
        foreach (var twice in names.GroupBy(n => n, StringComparer.OrdinalIgnoreCase).Where(g => g.Count() > 1))
            s.Error(key, $"\"{twice.Key}\" is listed {twice.Count()} times; list each once");
    }

    private static SlotFamily? ReadFamily(TomlSection f, ManufacturingSettings shop, IReadOnlyList<string> partProcesses, Polygon? outline)
    {
        var table = SlotTableReader.Read(f, outline, oneValueEach: false);
        var processes = ReadProcesses(f, "processes", shop) ?? partProcesses.ToList();
        f.RejectUnknownKeys();
        if (table is null || processes.Count == 0) return null;
        return new SlotFamily(table.Pattern, table.Edge, table.PitchesM, table.ExtentsM, table.WidthsM, processes, table.RemainingThicknessFraction);
    }

    private static PlateChoice? ReadCurrent(TomlSection? s, MaterialLibrary library, ManufacturingSettings shop, Polygon? outline)
    {
        if (s is null) return null;
        var thickness = s.PositiveQuantity("thickness", QuantityKind.Length, required: true);
        var material = s.RequiredString("material");
        if (material is not null && !library.TryGetConductor(material, out _))
            s.Error("material", $"unknown conductor \"{material}\"{NameSuggestion.DidYouMean(material, library.Conductors.Select(c => c.Name))}");
        var process = s.OptionalString("process") ?? "laser";
        if (!shop.Processes.ContainsKey(process)) s.Error("process", $"unknown process \"{process}\"{NameSuggestion.DidYouMean(process, shop.Processes.Keys)}");
        SlotChoice? slots = null;
        if (s.OptionalTable("slots") is { } slotTable)
        {
            slots = SlotTableReader.Read(slotTable, outline, oneValueEach: true)?.Single;
            slotTable.RejectUnknownKeys();
        }
        s.RejectUnknownKeys();
        return thickness is null || material is null ? null : new PlateChoice(thickness.Value, library.TryGetConductor(material, out var c) ? c.Name : material, process, slots);
    }
}
