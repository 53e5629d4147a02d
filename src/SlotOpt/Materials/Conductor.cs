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

    /// <summary>Range in which the linear coefficient is trusted (common practice, no source).</summary>
    public const double LinearModelMinK = 150, LinearModelMaxK = 500;

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
            default:
                if (temperatureK < 1 || temperatureK > 1000)
                    throw new InputException($"temperature {temperatureK:0.#} K is outside 1..1000 K for {Name}");
                // rho(T) = rho20 (1 + alpha20 (T - 293.15 K)): the usual linear law (IEC 60028 for copper)
                return Resistivity20COhmM * (1 + Alpha20PerK * (temperatureK - RoomTemperatureK));
        }
    }

    /// <summary>True where the resistivity at this temperature rests on an extrapolated linear coefficient.</summary>
    public bool IsExtrapolatedAt(double temperatureK) =>
        TemperatureModel == TemperatureModel.Linear && (temperatureK < LinearModelMinK || temperatureK > LinearModelMaxK);

    public double ConductivityAt(double temperatureK) => 1.0 / ResistivityAt(temperatureK);

    /// <summary>rho(T) = rho(293 K) - rho_i(293 K) + rho_i(T): Matthiessen's rule (residual term independent of T).</summary>
    private double MatthiessenResistivity(IntrinsicResistivity table, double temperatureK) =>
        Resistivity20COhmM - table.At(RoomTemperatureK) + table.At(temperatureK);
}
