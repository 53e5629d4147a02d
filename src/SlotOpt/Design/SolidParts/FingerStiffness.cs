namespace SlotOpt.Design.SolidParts;

/// <summary>
/// The strip between two slots is a cantilever fixed at the uncut ligament. In a normal AC field the
/// force on its eddy currents pulses at twice the supply frequency, in the plate's plane, so its first
/// in-plane bending mode must sit well above that.
/// </summary>
public static class FingerStiffness
{
    /// <summary>Margin of the first mode over the 2f excitation (common practice, no source).</summary>
    public const double FrequencyMargin = 2.0;

    /// <summary>
    /// First natural frequency of a uniform cantilever, f1 = (beta1 L)^2 / (2 pi L^2) sqrt(E I / (rho A)),
    /// beta1 L = 1.87510 (R. D. Blevins, Formulas for Natural Frequency and Mode Shape, 1979, Table 8-1);
    /// in-plane bending of a strip of width w: I/A = w^2 / 12.
    /// </summary>
    public static double FirstModeHz(double lengthM, double widthM, double youngsModulusPa, double densityKgPerM3)
    {
        const double beta1L = 1.87510407;
        return beta1L * beta1L / (2 * Math.PI * lengthM * lengthM) * Math.Sqrt(youngsModulusPa * widthM * widthM / (12 * densityKgPerM3));
    }

    /// <summary>The longest finger of this width whose first mode stays FrequencyMargin above 2 f.</summary>
    public static double LongestFingerM(double widthM, double supplyFrequencyHz, double youngsModulusPa, double densityKgPerM3)
    {
        var target = FrequencyMargin * 2 * supplyFrequencyHz;
        // f1 = c / L^2, so c is the first mode of a 1 m finger and L = sqrt(c / target)
        return Math.Sqrt(FirstModeHz(1, widthM, youngsModulusPa, densityKgPerM3) / target);
    }
}
