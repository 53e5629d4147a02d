using SlotOpt.Tables;

namespace SlotOpt.Design;

/// <summary>The built-in cutting processes (laser, waterjet, milling, punching, guillotine, wire EDM).</summary>
public static class CuttingProcessLibrary
{
    public static IReadOnlyDictionary<string, CuttingProcess> BuiltIn => Defaults.Value;

    private static readonly Lazy<IReadOnlyDictionary<string, CuttingProcess>> Defaults = new(Load);

    private static IReadOnlyDictionary<string, CuttingProcess> Load()
    {
        var table = EmbeddedData.ReadCsv("Design", "cutting-processes.csv");
        return table.Rows.Select(r => new CuttingProcess(
                r.Text("process"),
                r.Number("min_slot_width_mm") * 1e-3,
                r.Number("min_strip_over_thickness"),
                r.Number("min_ligament_over_thickness"),
                (int)r.Number("max_slots"),
                r.Number("cost_per_metre_per_mm"),
                r.Number("cost_per_slot"),
                r.Number("setup_cost"),
                r.Number("cost_per_sheet"),
                r.Text("origin"))
            {
                DamageDepthM = r.Number("damage_depth_mm") * 1e-3,
                DamageLossFactor = r.Number("damage_loss_factor"),
            })
            .ToDictionary(p => p.Name, StringComparer.Ordinal);
    }
}
