using SlotOpt.Design.SolidParts;
using System.Globalization;
using SlotOpt.Tables;
using SlotOpt.Design;
using SlotOpt.Plates;
using SlotOpt.Reports;
using SlotOpt.Runs;
using SlotOpt.Selection;

namespace SlotOpt.Cli;

/// <summary>
/// The console form of a run, formatted from the result itself: chosen design per part against the reference, its
/// confirmation, the validity of both, totals, savings, limits, front. Numbers follow <see cref="Numbers"/>, as the report does.
/// </summary>
public static class RunText
{
    public static void Write(RunResult r, TextWriter o)
    {
        var ci = CultureInfo.InvariantCulture;
        var economics = r.Problem.Economics;
        var cur = economics.Currency;
        o.WriteLine(r.Problem.Name);
        o.WriteLine(string.Create(ci, $"  {r.Parts.Sum(p => p.Options.Count)} options evaluated ({r.Parts.Sum(p => p.Feasible.Count)} within the rules), {r.SheetSolves} plate solves in {Numbers.Of(r.EvaluationSeconds, "s")}; selection {r.Outcome.Effort.SolverCalls} solver calls, {Numbers.Of(r.Outcome.Effort.WallSeconds, "s")}"));
        foreach (var p in r.Parts)
            foreach (var (rule, count) in p.RejectionCounts)
                o.WriteLine($"  {p.Part.Name}: {count} options dropped: {rule}");
        if (r.Chosen is null)
        {
            o.WriteLine(r.Outcome.Status == SelectionStatus.Infeasible
                ? "  No design meets every limit."
                : "  The search ran out of its time budget before finding a design that meets every limit.");
            foreach (var line in r.Outcome.Diagnosis?.Explain() ?? []) o.WriteLine($"  - {line}");
            return;
        }
        if (r.Outcome.Status == SelectionStatus.FeasibleAtLimit)
            o.WriteLine("  Note: the search hit its time budget; the design below meets every limit, but a better one among the listed options may exist.");
        o.WriteLine();
        for (var i = 0; i < r.Chosen.Count; i++)
        {
            var chosen = r.Chosen[i];
            var reference = r.Parts[i].Reference;
            o.WriteLine($"  {chosen.PartName}");
            o.WriteLine(string.Create(ci, $"    chosen:  {chosen.Description}"));
            o.WriteLine($"             loss {Numbers.Watts(chosen.Loss.TotalW)}{Torque(chosen.TorqueNm)}{Drag(chosen.DragN)}, build cost {Numbers.Money(chosen.BuildCost, cur)}");
            o.WriteLine(string.Create(ci, $"    {(r.Parts[i].ReferenceIsCurrent ? "current" : "baseline")}: {reference.Description}"));
            o.WriteLine($"             loss {Numbers.Watts(reference.Loss.TotalW)}{Torque(reference.TorqueNm)}{Drag(reference.DragN)}{(reference.Model is { } model ? $" ({model.Name} model)" : "")}, build cost {Numbers.Money(reference.BuildCost, cur)}{(reference.Rejection is null ? "" : $" (breaks: {reference.Rejection.Message})")}");
            if (r.Confirmation(chosen.PartName) is { } confirmed) o.WriteLine($"    confirmed: {ReportContent.ConfirmationText(confirmed)}");
            if (r.Confirmation(chosen.PartName)?.Minimum is { Wanted: var wanted } minimum)
                o.WriteLine($"    minimum {wanted.Name}: {Numbers.Of(minimum.Achieved, wanted.Unit)} at {Numbers.Of(wanted.Speed, wanted.SpeedUnit)} ({ReactionModelChoice.Name(minimum.Model)}) {(minimum.Reached ? "reaches" : "FALLS SHORT of")} the required {Numbers.Of(wanted.Value, wanted.Unit)}");
            foreach (var role in new[] { DesignRole.Chosen, DesignRole.Reference })
                if (r.HeatOf(chosen.PartName, role) is { } heat) o.WriteLine($"    {(role == DesignRole.Chosen ? "chosen" : r.Parts[i].ReferenceIsCurrent ? "current" : "baseline")} temperature: {Temperature(heat)}");
            foreach (var flag in chosen.Flags) o.WriteLine($"    warning: {flag}");
            if (!ReferenceEquals(chosen, reference) && chosen.Id != reference.Id)
                foreach (var flag in reference.Flags) o.WriteLine($"    warning ({(r.Parts[i].ReferenceIsCurrent ? "current" : "baseline")} design): {flag}");
        }
        o.WriteLine();
        var vpw = economics.ValuePerWatt;
        o.WriteLine($"  total:     loss {Numbers.Watts(r.TotalLossW)}, build cost {Numbers.Money(r.TotalBuildCost, cur)}, owning cost {Numbers.Money(r.OwningCost, cur)} (loss at {Numbers.Sig(vpw)} {cur}/W{(economics.SeparatesLoadLoss ? $" no-load, {Numbers.Sig(economics.LoadValuePerWatt!.Value)} {cur}/W load" : "")})");
        var refBase = r.Reference;
        o.WriteLine($"  {refBase.Name}: loss {Numbers.Watts(refBase.LossW)}, build cost {Numbers.Money(refBase.BuildCost, cur)}, owning cost {Numbers.Money(refBase.OwningCost(r.Problem), cur)}");
        var savedW = refBase.LossW - r.TotalLossW;
        var savedOwning = refBase.OwningCost(r.Problem) - r.OwningCost;
        o.WriteLine($"  saves {Numbers.Watts(savedW)}{(r.Problem.YearlyLossCost(refBase.Options) is { } before && r.Problem.YearlyLossCost(r.Chosen!) is { } after ? $" = {Numbers.Money(before - after, cur)} a year" : "")} and {Numbers.Money(savedOwning, cur)} of owning cost over the life");
        if (r.Outcome.Front is { } front)
        {
            o.WriteLine();
            o.WriteLine($"  trade-off curve ({front.Points.Count} points{(front.IsCapped ? ", capped" : "")}{(front.Status == SelectionStatus.Optimal ? "" : ", some not searched to the end")}):");
            o.WriteLine($"    {"build cost",12} {"loss W",12} {"owning cost",12}");
            foreach (var p in front.Points)
                o.WriteLine($"    {Numbers.Sig(p.BuildCost),12} {Numbers.Sig(p.LossW),12} {Numbers.Sig(r.Problem.Economics.SeparatesLoadLoss ? r.Problem.OwningCost(p.CandidateIds.Select(r.Option)) : p.BuildCost + vpw * p.LossW),12}");
        }
        o.WriteLine();
        o.WriteLine("  These are engineering estimates to be confirmed by test; see the report's cautions.");
    }

    /// <summary>A hot plate's coupled temperature: hottest point (value and place), mean rise, the resistivity's temperature, the limit.</summary>
    private static string Temperature(PlateHeat heat)
    {
        if (heat.Heating is not { } h) return $"no steady state ({heat.Failure})";
        var t = h.Temperature;
        return string.Create(CultureInfo.InvariantCulture,
            $"hottest {Numbers.Celsius(t.HottestK, "degC")} (rise {Numbers.Kelvin(t.MaxRiseK)}) at x {Numbers.Of(t.HottestXM * 1e3, "mm")}, y {Numbers.Of(t.HottestYM * 1e3, "mm")}; mean rise {Numbers.Kelvin(t.MeanRiseK)}; resistivity at {Numbers.Celsius(h.LossWeightedTemperatureK, "degC")} (loss-weighted); {(heat.Limit.IsSet ? heat.Breach ?? "within the limit" : "no limit set")}");
    }

    private static string Drag(double? dragN) => dragN is { } d ? $", drag {Numbers.Newtons(d)}" : "";

    private static string Torque(double? torqueNm) => torqueNm is { } t ? $", braking torque {Numbers.Of(t, "N m")}" : "";
}
