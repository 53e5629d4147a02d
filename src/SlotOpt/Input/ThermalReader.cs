using SlotOpt.Design.SolidParts;
using System.Globalization;
using SlotOpt.Design;
using SlotOpt.Input.Toml;
using SlotOpt.Materials;
using SlotOpt.Plates.Thermal;
using SlotOpt.Runs;
using SlotOpt.Tables;

namespace SlotOpt.Input;

/// <summary>
/// Reads a plate's [thermal] section:
/// <code>
/// cooling = "air" | "oil" | "fixed";  h (W/m2K, a number, "fixed" only)
/// ambient (default "20 degC"); emissivity (0..1, default 0: no radiation); edges = "insulated" (default) | "ambient"
/// vertical_axis = "y" (default) | "x": the plate axis that points up (its extent is the convection length)
/// material = a conductor name (thermal conductivity from the built-in table, resistivity law from the conductor)
///   | thermal_conductivity (W/(m K), a number) and temperature_coefficient (1/K, a number: linear law)
/// resistivity_temperature (default "20 degC"): the temperature at which [plate] resistivity or conductivity holds
/// max_temperature (e.g. "120 degC") and/or max_temperature_rise (K, a number)
/// </code>
/// </summary>
public static class ThermalReader
{
    public static readonly string[] CoolingWords = ["air", "oil", "fixed"];
    public static readonly string[] EdgeWords = ["insulated", "ambient"];

    /// <summary>The section read against the plate's bounds (for the vertical length); null after recording errors.</summary>
    public static PlateThermalInput? Read(TomlSection t, double widthM, double heightM)
    {
        var reference = t.OptionalQuantity("resistivity_temperature", QuantityKind.Temperature) ?? Conductor.RoomTemperatureK;
        if (!(reference > 0)) t.Error("resistivity_temperature", "is below absolute zero");
        var material = ReadMaterial(t, reference);
        var common = ReadCoolingAndLimit(t, widthM, heightM);
        return common is null || material is null ? null : new PlateThermalInput(common.Cooling, material, common.Limit);
    }

    /// <summary>
    /// A plate part's [parts.thermal] in a problem file: the cooling and limit keys of a plate file's [thermal]
    /// (cooling, h, ambient, emissivity, edges, vertical_axis, max_temperature, max_temperature_rise); the material's
    /// thermal side comes from each candidate material, so every one of the part's materials needs a listed thermal conductivity.
    /// </summary>
    public static PartThermal? ReadPart(TomlSection t, double widthM, double heightM, IReadOnlyList<string> materials)
    {
        var common = ReadCoolingAndLimit(t, widthM, heightM);
        foreach (var m in materials.Where(m => !ThermalConductivityTable.TryGet(m, out _, out _)))
            t.Error("cooling", $"no thermal conductivity listed for the part's material \"{m}\"; the temperature needs one for every material");
        if (common is not null && !common.Limit.IsSet) t.Warn("cooling", "no max_temperature or max_temperature_rise: the temperature is reported but limits nothing");
        return t.Errors.Any ? null : common;
    }

    private static PartThermal? ReadCoolingAndLimit(TomlSection t, double widthM, double heightM)
    {
        var cooling = t.OptionalChoice("cooling", CoolingWords);
        if (cooling is null && !t.Has("cooling")) t.Error("cooling", $"missing: one of {string.Join(", ", CoolingWords)}");
        var h = t.OptionalNumber("h");
        if (cooling == "fixed" && h is null && !t.Has("h")) t.Error("h", "missing: the heat transfer coefficient of each face in W/m2K, e.g. 25");
        if (cooling is "air" or "oil" && t.Has("h")) t.Error("h", $"is given only with cooling = \"fixed\"; {cooling} computes it from the temperature rise");
        if (h is { } hv && !(hv > 0)) t.Error("h", "must be positive (W/m2K)");
        var ambient = t.OptionalQuantity("ambient", QuantityKind.Temperature) ?? Conductor.RoomTemperatureK;
        if (!(ambient > 0)) t.Error("ambient", "is below absolute zero");
        var emissivity = t.OptionalNumber("emissivity") ?? 0;
        if (!(emissivity >= 0 && emissivity <= 1)) t.Error("emissivity", "must lie between 0 and 1");
        var edges = t.OptionalChoice("edges", EdgeWords) ?? "insulated";
        var axis = t.OptionalChoice("vertical_axis", ["x", "y"]) ?? "y";
        var maxTemperature = t.OptionalQuantity("max_temperature", QuantityKind.Temperature);
        if (maxTemperature is { } mt && !(mt > ambient)) t.Error("max_temperature", "must lie above the ambient temperature");
        var maxRise = t.OptionalNumber("max_temperature_rise");
        if (maxRise is { } mr && !(mr > 0)) t.Error("max_temperature_rise", "must be a positive rise in K");
        t.RejectUnknownKeys();
        if (cooling is null || t.Errors.Any) return null;
        var medium = cooling switch { "air" => CoolingMedium.Air, "oil" => CoolingMedium.Oil, _ => CoolingMedium.Fixed };
        var plateCooling = t.Guard("cooling", () => new PlateCooling(medium, ambient, emissivity, edges == "ambient" ? ThermalEdge.Ambient : ThermalEdge.Insulated,
            medium == CoolingMedium.Fixed ? h : null, axis == "y" ? heightM : widthM));
        return plateCooling is null ? null : new PartThermal(plateCooling, new TemperatureLimit(maxTemperature, maxRise));
    }

    private static ThermalMaterial? ReadMaterial(TomlSection t, double referenceK)
    {
        var name = t.OptionalString("material");
        var k = t.OptionalNumber("thermal_conductivity");
        var alpha = t.OptionalNumber("temperature_coefficient");
        var c = CultureInfo.InvariantCulture;
        if (name is not null)
        {
            if (t.Has("temperature_coefficient")) t.Error("temperature_coefficient", "give either material or temperature_coefficient, not both");
            if (!MaterialLibrary.BuiltIn.TryGetConductor(name, out var conductor))
            {
                var names = MaterialLibrary.BuiltIn.Conductors.Select(x => x.Name).ToList();
                t.Error("material", $"unknown conductor \"{name}\"{NameSuggestion.DidYouMean(name, names)}; `slotopt materials` lists them");
                return null;
            }
            double thermal;
            string kSource;
            if (k is { } given) { thermal = given; kSource = "given"; }
            else if (ThermalConductivityTable.TryGet(conductor.Name, out thermal, out _)) kSource = "built-in table";
            else { t.Error("material", $"no thermal conductivity listed for \"{conductor.Name}\"; give thermal_conductivity"); return null; }
            if (!(thermal > 0)) { t.Error("thermal_conductivity", "must be positive (W/(m K))"); return null; }
            double rhoReference;
            try { rhoReference = conductor.ResistivityAt(referenceK); }
            catch (InputException e) { t.Error("resistivity_temperature", e.Message); return null; }
            return new ThermalMaterial(thermal, temperatureK => rhoReference / conductor.ResistivityAt(temperatureK),
                string.Create(c, $"{conductor.Name}: k {Numbers.Of(thermal, "W/(m K)")} ({kSource}), resistivity following {conductor.Name}'s law from {referenceK - 273.15:0.#} degC"));
        }
        if (k is null && !t.Has("thermal_conductivity")) t.Error("material", "missing: a conductor name, or thermal_conductivity and temperature_coefficient");
        if (alpha is null && !t.Has("temperature_coefficient") && k is not null) t.Error("temperature_coefficient", "missing: the resistivity's linear temperature coefficient in 1/K, e.g. 0.001");
        if (k is not { } kv || alpha is not { } av) return null;
        if (!(kv > 0)) { t.Error("thermal_conductivity", "must be positive (W/(m K))"); return null; }
        return ThermalMaterial.Linear(kv, av, referenceK,
            string.Create(c, $"k {Numbers.Of(kv, "W/(m K)")}, resistivity linear with {Numbers.Sig(av)}/K from {referenceK - 273.15:0.#} degC"));
    }
}
