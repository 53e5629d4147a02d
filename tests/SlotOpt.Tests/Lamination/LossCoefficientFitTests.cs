using SlotOpt.Lamination;

namespace SlotOpt.Tests.Lamination;

public class LossCoefficientFitTests
{
    // Self-consistency: data generated with known coefficients on the model's own form
    // (G. Bertotti, IEEE Trans. Magn. 24(1):621, 1988 loss separation) must be recovered.
    // Tolerance 1e-6 relative: noise-free data, so only the minimiser's stopping tolerance remains.
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
        Assert.True(fit.WorstRelativeError < 1e-8);
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
