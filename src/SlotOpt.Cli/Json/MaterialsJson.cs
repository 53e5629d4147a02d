using System.Text.Json.Serialization;
using SlotOpt.Materials;
using SlotOpt.Reports.Json;

namespace SlotOpt.Cli;

/// <summary>`slotopt materials --json`: the built-in lamination grades and plate conductors with their data and sources.</summary>
public sealed record MaterialsJson(IReadOnlyList<MaterialsJson.Steel> Grades, IReadOnlyList<MaterialsJson.Conductor> Conductors) : VersionedJson
{
    /// <summary>A lamination grade: its standard data, loss coefficients, price and source.</summary>
    public sealed record Steel(
        string Grade,
        bool OwnDesignation,
        SteelFamily Family,
        double ThicknessMm,
        double DensityKgM3,
        double ResistivityUohmM,
        double SpecMaxLossWPerKg,
        double SpecPeakFluxDensityT,
        double SpecFrequencyHz,
        double StackingFactor,
        double RelativePermeability,
        double KneeFluxDensityT,
        double MaxFluxDensityT,
        double Kh,
        double Alpha,
        double Ke,
        double CoefficientsFrequencyHz,
        double PricePerKg,
        string Source);

    /// <summary>A plate conductor: resistivity and its temperature model, density, magnetism, price and source.</summary>
    public sealed record Conductor(
        string Name,
        [property: JsonPropertyName("resistivity_20c_uohm_m")] double Resistivity20cUohmM,
        [property: JsonPropertyName("alpha_20_per_k")] double Alpha20PerK,
        double DensityKgM3,
        double RelativePermeability,
        bool Magnetic,
        TemperatureModel TemperatureModel,
        double PricePerKg,
        string Source);
}
