using SlotOpt.Plates.Geometry;

namespace SlotOpt.Plates.Sources;

/// <summary>One pole: its face, its centre at travel offset zero (metres) and its flux density (tesla, sign = polarity).</summary>
public sealed record Pole(PoleFace Face, Vec2 Centre, double FluxDensityT);
