namespace SlotOpt.Plates.Thermal;

/// <summary>
/// The plate material's thermal side: thermal conductivity k (W/(m K)) and its electrical
/// conductivity at a temperature relative to the reference conductivity the sheet was given at,
/// sigma(T) / sigma_ref. The factor may throw (an <see cref="InputException"/> for a temperature
/// outside its data): the coupling reports that as a numerical failure with the temperature reached.
/// </summary>
public sealed record ThermalMaterial
{
    public ThermalMaterial(double thermalConductivityWPerMK, Func<double, double> conductivityFactorAtK, string description)
    {
        if (!(thermalConductivityWPerMK > 0) || !double.IsFinite(thermalConductivityWPerMK))
            throw new InputException($"the thermal conductivity must be positive (got {thermalConductivityWPerMK} W/(m K))");
        ThermalConductivityWPerMK = thermalConductivityWPerMK;
        ConductivityFactorAtK = conductivityFactorAtK;
        Description = description;
    }

    public double ThermalConductivityWPerMK { get; }
    public Func<double, double> ConductivityFactorAtK { get; }
    /// <summary>In words, for output: where k and the resistivity law come from.</summary>
    public string Description { get; }

    /// <summary>A linear resistivity law rho(T) = rho_ref (1 + alpha (T - T_ref)), so sigma(T)/sigma_ref = 1 / (1 + alpha (T - T_ref)).</summary>
    public static ThermalMaterial Linear(double thermalConductivityWPerMK, double alphaPerK, double referenceK, string description) =>
        new(thermalConductivityWPerMK, t =>
        {
            double ratio = 1 + alphaPerK * (t - referenceK);
            if (!(ratio > 0)) throw new InputException($"the linear resistivity law gives a non-positive resistivity at {t:0.#} K");
            return 1 / ratio;
        }, description);
}
