using System.Runtime.CompilerServices;
using SlotOpt.Waveforms;

namespace SlotOpt.Lamination;

/// <summary>Hysteresis loss from Steinmetz coefficients: kh f Bp^alpha for a sine, iGSE otherwise.</summary>
public static class HysteresisLoss
{
    /// <summary>The rainflow loops of each waveform, counted once (a waveform is immutable).</summary>
    private static readonly ConditionalWeakTable<IFluxWaveform, IReadOnlyList<FluxCycle>> Loops = new();

    /// <summary>Steinmetz: P = kh f Bp^alpha (W/kg with kh per kg).</summary>
    public static double Steinmetz(double kh, double alpha, double frequencyHz, double peakT) =>
        kh * frequencyHz * Math.Pow(peakT, alpha);

    /// <summary>
    /// Rate-independent hysteresis of any waveform: each loop found by rainflow counting (ASTM E1049-85)
    /// costs kh (dB_loop / 2)^beta per occurrence, P = f sum_j w_j kh (dB_j / 2)^beta. This is the iGSE with
    /// frequency exponent 1 and its loop splitting (Venkatachalam et al., COMPEL 2002): a loop's energy is
    /// k_i 2 dB (dB)^(beta - 1) with k_i = kh / 2^(beta + 1). A sine gives kh f Bp^beta exactly.
    /// </summary>
    public static double LoopSplit(double kh, double beta, IFluxWaveform waveform)
    {
        double perPeriod = 0;
        foreach (var cycle in Loops.GetValue(waveform, w => RainflowCycles.Count(w.PeriodSamplesT)))
            perPeriod += cycle.Weight * kh * Math.Pow(cycle.RangeT / 2, beta);
        return waveform.FundamentalHz * perPeriod;
    }

    /// <summary>
    /// Improved generalised Steinmetz equation (K. Venkatachalam, C. R. Sullivan, T. Abdallah, H. Tacca, COMPEL 2002):
    /// P = k_i &lt;|dB/dt|^a&gt; (dB_pp)^(b - a), k_i = k / ((2 pi)^(a-1) int_0^2pi |cos t|^a 2^(b-a) dt),
    /// for P = k f^a Bp^b on a sine. Hysteresis has a = 1 (energy per cycle independent of frequency);
    /// this single-loop form suits waveforms without minor loops (use <see cref="LoopSplit"/> for those).
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
