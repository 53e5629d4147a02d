using SlotOpt.Design;
using SlotOpt.Design.Cores;

namespace SlotOpt.Runs;

/// <summary>
/// Loss of one core part against frequency for every grade (gauge) it may be cut from: the part's own
/// waveform and peak moved to each frequency, evaluated as the part's option with the first process
/// (<see cref="CoreOptions.EvaluateOne"/>: steel flux, loss model, steel mass, building factor, cut edges). The crossings say where one gauge starts to lose less than another.
/// </summary>
public sealed record LossFrequencyCurves(CorePart Part, IReadOnlyList<double> FrequenciesHz, IReadOnlyList<LossFrequencyCurves.Curve> Curves, IReadOnlyList<LossFrequencyCurves.Crossing> Crossings)
{
    /// <summary>One grade's part loss (W) at each frequency.</summary>
    public sealed record Curve(string Grade, double GaugeMm, IReadOnlyList<double> LossW);

    /// <summary>Above <see cref="FrequencyHz"/>, <see cref="BetterAbove"/> loses less than <see cref="BetterBelow"/> (and below it the other way round).</summary>
    public sealed record Crossing(string BetterBelow, string BetterAbove, double FrequencyHz, double LossW);

    /// <summary>The span plotted around the operating frequency, each way, and the samples across it.</summary>
    public const double SpanFactor = 10;
    public const int Samples = 81;

    public static LossFrequencyCurves Of(CorePart part, Problem problem)
    {
        var f0 = part.Flux.FundamentalHz;
        var frequencies = Enumerable.Range(0, Samples).Select(k => f0 / SpanFactor * Math.Pow(SpanFactor * SpanFactor, k / (double)(Samples - 1))).ToArray();
        var process = problem.Shop.Processes[part.Processes[0]];
        var moved = frequencies.Select(f => part with { Flux = WaveformAtFrequency.Of(part.Flux, f) }).ToArray();
        var curves = part.Grades.Select(grade =>
        {
            var steel = problem.Library.GetSteel(grade, part.Name);
            // the option's own evaluation (steel flux, building factor, cut edges) at each frequency
            var loss = moved.Select(p => CoreOptions.EvaluateOne(p, steel, process, problem.Shop).Loss.TotalW).ToArray();
            return new Curve(grade, steel.ThicknessM * 1e3, loss);
        }).OrderByDescending(c => c.GaugeMm).ThenBy(c => c.Grade, StringComparer.Ordinal).ToList();
        return new LossFrequencyCurves(part, frequencies, curves, CrossingsOf(frequencies, curves));
    }

    /// <summary>Every sign change of the loss difference between two curves, located by linear interpolation in log f and log P.</summary>
    private static IReadOnlyList<Crossing> CrossingsOf(double[] frequencies, IReadOnlyList<Curve> curves)
    {
        var crossings = new List<Crossing>();
        for (var a = 0; a < curves.Count; a++)
        for (var b = a + 1; b < curves.Count; b++)
        for (var k = 0; k + 1 < frequencies.Length; k++)
        {
            double d0 = Math.Log(curves[a].LossW[k] / curves[b].LossW[k]), d1 = Math.Log(curves[a].LossW[k + 1] / curves[b].LossW[k + 1]);
            if (d0 == 0 || Math.Sign(d0) == Math.Sign(d1)) continue;
            var s = d0 / (d0 - d1);
            var f = Math.Exp(Math.Log(frequencies[k]) + s * (Math.Log(frequencies[k + 1]) - Math.Log(frequencies[k])));
            var p = Math.Exp(Math.Log(curves[a].LossW[k]) + s * (Math.Log(curves[a].LossW[k + 1]) - Math.Log(curves[a].LossW[k])));
            var (below, above) = d0 < 0 ? (curves[a], curves[b]) : (curves[b], curves[a]);
            crossings.Add(new Crossing(below.Grade, above.Grade, f, p));
        }
        return crossings.OrderBy(c => c.FrequencyHz).ToList();
    }
}
