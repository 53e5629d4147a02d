namespace SlotOpt.Waveforms;

/// <summary>One closed or half loop of a flux history: its peak-to-peak range and weight (1 full, 0.5 half).</summary>
public readonly record struct FluxCycle(double RangeT, double Weight);

/// <summary>
/// Rainflow counting of one period of a periodic flux history into loops (ASTM E1049-85 (2017),
/// "Standard Practices for Cycle Counting in Fatigue Analysis", §5.4.4). The period is rotated to start
/// at its largest value, so the major loop and every minor loop close.
/// </summary>
public static class RainflowCycles
{
    public static IReadOnlyList<FluxCycle> Count(IReadOnlyList<double> periodSamples)
    {
        var reversals = Reversals(periodSamples);
        var cycles = new List<FluxCycle>();
        if (reversals.Count < 2) return cycles;

        var start = 0;
        for (var i = 1; i < reversals.Count; i++) if (reversals[i] > reversals[start]) start = i;
        var rotated = new List<double>(reversals.Count + 1);
        for (var i = 0; i < reversals.Count; i++) rotated.Add(reversals[(start + i) % reversals.Count]);
        rotated.Add(rotated[0]);

        var stack = new List<double>();
        foreach (var point in rotated)
        {
            stack.Add(point);
            while (stack.Count >= 3)
            {
                var x = Math.Abs(stack[^1] - stack[^2]);
                var y = Math.Abs(stack[^2] - stack[^3]);
                if (x < y) break;
                if (stack.Count == 3)
                {
                    // y contains the starting point: a half loop (ASTM E1049 5.4.4.3 step 4)
                    cycles.Add(new FluxCycle(y, 0.5));
                    stack.RemoveAt(0);
                }
                else
                {
                    cycles.Add(new FluxCycle(y, 1));
                    stack.RemoveRange(stack.Count - 3, 2);
                }
            }
        }
        for (var i = 0; i + 1 < stack.Count; i++) cycles.Add(new FluxCycle(Math.Abs(stack[i + 1] - stack[i]), 0.5));
        return cycles;
    }

    /// <summary>The turning points of a periodic sequence (plateaus collapsed), in order.</summary>
    private static List<double> Reversals(IReadOnlyList<double> samples)
    {
        var distinct = new List<double>();
        foreach (var s in samples) if (distinct.Count == 0 || s != distinct[^1]) distinct.Add(s);
        if (distinct.Count > 1 && distinct[^1] == distinct[0]) distinct.RemoveAt(distinct.Count - 1);
        var n = distinct.Count;
        if (n < 2) return distinct;
        var reversals = new List<double>();
        for (var i = 0; i < n; i++)
        {
            var previous = distinct[(i - 1 + n) % n];
            var next = distinct[(i + 1) % n];
            var value = distinct[i];
            if ((value > previous && value > next) || (value < previous && value < next)) reversals.Add(value);
        }
        return reversals;
    }
}
