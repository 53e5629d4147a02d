namespace SlotOpt.Input;

/// <summary>The physical quantity a key or flag expects; text is parsed against exactly one.</summary>
public enum QuantityKind
{
    Length,
    FluxDensity,
    Frequency,
    Speed,
    Temperature,
    Resistivity,
    Density,
    Mass,
    Area,
    Power,
    Force,
    Pressure,
    Conductivity,
    Duration,
    Information,
    Torque,
}
