using System.Collections.Concurrent;
using System.Runtime.CompilerServices;
using SlotOpt.Waveforms;

namespace SlotOpt.Lamination;

/// <summary>A stack of laminations: the steel fraction of its volume sets the steel mass and the sheet count.</summary>
public static class LaminationStack
{
    /// <summary>B_steel = B_stack / stacking factor: the flux through the gross section is carried by the steel alone.</summary>
    public static double SteelFluxDensity(double stackFluxDensityT, double stackingFactor) => stackFluxDensityT / stackingFactor;

    /// <summary>
    /// The flux in the steel for a flux given over the gross section: every value divided by the stacking factor.
    /// One waveform object per (gross waveform, stacking factor), so that the spectral caches hold across options.
    /// </summary>
    public static IFluxWaveform SteelWaveform(IFluxWaveform grossFlux, double stackingFactor)
    {
        if (!(stackingFactor > 0 && stackingFactor <= 1)) throw new ArgumentOutOfRangeException(nameof(stackingFactor), stackingFactor, "must be in (0, 1]");
        return SteelWaveforms.GetValue(grossFlux, _ => new ConcurrentDictionary<double, IFluxWaveform>())
            .GetOrAdd(stackingFactor, sf => sf == 1 ? grossFlux : grossFlux.Scaled(1 / sf));
    }

    private static readonly ConditionalWeakTable<IFluxWaveform, ConcurrentDictionary<double, IFluxWaveform>> SteelWaveforms = new();

    /// <summary>m = V_gross x stacking factor x density (IEC 60404-13 definition of the stacking factor).</summary>
    public static double SteelMassKg(double grossVolumeM3, double stackingFactor, double densityKgPerM3) =>
        grossVolumeM3 * stackingFactor * densityKgPerM3;

    /// <summary>Sheets in a stack of a given height: height x stacking factor / thickness, rounded up.</summary>
    public static int SheetCount(double stackHeightM, double stackingFactor, double thicknessM) =>
        (int)Math.Ceiling(stackHeightM * stackingFactor / thicknessM - 1e-9);
}
