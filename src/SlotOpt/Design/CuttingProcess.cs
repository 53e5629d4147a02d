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
    string Origin)
{
    /// <summary>Depth of the band along each cut edge whose magnetic properties the cut degrades (m); 0 for none.</summary>
    public double DamageDepthM { get; init; }

    /// <summary>Loss of the degraded band over that of sound steel at the same flux density (1 for none).</summary>
    public double DamageLossFactor { get; init; } = 1;
}
