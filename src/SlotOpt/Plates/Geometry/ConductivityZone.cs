namespace SlotOpt.Plates.Geometry;

/// <summary>
/// A region of the plate whose conductivity is Factor times the reference one (a second material,
/// a hotter zone). Factor 0 makes the region non-conducting.
/// </summary>
public sealed record ConductivityZone(Polygon Area, double Factor);
