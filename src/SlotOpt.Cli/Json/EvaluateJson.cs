using SlotOpt.Reports.Json;

namespace SlotOpt.Cli;

/// <summary>`slotopt evaluate --json`: each part's current design (or baseline), its loss by origin, drag (a turning disc's torque) and cost, and the totals.</summary>
public sealed record EvaluateJson(
    string Problem,
    string Currency,
    IReadOnlyList<EvaluateJson.Part> Parts,
    double TotalLossW,
    double TotalCost,
    double ValuePerWatt,
    double OwningCost) : VersionedJson
{
    /// <summary>One part as evaluated: <see cref="Kind"/> is "current" or "baseline" (as in result.json's reference), <see cref="Breaks"/> the rule or limit it breaks.</summary>
    public sealed record Part(
        string Name,
        string Kind,
        string Design,
        double LossW,
        double HysteresisW,
        double ClassicalW,
        double ExcessW,
        double PlateEddyW,
        double? DragN,
        double BuildCost,
        string? Breaks,
        IReadOnlyList<string> Flags)
    {
        /// <summary>A turning disc: the braking torque (drag_n is then the tangential force at the magnets' radius); absent for other parts.</summary>
        [System.Text.Json.Serialization.JsonPropertyName("torque_n_m")]
        public double? TorqueNm { get; init; }
    }
}
