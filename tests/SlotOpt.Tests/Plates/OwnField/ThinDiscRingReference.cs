using System.Numerics;
using MathNet.Numerics.LinearAlgebra;

namespace SlotOpt.Tests.Plates.OwnField;

/// <summary>
/// Independent high-resolution reference for a thin disc (radius a, sheet conductance G) in a uniform
/// normal AC field B0 e^{j omega t}: the axisymmetric integral equation discretised as N concentric
/// rings of width D = a/N, each a circuit R_i I_i + j omega sum_j M_ij I_j = -j omega B0 pi r_i^2
/// (Faraday around ring i), R_i = 2 pi r_i / (G D). Mutual inductance of coaxial coplanar circles
/// (Maxwell): M = mu0 sqrt(r1 r2) [(2/k - k) K(k) - (2/k) E(k)], k^2 = 4 r1 r2 / (r1 + r2)^2
/// (F. W. Grover, "Inductance Calculations", 1946, ch. 13; Smythe, "Static and Dynamic Electricity", 7.10),
/// with K, E by the arithmetic-geometric mean (Abramowitz and Stegun 17.6). Rings up to 10 apart
/// are separated by the geometric mean distance of two strips of width D, centres n D apart:
/// ln(g/D) = [(n+1)^2 ln(n+1) + (n-1)^2 ln(n-1)]/2 - n^2 ln n - 3/2 (g = e^{-3/2} D for n = 0:
/// the self term). Loss P = sum R_i |I_i|^2 / 2. Shares nothing with the lattice solver.
/// </summary>
internal static class ThinDiscRingReference
{
    public static double LossW(double radiusM, double sheetConductanceS, double omega, double peakT, int rings)
    {
        double d = radiusM / rings;
        var r = Enumerable.Range(0, rings).Select(i => (i + 0.5) * d).ToArray();
        var m = Matrix<Complex>.Build.Dense(rings, rings);
        var rhs = MathNet.Numerics.LinearAlgebra.Vector<Complex>.Build.Dense(rings);
        for (int i = 0; i < rings; i++)
        {
            double resistance = 2 * Math.PI * r[i] / (sheetConductanceS * d);
            rhs[i] = new Complex(0, -omega * peakT * Math.PI * r[i] * r[i]);
            for (int j = 0; j < rings; j++)
            {
                int n = Math.Abs(i - j);
                double mutual;
                if (n <= 10)
                {
                    double g = d * Math.Exp(GmdLog(n));
                    double mean = (r[i] + r[j]) / 2;
                    mutual = Mutual(mean - g / 2, mean + g / 2);
                }
                else mutual = Mutual(r[i], r[j]);
                m[i, j] = new Complex(i == j ? resistance : 0, omega * mutual);
            }
        }
        var current = m.Solve(rhs);
        double loss = 0;
        for (int i = 0; i < rings; i++) loss += 0.5 * 2 * Math.PI * r[i] / (sheetConductanceS * d) * current[i].Magnitude * current[i].Magnitude;
        return loss;
    }

    private static double GmdLog(int n)
    {
        static double XLogX2(double x) => x <= 0 ? 0 : x * x * Math.Log(x);
        return 0.5 * (XLogX2(n + 1) + XLogX2(n - 1)) - XLogX2(n) - 1.5;
    }

    private static double Mutual(double r1, double r2)
    {
        double k2 = 4 * r1 * r2 / ((r1 + r2) * (r1 + r2));
        double k = Math.Sqrt(k2);
        var (ek, ee) = Elliptic(k);
        return 4e-7 * Math.PI * Math.Sqrt(r1 * r2) * ((2 / k - k) * ek - 2 / k * ee);
    }

    /// <summary>Complete elliptic integrals K(k), E(k) by the AGM: K = pi / (2 M(1, k')), E = K (1 - sum 2^(n-1) c_n^2).</summary>
    private static (double K, double E) Elliptic(double k)
    {
        double a = 1, b = Math.Sqrt(1 - k * k), c = k, sum = 0.5 * c * c, power = 0.5;
        for (int it = 0; it < 60 && Math.Abs(c) > 1e-17; it++)
        {
            double an = (a + b) / 2, bn = Math.Sqrt(a * b);
            c = (a - b) / 2;
            a = an; b = bn;
            power *= 2;
            sum += power * c * c;
        }
        double kk = Math.PI / (2 * a);
        return (kk, kk * (1 - sum));
    }
}
