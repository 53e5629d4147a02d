using System.Numerics;
using MathNet.Numerics.IntegralTransforms;
using SlotOpt.Lamination;
using SlotOpt.Materials;
using SlotOpt.Waveforms;

namespace SlotOpt.Tests.Lamination;

public class SpectralSkinTests
{
    private static ElectricalSteel M270 => MaterialLibrary.BuiltIn.GetSteel("M270-35A", "test");

    private const int Corners = 1000;

    /// <summary>A 1.0 T 50 Hz sine with a +/-0.03 T triangular ripple at 25 kHz: 1000 straight segments per period.</summary>
    private static PiecewiseLinearWaveform SineWithRipple() => new(50, RipplePhases(), RippleValues());

    private static double[] RipplePhases() => Enumerable.Range(0, Corners).Select(k => (double)k / Corners).ToArray();

    private static double[] RippleValues() =>
        Enumerable.Range(0, Corners).Select(k => Math.Sin(2 * Math.PI * k / Corners) + (k % 2 == 0 ? 0.03 : -0.03)).ToArray();

    /// <summary>
    /// Reference: dB/dt of the ripple waveform (constant on each of its equal segments) sampled at 2^21 points a period,
    /// transformed by MathNet's FFT (the dense reference), each harmonic's share of the mean square rate weighted by
    /// the exact slab factor F(x_1 sqrt n) (Lammeraner and Stafl, Eddy Currents, 1964), summed over every order the
    /// samples resolve.
    /// </summary>
    private static double FftSkinFactor(double x1)
    {
        const int samples = 1 << 21;
        var values = RippleValues();
        var rate = new Complex[samples];
        for (var k = 0; k < samples; k++)
        {
            var segment = (int)((k + 0.5) / samples * Corners);
            rate[k] = (values[(segment + 1) % Corners] - values[segment]) * Corners * 50.0;
        }
        Fourier.Forward(rate, FourierOptions.NoScaling);
        double weighted = 0, total = 0;
        for (var n = 1; n < samples / 2; n++)
        {
            var w = 2 * Math.Pow(rate[n].Magnitude / samples, 2);
            weighted += w * SkinEffect.Factor(x1 * Math.Sqrt(n));
            total += w;
        }
        return weighted / total;
    }

    // The PWM case of issue 11: the classical loss with the full-spectrum skin correction against an independent
    // full-spectrum sum by FFT (MathNet.Numerics as the dense reference). Tolerance 3 %: the sampled reference
    // aliases orders near 2^20 and leaves out the tail above them (< 0.1 % of the rate's mean square each).
    [Fact]
    public void Pwm_ripple_classical_loss_matches_a_full_spectrum_sum()
    {
        var wave = SineWithRipple();
        var loss = LaminationLossModel.Evaluate(M270, wave);
        var x1 = M270.ThicknessM / SkinDepth.Of(M270.Resistivity20COhmM, 50, M270.RelativePermeability);
        var reference = ClassicalEddyLoss.PerVolume(1 / M270.Resistivity20COhmM, M270.ThicknessM, wave.MeanSquareRate)
                        * FftSkinFactor(x1) / M270.DensityKgPerM3;
        Assert.Equal(reference, loss.ClassicalWPerKg, reference * 0.03);
        // the uncorrected classical loss is about 2.5 times larger (21.9 against 8.7 W/kg in the issue): the
        // correction must act; 0.5 is far from both.
        Assert.InRange(loss.SkinFactor, 0.2, 0.6);
        Assert.Contains(loss.Flags, f => f.Code == "skin-effect-in-harmonics");
    }

    // Parseval coverage (the brief: 1e-4 of the mean square rate, or a tail that cannot move the factor by 1e-4).
    [Fact]
    public void Pwm_correction_covers_the_spectrum_to_1e_4()
    {
        var wave = SineWithRipple();
        var spectral = SpectralSkinCorrection.Of(wave, M270.ThicknessM, M270.Resistivity20COhmM, M270.RelativePermeability);
        Assert.True(spectral.CoveredFraction >= 1 - 1e-4 || spectral.TailBound <= 1e-4,
            $"covered {spectral.CoveredFraction}, tail bound {spectral.TailBound} after {spectral.OrdersSummed} orders");
        // Parseval on the exact piecewise-linear spectrum: the orders summed hold all but the tail
        var sum = wave.MeanSquareRateByOrder(spectral.OrdersSummed).Sum();
        Assert.Equal(spectral.CoveredFraction, sum / wave.MeanSquareRate, 1e-9);
    }

    // Triangle wave: the share of order n is 2 (8 f Bp)^2 / (pi^2 n^2) for odd n (the square wave of dB/dt,
    // amplitude 4 f Bp, has Fourier amplitudes 4/(pi n) x 4 f Bp: Abramowitz and Stegun 1964, 4.3 series).
    // Tolerance 1e-9 relative: closed form against rotating phasors.
    [Theory]
    [InlineData(1)]
    [InlineData(2)]
    [InlineData(7)]
    [InlineData(1025)]
    [InlineData(40001)]
    public void Triangle_rate_spectrum_is_the_square_wave_series(int order)
    {
        var triangle = new PiecewiseLinearWaveform(50, [0.0, 0.25, 0.75], [0.0, 1.0, -1.0]);
        var w = triangle.MeanSquareRateByOrder(order)[order - 1];
        var expected = order % 2 == 1 ? 2 * Math.Pow(8 * 50 * 1.0, 2) / (Math.PI * Math.PI * order * order) : 0;
        Assert.Equal(expected, w, Math.Max(expected, 1) * 1e-9);
    }

    // G. Bertotti, "General properties of power losses in soft ferromagnetic materials", IEEE Trans. Magn. 24(1):621,
    // 1988: a triangular flux of the same peak and frequency has classical loss 8/pi^2 = 0.810569 and excess loss
    // 0.9129 of the sine's, in the low-frequency limit. The triangle's corners feed harmonics without end, whose skin
    // factor falls below 1 from x_1 sqrt n ~ 1: at 5 Hz that already costs 2e-4 of the ratio (the share of orders
    // beyond ~1000), at 0.05 Hz ~2e-6 (it scales with x_1^2). Tolerance 1e-5: the quoted digits.
    [Fact]
    public void Triangular_flux_has_Bertotti_ratios()
    {
        var sine = LaminationLossModel.Evaluate(M270, new SineWaveform(1.0, 0.05));
        var triangle = LaminationLossModel.Evaluate(M270, new PiecewiseLinearWaveform(0.05, [0.0, 0.25, 0.75], [0.0, 1.0, -1.0]));
        Assert.Equal(8 / (Math.PI * Math.PI), triangle.ClassicalWPerKg / sine.ClassicalWPerKg, 1e-5);
        Assert.Equal(0.810569, triangle.ClassicalWPerKg / sine.ClassicalWPerKg, 1e-5);
        Assert.Equal(0.9129, triangle.ExcessWPerKg / sine.ExcessWPerKg, 1e-4);
    }

    // Harmonic waveforms end: the correction is the exact finite sum. A fundamental and a 3rd harmonic of equal rate
    // amplitude weigh alike, so the factor is (F(x1) + F(x1 sqrt 3)) / 2 (Lammeraner and Stafl's F, superposed).
    // Tolerance 1e-12: same arithmetic.
    [Fact]
    public void Harmonic_waveform_sums_its_own_orders()
    {
        var wave = new HarmonicWaveform(400, [new Harmonic(1, 1.0, 0), new Harmonic(3, 1.0 / 3, 0)]);
        var s = SpectralSkinCorrection.Of(wave, 0.35e-3, 0.52e-6, 2000);
        var x1 = 0.35e-3 / SkinDepth.Of(0.52e-6, 400, 2000);
        Assert.Equal((SkinEffect.Factor(x1) + SkinEffect.Factor(x1 * Math.Sqrt(3))) / 2, s.Factor, 1e-12);
        Assert.Equal(3, s.OrdersSummed);
    }

    // The tail mean of F under a 1/n^2 envelope tends to 1 for small x and to (2/3) F(x_N) = 2/x_N for large x
    // (derived from F's limits, 1 - x^4/630 and 3/x: Lammeraner and Stafl 1964). Tolerances: next terms of each limit.
    [Fact]
    public void Tail_factor_has_its_limits()
    {
        Assert.Equal(1.0, SpectralSkinCorrection.TailFactor(1e-4), 1e-7);
        Assert.Equal(2.0 / 200, SpectralSkinCorrection.TailFactor(200), 1e-6);
    }
}
