using SlotOpt.Lamination;
using SlotOpt.Reports;

namespace SlotOpt.Tests.Lamination;

public class LossCoefficientFitTests
{
    // Self-consistency: data generated with known coefficients on the model's own form
    // (G. Bertotti, IEEE Trans. Magn. 24(1):621, 1988 loss separation) must be recovered.
    // Tolerance 1e-6 relative: noise-free data, so only the minimiser's stopping tolerance remains (the golden-section
    // search for alpha stops where the sum of squares is flat to rounding, ~sqrt(machine epsilon)).
    [Fact]
    public void Recovers_known_coefficients()
    {
        const double kh = 0.0152, alpha = 2.13, ke = 7.5e-4, d = 0.35e-3, rho = 0.52e-6, rhoM = 7650;
        var kc = Math.PI * Math.PI * d * d / (6 * rho * rhoM);
        var data = new List<LossMeasurement>();
        foreach (var f in new[] { 50.0, 100, 200, 400 })
        foreach (var b in new[] { 0.5, 0.8, 1.0, 1.2, 1.5 })
            data.Add(new LossMeasurement(b, f, kh * f * Math.Pow(b, alpha) + kc * f * f * b * b + ke * Math.Pow(f * b, 1.5)));

        var fit = LossCoefficientFit.Fit(data, d, rho, rhoM);
        Assert.Equal(kh, fit.HysteresisCoefficient, kh * 1e-6);
        Assert.Equal(alpha, fit.HysteresisExponent, alpha * 1e-6);
        Assert.Equal(ke, fit.ExcessCoefficient, ke * 1e-6);
        Assert.True(fit.WorstRelativeError < 1e-6, $"worst {fit.WorstRelativeError}");
        Assert.Empty(fit.Warnings);
        Assert.True(fit.RSquared > 0.999999);
    }

    // With 1 % multiplicative scatter (a fixed pseudo-random sequence) the fit still describes the data
    // within a few percent, and the coefficients come back within their own standard errors x 4.
    [Fact]
    public void Survives_measurement_scatter()
    {
        const double kh = 0.02, alpha = 1.9, ke = 1.0e-3, d = 0.5e-3, rho = 0.42e-6, rhoM = 7700;
        var kc = Math.PI * Math.PI * d * d / (6 * rho * rhoM);
        var random = new Random(12345);
        var data = new List<LossMeasurement>();
        foreach (var f in new[] { 50.0, 60, 100, 200, 400, 700 })
        foreach (var b in new[] { 0.3, 0.6, 0.9, 1.2, 1.5 })
        {
            var p = kh * f * Math.Pow(b, alpha) + kc * f * f * b * b + ke * Math.Pow(f * b, 1.5);
            data.Add(new LossMeasurement(b, f, p * (1 + 0.01 * (2 * random.NextDouble() - 1))));
        }
        var fit = LossCoefficientFit.Fit(data, d, rho, rhoM);
        Assert.True(fit.WorstRelativeError < 0.03, $"worst {fit.WorstRelativeError}");
        Assert.InRange(fit.HysteresisExponent, alpha - 4 * fit.HysteresisExponentError, alpha + 4 * fit.HysteresisExponentError);
        Assert.InRange(fit.HysteresisCoefficient, kh - 4 * fit.HysteresisCoefficientError, kh + 4 * fit.HysteresisCoefficientError);
    }

    [Fact]
    public void Refuses_too_few_points()
    {
        Assert.Throws<InputException>(() => LossCoefficientFit.Fit([new(1, 50, 1), new(1.5, 50, 2)], 0.35e-3, 0.5e-6, 7650));
    }
}

public class LossCoefficientFitHonestyTests
{
    private const double D = 0.35e-3, Rho = 0.52e-6, RhoM = 7650, Kh = 0.0129, Alpha = 2.47, Ke = 6.8e-4;

    private static List<LossMeasurement> Table(double[] frequencies, double[] fluxes)
    {
        var kc = Math.PI * Math.PI * D * D / (6 * Rho * RhoM); // Bertotti 1988 classical term of a sine
        return frequencies.SelectMany(f => fluxes.Select(b => new LossMeasurement(b, f, Kh * f * Math.Pow(b, Alpha) + kc * f * f * b * b + Ke * Math.Pow(f * b, 1.5)))).ToList();
    }

    // Issue 11: a resistivity too low makes the classical term exceed part of the data; the fit must not return a
    // negative ke. Here the true 0.52 uOhm m is given as 0.15 uOhm m (3.5 x the classical term): every coefficient
    // comes back >= 0 and a warning names the resistivity and thickness, or the fit refuses (exit 4). Exact checks.
    [Fact]
    public void Classical_term_above_the_data_gives_no_negative_coefficient()
    {
        var data = Table([50, 100, 200, 400, 1000], [0.5, 1.0, 1.5]);
        try
        {
            var fit = LossCoefficientFit.Fit(data, D, 0.15e-6, RhoM);
            Assert.True(fit.HysteresisCoefficient >= 0 && fit.ExcessCoefficient >= 0, $"kh {fit.HysteresisCoefficient}, ke {fit.ExcessCoefficient}");
            Assert.Contains(fit.Warnings, w => w.Contains("resistivity") && w.Contains("thickness"));
        }
        catch (NumericalFailureException e)
        {
            Assert.Contains("resistivity", e.Message);
        }
    }

    // Issue 11: one frequency only gave R^2 0.999 and kh +/-170 % without a word. Hysteresis is energy per cycle and
    // excess grows as f^1.5 (Bertotti 1988), so one frequency cannot separate them: the fit must warn. Exact check.
    [Fact]
    public void One_frequency_is_a_warning()
    {
        var fit = LossCoefficientFit.Fit(Table([50], [0.4, 0.7, 1.0, 1.3, 1.6]), D, Rho, RhoM);
        Assert.Contains(fit.Warnings, w => w.Contains("one frequency"));
        Assert.True(fit.HysteresisCoefficient >= 0 && fit.ExcessCoefficient >= 0);
    }

    // A thickness given without its unit (0.35 read as metres) is flagged (common practice: laminations are 0.05 to 1 mm).
    [Fact]
    public void Thickness_read_as_metres_is_flagged_or_refused()
    {
        var data = Table([50, 400], [0.5, 1.0, 1.5]);
        try
        {
            var fit = LossCoefficientFit.Fit(data, 0.35, Rho, RhoM);
            Assert.Contains(fit.Warnings, w => w.Contains("0.35 m"));
        }
        catch (NumericalFailureException e)
        {
            Assert.Contains("thickness", e.Message);
        }
    }

    // Issue 15: a near-zero loss and a resistivity of 1e-300 end with a clear message (InputException or
    // NumericalFailureException), never an overflow or a stack trace.
    [Fact]
    public void Absurd_inputs_end_with_a_clear_message()
    {
        var data = Table([50, 400], [0.5, 1.0, 1.5]);
        data[2] = data[2] with { LossWPerKg = 1e-300 };
        Assert.Contains("w_per_kg", Assert.Throws<InputException>(() => LossCoefficientFit.Fit(data, D, Rho, RhoM)).Message);
        var clean = Table([50, 400], [0.5, 1.0, 1.5]);
        Assert.Contains("resistivity", Assert.Throws<NumericalFailureException>(() => LossCoefficientFit.Fit(clean, D, 1e-300, RhoM)).Message);
    }

    // Issue 15: 50,000 rows must fit without an n x n matrix (memory O(n)); the generated coefficients come back
    // (self-consistency, Bertotti 1988 form) within 1e-5 relative.
    [Fact]
    public void Fifty_thousand_rows_fit()
    {
        var fluxes = Enumerable.Range(0, 500).Select(k => 0.2 + 1.5 * k / 499.0).ToArray();
        var frequencies = Enumerable.Range(0, 100).Select(k => 20 + 10.0 * k).ToArray();
        var data = Table(frequencies, fluxes);
        Assert.Equal(50_000, data.Count);
        var fit = LossCoefficientFit.Fit(data, D, Rho, RhoM);
        Assert.Equal(Kh, fit.HysteresisCoefficient, Kh * 1e-5);
        Assert.Equal(Ke, fit.ExcessCoefficient, Ke * 1e-5);
    }
}
