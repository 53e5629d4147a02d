using SlotOpt.Materials;
using SlotOpt.Plates.Geometry;

namespace SlotOpt.Design.SolidParts;

/// <summary>Build cost of a plate: material bought (with scrap), the outline and slots cut, set-up.</summary>
public static class PlateCost
{
    public sealed record Breakdown(double MassKg, double Material, double Cutting, double Setup)
    {
        public double Total => Material + Cutting + Setup;
    }

    /// <param name="slotCutLengthM">Total length of cut the slots need (see <see cref="SlotCutLength"/>).</param>
    public static Breakdown Of(Polygon outline, double thicknessM, Conductor material, CuttingProcess process, double slotCutLengthM, int slotCount, ManufacturingSettings shop)
    {
        // the slots' material is bought with the plate, so mass priced = outline area x t x density
        var mass = outline.Area * thicknessM * material.DensityKgPerM3;
        var materialCost = mass * (1 + shop.ScrapFraction) * material.PricePerKg;
        var cutLength = Perimeter(outline) + slotCutLengthM;
        var cutting = cutLength * process.CostPerMetrePerMmThickness * thicknessM * 1e3 + slotCount * process.CostPerSlot;
        return new Breakdown(mass, materialCost, cutting, shop.SetupPerUnit(process));
    }

    /// <summary>
    /// Cut length of one slot: a slot no wider than 1.5 kerfs is one pass along its length; a wider one is
    /// cut round its contour, 2 x length + width (common practice, no source).
    /// </summary>
    public static double SlotCutLength(double lengthM, double widthM, CuttingProcess process) =>
        widthM <= 1.5 * process.MinSlotWidthM ? lengthM : 2 * lengthM + widthM;

    public static double Perimeter(Polygon outline)
    {
        double sum = 0;
        var v = outline.Vertices;
        for (int i = 0, j = v.Count - 1; i < v.Count; j = i++) sum += (v[i] - v[j]).Length;
        return sum;
    }
}
