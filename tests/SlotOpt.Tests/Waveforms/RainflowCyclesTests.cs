using SlotOpt.Lamination;
using SlotOpt.Waveforms;

namespace SlotOpt.Tests.Waveforms;

public class RainflowCyclesTests
{
    // Rainflow counting, ASTM E1049-85 §5.4.4, applied by hand to a period rising -1 -> 0.5, dipping to 0.3,
    // rising to 1 and falling back: the major loop of range 2.0 closes, and the dip is one full minor loop
    // of range 0.2. Exact.
    [Fact]
    public void Counts_a_minor_loop_inside_the_major_one()
    {
        var cycles = RainflowCycles.Count([-1.0, 0.5, 0.3, 1.0]);
        var total = cycles.GroupBy(c => Math.Round(c.RangeT, 9)).ToDictionary(g => g.Key, g => g.Sum(c => c.Weight));
        Assert.Equal(2, total.Count);
        Assert.Equal(1.0, total[2.0]);
        Assert.Equal(1.0, total[0.2]);
    }

    // A sine is one loop of range 2 Bp, so loop-split hysteresis equals Steinmetz kh f Bp^beta exactly
    // (Venkatachalam et al., COMPEL 2002: the iGSE reduces to the Steinmetz equation on a sine).
    [Fact]
    public void Sine_gives_the_Steinmetz_loss()
    {
        var sine = new SineWaveform(1.3, 60);
        var expected = HysteresisLoss.Steinmetz(0.02, 2.1, 60, 1.3);
        Assert.Equal(expected, HysteresisLoss.LoopSplit(0.02, 2.1, sine), expected * 1e-12);
        var harmonicSine = new HarmonicWaveform(60, [new Harmonic(1, 1.3, 0.4)]);
        Assert.Equal(expected, HysteresisLoss.LoopSplit(0.02, 2.1, harmonicSine), expected * 1e-4);   // sampled peak
    }

    // The minor loop adds kh f (0.1)^beta to the major loop's kh f 1^beta (derived from the two counts above).
    [Fact]
    public void Minor_loop_adds_its_own_small_loss()
    {
        var wave = new PiecewiseLinearWaveform(50, [0.0, 0.4, 0.5, 0.6], [-1.0, 0.5, 0.3, 1.0]);
        var p = HysteresisLoss.LoopSplit(0.02, 2.0, wave);
        Assert.Equal(0.02 * 50 * (1 + 0.01), p, 1e-12);
    }
}
