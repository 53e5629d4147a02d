namespace SlotOpt.Waveforms;

/// <summary>B(t) = sum_n A_n sin(n 2 pi f t + phi_n), a fundamental with a set of harmonics.</summary>
public sealed class HarmonicWaveform : IFluxWaveform
{
    /// <summary>Samples per period per unit of the highest order, for peaks and mean powers of |dB/dt|.</summary>
    private const int SamplesPerOrder = 256;

    private readonly Harmonic[] harmonics;
    private readonly double[] rateSamples;
    private readonly double[] valueSamples;
    private readonly Dictionary<double, double> meanAbsRatePowers = new();

    public HarmonicWaveform(double fundamentalHz, IEnumerable<Harmonic> harmonics)
    {
        if (!(fundamentalHz > 0) || !double.IsFinite(fundamentalHz)) throw new InputException($"frequency must be positive, got {fundamentalHz} Hz");
        this.harmonics = harmonics.ToArray();
        if (this.harmonics.Length == 0) throw new InputException("a harmonic waveform needs at least one harmonic");
        foreach (var h in this.harmonics)
        {
            if (h.Order < 1) throw new InputException($"harmonic order must be 1 or more, got {h.Order}");
            if (!(h.AmplitudeT >= 0) || !double.IsFinite(h.AmplitudeT)) throw new InputException($"harmonic {h.Order} amplitude must be zero or positive, got {h.AmplitudeT} T");
            if (!double.IsFinite(h.PhaseRad)) throw new InputException($"harmonic {h.Order} phase must be finite");
        }
        FundamentalHz = fundamentalHz;

        var omega = 2 * Math.PI * fundamentalHz;
        var samples = SamplesPerOrder * this.harmonics.Max(h => h.Order);
        rateSamples = new double[samples];
        valueSamples = new double[samples];
        var max = double.NegativeInfinity;
        var min = double.PositiveInfinity;
        for (var k = 0; k < samples; k++)
        {
            var theta = 2 * Math.PI * k / samples;
            double b = 0, rate = 0;
            foreach (var h in this.harmonics)
            {
                b += h.AmplitudeT * Math.Sin(h.Order * theta + h.PhaseRad);
                rate += h.Order * omega * h.AmplitudeT * Math.Cos(h.Order * theta + h.PhaseRad);
            }
            rateSamples[k] = rate;
            valueSamples[k] = b;
            max = Math.Max(max, b);
            min = Math.Min(min, b);
        }
        PeakT = Math.Max(Math.Abs(max), Math.Abs(min));
        PeakToPeakT = max - min;
        // Parseval: <(dB/dt)^2> = sum_n (n omega A_n)^2 / 2, exact (orders assumed distinct; repeated orders are summed by sampling instead)
        MeanSquareRate = this.harmonics.Select(h => h.Order).Distinct().Count() == this.harmonics.Length
            ? this.harmonics.Sum(h => Math.Pow(h.Order * omega * h.AmplitudeT, 2) / 2)
            : rateSamples.Average(r => r * r);
    }

    public double FundamentalHz { get; }
    public double PeakT { get; }
    public double PeakToPeakT { get; }
    public double MeanSquareRate { get; }
    public bool IsSinusoidal => false;

    public double MeanAbsRatePower(double p)
    {
        lock (meanAbsRatePowers)
        {
            if (!meanAbsRatePowers.TryGetValue(p, out var value))
            {
                // Trapezoidal rule on a periodic trigonometric polynomial: spectrally accurate for smooth |.|^p away from zeros.
                value = rateSamples.Average(r => Math.Pow(Math.Abs(r), p));
                meanAbsRatePowers[p] = value;
            }
            return value;
        }
    }

    public IReadOnlyList<Harmonic> Spectrum(int maxOrder) => harmonics.Where(h => h.Order <= maxOrder).ToArray();

    /// <summary>Repeated orders add as phasors: A e^(i phi) summed, then (n omega |A|)^2 / 2.</summary>
    public IReadOnlyList<double> MeanSquareRateByOrder(int maxOrder)
    {
        var omega = 2 * Math.PI * FundamentalHz;
        var weights = new double[Math.Min(maxOrder, HighestOrder ?? 0)];
        foreach (var order in harmonics.Select(h => h.Order).Distinct().Where(n => n <= weights.Length))
        {
            var phasor = harmonics.Where(h => h.Order == order).Aggregate(System.Numerics.Complex.Zero,
                (sum, h) => sum + System.Numerics.Complex.FromPolarCoordinates(h.AmplitudeT, h.PhaseRad));
            weights[order - 1] = Math.Pow(order * omega * phasor.Magnitude, 2) / 2;
        }
        return weights;
    }

    public int? HighestOrder => harmonics.Where(h => h.AmplitudeT > 0).Select(h => (int?)h.Order).Max() ?? 1;

    public IReadOnlyList<double> PeriodSamplesT => valueSamples;

    public double ValueAt(double timeS)
    {
        var theta = 2 * Math.PI * FundamentalHz * timeS;
        return harmonics.Sum(h => h.AmplitudeT * Math.Sin(h.Order * theta + h.PhaseRad));
    }

    public IFluxWaveform Scaled(double factor) =>
        new HarmonicWaveform(FundamentalHz, harmonics.Select(h => h with { AmplitudeT = h.AmplitudeT * factor }));
}
