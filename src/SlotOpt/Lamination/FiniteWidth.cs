namespace SlotOpt.Lamination;

/// <summary>
/// Correction of the classical loss for a lamination feature of finite width w (a tooth, a strip),
/// flux along its length: by the Prandtl membrane analogy the loss per length is sigma (dB/dt)^2 J_t / 4,
/// J_t the Saint-Venant torsion constant of the a x b section (S. P. Timoshenko and J. N. Goodier,
/// Theory of Elasticity, 3rd ed., 1970, ch. 10, torsion of rectangular bars).
/// </summary>
public static class FiniteWidth
{
    /// <summary>
    /// k1 of J_t = k1 a^3 b for a rectangle a (short side) x b (long side):
    /// k1 = (1/3)[1 - (192/pi^5)(a/b) sum_{n odd} tanh(n pi b / (2a)) / n^5] (Timoshenko and Goodier, ch. 10).
    /// </summary>
    public static double TorsionCoefficient(double shortSide, double longSide)
    {
        if (!(shortSide > 0) || !(longSide >= shortSide)) throw new ArgumentOutOfRangeException(nameof(shortSide), "need 0 < short side <= long side");
        var ratio = shortSide / longSide;
        double sum = 0;
        for (var n = 1; n <= 99; n += 2)
        {
            var term = Math.Tanh(n * Math.PI / (2 * ratio)) / Math.Pow(n, 5);
            sum += term;
            if (term < 1e-17 * sum) break;
        }
        return (1 - 192 / Math.Pow(Math.PI, 5) * ratio * sum) / 3;
    }

    /// <summary>
    /// Classical loss of a d x w section over that of an infinitely wide sheet of thickness d:
    /// 3 k1 (a/d)^2 with a = min(d, w), since P/V = sigma (dB/dt)^2 k1 a^2 / 4 against sigma (dB/dt)^2 d^2 / 12.
    /// </summary>
    public static double Factor(double thicknessM, double widthM)
    {
        if (!(thicknessM > 0)) throw new ArgumentOutOfRangeException(nameof(thicknessM), thicknessM, "must be positive");
        if (double.IsPositiveInfinity(widthM)) return 1;
        if (!(widthM > 0)) throw new ArgumentOutOfRangeException(nameof(widthM), widthM, "must be positive");
        var a = Math.Min(thicknessM, widthM);
        var b = Math.Max(thicknessM, widthM);
        var relative = a / thicknessM;
        return 3 * TorsionCoefficient(a, b) * relative * relative;
    }
}
