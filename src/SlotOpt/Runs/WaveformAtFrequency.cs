using SlotOpt.Waveforms;

namespace SlotOpt.Runs;

/// <summary>The same flux waveform (shape and peak) with its period stretched to another fundamental frequency.</summary>
public static class WaveformAtFrequency
{
    public static IFluxWaveform Of(IFluxWaveform waveform, double frequencyHz) => waveform switch
    {
        SineWaveform sine => new SineWaveform(sine.PeakT, frequencyHz),
        PiecewiseLinearWaveform samples => new PiecewiseLinearWaveform(frequencyHz, samples.Phases, samples.ValuesT),
        HarmonicWaveform harmonics => new HarmonicWaveform(frequencyHz, harmonics.Spectrum(int.MaxValue)),
        _ => throw new ArgumentOutOfRangeException(nameof(waveform), waveform.GetType().Name, "unknown waveform kind"),
    };
}
