using SlotOpt.Design;
using SlotOpt.Design.Cores;
using SlotOpt.Input.Toml;
using SlotOpt.Materials;
using SlotOpt.Runs;
using SlotOpt.Selection;
using SlotOpt.Tables;

namespace SlotOpt.Input;

/// <summary>
/// Reads a problem file (TOML) into a validated <see cref="Problem"/>. Every mistake in the file is
/// collected and reported at once, each naming the file, the line and the key; unknown keys are errors.
/// </summary>
public static class ProblemReader
{
    public static readonly IReadOnlyList<string> GoalNames = ["lowest-owning-cost", "lowest-loss-within-budget", "lowest-cost-within-loss-cap", "trade-off-curve"];

    public static Problem ReadFile(string path)
    {
        var text = InputFile.ReadAllText(path, "problem file");
        return Read(text, path);
    }

    public static Problem Read(string text, string path)
    {
        var fileName = path;
        var errors = new InputErrors();
        var root = new TomlSection(TomlDocumentReader.Read(text, fileName, errors), "", fileName, errors);
        errors.ThrowIfAny(); // a file that does not parse has nothing more to say

        var problem = root.RequiredTable("problem");
        var name = problem?.RequiredString("name") ?? "";
        var currency = problem?.OptionalString("currency") ?? "EUR";
        var goal = ReadGoal(problem);
        problem?.RejectUnknownKeys();

        var economics = ReadEconomics(root.OptionalTable("economics"), currency, errors, fileName);
        var library = MaterialOverridesReader.Read(root.OptionalTable("materials"), MaterialLibrary.BuiltIn);
        var shop = ManufacturingReader.Read(root.OptionalTable("manufacturing"));
        var baseDirectory = Path.GetDirectoryName(Path.GetFullPath(path)) ?? ".";

        var parts = new List<Part>();
        var partSections = root.TableArray("parts", required: true);
        if (partSections.Count == 0 && root.Has("parts")) root.Error("parts", "needs at least one [[parts]] table");
        foreach (var section in partSections)
        {
            var kind = section.RequiredString("kind");
            Part? part = kind switch
            {
                "core" => CorePartReader.Read(section, library, shop, baseDirectory),
                "plate" => PlatePartReader.Read(section, library, shop, baseDirectory),
                null => null,
                _ => Unknown(section, kind),
            };
            if (part is not null) parts.Add(part);
        }
        var names = parts.GroupBy(p => p.Name).Where(g => g.Count() > 1);
        foreach (var duplicate in names)
            errors.Add(fileName, duplicate.Last().Line, "parts", $"two parts are named \"{duplicate.Key}\"; names must differ");

        var limits = ReadLimits(root.OptionalTable("limits"), parts, shop);
        CheckGoalHasItsLimit(goal, limits, problem);
        root.RejectUnknownKeys();
        errors.ThrowIfAny();
        return new Problem(name, path, goal, economics, limits, shop, library, parts, errors.Warnings);
    }

    private static Part? Unknown(TomlSection section, string kind)
    {
        section.Error("kind", $"\"{kind}\" is not a part kind; use \"core\" or \"plate\"{NameSuggestion.DidYouMean(kind, ["core", "plate"])}");
        return null;
    }

    private static Objective ReadGoal(TomlSection? problem)
    {
        var text = problem?.OptionalChoice("objective", GoalNames.ToArray()) ?? "lowest-owning-cost";
        return text switch
        {
            "lowest-loss-within-budget" => Objective.LowestLossWithinBudget,
            "lowest-cost-within-loss-cap" => Objective.LowestCostWithinLossCap,
            "trade-off-curve" => Objective.TradeOffCurve,
            _ => Objective.LowestOwningCost,
        };
    }

    private static Economics ReadEconomics(TomlSection? section, string currency, InputErrors errors, string fileName)
    {
        if (section is null) return new Economics(currency, 0, null, null, null, null);
        var valuePerWatt = section.OptionalNumber("value_per_watt");
        var noLoadValue = section.OptionalNumber("no_load_value_per_watt");
        var loadValue = section.OptionalNumber("load_value_per_watt");
        var price = section.OptionalNumber("energy_price_per_kwh");
        var hours = section.OptionalNumber("hours_per_year");
        var years = section.OptionalNumber("years");
        var rate = section.OptionalNumber("discount_rate");
        var loadFactor = section.OptionalNumber("load_factor");
        var perUnitLoad = section.OptionalNumber("per_unit_load");
        section.RejectUnknownKeys();
        var given = new[] { valuePerWatt is not null, noLoadValue is not null || loadValue is not null, price is not null }.Count(g => g);
        if (given > 1)
            section.Error(valuePerWatt is not null ? "value_per_watt" : "no_load_value_per_watt", "give one of: value_per_watt; no_load_value_per_watt with load_value_per_watt; or energy_price_per_kwh with hours_per_year, years and discount_rate");
        if ((loadFactor is not null || perUnitLoad is not null) && price is null)
            section.Error(loadFactor is not null ? "load_factor" : "per_unit_load", "derives the load-loss value from an energy price: give energy_price_per_kwh with it");
        if (valuePerWatt is { } v)
        {
            if (v < 0) section.Error("value_per_watt", "must be zero or positive");
            return new Economics(currency, Math.Max(v, 0), null, null, null, null);
        }
        if (noLoadValue is not null || loadValue is not null)
        {
            if (noLoadValue is null) section.Error("no_load_value_per_watt", "missing: give it with load_value_per_watt");
            if (loadValue is null) section.Error("load_value_per_watt", "missing: give it with no_load_value_per_watt");
            if (noLoadValue < 0) section.Error("no_load_value_per_watt", "must be zero or positive");
            if (loadValue < 0) section.Error("load_value_per_watt", "must be zero or positive");
            return new Economics(currency, Math.Max(noLoadValue ?? 0, 0), null, null, null, null) { LoadValuePerWatt = Math.Max(loadValue ?? 0, 0) };
        }
        if (price is null)
        {
            if (hours is not null || years is not null || rate is not null)
                section.Error("energy_price_per_kwh", "missing: hours_per_year, years and discount_rate need an energy price");
            return new Economics(currency, 0, null, null, null, null);
        }
        var ok = true;
        if (price < 0) { section.Error("energy_price_per_kwh", "must be zero or positive"); ok = false; }
        if (hours is null || hours <= 0 || hours > 8784) { section.Error("hours_per_year", "required with an energy price, between 0 and 8784 h"); ok = false; }
        if (years is null || years <= 0 || years > 100) { section.Error("years", "required with an energy price, between 0 and 100"); ok = false; }
        if (rate is null || rate <= -0.5 || rate > 1) { section.Error("discount_rate", "required with an energy price, as a fraction between -0.5 and 1 (0.06 for 6 %)"); ok = false; }
        if (loadFactor is { } lf && !(lf > 0 && lf <= 1)) { section.Error("load_factor", "must be in (0, 1]: mean load over peak load"); ok = false; }
        if (perUnitLoad is { } pul && !(pul > 0 && pul <= 2)) { section.Error("per_unit_load", "must be in (0, 2]: peak load over the rating the plate losses were given at"); ok = false; }
        if (!ok) return new Economics(currency, 0, price, hours, years, rate);
        var value = LossCapitalisation.ValuePerWatt(price.Value, hours!.Value, rate!.Value, years!.Value);
        if (loadFactor is null && perUnitLoad is null) return new Economics(currency, value, price, hours, years, rate);
        var share = LossCapitalisation.LoadEnergyShare(perUnitLoad ?? 1, loadFactor ?? 1);
        return new Economics(currency, value, price, hours, years, rate) { LoadValuePerWatt = value * share, LoadEnergyShare = share };
    }

    private static SharedLimits ReadLimits(TomlSection? section, IReadOnlyList<Part> parts, ManufacturingSettings shop)
    {
        if (section is null) return new SharedLimits();
        var budget = section.OptionalNumber("budget");
        if (budget is { } b && !(b > 0)) section.Error("budget", "must be positive");
        var lossCap = section.PositiveQuantity("total_loss_cap", QuantityKind.Power, required: false);
        var maxProcesses = section.OptionalInteger("max_processes", 1, shop.Processes.Count);
        var groups = new List<IReadOnlyList<string>>();
        section.AcceptOldName("coil_groups", "same_steel_coil");
        if (section.Has("same_steel_coil"))
        {
            var raw = section.GroupList("same_steel_coil");
            foreach (var group in raw)
            {
                foreach (var member in group)
                {
                    var part = parts.FirstOrDefault(p => p.Name == member);
                    if (part is null) section.Error("same_steel_coil", $"no part is named \"{member}\"{NameSuggestion.DidYouMean(member, parts.Select(p => p.Name))}");
                    else if (part is not CorePart) section.Error("same_steel_coil", $"\"{member}\" is a plate; same_steel_coil joins laminated cores cut from one steel coil");
                }
                if (group.Count < 2) section.Error("same_steel_coil", "a group of parts cut from the same steel coil needs at least two parts");
                groups.Add(group);
            }
        }
        section.RejectUnknownKeys();
        return new SharedLimits { Budget = budget, TotalLossCapW = lossCap, CoilGroups = groups, MaxDistinctProcesses = (int?)maxProcesses };
    }

    private static void CheckGoalHasItsLimit(Objective goal, SharedLimits limits, TomlSection? problem)
    {
        if (problem is null) return;
        if (goal == Objective.LowestLossWithinBudget && limits.Budget is null)
            problem.Error("objective", "lowest-loss-within-budget needs [limits] budget");
        if (goal == Objective.LowestCostWithinLossCap && limits.TotalLossCapW is null)
            problem.Error("objective", "lowest-cost-within-loss-cap needs [limits] total_loss_cap");
    }
}
