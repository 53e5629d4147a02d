using SlotOpt.Tables;

namespace SlotOpt.Materials;

/// <summary>
/// The lamination grades and plate conductors a run can use: the built-in data files
/// (Materials/Data), plus whatever a problem file adds or overrides.
/// </summary>
public sealed class MaterialLibrary
{
    private readonly Dictionary<string, ElectricalSteel> steels;
    private readonly Dictionary<string, Conductor> conductors;

    private MaterialLibrary(Dictionary<string, ElectricalSteel> steels, Dictionary<string, Conductor> conductors)
    {
        this.steels = steels;
        this.conductors = conductors;
    }

    public static MaterialLibrary BuiltIn => BuiltInLibrary.Value;

    public IReadOnlyCollection<ElectricalSteel> Steels => steels.Values;
    public IReadOnlyCollection<Conductor> Conductors => conductors.Values;

    /// <summary>A copy of this library with the given grades and conductors added or replaced by name.</summary>
    public MaterialLibrary With(IEnumerable<ElectricalSteel> extraSteels, IEnumerable<Conductor> extraConductors)
    {
        var s = new Dictionary<string, ElectricalSteel>(steels, StringComparer.OrdinalIgnoreCase);
        foreach (var steel in extraSteels) s[steel.Grade] = steel;
        var c = new Dictionary<string, Conductor>(conductors, StringComparer.OrdinalIgnoreCase);
        foreach (var conductor in extraConductors) c[conductor.Name] = conductor;
        return new MaterialLibrary(s, c);
    }

    public bool TryGetSteel(string grade, out ElectricalSteel steel) => steels.TryGetValue(grade, out steel!);
    public bool TryGetConductor(string name, out Conductor conductor) => conductors.TryGetValue(name, out conductor!);

    /// <summary>The grade by name, or an <see cref="InputException"/> naming the nearest grade.</summary>
    public ElectricalSteel GetSteel(string grade, string where) =>
        TryGetSteel(grade, out var steel)
            ? steel
            : throw new InputException($"{where}: unknown grade \"{grade}\"{NameSuggestion.DidYouMean(grade, steels.Keys)}; `slotopt materials` lists them");

    /// <summary>The conductor by name, or an <see cref="InputException"/> naming the nearest one.</summary>
    public Conductor GetConductor(string name, string where) =>
        TryGetConductor(name, out var conductor)
            ? conductor
            : throw new InputException($"{where}: unknown conductor \"{name}\"{NameSuggestion.DidYouMean(name, conductors.Keys)}; `slotopt materials` lists them");

    private static readonly Lazy<MaterialLibrary> BuiltInLibrary = new(() =>
        new MaterialLibrary(
            EmbeddedData.ReadCsv("Materials", "electrical-steels.csv").Rows.Select(ReadSteel).ToDictionary(s => s.Grade, StringComparer.OrdinalIgnoreCase),
            EmbeddedData.ReadCsv("Materials", "conductors.csv").Rows.Select(ReadConductor).ToDictionary(c => c.Name, StringComparer.OrdinalIgnoreCase)));

    private static ElectricalSteel ReadSteel(CsvRow row) => new(
        Grade: row.Text("grade"),
        Family: row.Text("family") switch
        {
            "NO" => SteelFamily.NonOriented,
            "GO" => SteelFamily.GrainOriented,
            "NO-thin" => SteelFamily.ThinNonOriented,
            var other => throw new InputException($"{row.SourceName}:{row.LineNumber}: family \"{other}\" is not NO, GO or NO-thin"),
        },
        ThicknessM: row.Number("thickness_mm") * 1e-3,
        DensityKgPerM3: row.Number("density_kg_m3"),
        Resistivity20COhmM: row.Number("resistivity_uohm_m") * 1e-6,
        SpecMaxLossWPerKg: row.Number("spec_max_loss_w_per_kg"),
        SpecPeakT: row.Number("spec_peak_t"),
        SpecFrequencyHz: row.Number("spec_frequency_hz"),
        StackingFactor: row.Number("stacking_factor"),
        RelativePermeability: row.Number("relative_permeability"),
        KneeFluxT: row.Number("knee_flux_t"),
        MaxFluxT: row.Number("max_flux_t"),
        HysteresisCoefficient: row.Number("kh_w_per_kg_hz_t_alpha"),
        HysteresisExponent: row.Number("alpha"),
        ExcessCoefficient: row.Number("ke_w_per_kg_t_s_1p5"),
        CoefficientsFrequencyHz: row.Number("coefficients_frequency_hz"),
        PricePerKg: row.Number("price_per_kg"),
        Source: row.Text("source"));

    private static Conductor ReadConductor(CsvRow row) => new(
        Name: row.Text("name"),
        Resistivity20COhmM: row.Number("resistivity_20c_uohm_m") * 1e-6,
        Alpha20PerK: row.Number("alpha_20_per_k"),
        DensityKgPerM3: row.Number("density_kg_m3"),
        RelativePermeability: row.Number("relative_permeability"),
        IsMagnetic: row.Boolean("magnetic"),
        TemperatureModel: row.Text("temperature_model") switch
        {
            "linear" => TemperatureModel.Linear,
            "matthiessen-Cu" => TemperatureModel.MatthiessenCopper,
            "matthiessen-Al" => TemperatureModel.MatthiessenAluminium,
            "matthiessen-Fe" => TemperatureModel.MatthiessenIron,
            var other => throw new InputException($"{row.SourceName}:{row.LineNumber}: temperature_model \"{other}\" is not linear, matthiessen-Cu, matthiessen-Al or matthiessen-Fe"),
        },
        YoungsModulusPa: row.Number("youngs_modulus_gpa") * 1e9,
        PricePerKg: row.Number("price_per_kg"),
        Source: row.Text("source"))
    {
        ResidualResistivityOhmM = row.Text("residual_resistivity_uohm_cm") is { Length: > 0 } ? row.Number("residual_resistivity_uohm_cm") * 1e-8 : null,
    };
}
