using System.Collections.Concurrent;
using System.Runtime.CompilerServices;
using MathNet.Numerics.Integration;
using SlotOpt.Waveforms;

namespace SlotOpt.Lamination;

/// <summary>
/// The skin factor of a whole waveform: how much each harmonic's classical loss is cut by its own skin depth,
/// weighted by that harmonic's share of the mean square dB/dt, over the full spectrum.
/// </summary>
/// <param name="Factor">Sum_n w_n F(d / delta_n) / sum_n w_n, the factor on sigma d^2 &lt;(dB/dt)^2&gt; / 12.</param>
/// <param name="OrdersSummed">Harmonics summed one by one before the tail.</param>
/// <param name="CoveredFraction">Share of &lt;(dB/dt)^2&gt; those harmonics hold (Parseval).</param>
/// <param name="TailBound">Largest error the tail estimate can make, relative to the factor.</param>
public sealed record SpectralSkinFactor(double Factor, int OrdersSummed, double CoveredFraction, double TailBound);

/// <summary>
/// Linear superposition of the exact 1-D slab solution (J. Lammeraner and M. Stafl, Eddy Currents, 1964):
/// harmonic n carries w_n = (n omega A_n)^2 / 2 of the mean square rate and loses F(x_1 sqrt n) of its classical
/// loss, x_1 = d / delta at the fundamental. Harmonics are summed until the uncovered share of the mean square rate
/// (known exactly by Parseval's theorem) is below <see cref="Tolerance"/>, or until the tail, which lies between 0
/// and W_tail F(x_N) since F falls with n, cannot move the factor by more than <see cref="Tolerance"/>. The tail is
/// then estimated with the 1/n^2 envelope of a waveform with corners: W_tail x 2 int_0^1 u F(x_N / u) du.
/// Results are cached per waveform and per (thickness, resistivity, permeability).
/// </summary>
public static class SpectralSkinCorrection
{
    /// <summary>Relative accuracy asked of the factor and of the Parseval coverage.</summary>
    public const double Tolerance = 1e-4;

    /// <summary>Orders beyond which the sum stops and reports what it could not cover (2^21, ~1 s of work for 1000 corners).</summary>
    public const int MaxOrders = 1 << 21;

    private const int FirstBlock = 512;

    private static readonly ConditionalWeakTable<IFluxWaveform, ConcurrentDictionary<(double, double, double), SpectralSkinFactor>> Cache = new();

    public static SpectralSkinFactor Of(IFluxWaveform waveform, double thicknessM, double resistivityOhmM, double relativePermeability)
    {
        var perWaveform = Cache.GetValue(waveform, _ => new ConcurrentDictionary<(double, double, double), SpectralSkinFactor>());
        return perWaveform.GetOrAdd((thicknessM, resistivityOhmM, relativePermeability),
            key => Compute(waveform, key.Item1, key.Item2, key.Item3));
    }

    private static SpectralSkinFactor Compute(IFluxWaveform waveform, double thicknessM, double resistivityOhmM, double relativePermeability)
    {
        var total = waveform.MeanSquareRate;
        if (!(total > 0)) return new SpectralSkinFactor(1, 0, 1, 0);
        var x1 = thicknessM / SkinDepth.Of(resistivityOhmM, waveform.FundamentalHz, relativePermeability);
        double weighted = 0, covered = 0;
        var summed = 0;
        var block = FirstBlock;
        while (true)
        {
            var limit = Math.Min(waveform.HighestOrder ?? MaxOrders, Math.Min(block, MaxOrders));
            var weights = waveform.MeanSquareRateByOrder(limit);
            for (var n = summed + 1; n <= weights.Count; n++)
            {
                var w = weights[n - 1];
                if (w == 0) continue;
                weighted += w * SkinEffect.Factor(x1 * Math.Sqrt(n));
                covered += w;
            }
            summed = weights.Count;
            var tail = Math.Max(total - covered, 0);
            var lastFactor = SkinEffect.Factor(x1 * Math.Sqrt(summed));
            var finished = waveform.HighestOrder is { } last && summed >= last;
            var covers = tail <= Tolerance * total;
            var bounded = tail * lastFactor <= Tolerance * weighted;
            if (finished || covers || bounded || summed >= MaxOrders)
            {
                var tailEstimate = finished ? 0 : tail * TailFactor(x1 * Math.Sqrt(summed));
                var factor = (weighted + tailEstimate) / total;
                if (!double.IsFinite(factor)) throw new NumericalFailureException($"spectral skin factor is not finite after {summed} harmonics");
                var bound = finished ? 0 : tail * lastFactor / (weighted + tailEstimate);
                return new SpectralSkinFactor(factor, summed, Math.Min(covered / total, 1), bound);
            }
            block *= 2;
        }
    }

    /// <summary>
    /// Mean of F over a tail whose weight falls as 1/n^2 from order N: N int_N^inf F(x_1 sqrt n) n^-2 dn, which with
    /// n = N/u^2 becomes 2 int_0^1 u F(x_N / u) du (1 when x_N is small, 2/x_N = (2/3) F(x_N) when it is large).
    /// Gauss-Legendre with 64 points: the integrand is smooth on [0, 1].
    /// </summary>
    public static double TailFactor(double xAtLastOrder) =>
        GaussLegendreRule.Integrate(u => u <= 0 ? 0 : 2 * u * SkinEffect.Factor(xAtLastOrder / u), 0, 1, 64);
}
