using System.Globalization;
using SlotOpt.Design;
using SlotOpt.Runs;
using SlotOpt.Selection;

namespace SlotOpt.Cli;

/// <summary>The console form of a run, formatted from the result itself: chosen design per part against the reference, its confirmation, totals, savings, limits, front.</summary>
public static class RunText
{
    public static void Write(RunResult r, TextWriter o)
    {
        var ci = CultureInfo.InvariantCulture;
        var economics = r.Problem.Economics;
        var cur = economics.Currency;
        o.WriteLine(r.Problem.Name);
        o.WriteLine(string.Create(ci, $"  {r.Parts.Sum(p => p.Options.Count)} options evaluated ({r.Parts.Sum(p => p.Feasible.Count)} within the rules), {r.SheetSolves} plate solves in {r.EvaluationSeconds:0.0} s; selection {r.Outcome.Effort.SolverCalls} solver calls, {r.Outcome.Effort.WallSeconds:0.00} s"));
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
            o.WriteLine("  Note: the search hit its time budget; the design below meets every limit but is not proven best.");
        o.WriteLine();
        for (var i = 0; i < r.Chosen.Count; i++)
        {
            var chosen = r.Chosen[i];
            var reference = r.Parts[i].Reference;
            o.WriteLine($"  {chosen.PartName}");
            o.WriteLine(string.Create(ci, $"    chosen:  {chosen.Description}"));
            o.WriteLine(string.Create(ci, $"             loss {chosen.Loss.TotalW:0.###} W{Drag(chosen.DragN)}, build cost {chosen.BuildCost:0.00} {cur}"));
            o.WriteLine(string.Create(ci, $"    {(r.Parts[i].ReferenceIsCurrent ? "current" : "baseline")}: {reference.Description}"));
            o.WriteLine(string.Create(ci, $"             loss {reference.Loss.TotalW:0.###} W{Drag(reference.DragN)}, build cost {reference.BuildCost:0.00} {cur}{(reference.Rejection is null ? "" : $" (breaks: {reference.Rejection.Message})")}"));
            if (r.Confirmation(chosen.PartName) is { } confirmed) o.WriteLine($"    confirmed: {Confirmed(confirmed)}");
            foreach (var role in new[] { DesignRole.Chosen, DesignRole.Reference })
                if (r.HeatOf(chosen.PartName, role) is { } heat) o.WriteLine($"    {(role == DesignRole.Chosen ? "chosen" : r.Parts[i].ReferenceIsCurrent ? "current" : "baseline")} temperature: {Temperature(heat)}");
            foreach (var flag in chosen.Flags) o.WriteLine($"    warning: {flag}");
        }
        o.WriteLine();
        var vpw = economics.ValuePerWatt;
        o.WriteLine(string.Create(ci, $"  total:     loss {r.TotalLossW:0.###} W, build cost {r.TotalBuildCost:0.00} {cur}, owning cost {r.OwningCost:0.00} {cur} (loss at {vpw:0.###} {cur}/W{(economics.SeparatesLoadLoss ? $" no-load, {economics.LoadValuePerWatt:0.###} {cur}/W load" : "")})"));
        var refBase = r.Reference;
        o.WriteLine(string.Create(ci, $"  {refBase.Name}: loss {refBase.LossW:0.###} W, build cost {refBase.BuildCost:0.00} {cur}, owning cost {refBase.OwningCost(r.Problem):0.00} {cur}"));
        var savedW = refBase.LossW - r.TotalLossW;
        var savedOwning = refBase.OwningCost(r.Problem) - r.OwningCost;
        o.WriteLine(string.Create(ci, $"  saves {savedW:0.###} W{(r.Problem.YearlyLossCost(refBase.Options) is { } before && r.Problem.YearlyLossCost(r.Chosen!) is { } after ? $" = {before - after:0.00} {cur} a year" : "")} and {savedOwning:0.00} {cur} of owning cost over the life"));
        if (r.Outcome.Front is { } front)
        {
            o.WriteLine();
            o.WriteLine($"  trade-off curve ({front.Points.Count} points{(front.IsCapped ? ", capped" : "")}{(front.Status == SelectionStatus.Optimal ? "" : ", not all proven")}):");
            o.WriteLine($"    {"build cost",12} {"loss W",12} {"owning cost",12}");
            foreach (var p in front.Points)
                o.WriteLine(string.Create(ci, $"    {p.BuildCost,12:0.00} {p.LossW,12:0.###} {p.BuildCost + vpw * p.LossW,12:0.00}"));
        }
        o.WriteLine();
        o.WriteLine("  These are engineering estimates to be confirmed by test; see the report's cautions.");
    }

    /// <summary>A chosen plate as confirmed: which model ran, its loss, drag and lift, the resistance-limited screen's loss, and why that model.</summary>
    private static string Confirmed(PlateConfirmation c) => string.Create(CultureInfo.InvariantCulture,
        $"{c.ModelWords}: loss {c.LossW:0.###} W{(c.DragN is { } d ? string.Create(CultureInfo.InvariantCulture, $", drag {d:0.###} N") : "")}{(c.LiftN is { } l ? string.Create(CultureInfo.InvariantCulture, $", lift {l:0.###} N") : "")} (resistance-limited screen: {c.ResistanceLimitedLossW:0.###} W){(c.GridError is { } e ? string.Create(CultureInfo.InvariantCulture, $"; estimated grid error {e.Relative:P2}") : "")}. {c.Reason}");

    /// <summary>A hot plate's coupled temperature: hottest point (value and place), mean rise, the resistivity's temperature, the limit.</summary>
    private static string Temperature(PlateHeat heat)
    {
        if (heat.Heating is not { } h) return $"no steady state ({heat.Failure})";
        var t = h.Temperature;
        return string.Create(CultureInfo.InvariantCulture,
            $"hottest {t.HottestK - 273.15:0.#} degC (rise {t.MaxRiseK:0.#} K) at x {t.HottestXM * 1e3:0} mm, y {t.HottestYM * 1e3:0} mm; mean rise {t.MeanRiseK:0.#} K; resistivity at {h.LossWeightedTemperatureK - 273.15:0.#} degC (loss-weighted); {(heat.Limit.IsSet ? heat.Breach ?? "within the limit" : "no limit set")}");
    }

    private static string Drag(double? dragN) => dragN is { } d ? string.Create(CultureInfo.InvariantCulture, $", drag {d:0.###} N") : "";
}
