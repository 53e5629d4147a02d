using SlotOpt.Lamination;
using SlotOpt.Materials;

namespace SlotOpt.Design.Cores;

/// <summary>Build cost of a core: steel bought (with scrap), sheets cut and stacked, tooling set-up.</summary>
public static class CoreCost
{
    public sealed record Breakdown(double SteelMassKg, int Sheets, double Material, double Cutting, double Stacking, double Setup)
    {
        public double Total => Material + Cutting + Stacking + Setup;
    }

    public static Breakdown Of(CorePart part, ElectricalSteel steel, CuttingProcess process, ManufacturingSettings shop)
    {
        var grossVolume = part.LaminationAreaM2 * part.StackHeightM;
        var mass = LaminationStack.SteelMassKg(grossVolume, steel.StackingFactor, steel.DensityKgPerM3);
        var sheets = LaminationStack.SheetCount(part.StackHeightM, steel.StackingFactor, steel.ThicknessM);
        // material: mass bought = mass used / (1 - scrap) is the exact form; (1 + scrap) is the usual quote basis (common practice, no source)
        var material = mass * (1 + shop.ScrapFraction) * steel.PricePerKg;
        // cutting: per sheet a fixed handling price plus the cut length at a price per metre and per mm of thickness
        var cutting = sheets * (process.CostPerSheet + part.CutLengthPerSheetM * process.CostPerMetrePerMmThickness * steel.ThicknessM * 1e3);
        var stacking = sheets * shop.StackingCostPerSheet;
        return new Breakdown(mass, sheets, material, cutting, stacking, shop.SetupPerUnit(process));
    }
}
