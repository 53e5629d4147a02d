namespace SlotOpt.Plates.Geometry;

/// <summary>
/// The slots (or grooves) one pattern generator made, with the narrowest conducting widths it
/// leaves (PitchM is the spacing of neighbouring slots): the strip between neighbouring slots and the ligament beyond a slot's end. The grid
/// uses the narrowest of these to choose its cell size; the validity check uses the strip width.
/// </summary>
public sealed record SlotPattern(IReadOnlyList<Slot> Slots, IReadOnlyList<Groove> Grooves, double PitchM, double StripWidthM, double LigamentM);
