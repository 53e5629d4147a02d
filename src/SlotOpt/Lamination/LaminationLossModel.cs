using SlotOpt.Materials;
using SlotOpt.Waveforms;

namespace SlotOpt.Lamination;

/// <summary>
/// Loss separation for a lamination (G. Bertotti, IEEE Trans. Magn. 24(1):621, 1988):
/// P = hysteresis + classical x skin factor x width factor + excess, per kg of steel.
/// Assumptions: flux along the sheet, uniform across its width, linear permeability for the skin
/// correction, hysteresis and excess coefficients independent of temperature.
/// </summary>
public static class LaminationLossModel
{
    /// <summary>Harmonics summed for the per-harmonic skin correction of a non-sinusoidal waveform.</summary>
    public const int SpectrumOrders = 400;

    /// <summary>Coefficients are trusted within this factor of the frequency they came from (common practice, no source).</summary>
    public const double CoefficientFrequencyRange = 4;

    /// <summary>Thickness over skin depth above which the skin correction is flagged (F(1) = 0.9984; F(x) = (3/x)(sinh x - sin x)/(cosh x - cos x), R. L. Stoll, The Analysis of Eddy Currents, Clarendon Press, 1974; keeping x &lt;~ 1 is common practice, no source).</summary>
    public const double SkinFlagRatio = 1;

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
        var skinFactor = waveform.IsSinusoidal
            ? SkinEffect.Factor(d / skinDepth)
            : SpectralSkinFactor(waveform, d, resistivity, steel.RelativePermeability);
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

        var peak = waveform.PeakT;
        if (peak > steel.MaxFluxT)
            flags.Add(new ValidityFlag("flux-beyond-grade", $"peak {peak:0.###} T exceeds the {steel.MaxFluxT:0.##} T that {steel.Grade} carries at 10 kA/m: the steel saturates and the loss model does not hold"));
        else if (peak > steel.KneeFluxT)
            flags.Add(new ValidityFlag("flux-near-saturation", $"peak {peak:0.###} T is above the knee ({steel.KneeFluxT:0.##} T, the polarisation at 5 kA/m) of {steel.Grade}: magnetising current and loss rise steeply"));
        var ratio = d / skinDepth;
        if (ratio > SkinFlagRatio)
            flags.Add(new ValidityFlag("thick-against-skin-depth", $"thickness is {ratio:0.##} skin depths at {f:0.#} Hz (mu_r {steel.RelativePermeability:0}): classical loss corrected by {skinFactor:0.###}, with linear permeability assumed"));
        if (f > steel.CoefficientsFrequencyHz * CoefficientFrequencyRange || f < steel.CoefficientsFrequencyHz / CoefficientFrequencyRange)
            flags.Add(new ValidityFlag("coefficients-extrapolated", $"{f:0.#} Hz is far from the {steel.CoefficientsFrequencyHz:0.#} Hz data the hysteresis and excess coefficients of {steel.Grade} came from"));

        var result = new LaminationLoss(hysteresis, classical, excess, steel.DensityKgPerM3, skinFactor, widthFactor, skinDepth, ratio, resistivity, flags);
        if (!double.IsFinite(result.TotalWPerKg))
            throw new NumericalFailureException($"grade {steel.Grade}: loss is not finite (hysteresis {hysteresis}, classical {classical}, excess {excess})");
        return result;
    }

    /// <summary>
    /// Skin factor of a non-sinusoidal waveform: each harmonic's classical loss (n omega A_n)^2 / 2 weighted by
    /// its own F(d / delta_n), over the sum of those losses (linear superposition of the 1-D solution).
    /// </summary>
    private static double SpectralSkinFactor(IFluxWaveform waveform, double thicknessM, double resistivityOhmM, double relativePermeability)
    {
        double weighted = 0, total = 0;
        foreach (var h in waveform.Spectrum(SpectrumOrders))
        {
            var rate = h.Order * h.AmplitudeT;
            var weight = rate * rate;
            if (weight == 0) continue;
            var delta = SkinDepth.Of(resistivityOhmM, h.Order * waveform.FundamentalHz, relativePermeability);
            weighted += weight * SkinEffect.Factor(thicknessM / delta);
            total += weight;
        }
        return total > 0 ? weighted / total : 1;
    }
}
