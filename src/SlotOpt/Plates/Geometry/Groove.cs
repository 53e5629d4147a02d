namespace SlotOpt.Plates.Geometry;

/// <summary>
/// A groove that does not go through the plate: over its area the remaining thickness is
/// RemainingThicknessFraction (0 &lt; f &lt; 1) of the full thickness, so the sheet conductance is
/// reduced by that fraction there.
/// </summary>
public sealed record Groove(Polygon Area, double RemainingThicknessFraction);
