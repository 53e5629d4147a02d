using SlotOpt.Design;
using SlotOpt.Input.Toml;

namespace SlotOpt.Input;

/// <summary>
/// Reads [manufacturing]: scrap fraction, stacking cost per sheet, quantity built (set-up costs are
/// shared by that many units), and [manufacturing.processes.NAME]
/// tables that override any field of a built-in cutting process or add a new one.
/// </summary>
public static class ManufacturingReader
{
    private static readonly string[] Fields = ["min_slot_width", "min_strip_over_thickness", "min_ligament_over_thickness", "max_slots", "cost_per_metre_per_mm", "cost_per_slot", "setup_cost", "cost_per_sheet"];

    public static ManufacturingSettings Read(TomlSection? section)
    {
        var defaults = ManufacturingSettings.Default;
        if (section is null) return defaults;
        var scrap = section.OptionalNumber("scrap_fraction") ?? defaults.ScrapFraction;
        if (scrap is < 0 or >= 1) section.Error("scrap_fraction", $"must lie in [0, 1), got {scrap}");
        var stacking = section.OptionalNumber("stacking_cost_per_sheet") ?? defaults.StackingCostPerSheet;
        if (stacking < 0) section.Error("stacking_cost_per_sheet", "must be zero or positive");
        var quantity = section.OptionalInteger("quantity", 1, 100_000_000) ?? defaults.Quantity;
        var processes = new Dictionary<string, CuttingProcess>(defaults.Processes, StringComparer.Ordinal);
        var table = section.OptionalTable("processes");
        if (table is not null)
        {
            foreach (var name in table.KeysWritten())
            {
                var p = table.OptionalTable(name);
                if (p is null) continue;
                processes.TryGetValue(name, out var baseline);
                if (baseline is null)
                    foreach (var field in Fields)
                        if (!p.Has(field)) p.Error(field, $"missing: a new process \"{name}\" needs every field ({string.Join(", ", Fields)})");
                var minSlot = p.PositiveQuantity("min_slot_width", QuantityKind.Length, required: false) ?? baseline?.MinSlotWidthM ?? 0;
                processes[name] = new CuttingProcess(
                    name,
                    minSlot,
                    NonNegative(p, "min_strip_over_thickness") ?? baseline?.MinStripOverThickness ?? 0,
                    NonNegative(p, "min_ligament_over_thickness") ?? baseline?.MinLigamentOverThickness ?? 0,
                    (int)(p.OptionalInteger("max_slots", 0, 100_000) ?? baseline?.MaxSlots ?? 0),
                    NonNegative(p, "cost_per_metre_per_mm") ?? baseline?.CostPerMetrePerMmThickness ?? 0,
                    NonNegative(p, "cost_per_slot") ?? baseline?.CostPerSlot ?? 0,
                    NonNegative(p, "setup_cost") ?? baseline?.SetupCost ?? 0,
                    NonNegative(p, "cost_per_sheet") ?? baseline?.CostPerSheet ?? 0,
                    baseline is null ? "defined in the problem file" : baseline.Origin + "; overridden in the problem file")
                {
                    DamageDepthM = p.PositiveQuantity("damage_depth", QuantityKind.Length, required: false) ?? baseline?.DamageDepthM ?? 0,
                    DamageLossFactor = p.OptionalNumber("damage_loss_factor") is { } k && k >= 1 ? k : baseline?.DamageLossFactor ?? 1,
                };
                p.RejectUnknownKeys();
            }
        }
        section.RejectUnknownKeys();
        return new ManufacturingSettings(processes, scrap, stacking, (int)quantity);
    }

    private static double? NonNegative(TomlSection section, string key)
    {
        var v = section.OptionalNumber(key);
        if (v is < 0) { section.Error(key, "must be zero or positive"); return null; }
        return v;
    }
}
