namespace SlotOpt.Plates.Geometry;

/// <summary>
/// A zero-width cut (a kerf far thinner than a grid cell) from Start to End, metres. No current
/// crosses it, so the stream function is constant along it: the grid nodes nearest the line
/// (a 4-connected chain) are merged into one unknown, or into the outside if the chain reaches it.
/// </summary>
public sealed record CutLine(Vec2 Start, Vec2 End);
