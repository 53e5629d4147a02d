using SlotOpt.Waveforms;

namespace SlotOpt.Lamination;

/// <summary>Excess (anomalous) loss of Bertotti's loss separation.</summary>
public static class ExcessLoss
{
    /// <summary>
    /// C_e = (2 pi)^1.5 &lt;|cos|^1.5&gt; = 8.7634, so that ke (f Bp)^1.5 on a sine equals ke/C_e &lt;|dB/dt|^1.5&gt;
    /// (G. Bertotti, IEEE Trans. Magn. 24(1):621, 1988, who rounds the prefactor to 8).
    /// </summary>
    public static readonly double SineFormFactor = Math.Pow(2 * Math.PI, 1.5) * Waveforms.SineWaveform.MeanAbsCosinePower(1.5);

    /// <summary>P = ke/C_e &lt;|dB/dt|^1.5&gt; (W/kg with ke per kg); on a sine, ke (f Bp)^1.5.</summary>
    public static double FromMeanRate(double ke, double meanAbsRatePower1p5) => ke / SineFormFactor * meanAbsRatePower1p5;

    /// <summary>P = ke (f Bp)^1.5 for a sine.</summary>
    public static double Sine(double ke, double frequencyHz, double peakT) => ke * Math.Pow(frequencyHz * peakT, 1.5);
}
