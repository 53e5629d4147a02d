namespace SlotOpt.Lamination;

/// <summary>One measured specific loss: sine of peak B at frequency f gave this many W/kg.</summary>
public readonly record struct LossMeasurement(double PeakT, double FrequencyHz, double LossWPerKg);
