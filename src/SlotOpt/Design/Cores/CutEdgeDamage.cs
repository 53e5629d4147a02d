namespace SlotOpt.Design.Cores;

/// <summary>
/// Loss added by the band of steel a cut degrades along its edge (two-zone model: a band of depth delta_c at K_c times
/// the loss of sound steel, the rest sound; the degradation depths and loss ratios per process are reviewed by
/// M. Bali and A. Muetze, "The degradation depth of non-grain oriented electrical steel sheets of electric machines due
/// to mechanical and laser cutting: a state-of-the-art review", IEEE Trans. Ind. Appl. 55(1):366-375, 2019).
/// </summary>
public static class CutEdgeDamage
{
    /// <summary>
    /// P / P0 = 1 + f (K_c - 1), f = min(1, L delta_c / A) the degraded share of a lamination of area A with cut contour
    /// L per sheet. A strip of width w (two edges) has L / A = 2 / w, so f = 2 delta_c / w: the band model
    /// P(w)/P0 = 1 + 2 (delta_c / w)(K_c - 1) for w > 2 delta_c. Flux is taken as shared evenly by the band and the rest.
    /// </summary>
    public static double LossFactor(double cutLengthPerSheetM, double laminationAreaM2, CuttingProcess process)
    {
        if (process.DamageDepthM <= 0 || process.DamageLossFactor <= 1) return 1;
        var degradedShare = Math.Min(1, cutLengthPerSheetM * process.DamageDepthM / laminationAreaM2);
        return 1 + degradedShare * (process.DamageLossFactor - 1);
    }
}
