using SlotOpt.Lamination;
using SlotOpt.Waveforms;

namespace SlotOpt.Tests.Lamination;

public class ClassicalEddyLossTests
{
    // Worked value computed from P = pi^2 sigma d^2 f^2 Bp^2 / 6 (G. Bertotti, "General properties of power
    // losses in soft ferromagnetic materials", IEEE Trans. Magn. 24(1):621-630, 1988, classical term): sigma 2.0e6 S/m, d 0.50 mm, 50 Hz, 1.5 T -> 4626.4 W/m^3.
    // Tolerance 1e-5 relative: the reference is printed to 5 digits.
    [Fact]
    public void Sine_matches_the_worked_example()
    {
        var wave = new SineWaveform(1.5, 50);
        var p = ClassicalEddyLoss.PerVolume(2.0e6, 0.50e-3, wave.MeanSquareRate);
        Assert.Equal(4626.4, p, 4626.4 * 1e-5);
    }

    // Computed from the same Bertotti 1988 classical term, per kg pi^2 d^2 f^2 Bp^2 / (6 rho rho_m), for an M270-35A-like sheet: rho 0.52 uOhm m, d 0.35 mm, 7650 kg/m^3:
    // 0.285 W/kg at 1.5 T 50 Hz and 8.10 W/kg at 1.0 T 400 Hz. Tolerance 0.2 %: 3-digit reference.
    [Theory]
    [InlineData(1.5, 50, 0.285)]
    [InlineData(1.0, 400, 8.10)]
    public void Per_mass_matches_the_tabulated_grade_like_values(double peakT, double frequencyHz, double expectedWPerKg)
    {
        var wave = new SineWaveform(peakT, frequencyHz);
        var pPerKg = ClassicalEddyLoss.PerVolume(1 / 0.52e-6, 0.35e-3, wave.MeanSquareRate) / 7650;
        Assert.Equal(expectedWPerKg, pPerKg, expectedWPerKg * 2e-3);
    }

    // A triangular flux of the same peak and frequency has <(dB/dt)^2> = 16 Bp^2 f^2 against 2 pi^2 f^2 Bp^2
    // for the sine, so its classical loss is 8/pi^2 = 0.8106 of the sine's (derived from the
    // waveform-independent form of Bertotti 1988). Tolerance 1e-12: exact arithmetic on straight segments.
    [Fact]
    public void Triangular_flux_loses_eight_over_pi_squared_of_the_sine()
    {
        var triangle = new PiecewiseLinearWaveform(50, [0.0, 0.25, 0.75], [0.0, 1.5, -1.5]);
        var sine = new SineWaveform(1.5, 50);
        var ratio = ClassicalEddyLoss.PerVolume(2e6, 0.5e-3, triangle.MeanSquareRate) / ClassicalEddyLoss.PerVolume(2e6, 0.5e-3, sine.MeanSquareRate);
        Assert.Equal(8 / (Math.PI * Math.PI), ratio, 1e-12);
    }
}
