using System.Numerics;

namespace SlotOpt.Waveforms;

/// <summary>
/// A periodic B(t) through samples joined by straight lines (PWM-like, trapezoidal, triangular),
/// the last sample joined back to the first one period later. Rates of change are constant on each
/// segment, so the mean powers of |dB/dt| and the spectrum are exact.
/// </summary>
public sealed class PiecewiseLinearWaveform : IFluxWaveform
{
    private readonly double[] phases;   // sample times as fractions of the period, 0 <= phase < 1, increasing
    private readonly double[] valuesT;
    private readonly double[] durations; // segment i runs from sample i to sample i+1 (wrapping), as fractions of the period
    private readonly double[] ratesTPerS;
    private readonly object spectrumLock = new();
    private Harmonic[] spectrum = [];
    private double[] rateWeights = [];

    /// <param name="fundamentalHz">1 / period.</param>
    /// <param name="phases">Sample times as fractions of the period, strictly increasing within [0, 1).</param>
    /// <param name="valuesT">B at each sample (T).</param>
    public PiecewiseLinearWaveform(double fundamentalHz, IReadOnlyList<double> phases, IReadOnlyList<double> valuesT)
    {
        if (!(fundamentalHz > 0) || !double.IsFinite(fundamentalHz)) throw new InputException($"frequency must be positive, got {fundamentalHz} Hz");
        if (phases.Count != valuesT.Count) throw new ArgumentException("phases and values differ in length");
        if (phases.Count < 2) throw new InputException("a piecewise-linear waveform needs at least two samples");
        for (var i = 0; i < phases.Count; i++)
        {
            if (!double.IsFinite(phases[i]) || phases[i] < 0 || phases[i] >= 1) throw new InputException($"sample {i + 1}: phase {phases[i]} is outside [0, 1)");
            if (!double.IsFinite(valuesT[i])) throw new InputException($"sample {i + 1}: flux density is not finite");
            if (i > 0 && !(phases[i] > phases[i - 1])) throw new InputException($"sample {i + 1}: times must increase");
        }
        FundamentalHz = fundamentalHz;
        this.phases = phases.ToArray();
        this.valuesT = valuesT.ToArray();
        var n = this.phases.Length;
        durations = new double[n];
        ratesTPerS = new double[n];
        var period = 1 / fundamentalHz;
        for (var i = 0; i < n; i++)
        {
            var next = (i + 1) % n;
            durations[i] = (next == 0 ? 1 + this.phases[0] : this.phases[next]) - this.phases[i];
            ratesTPerS[i] = (this.valuesT[next] - this.valuesT[i]) / (durations[i] * period);
        }
        PeakT = this.valuesT.Max(Math.Abs);
        PeakToPeakT = this.valuesT.Max() - this.valuesT.Min();
        MeanSquareRate = MeanAbsRatePower(2);
    }

    public double FundamentalHz { get; }
    public double PeakT { get; }
    public double PeakToPeakT { get; }
    public double MeanSquareRate { get; }
    public bool IsSinusoidal => false;
    public IReadOnlyList<double> Phases => phases;
    public IReadOnlyList<double> ValuesT => valuesT;

    /// <summary>&lt;|dB/dt|^p&gt; = sum_i (dt_i / T) |s_i|^p, exact for straight segments.</summary>
    public double MeanAbsRatePower(double p)
    {
        double sum = 0;
        for (var i = 0; i < durations.Length; i++) sum += durations[i] * Math.Pow(Math.Abs(ratesTPerS[i]), p);
        return sum;
    }

    /// <summary>
    /// Exact Fourier series. With complex coefficients c_n of B, n omega i c_n is the coefficient of dB/dt,
    /// which is piecewise constant: (1/T) sum_i s_i (e^{-i n w t_i} - e^{-i n w t_i+1}) / (i n w).
    /// Amplitude of sin(n w t + phi) is 2|c_n|; phi = arg(c_n) + pi/2.
    /// </summary>
    public IReadOnlyList<Harmonic> Spectrum(int maxOrder)
    {
        lock (spectrumLock)
        {
            if (spectrum.Length < maxOrder) spectrum = ComputeSpectrum(maxOrder);
            return spectrum.Take(maxOrder).ToArray();
        }
    }

    private Harmonic[] ComputeSpectrum(int maxOrder)
    {
        var result = new Harmonic[maxOrder];
        var omega = 2 * Math.PI * FundamentalHz;
        var period = 1 / FundamentalHz;
        for (var order = 1; order <= maxOrder; order++)
        {
            var nw = order * omega;
            var rateCoefficient = Complex.Zero;
            for (var i = 0; i < durations.Length; i++)
            {
                var t0 = phases[i] * period;
                var t1 = t0 + durations[i] * period;
                rateCoefficient += ratesTPerS[i] * (Complex.Exp(-Complex.ImaginaryOne * nw * t0) - Complex.Exp(-Complex.ImaginaryOne * nw * t1)) / (Complex.ImaginaryOne * nw);
            }
            rateCoefficient /= period;
            var c = rateCoefficient / (Complex.ImaginaryOne * nw);
            result[order - 1] = new Harmonic(order, 2 * c.Magnitude, c.Phase + Math.PI / 2);
        }
        return result;
    }

    /// <summary>Orders between exact restarts of the rotating phasors (keeps their rounding drift below 1e-12).</summary>
    private const int PhasorRestartOrders = 1024;

    /// <summary>
    /// dB/dt is piecewise constant, jumping by J_i = s_i - s_(i-1) at phase t_i, so its Fourier coefficient is exactly
    /// R_n = sum_i J_i e^(-i 2 pi n t_i) / (i 2 pi n) (integration by parts over one period) and the order's share
    /// of the mean square rate is 2 |R_n|^2. The phasors e^(-i 2 pi n t_i) rotate by one multiplication per order.
    /// </summary>
    public IReadOnlyList<double> MeanSquareRateByOrder(int maxOrder)
    {
        lock (spectrumLock)
        {
            if (rateWeights.Length < maxOrder) rateWeights = ExtendRateWeights(rateWeights, Math.Max(maxOrder, 2 * rateWeights.Length));
            return new ArraySegment<double>(rateWeights, 0, Math.Max(maxOrder, 0));
        }
    }

    public int? HighestOrder => null;

    private double[] ExtendRateWeights(double[] known, int orders)
    {
        var n = phases.Length;
        var jumps = new List<(double Phase, double Jump)>();
        for (var i = 0; i < n; i++)
        {
            var jump = ratesTPerS[i] - ratesTPerS[(i - 1 + n) % n];
            if (jump != 0) jumps.Add((phases[i], jump));
        }
        var result = new double[orders];
        Array.Copy(known, result, known.Length);
        var count = jumps.Count;
        var jumpSizes = jumps.Select(j => j.Jump).ToArray();
        var stepRe = new double[count];
        var stepIm = new double[count];
        var re = new double[count];
        var im = new double[count];
        for (var k = 0; k < count; k++)
        {
            stepRe[k] = Math.Cos(2 * Math.PI * jumps[k].Phase);
            stepIm[k] = -Math.Sin(2 * Math.PI * jumps[k].Phase);
        }
        for (var order = known.Length + 1; order <= orders; order++)
        {
            if (order == known.Length + 1 || order % PhasorRestartOrders == 0)
                for (var k = 0; k < count; k++)
                {
                    var angle = 2 * Math.PI * ((double)order * jumps[k].Phase % 1.0);
                    re[k] = Math.Cos(angle);
                    im[k] = -Math.Sin(angle);
                }
            double sumRe = 0, sumIm = 0;
            for (var k = 0; k < count; k++)
            {
                sumRe += jumpSizes[k] * re[k];
                sumIm += jumpSizes[k] * im[k];
                var nextRe = re[k] * stepRe[k] - im[k] * stepIm[k];
                im[k] = re[k] * stepIm[k] + im[k] * stepRe[k];
                re[k] = nextRe;
            }
            var scale = 2 * Math.PI * order;
            result[order - 1] = 2 * (sumRe * sumRe + sumIm * sumIm) / (scale * scale);
        }
        return result;
    }

    public IReadOnlyList<double> PeriodSamplesT => valuesT;

    public double ValueAt(double timeS)
    {
        var phase = timeS * FundamentalHz;
        phase -= Math.Floor(phase);
        var n = phases.Length;
        for (var i = 0; i < n; i++)
        {
            var start = phases[i];
            var local = phase - start;
            if (local < 0) local += 1;
            if (local <= durations[i]) return valuesT[i] + (valuesT[(i + 1) % n] - valuesT[i]) * local / durations[i];
        }
        return valuesT[0];
    }

    public IFluxWaveform Scaled(double factor) => new PiecewiseLinearWaveform(FundamentalHz, phases, valuesT.Select(v => v * factor).ToArray());
}
