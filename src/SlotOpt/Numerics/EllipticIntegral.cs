namespace SlotOpt.Numerics;

/// <summary>
/// Bulirsch's general complete elliptic integral
/// C(kc, p, c, s) = integral over [0, pi/2] of (c cos^2 phi + s sin^2 phi) / ((cos^2 phi + p sin^2 phi) sqrt(cos^2 phi + kc^2 sin^2 phi)) dphi,
/// by Bulirsch's descending Landen / arithmetic-geometric-mean iteration (R. Bulirsch, "Numerical calculation of
/// elliptic integrals and elliptic functions III", Numer. Math. 13 (1969) 305-315, algorithm cel; as printed in
/// N. Derby and S. Olbert, "Cylindrical magnets and ideal solenoids", Am. J. Phys. 78 (2010) 229-235, appendix).
/// K(k) = C(kc, 1, 1, 1) with kc = sqrt(1 - k^2). Domain here p >= 0 (p &lt; 0 is a Cauchy principal value, not needed).
/// </summary>
internal static class EllipticIntegral
{
    // the iteration converges quadratically: stopping at a relative step of 1e-8 leaves an error near 1e-16
    private const double StepTolerance = 1e-8;
    private const int MaxSteps = 60;

    public static double Cel(double kc, double p, double c, double s)
    {
        if (kc == 0 || !double.IsFinite(kc) || !(p >= 0) || !double.IsFinite(p)) throw new NumericalFailureException($"complete elliptic integral: modulus kc = {kc}, p = {p} is outside its domain");
        double k = Math.Abs(kc), pp = p, cc = c, ss = s, em = 1;
        if (p > 0)
        {
            pp = Math.Sqrt(p);
            ss = s / pp;
        }
        else
        {
            double f0 = kc * kc, q = 1 - f0, g0 = 1 - pp;
            f0 -= pp;
            q *= ss - c * pp;
            pp = Math.Sqrt(f0 / g0);
            cc = (c - ss) / g0;
            ss = -q / (g0 * g0 * pp) + cc * pp;
        }
        double f = cc;
        cc += ss / pp;
        double g = k / pp;
        ss = 2 * (ss + f * g);
        pp = g + pp;
        g = em;
        em = k + em;
        double kk = k;
        int steps = 0;
        while (Math.Abs(g - k) > g * StepTolerance)
        {
            if (++steps > MaxSteps) throw new NumericalFailureException($"complete elliptic integral: no convergence for kc = {kc}, p = {p}");
            k = 2 * Math.Sqrt(kk);
            kk = k * em;
            f = cc;
            cc += ss / pp;
            g = kk / pp;
            ss = 2 * (ss + f * g);
            pp = g + pp;
            g = em;
            em = k + em;
        }
        return Math.PI / 2 * (ss + cc * em) / (em * (em + pp));
    }
}
