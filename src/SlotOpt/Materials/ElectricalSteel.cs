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
    /// <summary>
    /// Resistivity at a temperature by Matthiessen's rule: silicon and other alloying add a temperature-independent
    /// residual to the intrinsic resistivity of pure iron, rho(T) = rho(20 degC) - rho_Fe(20 degC) + rho_Fe(T).
    /// </summary>
    /// <exception cref="InputException">The temperature lies outside the iron table.</exception>
    public double ResistivityAt(double temperatureK) =>
        Resistivity20COhmM - IntrinsicResistivity.Iron.At(Conductor.RoomTemperatureK) + IntrinsicResistivity.Iron.At(temperatureK);
}
