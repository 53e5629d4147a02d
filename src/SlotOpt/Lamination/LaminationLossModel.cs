using SlotOpt.Tables;
using SlotOpt.Materials;
using SlotOpt.Waveforms;

namespace SlotOpt.Lamination;

/// <summary>
/// Loss separation for a lamination (G. Bertotti, IEEE Trans. Magn. 24(1):621, 1988):
/// P = hysteresis + classical x skin factor x width factor + excess, per kg of steel.
/// Assumptions: flux along the sheet, uniform across its width, linear permeability for the skin
/// correction, hysteresis coefficients independent of temperature, the excess coefficient scaling with sqrt(conductivity).
/// </summary>
public static class LaminationLossModel
{
    /// <summary>Coefficients are trusted within this factor of the frequency they came from (common practice, no source).</summary>
    public const double CoefficientFrequencyRange = 4;

    /// <summary>Thickness over skin depth above which the skin correction is flagged (F(1) = 0.9984; F(x) = (3/x)(sinh x - sin x)/(cosh x - cos x), R. L. Stoll, The Analysis of Eddy Currents, Clarendon Press, 1974; keeping x &lt;~ 1 is common practice, no source).</summary>
    public const double SkinFlagRatio = 1;

    /// <summary>A spectral skin factor further than this from 1 is flagged: the harmonics, not the fundamental, are skin-limited.</summary>
    public const double SpectralSkinFlagDeparture = 0.002;

    public static LaminationLoss Evaluate(ElectricalSteel steel, IFluxWaveform waveform, LaminationConditions? conditions = null)
    {
        conditions ??= LaminationConditions.Room;
        var resistivity = ResistivityAt(steel, conditions.TemperatureK);
        if (!(resistivity > 0))
            throw new InputException($"grade {steel.Grade}: resistivity at {conditions.TemperatureK:0.#} K is not positive");
        var conductivity = 1 / resistivity;
        var f = waveform.FundamentalHz;
        var d = steel.ThicknessM;

        var skinDepth = SkinDepth.Of(resistivity, f, steel.RelativePermeability);
        var spectral = waveform.IsSinusoidal ? null : SpectralSkinCorrection.Of(waveform, d, resistivity, steel.RelativePermeability);
        var skinFactor = spectral?.Factor ?? SkinEffect.Factor(d / skinDepth);
        var widthFactor = FiniteWidth.Factor(d, conditions.FeatureWidthM);

        var classical = ClassicalEddyLoss.PerVolume(conductivity, d, waveform.MeanSquareRate) * skinFactor * widthFactor / steel.DensityKgPerM3;
        double hysteresis, excess;
        if (waveform.IsSinusoidal)
        {
            hysteresis = HysteresisLoss.Steinmetz(steel.HysteresisCoefficient, steel.HysteresisExponent, f, waveform.PeakT);
            excess = ExcessLoss.Sine(steel.ExcessCoefficient, f, waveform.PeakT);
        }
        else
        {
            hysteresis = HysteresisLoss.LoopSplit(steel.HysteresisCoefficient, steel.HysteresisExponent, waveform);
            excess = ExcessLoss.FromMeanRate(steel.ExcessCoefficient, waveform.MeanAbsRatePower(1.5));
        }
        // ke = 8 sqrt(sigma G S V0) (Bertotti 1988): the coefficient, known at room temperature, scales with sqrt(sigma)
        excess *= Math.Sqrt(steel.Resistivity20COhmM / resistivity);

        var peak = waveform.PeakT;
        var ratio = d / skinDepth;
        var flags = Flags(steel, peak, f, ratio, skinFactor, spectral);
        var result = new LaminationLoss(hysteresis, classical, excess, steel.DensityKgPerM3, skinFactor, widthFactor, skinDepth, ratio, resistivity, flags);
        if (!double.IsFinite(result.TotalWPerKg))
            throw new NumericalFailureException($"grade {steel.Grade}: loss is not finite (hysteresis {hysteresis}, classical {classical}, excess {excess})");
        return result;
    }

    /// <summary>The last steel and temperature this thread evaluated, with its resistivity (two table interpolations saved on a repeat).</summary>
    [ThreadStatic] private static (ElectricalSteel Steel, double TemperatureK, double ResistivityOhmM)? _lastResistivity;

    private static double ResistivityAt(ElectricalSteel steel, double temperatureK)
    {
        if (_lastResistivity is var (s, t, rho) && ReferenceEquals(s, steel) && t == temperatureK) return rho;
        rho = steel.ResistivityAt(temperatureK);
        _lastResistivity = (steel, temperatureK, rho);
        return rho;
    }

    /// <summary>The validity flags of one evaluation (none: a shared empty list). Each message is worded when read, so its closure is made only for a raised flag.</summary>
    private static IReadOnlyList<ValidityFlag> Flags(ElectricalSteel steel, double peak, double f, double ratio, double skinFactor, SpectralSkinFactor? spectral)
    {
        List<ValidityFlag>? flags = null;
        if (peak > steel.MaxFluxT) (flags ??= []).Add(BeyondGrade(steel, peak));
        else if (peak > steel.KneeFluxT) (flags ??= []).Add(NearSaturation(steel, peak));
        if (ratio > SkinFlagRatio) (flags ??= []).Add(ThickAgainstSkinDepth(steel, f, ratio, skinFactor));
        if (spectral is not null && Math.Abs(1 - spectral.Factor) > SpectralSkinFlagDeparture) (flags ??= []).Add(SkinInHarmonics(spectral));
        if (spectral is not null && spectral.TailBound > SpectralSkinCorrection.Tolerance) (flags ??= []).Add(SpectrumTruncated(spectral));
        if (f > steel.CoefficientsFrequencyHz * CoefficientFrequencyRange || f < steel.CoefficientsFrequencyHz / CoefficientFrequencyRange) (flags ??= []).Add(Extrapolated(steel, f));
        return (IReadOnlyList<ValidityFlag>?)flags ?? Array.Empty<ValidityFlag>();
    }

    private static ValidityFlag BeyondGrade(ElectricalSteel steel, double peak) =>
        new("flux-beyond-grade", () => $"peak {Numbers.Of(peak, "T")} exceeds the {Numbers.Of(steel.MaxFluxT, "T")} that {steel.Grade} carries at 10 kA/m: the steel saturates and the loss model does not hold");

    private static ValidityFlag NearSaturation(ElectricalSteel steel, double peak) =>
        new("flux-near-saturation", () => $"peak {Numbers.Of(peak, "T")} is above the knee ({Numbers.Of(steel.KneeFluxT, "T")}, the polarisation at 5 kA/m) of {steel.Grade}: magnetising current and loss rise steeply");

    private static ValidityFlag ThickAgainstSkinDepth(ElectricalSteel steel, double f, double ratio, double skinFactor) =>
        new("thick-against-skin-depth", () => $"thickness is {Numbers.Sig(ratio)} skin depths at {Numbers.Of(f, "Hz")} (mu_r {Numbers.Sig(steel.RelativePermeability)}): classical loss corrected by {Numbers.Sig(skinFactor)}, with linear permeability assumed");

    private static ValidityFlag SkinInHarmonics(SpectralSkinFactor spectral) =>
        new("skin-effect-in-harmonics", () => $"the harmonics of the waveform are skin-limited: classical loss over the full spectrum ({spectral.OrdersSummed} harmonics, then the asymptotic tail) corrected by {Numbers.Sig(spectral.Factor)}, with linear permeability assumed");

    private static ValidityFlag SpectrumTruncated(SpectralSkinFactor spectral) =>
        new("spectrum-truncated", () => $"the skin correction stopped at {spectral.OrdersSummed} harmonics holding {Numbers.Percent(spectral.CoveredFraction)} of the mean square dB/dt; the tail estimate may be off by up to {Numbers.Percent(spectral.TailBound)}");

    private static ValidityFlag Extrapolated(ElectricalSteel steel, double f) =>
        new("coefficients-extrapolated", () => $"{Numbers.Of(f, "Hz")} is far from the {Numbers.Of(steel.CoefficientsFrequencyHz, "Hz")} data the hysteresis and excess coefficients of {steel.Grade} came from");
}
