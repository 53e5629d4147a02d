using SlotOpt.Reports.Json;

namespace SlotOpt.Cli;

/// <summary>`slotopt processes --json`: each cutting process's rules (widths as ratios to the plate thickness), prices and source.</summary>
public sealed record ProcessesJson(IReadOnlyList<ProcessesJson.Process> Processes) : VersionedJson
{
    public sealed record Process(
        string Name,
        double MinSlotWidthMm,
        double MinStripOverThickness,
        double MinLigamentOverThickness,
        int MaxSlots,
        double CostPerMetrePerMmThickness,
        double CostPerSlot,
        double SetupCost,
        double CostPerSheet,
        string Source);
}
