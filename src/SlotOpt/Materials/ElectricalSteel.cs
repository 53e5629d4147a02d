namespace SlotOpt.Materials;

/// <summary>
/// One lamination grade at one gauge: the standard's guaranteed loss at its specification point,
/// physical data, and the loss-separation coefficients of P = kh f Bp^alpha + kc f^2 Bp^2 + ke (f Bp)^1.5
/// (per mass; kc follows from resistivity and thickness, never from data).
/// </summary>
public sealed record ElectricalSteel(
    string Grade,
    SteelFamily Family,
    double ThicknessM,
    double DensityKgPerM3,
    double Resistivity20COhmM,
    double SpecMaxLossWPerKg,
    double SpecPeakT,
    double SpecFrequencyHz,
    double StackingFactor,
    double RelativePermeability,
    double KneeFluxT,
    double MaxFluxT,
    double HysteresisCoefficient,
    double HysteresisExponent,
    double ExcessCoefficient,
    double CoefficientsFrequencyHz,
    double PricePerKg,
    string Source)
{
    /// <summary>Slope of resistivity with temperature in iron-silicon alloys near room temperature (ohm m / K).</summary>
    /// <remarks>
    /// Matthiessen's rule: alloying adds a temperature-independent residual term, so the slope is that of
    /// pure iron, 0.0065/K x 9.7e-8 ohm m = 6.3e-10 ohm m/K (CRC Handbook, pure-iron resistivity; from memory).
    /// </remarks>
    public const double IronResistivitySlopeOhmMPerK = 6.3e-10;

    /// <summary>Resistivity at a temperature by Matthiessen's rule around 20 degC.</summary>
    public double ResistivityAt(double temperatureK) =>
        Resistivity20COhmM + IronResistivitySlopeOhmMPerK * (temperatureK - Conductor.RoomTemperatureK);
}
