namespace SlotOpt.Design;

/// <summary>
/// What one cutting process can make and what it costs: the rules a slot pattern must keep and the
/// prices of cutting. Defaults in Design/Data/cutting-processes.csv (each row says its origin);
/// a problem file may override any field.
/// </summary>
public sealed record CuttingProcess(
    string Name,
    double MinSlotWidthM,
    double MinStripOverThickness,
    double MinLigamentOverThickness,
    int MaxSlots,
    double CostPerMetrePerMmThickness,
    double CostPerSlot,
    double SetupCost,
    double CostPerSheet,
    string Origin);
