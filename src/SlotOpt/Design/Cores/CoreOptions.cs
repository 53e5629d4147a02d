using SlotOpt.Tables;
using System.Globalization;
using SlotOpt.Lamination;
using SlotOpt.Materials;

namespace SlotOpt.Design.Cores;

/// <summary>Enumerates and evaluates every grade x process option of a core part.</summary>
public static class CoreOptions
{
    /// <summary>The part's own building factor, else the table's for its construction and the steel's family, else 1 (no construction given).</summary>
    public static double BuildingFactorOf(CorePart part, ElectricalSteel steel) =>
        part.BuildingFactorOverride
        ?? (part.Construction is { } c ? BuildingFactors.Default(c, steel.Family)?.Factor : null)
        ?? 1.0;

    public static IReadOnlyList<EvaluatedOption> Evaluate(CorePart part, MaterialLibrary library, ManufacturingSettings shop)
    {
        var options = new List<EvaluatedOption>();
        foreach (var grade in part.Grades)
        foreach (var processName in part.Processes)
            options.Add(EvaluateOne(part, library.GetSteel(grade, part.Name), shop.Processes[processName], shop));
        return options;
    }

    public static EvaluatedOption EvaluateOne(CorePart part, ElectricalSteel steel, CuttingProcess process, ManufacturingSettings shop)
    {
        var conditions = new LaminationConditions { TemperatureK = part.TemperatureK, FeatureWidthM = part.FeatureWidthM };
        // the part's flux is over the gross section (lamination area x stack height); the steel alone carries it
        var steelFlux = LaminationStack.SteelWaveform(part.Flux, steel.StackingFactor);
        var specific = LaminationLossModel.Evaluate(steel, steelFlux, conditions);
        var cost = CoreCost.Of(part, steel, process, shop);
        var buildingFactor = BuildingFactorOf(part, steel);
        var cutDamage = CutEdgeDamage.LossFactor(part.CutLengthPerSheetM, part.LaminationAreaM2, process);
        // P_core = BF x P_specific x m (S. Zurek, "Building factor", Encyclopedia Magnetica), raised by the cut edges' degraded band
        var factor = buildingFactor * cutDamage;
        var loss = new LossBreakdown(
            factor * specific.HysteresisWPerKg * cost.SteelMassKg,
            factor * specific.ClassicalWPerKg * cost.SteelMassKg,
            factor * specific.ExcessWPerKg * cost.SteelMassKg,
            0, 0);
        RuleBreak? rejection = null;
        if (part.Construction is { } construction && steel.Family == SteelFamily.GrainOriented && CoreConstructionWords.FluxCrossesRollingDirection(construction))
            rejection = new RuleBreak(RuleKind.GrainOrientedAcrossRollingDirection, $"{RuleBreak.ShortNameOf(RuleKind.GrainOrientedAcrossRollingDirection)}: in a {CoreConstructionWords.Word(construction)} construction part of the flux runs at up to 90 degrees to the rolling direction of {steel.Grade}, where grain-oriented steel loses several times its rated loss; choose a non-oriented grade");
        else if (specific.Flags.FirstOrDefault(f => f.Code == "flux-beyond-grade") is { } beyond)
            rejection = new RuleBreak(RuleKind.FluxBeyondGrade, beyond.Message);
        else if (part.MaxLossW is { } cap && loss.TotalW > cap)
            rejection = new RuleBreak(RuleKind.LossAboveLimit, string.Create(CultureInfo.InvariantCulture, $"loss {Numbers.Watts(loss.TotalW)} exceeds the part's limit of {Numbers.Watts(cap)}"));
        var attributes = new Dictionary<string, string>
        {
            ["grade"] = steel.Grade,
            ["gauge_mm"] = (steel.ThicknessM * 1e3).ToString("0.00", CultureInfo.InvariantCulture),
            ["process"] = process.Name,
            ["coil"] = $"{steel.Grade} {(steel.ThicknessM * 1e3).ToString("0.00", CultureInfo.InvariantCulture)} mm",
            ["sheets"] = cost.Sheets.ToString(CultureInfo.InvariantCulture),
            ["steel_mass_kg"] = cost.SteelMassKg.ToString("0.###", CultureInfo.InvariantCulture),
            ["steel_flux_t"] = steelFlux.PeakT.ToString("0.###", CultureInfo.InvariantCulture),
            ["building_factor"] = buildingFactor.ToString("0.###", CultureInfo.InvariantCulture),
            ["cut_edge_loss_factor"] = cutDamage.ToString("0.###", CultureInfo.InvariantCulture),
        };
        var description = string.Create(CultureInfo.InvariantCulture, $"{steel.Grade} at {steel.ThicknessM * 1e3:0.00} mm, {cost.Sheets} sheets ({Numbers.Of(cost.SteelMassKg, "kg")}, {Numbers.Of(steelFlux.PeakT, "T")} in the steel), {process.Name}");
        return new EvaluatedOption(part.Name, $"{part.Name}/{steel.Grade}/{process.Name}", new CoreChoice(steel.Grade, process.Name), description, attributes, cost.Total, loss, null,
            specific.Flags.Select(f => $"{f.Code}: {f.Message}").ToList(), rejection);
    }
}
