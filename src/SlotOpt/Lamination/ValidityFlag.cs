namespace SlotOpt.Lamination;

/// <summary>A reason to read a result with care: where the model leaves its ground.</summary>
public sealed record ValidityFlag(string Code, string Message);
