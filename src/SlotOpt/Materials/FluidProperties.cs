namespace SlotOpt.Materials;

/// <summary>A cooling fluid's properties at one temperature, for the natural-convection correlation.</summary>
public readonly record struct FluidProperties(
    double KinematicViscosityM2PerS,
    double ThermalConductivityWPerMK,
    double PrandtlNumber,
    double ExpansionPerK);
