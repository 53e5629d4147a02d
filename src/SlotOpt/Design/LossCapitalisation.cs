namespace SlotOpt.Design;

/// <summary>The present worth of a watt of loss over a service life: no-load (A) and load (B) loss factors.</summary>
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
    /// A = energy price x energised hours per year / 1000 x PVF: money per watt of no-load loss, which runs whenever the
    /// unit is energised (IEEE Std C57.120-1991, energy part of the no-load loss factor; no demand charge).
    /// </summary>
    public static double ValuePerWatt(double energyPricePerKWh, double hoursPerYear, double discountRate, double years) =>
        energyPricePerKWh * hoursPerYear / 1000 * PresentWorthFactor(discountRate, years);

    /// <summary>
    /// Loss factor from load factor, LSF = 0.3 LF + 0.7 LF^2 (F. H. Buller and C. A. Woodrow, "Load factor - equivalent
    /// hour values compared", Electrical World 92(2):59-60, 1928): the mean of (load / peak load)^2.
    /// </summary>
    public static double LossFactor(double loadFactor)
    {
        if (!(loadFactor > 0 && loadFactor <= 1)) throw new InputException($"load factor must be in (0, 1], got {loadFactor}");
        return 0.3 * loadFactor + 0.7 * loadFactor * loadFactor;
    }

    /// <summary>
    /// B = A x PUL^2 x LSF: load loss, stated at rated current, scales with the per-unit peak load squared and is paid
    /// at the loss factor of the load (IEEE Std C57.120-1991, energy part of the load loss factor).
    /// </summary>
    public static double LoadEnergyShare(double perUnitPeakLoad, double loadFactor)
    {
        if (!(perUnitPeakLoad > 0 && perUnitPeakLoad <= 2)) throw new InputException($"per-unit load must be in (0, 2], got {perUnitPeakLoad}");
        return perUnitPeakLoad * perUnitPeakLoad * LossFactor(loadFactor);
    }
}
