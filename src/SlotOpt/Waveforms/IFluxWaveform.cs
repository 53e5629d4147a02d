namespace SlotOpt.Waveforms;

/// <summary>
/// A periodic flux density B(t) in the steel. Gives what the loss terms need: the peak, the
/// peak-to-peak swing, the mean square rate of change, mean powers of |dB/dt| and a spectrum.
/// </summary>
public interface IFluxWaveform
{
    double FundamentalHz { get; }

    /// <summary>Largest |B| over a period (T).</summary>
    double PeakT { get; }

    /// <summary>max B - min B over a period (T).</summary>
    double PeakToPeakT { get; }

    /// <summary>Time average of (dB/dt)^2 over a period (T^2/s^2).</summary>
    double MeanSquareRate { get; }

    /// <summary>Time average of |dB/dt|^p over a period ((T/s)^p).</summary>
    double MeanAbsRatePower(double p);

    /// <summary>The harmonics up to the given order (those with zero amplitude may be left out).</summary>
    IReadOnlyList<Harmonic> Spectrum(int maxOrder);

    /// <summary>
    /// Each order's share of <see cref="MeanSquareRate"/>, (n omega A_n)^2 / 2, for orders 1..maxOrder (fewer when
    /// the spectrum ends sooner, see <see cref="HighestOrder"/>); by Parseval's theorem they sum to MeanSquareRate.
    /// </summary>
    IReadOnlyList<double> MeanSquareRateByOrder(int maxOrder);

    /// <summary>The highest order with a nonzero amplitude, or null when the spectrum never ends (corners in B(t)).</summary>
    int? HighestOrder { get; }

    /// <summary>True for a single sine, for which the loss model has closed forms.</summary>
    bool IsSinusoidal { get; }

    /// <summary>B through one period, sampled finely enough to hold every turning point (T).</summary>
    IReadOnlyList<double> PeriodSamplesT { get; }

    /// <summary>B at a time (T).</summary>
    double ValueAt(double timeS);

    /// <summary>A copy with every flux value multiplied by a factor (same shape and frequency).</summary>
    IFluxWaveform Scaled(double factor);
}
