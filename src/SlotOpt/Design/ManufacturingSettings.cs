namespace SlotOpt.Design;

/// <summary>Shop-wide cost settings and the cutting processes available to the parts.</summary>
public sealed record ManufacturingSettings(
    IReadOnlyDictionary<string, CuttingProcess> Processes,
    double ScrapFraction,
    double StackingCostPerSheet,
    int Quantity)
{
    /// <summary>Defaults: 10 % scrap (common practice, no source), 0.003 per sheet stacked (invented demo price), one unit built.</summary>
    public static ManufacturingSettings Default => new(CuttingProcessLibrary.BuiltIn, 0.10, 0.003, 1);

    /// <summary>A process's set-up (tooling, programming) shared by every unit built.</summary>
    public double SetupPerUnit(CuttingProcess process) => process.SetupCost / Quantity;
}
