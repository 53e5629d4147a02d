namespace SlotOpt.Tests.Plates;

/// <summary>
/// Closed forms of the Saint-Venant torsion analogy used as references (Timoshenko & Goodier, Theory of Elasticity, 3rd ed., 1970, ch. 10; Roark's Formulas for Stress and Strain, 6th ed., Table 20).
/// Thin plate of sheet conductance G in a uniform normal field of rate dB/dt: psi solves
/// laplacian psi = G dB/dt, psi = 0 on the outline; with Prandtl's Phi (laplacian Phi = -2, J = 2 ∫ Phi dA)
/// psi = -G (dB/dt) Phi / 2, so P = ∫ |grad psi|^2 / G dA = G (dB/dt)^2 J / 4; for a sine of peak Bp the
/// time average of (dB/dt)^2 is omega^2 Bp^2 / 2, so P = G omega^2 Bp^2 J / 8.
/// </summary>
internal static class TorsionReference
{
    /// <summary>Time-averaged AC loss (W) for torsion constant J (m^4): P = G omega^2 Bp^2 J / 8.</summary>
    public static double AcLossW(double sheetConductanceS, double peakT, double frequencyHz, double torsionConstantM4)
    {
        double omega = 2 * Math.PI * frequencyHz;
        return sheetConductanceS * omega * omega * peakT * peakT * torsionConstantM4 / 8;
    }

    /// <summary>
    /// Rectangle a (short) x b (long): J = k1 a^3 b, k1 = (1/3)[1 - (192/pi^5)(a/b) sum_{n odd} tanh(n pi b/(2a))/n^5]
    /// (Timoshenko & Goodier, Theory of Elasticity, 3rd ed., 1970, ch. 10, rectangular bars, series).
    /// </summary>
    public static double RectangleK1(double bOverA)
    {
        double sum = 0;
        for (int n = 1; n < 400; n += 2) sum += Math.Tanh(n * Math.PI * bOverA / 2) / Math.Pow(n, 5);
        return (1 - 192 / Math.Pow(Math.PI, 5) / bOverA * sum) / 3;
    }

    public static double Rectangle(double a, double b)
    {
        double s = Math.Min(a, b), l = Math.Max(a, b);
        return RectangleK1(l / s) * s * s * s * l;
    }
}
