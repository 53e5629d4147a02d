using System.Globalization;

namespace SlotOpt.Plates.Thermal;

/// <summary>The hottest point a plate may reach: an absolute temperature, a rise above ambient, or both (K).</summary>
public sealed record TemperatureLimit(double? MaxTemperatureK, double? MaxRiseK)
{
    public bool IsSet => MaxTemperatureK is not null || MaxRiseK is not null;

    /// <summary>Null when the plate keeps within the limit, else what it broke, in words.</summary>
    public string? Breach(PlateTemperature t)
    {
        var c = CultureInfo.InvariantCulture;
        if (MaxTemperatureK is { } max && t.HottestK > max)
            return string.Create(c, $"hottest point {t.HottestK - 273.15:0.#} degC exceeds the limit {max - 273.15:0.#} degC");
        if (MaxRiseK is { } rise && t.MaxRiseK > rise)
            return string.Create(c, $"hottest rise {t.MaxRiseK:0.#} K exceeds the limit {rise:0.#} K");
        return null;
    }
}
