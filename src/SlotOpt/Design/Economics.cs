namespace SlotOpt.Design;

/// <summary>
/// What a watt of continuous loss is worth, and the figures it came from (for the report's savings per
/// year and over the life). With only a value per watt given, the per-year figures are unknown (null).
/// </summary>
public sealed record Economics(
    string Currency,
    double ValuePerWatt,
    double? EnergyPricePerKWh,
    double? HoursPerYear,
    double? Years,
    double? DiscountRate)
{
    /// <summary>Money per year for one watt of loss, when the energy price and hours are known.</summary>
    public double? YearlyCostPerWatt => EnergyPricePerKWh is { } price && HoursPerYear is { } hours ? price * hours / 1000 : null;
}
