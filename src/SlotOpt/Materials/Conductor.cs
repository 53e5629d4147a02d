namespace SlotOpt.Materials;

/// <summary>A plate material: resistivity at 20 degC and how it follows temperature.</summary>
public sealed record Conductor(
    string Name,
    double Resistivity20COhmM,
    double Alpha20PerK,
    double DensityKgPerM3,
    double RelativePermeability,
    bool IsMagnetic,
    TemperatureModel TemperatureModel,
    double YoungsModulusPa,
    double PricePerKg,
    string Source)
{
    public const double RoomTemperatureK = 293.15;

    /// <summary>Range in which the linear coefficient is trusted, and outside which it is refused (common practice, no source).</summary>
    public const double LinearModelMinK = 150, LinearModelMaxK = 500;

    /// <summary>
    /// The temperature-independent residual resistivity (impurities, defects) when the data give it (ohm m); null to infer
    /// it as rho(20 degC) - rho_intrinsic(20 degC). Annealed high-purity copper has rho(273 K)/rho_residual (RRR) of 100
    /// or more (N. J. Simon, E. S. Drexler, R. P. Reed, Properties of Copper and Copper Alloys at Cryogenic Temperatures,
    /// NIST Monograph 177, 1992; from memory).
    /// </summary>
    public double? ResidualResistivityOhmM { get; init; }

    /// <summary>Resistivity at a temperature (ohm m).</summary>
    /// <exception cref="InputException">The temperature lies outside the model's data.</exception>
    public double ResistivityAt(double temperatureK)
    {
        switch (TemperatureModel)
        {
            case TemperatureModel.MatthiessenCopper:
                return MatthiessenResistivity(IntrinsicResistivity.Copper, temperatureK);
            case TemperatureModel.MatthiessenAluminium:
                return MatthiessenResistivity(IntrinsicResistivity.Aluminium, temperatureK);
            case TemperatureModel.MatthiessenIron:
                return MatthiessenResistivity(IntrinsicResistivity.Iron, temperatureK);
            default:
                if (temperatureK < LinearModelMinK || temperatureK > LinearModelMaxK)
                    throw new InputException(string.Create(System.Globalization.CultureInfo.InvariantCulture,
                        $"temperature {temperatureK:0.#} K is outside {LinearModelMinK:0} to {LinearModelMaxK:0} K, where the linear resistivity law of {Name} is trusted; give its resistivity at that temperature as a material override"));
                // rho(T) = rho20 (1 + alpha20 (T - 293.15 K)): the usual linear law (IEC 60028 for copper)
                return Resistivity20COhmM * (1 + Alpha20PerK * (temperatureK - RoomTemperatureK));
        }
    }

    public double ConductivityAt(double temperatureK) => 1.0 / ResistivityAt(temperatureK);

    /// <summary>
    /// rho(T) = rho_residual + rho_i(T): Matthiessen's rule (residual term independent of T), the residual given or
    /// inferred as rho(293 K) - rho_i(293 K).
    /// </summary>
    private double MatthiessenResistivity(IntrinsicResistivity table, double temperatureK) =>
        (ResidualResistivityOhmM ?? Resistivity20COhmM - table.At(RoomTemperatureK)) + table.At(temperatureK);
}
