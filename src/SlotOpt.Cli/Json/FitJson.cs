using SlotOpt.Reports.Json;

namespace SlotOpt.Cli;

/// <summary>`slotopt fit --json`: the fitted coefficients with their standard errors, the classical coefficient from theory, and the quality of the fit.</summary>
public sealed record FitJson(
    double Kh,
    double Alpha,
    double Ke,
    double KhStandardError,
    double AlphaStandardError,
    double KeStandardError,
    double Kc,
    double RSquared,
    double WorstRelativeError,
    int Points,
    IReadOnlyList<string> Warnings) : VersionedJson;
