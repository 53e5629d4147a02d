using SlotOpt.Input.Toml;
using SlotOpt.Materials;
using SlotOpt.Tables;

namespace SlotOpt.Input;

/// <summary>
/// Reads [[materials.steel]] and [[materials.conductor]]: new grades and conductors, or overrides of
/// built-in ones. `based_on = "M270-35A"` starts from a built-in row and changes only the keys given;
/// without it every field is required.
/// </summary>
public static class MaterialOverridesReader
{
    public static MaterialLibrary Read(TomlSection? section, MaterialLibrary library)
    {
        if (section is null) return library;
        var steels = section.TableArray("steel", required: false).Select(s => ReadSteel(s, library)).OfType<ElectricalSteel>().ToList();
        var conductors = section.TableArray("conductor", required: false).Select(c => ReadConductor(c, library)).OfType<Conductor>().ToList();
        section.RejectUnknownKeys();
        return library.With(steels, conductors);
    }

    private static ElectricalSteel? ReadSteel(TomlSection s, MaterialLibrary library)
    {
        var grade = s.RequiredString("grade");
        var basedOnName = s.OptionalString("based_on");
        ElectricalSteel? basis = null;
        if (basedOnName is not null && !library.TryGetSteel(basedOnName, out basis))
            s.Error("based_on", $"no built-in grade \"{basedOnName}\"{NameSuggestion.DidYouMean(basedOnName, library.Steels.Select(x => x.Grade))}");
        var need = basis is null;
        double? Q(string key, QuantityKind kind, double? fallback) => s.PositiveQuantity(key, kind, required: need) ?? fallback;
        double? N(string key, double? fallback)
        {
            if (need && !s.Has(key)) { s.Error(key, "missing (required without based_on)"); return null; }
            var v = s.OptionalNumber(key);
            if (v is { } x && !(x > 0)) { s.Error(key, "must be positive"); return null; }
            return v ?? fallback;
        }
        var familyText = s.OptionalChoice("family", ["NO", "GO", "NO-thin"]);
        if (need && familyText is null && !s.Has("family")) s.Error("family", "missing (required without based_on): NO, GO or NO-thin");
        var family = familyText switch { "GO" => SteelFamily.GrainOriented, "NO-thin" => SteelFamily.ThinNonOriented, "NO" => SteelFamily.NonOriented, _ => basis?.Family ?? SteelFamily.NonOriented };

        var steel = new ElectricalSteel(
            grade ?? "",
            family,
            Q("thickness", QuantityKind.Length, basis?.ThicknessM) ?? 0,
            Q("density", QuantityKind.Density, basis?.DensityKgPerM3) ?? 0,
            Q("resistivity", QuantityKind.Resistivity, basis?.Resistivity20COhmM) ?? 0,
            N("spec_max_loss_w_per_kg", basis?.SpecMaxLossWPerKg) ?? 0,
            Q("spec_peak", QuantityKind.FluxDensity, basis?.SpecPeakT) ?? 0,
            Q("spec_frequency", QuantityKind.Frequency, basis?.SpecFrequencyHz) ?? 0,
            N("stacking_factor", basis?.StackingFactor) ?? 0,
            N("relative_permeability", basis?.RelativePermeability) ?? 0,
            Q("knee_flux", QuantityKind.FluxDensity, basis?.KneeFluxT) ?? 0,
            Q("max_flux", QuantityKind.FluxDensity, basis?.MaxFluxT) ?? 0,
            N("kh", basis?.HysteresisCoefficient) ?? 0,
            N("alpha", basis?.HysteresisExponent) ?? 0,
            N("ke", basis?.ExcessCoefficient) ?? 0,
            Q("coefficients_frequency", QuantityKind.Frequency, basis?.CoefficientsFrequencyHz) ?? 0,
            N("price_per_kg", basis?.PricePerKg) ?? 0,
            s.OptionalString("source") ?? (basis is null ? "defined in the problem file" : $"{basis.Grade} with changes from the problem file"));
        if (steel.StackingFactor > 1) s.Error("stacking_factor", "must not exceed 1");
        if (steel.KneeFluxT > steel.MaxFluxT && steel.MaxFluxT > 0) s.Error("knee_flux", "must not exceed max_flux");
        s.RejectUnknownKeys();
        return grade is null ? null : steel;
    }

    private static Conductor? ReadConductor(TomlSection s, MaterialLibrary library)
    {
        var name = s.RequiredString("name");
        var basedOnName = s.OptionalString("based_on");
        Conductor? basis = null;
        if (basedOnName is not null && !library.TryGetConductor(basedOnName, out basis))
            s.Error("based_on", $"no built-in conductor \"{basedOnName}\"{NameSuggestion.DidYouMean(basedOnName, library.Conductors.Select(x => x.Name))}");
        var need = basis is null;
        double? Q(string key, QuantityKind kind, double? fallback) => s.PositiveQuantity(key, kind, required: need) ?? fallback;
        var alpha = s.OptionalNumber("alpha_20");
        if (need && alpha is null) s.Error("alpha_20", "missing (required without based_on): temperature coefficient at 20 degC, 1/K");
        var mu = s.OptionalNumber("relative_permeability");
        if (mu is < 1) s.Error("relative_permeability", "must be 1 or more");
        var modelText = s.OptionalChoice("temperature_model", ["linear", "matthiessen-Cu", "matthiessen-Al", "matthiessen-Fe"]);
        var model = modelText switch { "matthiessen-Cu" => TemperatureModel.MatthiessenCopper, "matthiessen-Al" => TemperatureModel.MatthiessenAluminium, "matthiessen-Fe" => TemperatureModel.MatthiessenIron, "linear" => TemperatureModel.Linear, _ => basis?.TemperatureModel ?? TemperatureModel.Linear };
        var price = s.OptionalNumber("price_per_kg");
        if (need && price is null) s.Error("price_per_kg", "missing (required without based_on)");
        var conductor = new Conductor(
            name ?? "",
            Q("resistivity", QuantityKind.Resistivity, basis?.Resistivity20COhmM) ?? 0,
            alpha ?? basis?.Alpha20PerK ?? 0,
            Q("density", QuantityKind.Density, basis?.DensityKgPerM3) ?? 0,
            mu ?? basis?.RelativePermeability ?? 1,
            s.OptionalBoolean("magnetic") ?? basis?.IsMagnetic ?? false,
            model,
            Q("youngs_modulus", QuantityKind.Pressure, basis?.YoungsModulusPa) ?? 0,
            price ?? basis?.PricePerKg ?? 0,
            s.OptionalString("source") ?? (basis is null ? "defined in the problem file" : $"{basis.Name} with changes from the problem file"));
        s.RejectUnknownKeys();
        return name is null ? null : conductor;
    }
}
