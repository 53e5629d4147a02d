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
/// A disc (shape = "disc", diameter, bore: <see cref="DiscReader"/>) turns under magnets ([parts.source] kind = "magnets", motion = "rotation"),
/// takes radial slot families (pattern = "radial" with lists of count, width, from, to) and the torque limits max_torque and min_torque
/// (at min_torque_speed, a number of rpm; default the source's rotation_speed) instead of max_drag and min_drag.
/// </summary>
public static class PlatePartReader
{
    public static PlatePart? Read(TomlSection s, MaterialLibrary library, ManufacturingSettings shop, string baseDirectory)
    {
        var name = s.RequiredString("name");
        s.OptionalString("kind");
        var isDisc = s.OptionalChoice("shape", ["rectangle", "disc"]) == "disc";
        var disc = isDisc ? DiscReader.Read(s) : null;
        var outline = isDisc ? disc?.Outline : ReadOutline(s);
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
        var maxTorque = s.PositiveQuantity("max_torque", QuantityKind.Torque, required: false);
        var minTorqueNm = s.PositiveQuantity("min_torque", QuantityKind.Torque, required: false);
        var minTorqueRpm = s.OptionalNumber("min_torque_speed");
        if (minTorqueRpm is not null && !(minTorqueRpm > 0 && minTorqueRpm <= 1e6)) s.Error("min_torque_speed", "must be a positive number of revolutions per minute, at most 1e6");
        var maxLoss = s.PositiveQuantity("max_loss", QuantityKind.Power, required: false);
        var minLigament = s.PositiveQuantity("min_ligament", QuantityKind.Length, required: false) ?? 0;
        var grid = s.OptionalTable("grid");
        var cell = grid?.PositiveQuantity("cell", QuantityKind.Length, required: false);
        grid?.RejectUnknownKeys();
        if (grid is not null && outline is not null) CheckCellCount(grid, cell, outline);
        var sourceSection = s.RequiredTable("source");
        var excitation = sourceSection is null ? null : PlateSourceReader.Read(sourceSection, outline, baseDirectory, disc: disc);
        var families = s.TableArray("slots", required: false).Select(f => ReadFamily(f, shop, processes, outline, disc)).OfType<SlotFamily>().ToList();
        var current = ReadCurrent(s.OptionalTable("current"), library, shop, outline, disc);
        var thermalSection = s.OptionalTable("thermal");
        PartThermal? thermal = null;
        if (thermalSection is not null && excitation is PlateExcitation.Turning)
            thermalSection.Error("cooling", "[parts.thermal] is for plates under sliding sources and AC fields, not a turning disc: limit its loss with max_loss");
        else if (thermalSection is not null && outline is not null)
        {
            var (min, max) = outline.Bounds;
            thermal = ThermalReader.ReadPart(thermalSection, max.X - min.X, max.Y - min.Y, materials);
        }
        var lossKind = LossKindWords.Read(s);
        s.RejectUnknownKeys();

        var turning = excitation as PlateExcitation.Turning;
        if (turning is not null && maxDrag is not null) s.Error("max_drag", "a turning disc is limited by its braking torque: max_torque");
        if (turning is not null && minDragN is not null) s.Error("min_drag", "a turning disc wants a braking torque: min_torque (at min_torque_speed)");
        if (turning is null && excitation is not null)
            foreach (var key in new[] { "max_torque", "min_torque", "min_torque_speed" }.Where(s.Has))
                s.Error(key, "a torque is for a turning disc (shape = \"disc\", [parts.source] motion = \"rotation\"); sliding parts take max_drag and min_drag");
        if (minTorqueRpm is not null && minTorqueNm is null) s.Error("min_torque_speed", "names the speed of a min_torque: give min_torque as well");
        BrakingMinimum? minBraking = null;
        if (turning is not null && minTorqueNm is { } wantedTorque && minTorqueRpm is null or (> 0 and <= 1e6))
        {
            var rpm = minTorqueRpm ?? turning.Rpm;
            minBraking = BrakingMinimum.Torque(wantedTorque, rpm);
            if (maxTorque is { } limit && minTorqueRpm is null && wantedTorque > limit)
                s.Error("min_torque", $"{wantedTorque:0.###} N m is above max_torque ({limit:0.###} N m) at the same speed: no option can meet both");
        }
        if (maxDrag is not null && excitation is { IsMoving: false } && turning is null) s.Error("max_drag", "a drag limit needs a moving source ([parts.source] kind = \"moving_poles\" or \"magnets\")");
        if (minDragSpeed is not null && minDragN is null) s.Error("min_drag_speed", "names the speed of a min_drag: give min_drag as well");
        if (minDragN is { } force && excitation is PlateExcitation.Moving moving)
        {
            var speed = minDragSpeed ?? moving.SpeedMPerS;
            minBraking = BrakingMinimum.Drag(force, speed);
            if (maxDrag is { } limit && speed == moving.SpeedMPerS && force > limit)
                s.Error("min_drag", $"{force:0.###} N is above max_drag ({limit:0.###} N) at the same speed: no option can meet both");
        }
        else if (minDragN is not null && excitation is { IsMoving: false } && turning is null)
            s.Error("min_drag", "a minimum drag needs a moving source ([parts.source] kind = \"moving_poles\" or \"magnets\")");
        if (thicknesses is not null && outline is not null)
        {
            var (min, max) = outline.Bounds;   // a disc: its diameter
            var smaller = Math.Min(max.X - min.X, max.Y - min.Y);
            foreach (var t in thicknesses.Where(t => t > smaller / 5))
                s.Warn("thicknesses", $"{t * 1e3:0.###} mm is not thin against the plate ({smaller * 1e3:0.#} mm across): the thin-plate model assumes thickness << width");
        }
        if (name is null || outline is null || thicknesses is null || materials.Count == 0 || excitation is null) return null;
        return new PlatePart(name, s.Line, temperature, maxLoss, outline, thicknesses, materials, excitation, families, processes,
            maxDrag, minLigament, cell, current, thermal, disc, maxTorque, minBraking) { DeclaredLossKind = lossKind };
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
                $"a {Numbers.Of(h * 1e3, "mm")} cell needs {cells:N0} cells over the plate's {Numbers.Sig((max.X - min.X) * 1e3)} x {Numbers.Of((max.Y - min.Y) * 1e3, "mm")}; the limit is {limit:N0} cells: choose a larger cell"));
    }

    /// <summary>A name listed twice would be evaluated twice and counted twice by the selection: refused where it is written.</summary>
    internal static void RejectDuplicates(TomlSection s, string key, IReadOnlyList<string> names)
    {
        foreach (var twice in names.GroupBy(n => n, StringComparer.OrdinalIgnoreCase).Where(g => g.Count() > 1))
            s.Error(key, $"\"{twice.Key}\" is listed {twice.Count()} times; list each once");
    }

    private static SlotFamily? ReadFamily(TomlSection f, ManufacturingSettings shop, IReadOnlyList<string> partProcesses, Polygon? outline, DiscShape? disc)
    {
        if (f.OptionalString("pattern") == "radial") return ReadRadialFamily(f, shop, partProcesses, disc);
        if (disc is not null) f.Error("pattern", "a disc takes radial slots: pattern = \"radial\"");
        var table = SlotTableReader.Read(f, outline, oneValueEach: false);
        var processes = ReadProcesses(f, "processes", shop) ?? partProcesses.ToList();
        f.RejectUnknownKeys();
        if (table is null || processes.Count == 0) return null;
        return new SlotFamily(table.Pattern, table.Edge, table.PitchesM, table.ExtentsM, table.WidthsM, processes, table.RemainingThicknessFraction);
    }

    /// <summary>Radial slots round a disc (<see cref="DiscReader"/>): every combination of count, from, to and width is an option.</summary>
    private static SlotFamily? ReadRadialFamily(TomlSection f, ManufacturingSettings shop, IReadOnlyList<string> partProcesses, DiscShape? disc)
    {
        var table = DiscReader.ReadKeys(f, disc, oneValueEach: false, shapeTable: "the part's");
        var processes = ReadProcesses(f, "processes", shop) ?? partProcesses.ToList();
        f.RejectUnknownKeys();
        if (disc is null || table is null || processes.Count == 0 || DiscReader.Check(f, disc, table) is not { } options) return null;
        return new SlotFamily(SlotPatternKind.Radial, PlateEdge.Bottom, [], [], options.Select(o => o.WidthM).Distinct().ToList(), processes, null,
            options.Select(o => o.Ring).Distinct().ToList());
    }

    private static PlateChoice? ReadCurrent(TomlSection? s, MaterialLibrary library, ManufacturingSettings shop, Polygon? outline, DiscShape? disc)
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
            if (slotTable.OptionalString("pattern") == "radial")
            {
                var table = DiscReader.ReadKeys(slotTable, disc, oneValueEach: true, shapeTable: "the part's");
                if (disc is not null && table is not null && DiscReader.Check(slotTable, disc, table) is [var radial]) slots = SlotChoice.RadialOn(disc, radial.Ring, radial.WidthM);
            }
            else
            {
                if (disc is not null) slotTable.Error("pattern", "a disc takes radial slots: pattern = \"radial\"");
                slots = SlotTableReader.Read(slotTable, outline, oneValueEach: true)?.Single;
            }
            slotTable.RejectUnknownKeys();
        }
        s.RejectUnknownKeys();
        return thickness is null || material is null ? null : new PlateChoice(thickness.Value, library.TryGetConductor(material, out var c) ? c.Name : material, process, slots);
    }
}
