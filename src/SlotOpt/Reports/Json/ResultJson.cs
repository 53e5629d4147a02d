using SlotOpt.Design;
using SlotOpt.Plates;
using SlotOpt.Runs;
using SlotOpt.Selection;

namespace SlotOpt.Reports.Json;

/// <summary>
/// result.json, the machine-readable form of a run (`slotopt run --json` prints the same document): the numbers
/// the console prints, and nothing that changes from run to run. Keys are the property names in snake_case
/// (<see cref="JsonFormat"/>); absent values (null) are left out. The selection search's effort is
/// `search_solver_calls` and `search_deterministic_seconds` (schema 3; `cp_sat_calls` and `cp_sat_deterministic_seconds` before).
/// </summary>
public sealed record ResultJson(
    string Problem,
    string Currency,
    Objective Objective,
    SelectionStatus Status,
    IReadOnlyList<ResultJson.ChosenPart>? Parts,
    double? TotalLossW,
    double? TotalCost,
    double? OwningCost,
    double ValuePerWatt,
    double LoadValuePerWatt,
    IReadOnlyList<ResultJson.BaselineTotals> Baselines,
    IReadOnlyList<ResultJson.FrontDesign>? Front,
    bool? FrontComplete,
    IReadOnlyList<string>? Diagnosis,
    int SheetSolves,
    int SearchSolverCalls,
    double SearchDeterministicSeconds) : VersionedJson
{
    /// <summary>One part's chosen option, its loss by origin, the reference it is measured against, the confirmation of a plate, and how many options the rules dropped.</summary>
    public sealed record ChosenPart(
        string Name,
        string Design,
        string Id,
        IReadOnlyDictionary<string, string> Attributes,
        double LossW,
        double HysteresisW,
        double ClassicalW,
        double ExcessW,
        double PlateEddyW,
        double? DragN,
        double BuildCost,
        double ValuePerWatt,
        IReadOnlyList<string> Flags,
        string? Model,
        string? ModelReason,
        ReferenceDesign Reference,
        Confirmation? Confirmed,
        int Options,
        IReadOnlyDictionary<string, int> Rejected,
        Temperature? Temperature)
    {
        /// <summary>A turning disc: the mean braking torque (drag_n is then the tangential force at the magnets' radius, torque over that radius).</summary>
        [System.Text.Json.Serialization.JsonPropertyName("torque_n_m")]
        public double? TorqueNm { get; init; }
    }

    /// <summary>The part's current design, or its baseline; <see cref="Breaks"/> is the rule or limit it breaks; Model the plate model that gave its loss.</summary>
    public sealed record ReferenceDesign(string Kind, string Design, double LossW, double? DragN, double BuildCost, string? Breaks, Temperature? Temperature, string? Model)
    {
        /// <summary>A turning disc: the reference disc's braking torque.</summary>
        [System.Text.Json.Serialization.JsonPropertyName("torque_n_m")]
        public double? TorqueNm { get; init; }
    }

    /// <summary>
    /// A hot plate's coupled temperature (<see cref="PlateHeat"/>): rises above ambient, the hottest point (K, and x, y in m),
    /// the temperature the resistivity was taken at (loss-weighted mean, and the range over the plate), the limit it
    /// breaks; Failure instead when the coupled solve found no steady state.
    /// </summary>
    public sealed record Temperature(
        double? TemperatureRiseMaxK,
        double? TemperatureRiseMeanK,
        double? HottestTemperatureK,
        IReadOnlyList<double>? HottestPointM,
        double? AmbientK,
        double? ResistivityTemperatureK,
        IReadOnlyList<double>? ResistivityTemperatureRangeK,
        int? CouplingIterations,
        string? Breaks,
        string? Failure)
    {
        public static Temperature? Of(PlateHeat? heat)
        {
            if (heat is null) return null;
            if (heat.Heating is not { } h) return new Temperature(null, null, null, null, null, null, null, null, heat.Breach, heat.Failure);
            var t = h.Temperature;
            return new Temperature(t.MaxRiseK, t.MeanRiseK, t.HottestK, [t.HottestXM, t.HottestYM], t.AmbientK, h.LossWeightedTemperatureK,
                [h.ResistivityMinK, h.ResistivityMaxK], h.CouplingIterations, heat.Breach, null);
        }
    }

    /// <summary>A chosen plate solved with the model its validity calls for (its name as `plate --model` spells it), with its lift and its grid-error estimate (relative) and the method that made it (three-grid, three-grid-order-unconfirmed, two-grid or finer-grid: Plates/DiscretisationError).</summary>
    public sealed record Confirmation(string Model, string Reason, double LossW, double? DragN, double? LiftN, double ResistanceLimitedLossW, double? DiscretisationError)
    {
        /// <summary>How DiscretisationError was estimated; absent with it.</summary>
        public string? GridErrorMethod { get; init; }

        /// <summary>A turning disc: the confirmed braking torque.</summary>
        [System.Text.Json.Serialization.JsonPropertyName("torque_n_m")]
        public double? TorqueNm { get; init; }
    }

    public sealed record BaselineTotals(string Name, double Cost, double LossW, double OwningCost, IReadOnlyList<string> Breaks);

    /// <summary>One point of the trade-off front: its build cost, loss and the candidate ids of its design.</summary>
    public sealed record FrontDesign(double Cost, double LossW, IReadOnlyList<string> Designs);

    public static ResultJson From(RunResult r)
    {
        var economics = r.Problem.Economics;
        return new ResultJson(
            r.Problem.Name,
            economics.Currency,
            r.Problem.Goal,
            r.Outcome.Status,
            r.Chosen?.Select((o, i) => Chosen(r, o, r.Parts[i])).ToList(),
            r.HasDesign ? r.TotalLossW : null,
            r.HasDesign ? r.TotalBuildCost : null,
            r.HasDesign ? r.OwningCost : null,
            economics.ValuePerWatt,
            economics.ValuePerWattFor(LossKind.Load),
            r.Baselines.Select(b => new BaselineTotals(b.Name, b.BuildCost, b.LossW, b.OwningCost(r.Problem), b.Breaks)).ToList(),
            r.Outcome.Front?.Points.Select(p => new FrontDesign(p.BuildCost, p.LossW, p.CandidateIds)).ToList(),
            r.Outcome.Front is { } f ? f.Status == SelectionStatus.Optimal && !f.IsCapped : null,
            r.Outcome.Diagnosis?.Explain(),
            // effort in reproducible units only (wall times differ run to run; the console prints them)
            r.SheetSolves,
            r.Outcome.Effort.SolverCalls,
            r.Outcome.Effort.DeterministicSeconds);
    }

    private static ChosenPart Chosen(RunResult r, EvaluatedOption o, PartEvaluation part) => new(
        o.PartName, o.Description, o.Id, o.Attributes,
        o.Loss.TotalW, o.Loss.HysteresisW, o.Loss.ClassicalW, o.Loss.ExcessW, o.Loss.PlateEddyW, o.DragN, o.BuildCost, r.Problem.ValuePerWattOf(o.PartName), o.Flags,
        o.Model?.Name, o.Model?.Reason,
        new ReferenceDesign(part.ReferenceIsCurrent ? "current" : "baseline", part.Reference.Description, part.Reference.Loss.TotalW, part.Reference.DragN, part.Reference.BuildCost, part.Reference.Rejection?.Message,
            Temperature.Of(r.HeatOf(o.PartName, DesignRole.Reference)), part.Reference.Model?.Name) { TorqueNm = part.Reference.TorqueNm },
        r.Confirmation(o.PartName) is { } c ? new Confirmation(c.ModelName, c.Reason, c.LossW, c.DragN, c.LiftN, c.ResistanceLimitedLossW, c.GridError?.Relative) { TorqueNm = c.TorqueNm, GridErrorMethod = c.GridError?.MethodName } : null,
        part.Options.Count,
        part.RejectionCounts,
        Temperature.Of(r.HeatOf(o.PartName, DesignRole.Chosen))) { TorqueNm = o.TorqueNm };
}
