namespace SlotOpt.Lamination;

/// <summary>Specific loss of one grade under one waveform, split into its terms, with the factors that shaped it.</summary>
public sealed record LaminationLoss(
    double HysteresisWPerKg,
    double ClassicalWPerKg,
    double ExcessWPerKg,
    double DensityKgPerM3,
    double SkinFactor,
    double WidthFactor,
    double SkinDepthM,
    double ThicknessOverSkinDepth,
    double ResistivityOhmM,
    IReadOnlyList<ValidityFlag> Flags)
{
    public double TotalWPerKg => HysteresisWPerKg + ClassicalWPerKg + ExcessWPerKg;
    public double TotalWPerM3 => TotalWPerKg * DensityKgPerM3;
}
