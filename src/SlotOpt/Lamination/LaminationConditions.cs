using SlotOpt.Materials;

namespace SlotOpt.Lamination;

/// <summary>How a lamination is worked: temperature and the narrowest feature the flux runs along.</summary>
public sealed record LaminationConditions
{
    public static readonly LaminationConditions Room = new();

    /// <summary>Operating temperature of the steel (K); sets the resistivity.</summary>
    public double TemperatureK { get; init; } = Conductor.RoomTemperatureK;

    /// <summary>Width of the narrowest feature (tooth, strip) in the sheet plane (m); infinity for a wide sheet.</summary>
    public double FeatureWidthM { get; init; } = double.PositiveInfinity;
}
