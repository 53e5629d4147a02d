using System.Globalization;
using MathNet.Numerics.LinearAlgebra;
using MathNet.Numerics.Optimization;
using SlotOpt.Tables;

namespace SlotOpt.Lamination;

/// <summary>Fitted hysteresis and excess coefficients with their standard errors, the fit quality and what to distrust.</summary>
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
    IReadOnlyList<double> Predicted,
    IReadOnlyList<string> Warnings);

/// <summary>
/// Fits kh, alpha and ke of P = kh f B^alpha + kc f^2 B^2 F(d/delta) + ke (f B)^1.5 to measured sine losses, with the
/// classical term fixed by theory (kc = pi^2 d^2 / (6 rho rho_m)), on relative residuals (low and high losses weigh
/// alike). For a fixed alpha the model is linear in kh and ke, so alpha is found by a one-dimensional search and kh,
/// ke by non-negative least squares at each alpha (separable least squares: G. H. Golub and V. Pereyra, SIAM J. Numer.
/// Anal. 10(2):413, 1973; non-negativity by the active set of C. L. Lawson and R. J. Hanson, Solving Least Squares
/// Problems, 1974, ch. 23). The work is O(n) per alpha: no n x n matrix is ever formed.
/// </summary>
public static class LossCoefficientFit
{
    /// <summary>Hysteresis exponents searched: Steinmetz exponents of electrical steels lie well inside (common practice, no source).</summary>
    public const double MinExponent = 1.0, MaxExponent = 4.0;

    /// <summary>Worst relative error above which the model is said not to explain the table (common practice, no source).</summary>
    public const double UnexplainedRelativeError = 0.5;

    private const int ExponentScanPoints = 61;

    /// <param name="relativePermeability">For the skin correction of the classical term; null to leave it out.</param>
    /// <exception cref="InputException">Too few or implausible measurements.</exception>
    /// <exception cref="NumericalFailureException">The model cannot explain the table (the message names the likely cause).</exception>
    public static FittedCoefficients Fit(IReadOnlyList<LossMeasurement> data, double thicknessM, double resistivityOhmM, double densityKgPerM3, double? relativePermeability = null)
    {
        if (data.Count < 4) throw new InputException($"a fit of three coefficients needs at least 4 measurements, got {data.Count}");
        foreach (var m in data)
        {
            if (!(m.PeakT > 0 && m.FrequencyHz > 0 && m.LossWPerKg > 0) || !double.IsFinite(m.PeakT + m.FrequencyHz + m.LossWPerKg))
                throw new InputException(F($"measurement (B {m.PeakT} T, f {m.FrequencyHz} Hz, {m.LossWPerKg} W/kg): all three must be positive and finite"));
            if (m.PeakT > 3) throw new InputException(F($"measurement at {m.PeakT} T: no electrical steel reaches 3 T; is the column in gauss or mT?"));
            if (m.LossWPerKg < 1e-6 || m.LossWPerKg > 1e6) throw new InputException(F($"measurement of {Numbers.Of(m.LossWPerKg, "W/kg")} at {m.PeakT} T, {m.FrequencyHz} Hz: outside 1e-6 to 1e6 W/kg; check the unit of w_per_kg"));
        }
        if (data.Select(m => m.PeakT).Distinct().Count() < 2) throw new InputException("the measurements need at least two flux densities to fit the hysteresis exponent");
        foreach (var (value, name) in new[] { (thicknessM, "thickness"), (resistivityOhmM, "resistivity"), (densityKgPerM3, "density") })
            if (!(value > 0) || !double.IsFinite(value)) throw new InputException($"{name} must be positive and finite, got {value}");

        var warnings = PlausibilityWarnings(thicknessM, resistivityOhmM, densityKgPerM3);
        // kc = pi^2 d^2 / (6 rho rho_m) per kg (classical loss of a sine: G. Bertotti, "General properties of power losses in soft ferromagnetic materials", IEEE Trans. Magn. 24(1):621-630, 1988, classical term)
        var kc = Math.PI * Math.PI * thicknessM * thicknessM / (6 * resistivityOhmM * densityKgPerM3);
        var classical = data.Select(m =>
        {
            var skin = relativePermeability is { } mu
                ? SkinEffect.Factor(thicknessM / SkinDepth.Of(resistivityOhmM, m.FrequencyHz, mu))
                : 1.0;
            return kc * m.FrequencyHz * m.FrequencyHz * m.PeakT * m.PeakT * skin;
        }).ToArray();
        if (classical.Any(c => !double.IsFinite(c)))
            throw new NumericalFailureException(F($"the classical term kc f^2 B^2 is not finite (kc = {kc:G3} from thickness {thicknessM:G3} m, resistivity {resistivityOhmM:G3} ohm m, density {densityKgPerM3:G3} kg/m3): check those values"));

        var exceeding = Enumerable.Range(0, data.Count).Where(i => classical[i] >= data[i].LossWPerKg).ToList();
        if (exceeding.Count * 2 > data.Count)
            throw new NumericalFailureException(F($"the model cannot explain the table: the classical term alone (from thickness {Numbers.Of(thicknessM * 1e3, "mm")} and resistivity {Numbers.Of(resistivityOhmM * 1e6, "uOhm m")}) reaches or exceeds the measured loss at {exceeding.Count} of {data.Count} points; check the resistivity and the thickness") + Also(warnings));
        if (exceeding.Count > 0)
        {
            var worst = exceeding.MaxBy(i => classical[i] / data[i].LossWPerKg);
            warnings.Add(F($"the classical term alone (from thickness {Numbers.Of(thicknessM * 1e3, "mm")} and resistivity {Numbers.Of(resistivityOhmM * 1e6, "uOhm m")}) reaches or exceeds the measured loss at {exceeding.Count} of {data.Count} points (by {(classical[worst] / data[worst].LossWPerKg - 1) * 100:0.#} % at {data[worst].PeakT} T, {data[worst].FrequencyHz} Hz): the resistivity or the thickness is likely wrong, and kh, ke are held at zero or above"));
        }
        if (data.Select(m => m.FrequencyHz).Distinct().Count() < 2)
            warnings.Add("all measurements are at one frequency: hysteresis (per cycle) and excess (rising as f^1.5) cannot be separated, so kh and ke are not determined individually; add a second frequency");

        var objective = ObjectiveFunction.ScalarValue(alpha => SolveAtExponent(data, classical, alpha).SumOfSquares);
        var bestScan = Enumerable.Range(0, ExponentScanPoints)
            .Select(k => MinExponent + (MaxExponent - MinExponent) * k / (ExponentScanPoints - 1))
            .MinBy(a => SolveAtExponent(data, classical, a).SumOfSquares);
        var step = (MaxExponent - MinExponent) / (ExponentScanPoints - 1);
        var lower = Math.Max(MinExponent, bestScan - step);
        var upper = Math.Min(MaxExponent, bestScan + step);
        double exponent;
        try { exponent = GoldenSectionMinimizer.Minimum(objective, lower, upper, xTolerance: 1e-10, maxIterations: 1000).MinimizingPoint; }
        catch (OptimizationException e) { throw new NumericalFailureException($"loss coefficient fit: the search for the hysteresis exponent failed ({e.Message})"); }
        var solution = SolveAtExponent(data, classical, exponent);
        if (!double.IsFinite(solution.SumOfSquares)) throw new NumericalFailureException("loss coefficient fit produced a non-finite residual");
        if (exponent - MinExponent < 1e-3 || MaxExponent - exponent < 1e-3)
            warnings.Add(F($"the hysteresis exponent sits at the edge of its search range ({exponent:0.###}; searched {MinExponent} to {MaxExponent}): the data do not fit a Steinmetz term"));
        if (solution.Kh == 0) warnings.Add("kh is held at zero: the data leave no room for hysteresis after the classical and excess terms");
        if (solution.Ke == 0) warnings.Add("ke is held at zero: the data leave no room for excess loss after the hysteresis and classical terms");

        var predicted = Enumerable.Range(0, data.Count).Select(i => Model(data[i], classical[i], solution.Kh, exponent, solution.Ke)).ToArray();
        var worstRelative = Enumerable.Range(0, data.Count).Max(i => Math.Abs(predicted[i] - data[i].LossWPerKg) / data[i].LossWPerKg);
        if (worstRelative > UnexplainedRelativeError)
            throw new NumericalFailureException(F($"the model cannot explain the table: the best fit misses a point by {worstRelative * 100:0} %; check the resistivity, the thickness and the units of the columns") + Also(warnings));
        var mean = data.Average(m => m.LossWPerKg);
        var ssRes = Enumerable.Range(0, data.Count).Sum(i => Math.Pow(predicted[i] - data[i].LossWPerKg, 2));
        var ssTot = data.Sum(m => Math.Pow(m.LossWPerKg - mean, 2));
        var errors = StandardErrors(data, solution.Kh, exponent, solution.Ke, solution.SumOfSquares);
        foreach (var (value, error, name) in new[] { (solution.Kh, errors[0], "kh"), (solution.Ke, errors[2], "ke") })
            if (value > 0 && !(error < 0.5 * value))
                warnings.Add(F($"{name} is poorly determined (standard error {(double.IsFinite(error) ? $"{error / value * 100:0} %" : "unbounded")} of its value)"));
        return new FittedCoefficients(solution.Kh, exponent, solution.Ke, errors[0], errors[1], errors[2],
            ssTot > 0 ? 1 - ssRes / ssTot : 1, worstRelative, kc, predicted, warnings);
    }

    private static double Model(LossMeasurement m, double classical, double kh, double alpha, double ke) =>
        kh * m.FrequencyHz * Math.Pow(m.PeakT, alpha) + classical + ke * Math.Pow(m.FrequencyHz * m.PeakT, 1.5);

    private readonly record struct LinearSolution(double Kh, double Ke, double SumOfSquares);

    /// <summary>
    /// Non-negative least squares of y_i = kh a_i + ke b_i on relative residuals (a_i = f B^alpha / P, b_i = (f B)^1.5 / P,
    /// y_i = (P - P_classical) / P), from the 2 x 2 normal equations; with two unknowns the active set is one of four.
    /// </summary>
    private static LinearSolution SolveAtExponent(IReadOnlyList<LossMeasurement> data, double[] classical, double alpha)
    {
        double saa = 0, sab = 0, sbb = 0, say = 0, sby = 0, syy = 0;
        for (var i = 0; i < data.Count; i++)
        {
            var m = data[i];
            var a = m.FrequencyHz * Math.Pow(m.PeakT, alpha) / m.LossWPerKg;
            var b = Math.Pow(m.FrequencyHz * m.PeakT, 1.5) / m.LossWPerKg;
            var y = (m.LossWPerKg - classical[i]) / m.LossWPerKg;
            saa += a * a; sab += a * b; sbb += b * b; say += a * y; sby += b * y; syy += y * y;
        }
        // SSE(kh, ke) = syy - 2 kh say - 2 ke sby + kh^2 saa + 2 kh ke sab + ke^2 sbb
        double Sse(double kh, double ke) => syy - 2 * kh * say - 2 * ke * sby + kh * kh * saa + 2 * kh * ke * sab + ke * ke * sbb;
        var candidates = new List<(double Kh, double Ke)> { (0, 0) };
        if (saa > 0) candidates.Add((Math.Max(say / saa, 0), 0));
        if (sbb > 0) candidates.Add((0, Math.Max(sby / sbb, 0)));
        var det = saa * sbb - sab * sab;
        if (det > 1e-12 * saa * sbb)
        {
            var kh = (say * sbb - sby * sab) / det;
            var ke = (sby * saa - say * sab) / det;
            if (kh >= 0 && ke >= 0) candidates.Add((kh, ke));
        }
        var best = candidates.MinBy(c => Sse(c.Kh, c.Ke));
        return new LinearSolution(best.Kh, best.Ke, Math.Max(Sse(best.Kh, best.Ke), 0));
    }

    /// <summary>Covariance s^2 (J^T J)^-1 of the relative-residual fit, J the 3-column Jacobian (3 x 3 normal matrix, summed row by row).</summary>
    private static double[] StandardErrors(IReadOnlyList<LossMeasurement> data, double kh, double alpha, double ke, double sumOfSquares)
    {
        if (data.Count <= 3) return [double.NaN, double.NaN, double.NaN];
        var normal = Matrix<double>.Build.Dense(3, 3);
        foreach (var m in data)
        {
            var a = m.FrequencyHz * Math.Pow(m.PeakT, alpha) / m.LossWPerKg;
            double[] row = [a, kh * a * Math.Log(m.PeakT), Math.Pow(m.FrequencyHz * m.PeakT, 1.5) / m.LossWPerKg];
            for (var r = 0; r < 3; r++)
            for (var c = 0; c < 3; c++)
                normal[r, c] += row[r] * row[c];
        }
        var variance = sumOfSquares / (data.Count - 3);
        var inverse = normal.Inverse();
        return Enumerable.Range(0, 3).Select(k => inverse[k, k] >= 0 && double.IsFinite(inverse[k, k]) ? Math.Sqrt(variance * inverse[k, k]) : double.PositiveInfinity).ToArray();
    }

    /// <summary>Values a flag mix-up produces (a thickness in mm read as metres, a resistivity in uOhm cm read as ohm m).</summary>
    private static List<string> PlausibilityWarnings(double thicknessM, double resistivityOhmM, double densityKgPerM3)
    {
        var warnings = new List<string>();
        // laminations run from about 0.05 mm (thin strip) to 1 mm; electrical steels 0.1 to 0.8 uOhm m; density 7000 to 8000 kg/m3 (common practice, no source)
        if (thicknessM > 5e-3 || thicknessM < 1e-5)
            warnings.Add(F($"thickness {Numbers.Of(thicknessM, "m")} is not a lamination gauge (0.05 to 1 mm); was it given without its unit (0.35 read as 0.35 m)? Give e.g. 0.35mm"));
        if (resistivityOhmM > 5e-6 || resistivityOhmM < 5e-8)
            warnings.Add(F($"resistivity {Numbers.Of(resistivityOhmM, "ohm m")} is far from electrical steel (0.1 to 0.8 uOhm m); give e.g. \"0.52 uOhm m\""));
        if (densityKgPerM3 < 5000 || densityKgPerM3 > 10000)
            warnings.Add(F($"density {Numbers.Of(densityKgPerM3, "kg/m3")} is far from steel (7000 to 8000 kg/m3)"));
        return warnings;
    }

    private static string F(FormattableString s) => s.ToString(CultureInfo.InvariantCulture);

    /// <summary>The plausibility warnings, appended to a refusal since they often name its cause.</summary>
    private static string Also(IReadOnlyList<string> warnings) => warnings.Count == 0 ? "" : "; also: " + string.Join("; ", warnings);
}
