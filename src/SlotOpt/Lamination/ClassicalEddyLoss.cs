namespace SlotOpt.Lamination;

/// <summary>Classical eddy-current loss of a thin lamination, any waveform, field uniform through the thickness.</summary>
public static class ClassicalEddyLoss
{
    /// <summary>
    /// P/V = sigma d^2 &lt;(dB/dt)^2&gt; / 12 (W/m^3), from E(z) = z dB/dt across the sheet
    /// (G. Bertotti, IEEE Trans. Magn. 24(1):621, 1988; for a sine, pi^2 sigma d^2 f^2 Bp^2 / 6).
    /// </summary>
    public static double PerVolume(double conductivitySPerM, double thicknessM, double meanSquareRate) =>
        conductivitySPerM * thicknessM * thicknessM * meanSquareRate / 12;
}
