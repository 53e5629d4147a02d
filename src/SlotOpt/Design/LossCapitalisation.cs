namespace SlotOpt.Design;

/// <summary>The present worth of a watt of continuous loss over a service life.</summary>
public static class LossCapitalisation
{
    /// <summary>
    /// Present-worth factor of an annuity: PVF = ((1 + i)^n - 1) / (i (1 + i)^n); n years at rate i
    /// (IEEE Std C57.120-1991, Loss Evaluation Guide for Power Transformers and Reactors). i = 0 gives n.
    /// </summary>
    public static double PresentWorthFactor(double discountRate, double years)
    {
        if (!(years > 0)) throw new InputException($"years must be positive, got {years}");
        if (!(discountRate > -1)) throw new InputException($"discount rate must exceed -100 %, got {discountRate}");
        if (Math.Abs(discountRate) < 1e-12) return years;
        var growth = Math.Pow(1 + discountRate, years);
        return (growth - 1) / (discountRate * growth);
    }

    /// <summary>
    /// A = energy price x hours per year / 1000 x PVF: money per watt of loss running all those hours
    /// (IEEE Std C57.120-1991, IEEE Loss Evaluation Guide for Power Transformers and Reactors: A = (C_energy x 8760 h) x PVF,
    /// PVF = ((1 + i)^n - 1) / (i (1 + i)^n), here with no demand charge).
    /// </summary>
    public static double ValuePerWatt(double energyPricePerKWh, double hoursPerYear, double discountRate, double years) =>
        energyPricePerKWh * hoursPerYear / 1000 * PresentWorthFactor(discountRate, years);
}
