namespace SlotOpt.Plates;

/// <summary>The chosen model with the figures and thresholds that decided it.</summary>
public sealed record ModelChoice(SheetModelKind Kind, double ReynoldsNumber, double ThicknessToSkinDepth, double ReynoldsThreshold, double ThicknessThreshold, string Reason);
