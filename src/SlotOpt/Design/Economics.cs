namespace SlotOpt.Design;

/// <summary>
/// What a watt of continuous loss is worth, and the figures it came from (for the report's savings per year and over
/// the life). <see cref="ValuePerWatt"/> values no-load loss, and load loss too unless <see cref="LoadValuePerWatt"/>
/// differs (IEEE Std C57.120-1991 A and B factors). With only values per watt given, the per-year figures are unknown.
/// </summary>
public sealed record Economics(
    string Currency,
    double ValuePerWatt,
    double? EnergyPricePerKWh,
    double? HoursPerYear,
    double? Years,
    double? DiscountRate)
{
    /// <summary>Value of a watt of load loss (the B factor); null when it is the same as <see cref="ValuePerWatt"/>.</summary>
    public double? LoadValuePerWatt { get; init; }

    /// <summary>Share of the energised hours' energy a watt of rated load loss costs: PUL^2 x LSF; null when not derived.</summary>
    public double? LoadEnergyShare { get; init; }

    /// <summary>True when no-load and load loss are valued apart.</summary>
    public bool SeparatesLoadLoss => LoadValuePerWatt is { } b && b != ValuePerWatt;

    /// <summary>The value of a watt of this kind of loss.</summary>
    public double ValuePerWattFor(LossKind kind) => kind == LossKind.Load ? LoadValuePerWatt ?? ValuePerWatt : ValuePerWatt;

    /// <summary>Money per year for one watt of no-load loss, when the energy price and hours are known.</summary>
    public double? YearlyCostPerWatt => EnergyPricePerKWh is { } price && HoursPerYear is { } hours ? price * hours / 1000 : null;

    /// <summary>Money per year for one watt of this kind of loss, when the energy price and hours are known.</summary>
    public double? YearlyCostPerWattFor(LossKind kind) =>
        kind == LossKind.Load && LoadValuePerWatt is not null ? YearlyCostPerWatt * LoadEnergyShare : YearlyCostPerWatt;
}
