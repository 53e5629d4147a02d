using SlotOpt.Plates.Thermal;

namespace SlotOpt.Runs;

/// <summary>The [thermal] section of a plate file, validated and in SI: cooling, material's thermal side, and the limit.</summary>
public sealed record PlateThermalInput(PlateCooling Cooling, ThermalMaterial Material, TemperatureLimit Limit);
