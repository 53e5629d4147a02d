namespace SlotOpt.Design.SolidParts;

/// <summary>Drag and lift of a plate at one speed of the source, with the plate's own field, beside the low-speed (resistance-limited) drag.</summary>
public sealed record SpeedPoint(double SpeedMPerS, double DragN, double LiftN, double ResistanceLimitedDragN);
