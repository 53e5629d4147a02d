using SlotOpt.Waveforms;

namespace SlotOpt.Lamination;

/// <summary>Hysteresis loss from Steinmetz coefficients: kh f Bp^alpha for a sine, iGSE otherwise.</summary>
public static class HysteresisLoss
{
    /// <summary>Steinmetz: P = kh f Bp^alpha (W/kg with kh per kg).</summary>
    public static double Steinmetz(double kh, double alpha, double frequencyHz, double peakT) =>
        kh * frequencyHz * Math.Pow(peakT, alpha);

    /// <summary>
    /// Improved generalised Steinmetz equation (K. Venkatachalam, C. R. Sullivan, T. Abdallah, H. Tacca, COMPEL 2002):
    /// P = k_i &lt;|dB/dt|^a&gt; (dB_pp)^(b - a), k_i = k / ((2 pi)^(a-1) int_0^2pi |cos t|^a 2^(b-a) dt),
    /// for P = k f^a Bp^b on a sine. Hysteresis has a = 1 (energy per cycle independent of frequency);
    /// minor loops are counted through &lt;|dB/dt|&gt; without loop splitting.
    /// </summary>
    public static double ImprovedGeneralisedSteinmetz(double k, double frequencyExponent, double fluxExponent, IFluxWaveform waveform)
    {
        var a = frequencyExponent;
        var b = fluxExponent;
        var cosineIntegral = 2 * Math.PI * SineWaveform.MeanAbsCosinePower(a);
        var ki = k / (Math.Pow(2 * Math.PI, a - 1) * cosineIntegral * Math.Pow(2, b - a));
        return ki * waveform.MeanAbsRatePower(a) * Math.Pow(waveform.PeakToPeakT, b - a);
    }
}
