namespace SlotOpt.Lamination;

/// <summary>
/// Exact 1-D skin-effect correction of the classical loss of a lamination with a sinusoidal mean flux
/// imposed (linear material): P = P_classical F(x), x = d / delta,
/// F(x) = (3/x)(sinh x - sin x)/(cosh x - cos x) (J. Lammeraner and M. Stafl, Eddy Currents, 1964;
/// R. L. Stoll, The Analysis of Eddy Currents, 1974). F -> 1 - x^4/630 for small x, 3/x for large x.
/// </summary>
public static class SkinEffect
{
    /// <summary>F(x) for x = thickness / skin depth >= 0.</summary>
    public static double Factor(double thicknessOverSkinDepth)
    {
        var x = thicknessOverSkinDepth;
        if (!(x >= 0)) throw new ArgumentOutOfRangeException(nameof(thicknessOverSkinDepth), x, "must be zero or positive");
        if (x == 0) return 1;
        if (x > 40) return 3 / x; // the ratio differs from 1 by ~e^-x there
        if (x < 1)
        {
            // series avoid the cancellation in sinh x - sin x and cosh x - cos x:
            // (sinh x - sin x)/2 = x^3/3! + x^7/7! + ...,  (cosh x - cos x)/2 = x^2/2! + x^6/6! + ...
            double x2 = x * x, x4 = x2 * x2;
            double num = 0, den = 0, termNum = x2 * x / 6, termDen = x2 / 2;
            for (var k = 0; k < 8; k++)
            {
                num += termNum;
                den += termDen;
                // the terms fall by x^4 / 840 or faster: once both are below a quarter of an ulp of their sums, no
                // further term can change either sum (round to nearest), so stopping gives the 8-term result exactly
                if (termNum < num * 1e-17 && termDen < den * 1e-17) break;
                termNum *= x4 / ((4 * k + 4) * (4 * k + 5) * (4 * k + 6) * (4 * k + 7));
                termDen *= x4 / ((4 * k + 3) * (4 * k + 4) * (4 * k + 5) * (4 * k + 6));
            }
            return 3 / x * num / den;
        }
        return 3 / x * (Math.Sinh(x) - Math.Sin(x)) / (Math.Cosh(x) - Math.Cos(x));
    }
}
