using MathNet.Numerics.LinearAlgebra;
using MathNet.Numerics.Optimization;

namespace SlotOpt.Lamination;

/// <summary>Fitted hysteresis and excess coefficients with their standard errors and the fit quality.</summary>
public sealed record FittedCoefficients(
    double HysteresisCoefficient,
    double HysteresisExponent,
    double ExcessCoefficient,
    double HysteresisCoefficientError,
    double HysteresisExponentError,
    double ExcessCoefficientError,
    double RSquared,
    double WorstRelativeError,
    double ClassicalCoefficient,
    IReadOnlyList<double> Predicted);

/// <summary>
/// Fits kh, alpha and ke of P = kh f B^alpha + kc f^2 B^2 F(d/delta) + ke (f B)^1.5 to measured sine losses,
/// with the classical term fixed by theory (kc = pi^2 d^2 / (6 rho rho_m)), by Levenberg-Marquardt on
/// relative residuals (so that low and high losses weigh alike).
/// </summary>
public static class LossCoefficientFit
{
    /// <param name="relativePermeability">For the skin correction of the classical term; null to leave it out.</param>
    public static FittedCoefficients Fit(IReadOnlyList<LossMeasurement> data, double thicknessM, double resistivityOhmM, double densityKgPerM3, double? relativePermeability = null)
    {
        if (data.Count < 4) throw new InputException($"a fit of three coefficients needs at least 4 measurements, got {data.Count}");
        if (data.Select(m => m.PeakT).Distinct().Count() < 2) throw new InputException("the measurements need at least two flux densities to fit the hysteresis exponent");
        foreach (var m in data)
            if (!(m.PeakT > 0 && m.FrequencyHz > 0 && m.LossWPerKg > 0))
                throw new InputException($"measurement (B {m.PeakT} T, f {m.FrequencyHz} Hz, {m.LossWPerKg} W/kg): all three must be positive");

        // kc = pi^2 d^2 / (6 rho rho_m) per kg (classical loss of a sine: G. Bertotti, "General properties of power losses in soft ferromagnetic materials", IEEE Trans. Magn. 24(1):621-630, 1988, classical term)
        var kc = Math.PI * Math.PI * thicknessM * thicknessM / (6 * resistivityOhmM * densityKgPerM3);
        var classical = data.Select(m =>
        {
            var skin = relativePermeability is { } mu
                ? SkinEffect.Factor(thicknessM / SkinDepth.Of(resistivityOhmM, m.FrequencyHz, mu))
                : 1.0;
            return kc * m.FrequencyHz * m.FrequencyHz * m.PeakT * m.PeakT * skin;
        }).ToArray();

        var x = Vector<double>.Build.Dense(data.Count, i => i);
        var y = Vector<double>.Build.Dense(data.Count, i => data[i].LossWPerKg);
        var weight = Vector<double>.Build.Dense(data.Count, i => 1 / (data[i].LossWPerKg * data[i].LossWPerKg));

        Vector<double> Model(Vector<double> p, Vector<double> index) =>
            Vector<double>.Build.Dense(index.Count, k =>
            {
                var m = data[(int)index[k]];
                return p[0] * m.FrequencyHz * Math.Pow(m.PeakT, p[1]) + classical[(int)index[k]] + p[2] * Math.Pow(m.FrequencyHz * m.PeakT, 1.5);
            });

        var start = InitialGuess(data, classical);
        var objective = ObjectiveFunction.NonlinearModel(Model, x, y, weight);
        var minimizer = new LevenbergMarquardtMinimizer(maximumIterations: 1000);
        var result = minimizer.FindMinimum(objective, start);
        if (result.ReasonForExit is ExitCondition.ExceedIterations or ExitCondition.InvalidValues or ExitCondition.ManuallyStopped)
            throw new NumericalFailureException($"loss coefficient fit did not converge ({result.ReasonForExit})");
        var p = result.MinimizingPoint;
        if (p.Any(v => !double.IsFinite(v))) throw new NumericalFailureException("loss coefficient fit produced non-finite coefficients");

        var predicted = Model(p, x);
        var mean = y.Average();
        var ssRes = (y - predicted).PointwisePower(2).Sum();
        var ssTot = y.Select(v => (v - mean) * (v - mean)).Sum();
        var worst = Enumerable.Range(0, data.Count).Max(i => Math.Abs(predicted[i] - y[i]) / y[i]);
        var errors = result.StandardErrors ?? Vector<double>.Build.Dense(3, double.NaN);
        return new FittedCoefficients(p[0], p[1], p[2], errors[0], errors[1], errors[2],
            ssTot > 0 ? 1 - ssRes / ssTot : 1, worst, kc, predicted.ToArray());
    }

    /// <summary>For alpha = 2 the model is linear in kh and ke: solve that weighted least-squares problem to start from.</summary>
    private static Vector<double> InitialGuess(IReadOnlyList<LossMeasurement> data, double[] classical)
    {
        const double alpha = 2;
        var a = Matrix<double>.Build.Dense(data.Count, 2, (i, j) =>
            (j == 0 ? data[i].FrequencyHz * Math.Pow(data[i].PeakT, alpha) : Math.Pow(data[i].FrequencyHz * data[i].PeakT, 1.5)) / data[i].LossWPerKg);
        var b = Vector<double>.Build.Dense(data.Count, i => (data[i].LossWPerKg - classical[i]) / data[i].LossWPerKg);
        var solution = a.Solve(b);
        var kh = solution[0] > 0 && double.IsFinite(solution[0]) ? solution[0] : 0.01;
        var ke = solution[1] > 0 && double.IsFinite(solution[1]) ? solution[1] : 1e-4;
        return Vector<double>.Build.DenseOfArray([kh, alpha, ke]);
    }
}
