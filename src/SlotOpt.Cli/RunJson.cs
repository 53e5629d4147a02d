using SlotOpt.Design;
using SlotOpt.Runs;
using SlotOpt.Selection;

namespace SlotOpt.Cli;

/// <summary>The machine-readable form of a run: the same numbers the console prints, and nothing that changes from run to run.</summary>
public static class RunJson
{
    public static object From(RunResult r)
    {
        var economics = r.Problem.Economics;
        return new
        {
            problem = r.Problem.Name,
            currency = economics.Currency,
            objective = r.Problem.Goal,
            status = r.Outcome.Status,
            parts = r.Chosen?.Select((o, i) => new
            {
                name = o.PartName,
                design = o.Description,
                id = o.Id,
                attributes = o.Attributes,
                loss_w = o.Loss.TotalW,
                hysteresis_w = o.Loss.HysteresisW,
                classical_w = o.Loss.ClassicalW,
                excess_w = o.Loss.ExcessW,
                plate_eddy_w = o.Loss.PlateEddyW,
                drag_n = o.DragN,
                build_cost = o.BuildCost,
                value_per_watt = r.Problem.ValuePerWattOf(o.PartName),
                flags = o.Flags,
                reference = new
                {
                    kind = r.Parts[i].ReferenceIsCurrent ? "current" : "baseline",
                    design = r.Parts[i].Reference.Description,
                    loss_w = r.Parts[i].Reference.Loss.TotalW,
                    drag_n = r.Parts[i].Reference.DragN,
                    build_cost = r.Parts[i].Reference.BuildCost,
                    breaks = r.Parts[i].Reference.Rejection,
                },
                confirmed = r.Confirmation(o.PartName) is { } c
                    ? new { model = c.Model, reason = c.Reason, loss_w = c.LossW, drag_n = c.DragN, lift_n = c.LiftN, resistance_limited_loss_w = c.ResistanceLimitedLossW }
                    : null,
                options = r.Parts[i].Options.Count,
                rejected = r.Parts[i].RejectionCounts,
            }),
            total_loss_w = r.HasDesign ? r.TotalLossW : (double?)null,
            total_cost = r.HasDesign ? r.TotalBuildCost : (double?)null,
            owning_cost = r.HasDesign ? r.OwningCost : (double?)null,
            value_per_watt = economics.ValuePerWatt,
            load_value_per_watt = economics.ValuePerWattFor(LossKind.Load),
            baselines = r.Baselines.Select(b => new { name = b.Name, cost = b.BuildCost, loss_w = b.LossW, owning_cost = b.OwningCost(r.Problem), breaks = b.Breaks }),
            front = r.Outcome.Front?.Points.Select(p => new { cost = p.BuildCost, loss_w = p.LossW, designs = p.CandidateIds }),
            front_complete = r.Outcome.Front is { } f ? f.Status == SelectionStatus.Optimal && !f.IsCapped : (bool?)null,
            diagnosis = r.Outcome.Diagnosis?.Explain(),
            // effort in reproducible units only (wall times differ run to run; the console prints them)
            sheet_solves = r.SheetSolves,
            cp_sat_calls = r.Outcome.Effort.SolverCalls,
            cp_sat_deterministic_seconds = r.Outcome.Effort.DeterministicSeconds,
        };
    }
}
