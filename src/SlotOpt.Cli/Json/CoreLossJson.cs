using SlotOpt.Reports.Json;

namespace SlotOpt.Cli;

/// <summary>`slotopt core-loss --json`: the conditions and the specific loss with its breakdown and corrections.</summary>
public sealed record CoreLossJson(
    string Grade,
    double ThicknessMm,
    double PeakFluxDensityT,
    double FrequencyHz,
    double TemperatureK,
    string Waveform,
    double TotalWPerKg,
    double HysteresisWPerKg,
    double ClassicalWPerKg,
    double ExcessWPerKg,
    double TotalWPerM3,
    double SkinFactor,
    double WidthFactor,
    double SkinDepthMm,
    double ThicknessOverSkinDepth,
    double ResistivityUohmM,
    IReadOnlyList<string> Flags) : VersionedJson;
