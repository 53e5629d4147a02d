using SlotOpt.Plates.Thermal;

namespace SlotOpt.Design;

/// <summary>How an option's temperature was found (see <see cref="PlateTemperatureScreen"/>).</summary>
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
/// A plate option's steady temperature: hottest point (K and where, m), rises above ambient (K), the temperature the
/// resistivity was taken at (K; the loss-weighted mean for a coupled solve), and how it was found.
/// </summary>
public sealed record OptionTemperature(double HottestK, double HottestXM, double HottestYM, double MaxRiseK, double MeanRiseK, double ResistivityK, TemperatureMethod Method)
{
    public static OptionTemperature Of(PlateTemperature t, double resistivityK, TemperatureMethod method) =>
        new(t.HottestK, t.HottestXM, t.HottestYM, t.MaxRiseK, t.MeanRiseK, resistivityK, method);

    public string MethodWords => Method switch
    {
        TemperatureMethod.UpperBound => "upper bound (loss at the ambient resistivity)",
        TemperatureMethod.LowerBound => "lower bound (loss at the hottest point's resistivity)",
        _ => "coupled (resistivity at the local temperature)",
    };
}
