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
        var flags = new List<ValidityFlag>();
        var resistivity = steel.ResistivityAt(conditions.TemperatureK);
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
        if (peak > steel.MaxFluxT)
            flags.Add(new ValidityFlag("flux-beyond-grade", $"peak {peak:0.###} T exceeds the {steel.MaxFluxT:0.##} T that {steel.Grade} carries at 10 kA/m: the steel saturates and the loss model does not hold"));
        else if (peak > steel.KneeFluxT)
            flags.Add(new ValidityFlag("flux-near-saturation", $"peak {peak:0.###} T is above the knee ({steel.KneeFluxT:0.##} T, the polarisation at 5 kA/m) of {steel.Grade}: magnetising current and loss rise steeply"));
        var ratio = d / skinDepth;
        if (ratio > SkinFlagRatio)
            flags.Add(new ValidityFlag("thick-against-skin-depth", $"thickness is {ratio:0.##} skin depths at {f:0.#} Hz (mu_r {steel.RelativePermeability:0}): classical loss corrected by {skinFactor:0.###}, with linear permeability assumed"));
        if (spectral is not null && Math.Abs(1 - spectral.Factor) > SpectralSkinFlagDeparture)
            flags.Add(new ValidityFlag("skin-effect-in-harmonics", $"the harmonics of the waveform are skin-limited: classical loss over the full spectrum ({spectral.OrdersSummed} harmonics, then the asymptotic tail) corrected by {spectral.Factor:0.###}, with linear permeability assumed"));
        if (spectral is not null && spectral.TailBound > SpectralSkinCorrection.Tolerance)
            flags.Add(new ValidityFlag("spectrum-truncated", $"the skin correction stopped at {spectral.OrdersSummed} harmonics holding {spectral.CoveredFraction:P3} of the mean square dB/dt; the tail estimate may be off by up to {spectral.TailBound:P2}"));
        if (f > steel.CoefficientsFrequencyHz * CoefficientFrequencyRange || f < steel.CoefficientsFrequencyHz / CoefficientFrequencyRange)
            flags.Add(new ValidityFlag("coefficients-extrapolated", $"{f:0.#} Hz is far from the {steel.CoefficientsFrequencyHz:0.#} Hz data the hysteresis and excess coefficients of {steel.Grade} came from"));

        var result = new LaminationLoss(hysteresis, classical, excess, steel.DensityKgPerM3, skinFactor, widthFactor, skinDepth, ratio, resistivity, flags);
        if (!double.IsFinite(result.TotalWPerKg))
            throw new NumericalFailureException($"grade {steel.Grade}: loss is not finite (hysteresis {hysteresis}, classical {classical}, excess {excess})");
        return result;
    }
}
