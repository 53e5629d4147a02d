namespace SlotOpt.Numerics;

/// <summary>How one linear solve went: iterations and the final true relative residual |b - A x| / |b|.</summary>
public readonly record struct SolveReport(bool Converged, int Iterations, double RelativeResidual, string Reason);
