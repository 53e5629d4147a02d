namespace SlotOpt.Design.Limits;

/// <summary>
/// What one part's run holds at once, in the counts <see cref="MemoryModel"/> prices: its slot geometries, with a thermal section the
/// thicknesses x materials heated on each, for a moving source the travel positions its coupled ranking keeps, for a turning disc the
/// lattice-and-angle pairs its source integrates (the model caps the kept ones).
/// </summary>
public sealed record PartWorkload(int Geometries, int ThermalOptionsPerGeometry = 0, int TravelPositions = 0, int RotatingRateSets = 0);
