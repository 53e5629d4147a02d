namespace SlotOpt.Lamination;

/// <summary>A stack of laminations: the steel fraction of its volume sets the steel mass and the sheet count.</summary>
public static class LaminationStack
{
    /// <summary>m = V_gross x stacking factor x density (IEC 60404-13 definition of the stacking factor).</summary>
    public static double SteelMassKg(double grossVolumeM3, double stackingFactor, double densityKgPerM3) =>
        grossVolumeM3 * stackingFactor * densityKgPerM3;

    /// <summary>Sheets in a stack of a given height: height x stacking factor / thickness, rounded up.</summary>
    public static int SheetCount(double stackHeightM, double stackingFactor, double thicknessM) =>
        (int)Math.Ceiling(stackHeightM * stackingFactor / thicknessM - 1e-9);
}
