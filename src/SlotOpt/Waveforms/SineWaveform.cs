namespace SlotOpt.Waveforms;

/// <summary>B(t) = Bp sin(2 pi f t).</summary>
public sealed class SineWaveform : IFluxWaveform
{
    public SineWaveform(double peakT, double frequencyHz)
    {
        if (!(peakT >= 0) || !double.IsFinite(peakT)) throw new InputException($"peak flux density must be zero or positive, got {peakT} T");
        if (!(frequencyHz > 0) || !double.IsFinite(frequencyHz)) throw new InputException($"frequency must be positive, got {frequencyHz} Hz");
        PeakT = peakT;
        FundamentalHz = frequencyHz;
    }

    public double FundamentalHz { get; }
    public double PeakT { get; }
    public double PeakToPeakT => 2 * PeakT;
    public bool IsSinusoidal => true;

    private double RateAmplitude => 2 * Math.PI * FundamentalHz * PeakT;

    /// <summary>&lt;(dB/dt)^2&gt; = (omega Bp)^2 / 2.</summary>
    public double MeanSquareRate => RateAmplitude * RateAmplitude / 2;

    /// <summary>&lt;|dB/dt|^p&gt; = (omega Bp)^p &lt;|cos|^p&gt;.</summary>
    public double MeanAbsRatePower(double p) => Math.Pow(RateAmplitude, p) * MeanAbsCosinePower(p);

    public IReadOnlyList<Harmonic> Spectrum(int maxOrder) => [new Harmonic(1, PeakT, 0)];

    public IReadOnlyList<double> MeanSquareRateByOrder(int maxOrder) => maxOrder >= 1 ? [MeanSquareRate] : [];

    public int? HighestOrder => 1;

    public IReadOnlyList<double> PeriodSamplesT => [0, PeakT, 0, -PeakT];

    public double ValueAt(double timeS) => PeakT * Math.Sin(2 * Math.PI * FundamentalHz * timeS);

    public IFluxWaveform Scaled(double factor) => new SineWaveform(PeakT * factor, FundamentalHz);

    /// <summary>
    /// Mean of |cos theta|^p over a period: Gamma((p+1)/2) / (sqrt(pi) Gamma(p/2 + 1))
    /// (Abramowitz and Stegun 6.2.1 and 6.2.2, the Beta-function form of the Wallis integral).
    /// </summary>
    public static double MeanAbsCosinePower(double p) =>
        MathNet.Numerics.SpecialFunctions.Gamma((p + 1) / 2) / (Math.Sqrt(Math.PI) * MathNet.Numerics.SpecialFunctions.Gamma(p / 2 + 1));
}
