using System.Globalization;
using SlotOpt.Lamination;
using SlotOpt.Materials;

namespace SlotOpt.Design;

/// <summary>Enumerates and evaluates every grade x process option of a core part.</summary>
public static class CoreOptions
{
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
        var specific = LaminationLossModel.Evaluate(steel, part.Flux, conditions);
        var cost = CoreCost.Of(part, steel, process, shop);
        var loss = new LossBreakdown(
            specific.HysteresisWPerKg * cost.SteelMassKg,
            specific.ClassicalWPerKg * cost.SteelMassKg,
            specific.ExcessWPerKg * cost.SteelMassKg,
            0, 0);
        RuleBreak? rejection = null;
        if (specific.Flags.FirstOrDefault(f => f.Code == "flux-beyond-grade") is { } beyond)
            rejection = new RuleBreak(RuleKind.FluxBeyondGrade, beyond.Message);
        else if (part.MaxLossW is { } cap && loss.TotalW > cap)
            rejection = new RuleBreak(RuleKind.LossAboveLimit, string.Create(CultureInfo.InvariantCulture, $"loss {loss.TotalW:0.##} W exceeds the part's limit of {cap:0.##} W"));
        var attributes = new Dictionary<string, string>
        {
            ["grade"] = steel.Grade,
            ["gauge_mm"] = (steel.ThicknessM * 1e3).ToString("0.00", CultureInfo.InvariantCulture),
            ["process"] = process.Name,
            ["coil"] = $"{steel.Grade} {(steel.ThicknessM * 1e3).ToString("0.00", CultureInfo.InvariantCulture)} mm",
            ["sheets"] = cost.Sheets.ToString(CultureInfo.InvariantCulture),
            ["steel_mass_kg"] = cost.SteelMassKg.ToString("0.###", CultureInfo.InvariantCulture),
        };
        var description = string.Create(CultureInfo.InvariantCulture, $"{steel.Grade} at {steel.ThicknessM * 1e3:0.00} mm, {cost.Sheets} sheets ({cost.SteelMassKg:0.##} kg), {process.Name}");
        return new EvaluatedOption(part.Name, $"{part.Name}/{steel.Grade}/{process.Name}", new CoreChoice(steel.Grade, process.Name), description, attributes, cost.Total, loss, null,
            specific.Flags.Select(f => $"{f.Code}: {f.Message}").ToList(), rejection);
    }
}
