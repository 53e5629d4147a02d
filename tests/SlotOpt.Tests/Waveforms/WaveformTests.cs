using SlotOpt.Input;
using SlotOpt.Lamination;
using SlotOpt.Waveforms;

namespace SlotOpt.Tests.Waveforms;

public class WaveformTests
{
    // Fourier series of a triangle wave of peak Bp: 8 Bp / (pi^2 n^2) for odd n, 0 for even n
    // (e.g. M. Abramowitz and I. A. Stegun, Handbook of Mathematical Functions, 1964, 4.3.x sums; a standard
    // series). Tolerance 1e-12 T: the spectrum of straight segments is computed in closed form.
    [Theory]
    [InlineData(1)]
    [InlineData(2)]
    [InlineData(3)]
    [InlineData(5)]
    [InlineData(11)]
    public void Triangle_spectrum_is_the_textbook_series(int order)
    {
        var triangle = new PiecewiseLinearWaveform(50, [0.0, 0.25, 0.75], [0.0, 1.0, -1.0]);
        var h = triangle.Spectrum(order)[order - 1];
        var expected = order % 2 == 1 ? 8 / (Math.PI * Math.PI * order * order) : 0;
        Assert.Equal(expected, h.AmplitudeT, 1e-12);
    }

    // Parseval: sum_n (n omega A_n)^2 / 2 -> <(dB/dt)^2>; the tail after 2000 odd orders of a triangle is
    // ~ sum 1/n^2 ~ 1/2000 of the total, so within 0.05 %.
    [Fact]
    public void Spectrum_carries_the_mean_square_rate()
    {
        var triangle = new PiecewiseLinearWaveform(400, [0.0, 0.25, 0.75], [0.0, 1.2, -1.2]);
        var omega = 2 * Math.PI * 400;
        var fromSpectrum = triangle.Spectrum(4000).Sum(h => Math.Pow(h.Order * omega * h.AmplitudeT, 2) / 2);
        Assert.Equal(triangle.MeanSquareRate, fromSpectrum, triangle.MeanSquareRate * 5e-4);
        Assert.Equal(16 * 1.2 * 1.2 * 400 * 400, triangle.MeanSquareRate, 1e-6);
    }

    // B = sin t + sin(3t)/3 peaks at t = pi/4 at 2 sqrt(2)/3 (derived: dB/dt = 2 cos 2t cos t = 0).
    // Tolerance 1e-6: dense sampling, error ~ (2 pi / 768)^2.
    [Fact]
    public void Harmonic_peak_is_found()
    {
        var wave = new HarmonicWaveform(50, [new Harmonic(1, 1, 0), new Harmonic(3, 1.0 / 3, 0)]);
        Assert.Equal(2 * Math.Sqrt(2) / 3, wave.PeakT, 1e-4);
        var omega = 2 * Math.PI * 50;
        Assert.Equal(omega * omega / 2 * (1 + 1), wave.MeanSquareRate, 1e-6);
    }

    // C_e = (2 pi)^1.5 <|cos|^1.5> = 8.7634 (Bertotti, IEEE Trans. Magn. 24, 1988, sinusoidal average of the excess term, derived). Tolerance 1e-4: 5-digit value.
    [Fact]
    public void Excess_form_factor_is_8_7634()
    {
        Assert.Equal(8.7634, ExcessLoss.SineFormFactor, 1e-4);
    }

    // iGSE checks (derived from Venkatachalam, Sullivan, Abdallah and Tacca, COMPEL 2002): a sine returns
    // k f^alpha Bp^beta exactly; a symmetric triangle with alpha 1.5, beta 2.5 gives 0.9129 of the sine.
    // Tolerances 1e-12 (identity) and 1e-4 (4-digit reference).
    [Fact]
    public void Improved_generalised_Steinmetz_matches_its_checks()
    {
        var sine = new SineWaveform(0.2, 20e3);
        var expected = 3.0 * Math.Pow(20e3, 1.5) * Math.Pow(0.2, 2.5);
        Assert.Equal(expected, HysteresisLoss.ImprovedGeneralisedSteinmetz(3.0, 1.5, 2.5, sine), expected * 1e-12);
        var triangle = new PiecewiseLinearWaveform(20e3, [0.0, 0.25, 0.75], [0.0, 0.2, -0.2]);
        var ratio = HysteresisLoss.ImprovedGeneralisedSteinmetz(3.0, 1.5, 2.5, triangle) / expected;
        Assert.Equal(0.9129, ratio, 1e-4);
    }

    [Fact]
    public void Waveform_csv_reads_phase_and_time_columns()
    {
        var byPhase = WaveformCsv.Parse("phase,b_t\n0,0\n0.25,1.5\n0.75,-1.5\n1,0\n", "w.csv", 50);
        Assert.Equal(3, byPhase.Phases.Count);
        Assert.Equal(1.5, byPhase.PeakT);
        var byTime = WaveformCsv.Parse("t_s,b_t\n0,0\n0.005,1.5\n0.015,-1.5\n", "w.csv", 50);
        Assert.Equal(byPhase.MeanSquareRate, byTime.MeanSquareRate, 1e-9);
        var e = Assert.Throws<InputException>(() => WaveformCsv.Parse("phase,b_t\n0,0\n0.5,x\n", "w.csv", 50));
        Assert.Contains("w.csv:3", e.Message);
    }
}
