namespace SlotOpt.Plates.Thermal;

/// <summary>How a plate's temperature was found (see <see cref="TemperatureBracket"/>).</summary>
public enum TemperatureMethod
{
    /// <summary>The loss at the resistivity of the ambient temperature (the coldest the plate can be): an upper bound, one thermal solve.</summary>
    UpperBound,
    /// <summary>The loss at the resistivity of the upper bound's hottest point: a lower bound, one thermal solve.</summary>
    LowerBound,
    /// <summary>Loss and temperature solved together, each cell's resistivity at its own temperature (<see cref="PlateHeating"/>).</summary>
    Coupled,
}

/// <summary>
/// Whether a plate keeps a temperature limit, cheaply where the answer is clear and coupled where it is not. In the
/// resistance-limited regime the loss of an EMF-driven sheet falls when every cell's conductance falls (the dissipated
/// power is the maximum over the currents of 2 EMF.I - I.R.I, which falls as R rises; Rayleigh's monotonicity, common
/// practice, no source), and a plate heated only by its loss never drops below ambient. The loss map at a uniform
/// conductance is the unit map times sigma(T) t, so:
/// <list type="number">
/// <item>Upper bound: the map at sigma(ambient), one thermal solve. Within the limit (or no limit): done.</item>
/// <item>Lower bound: the map at sigma(upper bound's hottest point), one thermal solve. Still above the limit: breaks it.</item>
/// <item>Between the two: the coupled solve decides.</item>
/// </list>
/// The bounds are exact for the total loss; the loss moves only a little across the plate when the conductivity varies
/// over it, so they bound the hottest point in practice (tested: the coupled hottest lies between them). A plate so hot
/// that a solve leaves the cooling fluid's or the resistivity's data breaks any limit set.
/// </summary>
public static class TemperatureBracket
{
    /// <summary>The temperature found (null with Failure when none could be), the temperature its resistivity was taken at (K), how, and the limit's breach in words (null when kept or unset).</summary>
    public sealed record Outcome(PlateTemperature? Temperature, double ResistivityK, TemperatureMethod Method, string? Breach, string? Failure);

    /// <param name="screen">The thermal solves of the plate's geometry (its grid; shared by the thicknesses and materials of that geometry).</param>
    /// <param name="cellLossPerSiemensW">The loss per cell at a sheet conductance of 1 S (the resistance-limited solve's map).</param>
    /// <param name="sheetConductanceAtK">sigma(T) t of the plate; may throw <see cref="InputException"/> outside its data.</param>
    /// <param name="coupled">The coupled solve, run only between the bounds.</param>
    public static Outcome Find(ThermalScreen screen, double[] cellLossPerSiemensW, double thermalConductivityWPerMK, double thicknessM, Func<double, double> sheetConductanceAtK,
        PlateCooling cooling, TemperatureLimit limit, Func<HeatedPlate> coupled)
    {
        PlateTemperature At(double k)
        {
            var g = sheetConductanceAtK(k);
            return screen.Solve(cellLossPerSiemensW.Select(p => p * g).ToArray(), thermalConductivityWPerMK, thicknessM, cooling);
        }
        Outcome TooHot(TemperatureMethod method, string why) =>
            new(null, double.NaN, method, limit.IsSet ? $"too hot to compute, beyond the limit: {why}" : null, why);

        PlateTemperature upper;
        try { upper = At(cooling.AmbientK); }
        catch (Exception e) when (e is NumericalFailureException or InputException) { return TooHot(TemperatureMethod.UpperBound, e.Message); }
        if (!limit.IsSet || limit.Breach(upper) is null) return new Outcome(upper, cooling.AmbientK, TemperatureMethod.UpperBound, null, null);

        PlateTemperature lower;
        try { lower = At(upper.HottestK); }
        catch (Exception e) when (e is NumericalFailureException or InputException) { return TooHot(TemperatureMethod.LowerBound, e.Message); }
        if (limit.Breach(lower) is { } lowerBreach) return new Outcome(lower, upper.HottestK, TemperatureMethod.LowerBound, $"{lowerBreach} even at the lower bound", null);

        HeatedPlate heated;
        try { heated = coupled(); }
        catch (NumericalFailureException e) { return TooHot(TemperatureMethod.Coupled, e.Message); }
        return new Outcome(heated.Temperature, heated.LossWeightedTemperatureK, TemperatureMethod.Coupled, limit.Breach(heated.Temperature), null);
    }
}
