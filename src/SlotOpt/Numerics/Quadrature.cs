namespace SlotOpt.Numerics;

/// <summary>Gauss-Legendre rules on [0, 1] (Newton on P_n; Abramowitz and Stegun 25.4.29), cached per order.</summary>
internal static class Quadrature
{
    private static readonly System.Collections.Concurrent.ConcurrentDictionary<int, (double[], double[])> Cache = new();

    public static (double[] Nodes, double[] Weights) GaussLegendre01(int n) => Cache.GetOrAdd(n, Compute);

    private static (double[], double[]) Compute(int n)
    {
        var x = new double[n];
        var w = new double[n];
        for (int i = 0; i < n; i++)
        {
            double z = Math.Cos(Math.PI * (i + 0.75) / (n + 0.5));
            double dp = 0;
            for (int it = 0; it < 100; it++)
            {
                double p0 = 1, p1 = z;
                for (int k = 2; k <= n; k++) { double p2 = ((2 * k - 1) * z * p1 - (k - 1) * p0) / k; p0 = p1; p1 = p2; }
                dp = n * (z * p1 - p0) / (z * z - 1);
                double dz = p1 / dp;
                z -= dz;
                if (Math.Abs(dz) < 1e-15) break;
            }
            x[i] = (1 - z) / 2;
            w[i] = 1 / ((1 - z * z) * dp * dp);   // 2 / ((1 - z^2) P_n'^2) on [-1, 1], halved for [0, 1]
        }
        return (x, w);
    }
}
