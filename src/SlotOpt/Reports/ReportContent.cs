using SlotOpt.Design.SolidParts;
using SlotOpt.Reports.Plots;
using System.Globalization;
using SlotOpt.Tables;
using SlotOpt.Design;
using SlotOpt.Design.Cores;
using SlotOpt.Plates.Thermal;
using SlotOpt.Runs;
using SlotOpt.Selection;

namespace SlotOpt.Reports;

/// <summary>
/// What the report says, in order: a one-line verdict, the chosen design in workshop words, what it saves,
/// which limits bind, the job and its inputs, the plots, the options the rules dropped, the validity flags,
/// and the assumptions, cautions and methods. Numbers follow <see cref="Numbers"/>, as the console does, so the two agree.
/// </summary>
public static class ReportContent
{
    private static readonly CultureInfo Ci = CultureInfo.InvariantCulture;

    public static ReportDocument Build(RunResult r, ReportFigures figures, string stampLine)
    {
        var limits = LimitChecks(r);
        var blocks = new List<ReportBlock> { new StampLine(stampLine), new Verdict(VerdictLine(r, limits)) };
        Result(r, blocks);
        Savings(r, blocks);
        Limits(r, limits, blocks);
        Job(r, blocks);
        Plots(r, figures, blocks);
        Rejections(r, blocks);
        Flags(r, blocks);
        Cautions(r, blocks);
        Files(figures, blocks);
        return new ReportDocument(r.Problem.Name, blocks);
    }

    private static string F(FormattableString s) => s.ToString(Ci);
    private static string Cur(RunResult r) => r.Problem.Economics.Currency;
    private static string N(double value) => Numbers.Sig(value);
    private static string Money(RunResult r, double amount) => Numbers.Money(amount, Cur(r));

    /// <summary>One limit the chosen design is held to: its words, and whether the design uses it to within <see cref="BindingFraction"/>.</summary>
    private sealed record LimitCheck(string Name, string Text, bool Binds);

    /// <summary>
    /// The verdict at the top of the report: the chosen design, what it saves against the current design (or the
    /// first baseline) in owning cost and loss, and which limits bind; or why there is no design.
    /// </summary>
    private static string VerdictLine(RunResult r, IReadOnlyList<LimitCheck> limits)
    {
        if (r.Chosen is null)
            return r.Outcome.Status == SelectionStatus.Infeasible
                ? "Verdict: no design meets every limit" + (r.Outcome.Diagnosis?.Explain() is [var first, ..] ? ": " + first : ".")
                : "Verdict: the search ran out of its time budget before finding a design that meets every limit.";
        var design = r.Chosen.Count == 1 ? WorkshopWords.Of(r.Chosen[0], r.Parts[0].Part) : string.Join("; ", r.Chosen.Select((o, i) => $"{o.PartName}: {WorkshopWords.Of(o, r.Parts[i].Part)}"));
        var reference = r.Reference;
        var savedOwning = reference.OwningCost(r.Problem) - r.OwningCost;
        var savedW = reference.LossW - r.TotalLossW;
        var saves = (savedOwning >= 0 ? $"saves {Money(r, savedOwning)}" : $"costs {Money(r, -savedOwning)} more") + " of owning cost and "
            + (savedW >= 0 ? $"{Numbers.Watts(savedW)} of loss" : $"adds {Numbers.Watts(-savedW)} of loss")
            + $" against the {reference.Name} ({Numbers.Watts(reference.LossW)} to {Numbers.Watts(r.TotalLossW)})"
            + (BaselineBreaks.Of(r, reference).Count > 0 ? $", which breaks a limit" : "");
        var binding = limits.Where(l => l.Binds).Select(l => l.Name).ToList();
        var binds = binding.Count switch
        {
            0 => limits.Count == 0 ? "no limit is set" : "no limit binds (the goal alone chose it)",
            1 => $"the {binding[0]} binds",
            _ => $"binding: {string.Join(", ", binding)}",
        };
        return $"Verdict: {design}. It {saves}; {binds}.";
    }

    /// <summary>" (tie plate, clamp)" naming the parts whose loss is of this kind, or "" when none is.</summary>
    private static string PartsOfKind(Problem p, LossKind kind)
    {
        var names = p.Parts.Where(x => x.LossKind == kind).Select(x => x.Name).ToList();
        return names.Count == 0 ? "" : $" ({string.Join(", ", names)})";
    }

    private static void Job(RunResult r, List<ReportBlock> b)
    {
        var p = r.Problem;
        var e = p.Economics;
        b.Add(new Heading("The job"));
        b.Add(new Paragraph(F($"Problem file {Path.GetFileName(p.SourcePath)}; goal: {GoalWords(p.Goal)}. Currency {e.Currency}.")));
        var economics = e.SeparatesLoadLoss
            ? F($"A watt of no-load loss{PartsOfKind(p, LossKind.NoLoad)} is worth {N(e.ValuePerWatt)} {e.Currency} over the life, a watt of load loss{PartsOfKind(p, LossKind.Load)} {N(e.LoadValuePerWatt!.Value)} {e.Currency}")
              + (e.LoadEnergyShare is { } share ? F($", since load loss is paid at (per-unit load)^2 x loss factor = {N(share)} of the energised hours (IEEE C57.120 A and B factors)") : "")
            : F($"A watt of continuous loss is worth {N(e.ValuePerWatt)} {e.Currency} over the life");
        if (e.EnergyPricePerKWh is { } price && e.HoursPerYear is { } hours)
            economics += F($" (energy at {N(price)} {e.Currency}/kWh for {N(hours)} h a year") + (e.Years is { } years ? F($", {N(years)} years") : "")
                + (e.DiscountRate is { } rate ? F($" discounted at {N(rate * 100)} %") : "") + ")";
        b.Add(new Paragraph(economics + "."));
        var rows = r.Parts.Select(pe => (IReadOnlyList<string>)[pe.Part.Name, Inputs(pe.Part), pe.Options.Count.ToString(Ci), pe.Feasible.Count.ToString(Ci)]).ToList();
        b.Add(new Table(["part", "inputs", "options evaluated", "within the rules"], rows, [false, false, true, true]));
        var limits = SharedLimitLines(p).ToList();
        b.Add(new Paragraph(limits.Count == 0 ? "No shared limits across the parts." : "Shared limits: " + string.Join("; ", limits) + "."));
        if (p.Warnings.Count > 0) b.Add(new BulletList(p.Warnings.Select(w => "warning: " + w).ToList()));
        b.Add(new Paragraph(F($"{r.Parts.Sum(pe => pe.Options.Count)} options evaluated ({r.Parts.Sum(pe => pe.Feasible.Count)} within the rules), {r.SheetSolves} plate solves; the selection search made {r.Outcome.Effort.SolverCalls} solver calls.")));
    }

    private static string GoalWords(Objective goal) => goal switch
    {
        Objective.LowestOwningCost => "the lowest owning cost (build cost plus the capitalised loss)",
        Objective.LowestLossWithinBudget => "the lowest loss within the budget",
        Objective.LowestCostWithinLossCap => "the lowest build cost within the loss cap",
        Objective.TradeOffCurve => "the trade-off curve of loss against build cost, and on it the lowest owning cost",
        _ => goal.ToString(),
    };

    private static string Inputs(Part part) => part switch
    {
        CorePart c => F($"laminated core: {N(c.LaminationAreaM2 * 1e4)} cm² lamination area, {N(c.StackHeightM * 1e3)} mm stack; {N(c.Flux.PeakT)} T peak at {N(c.Flux.FundamentalHz)} Hz, {(c.Flux.IsSinusoidal ? "sine" : "non-sinusoidal waveform")}; {Numbers.Celsius(c.TemperatureK)}")
            + (double.IsFinite(c.FeatureWidthM) ? F($"; narrowest feature {N(c.FeatureWidthM * 1e3)} mm") : "")
            + $"; grades {string.Join(", ", c.Grades)}; processes {string.Join(", ", c.Processes)}"
            + (c.MaxLossW is { } max ? $"; loss limit {Numbers.Watts(max)}" : ""),
        PlatePart pl => PlateInputs(pl),
        _ => throw new ArgumentOutOfRangeException(nameof(part), part.GetType().Name, "unknown part kind"),
    };

    private static string PlateInputs(PlatePart p)
    {
        var (min, max) = p.Outline.Bounds;
        var source = p.Excitation switch
        {
            PlateExcitation.Turning turning => $"the disc turning at {Numbers.Of(turning.Rpm, "rpm")} under {turning.Source.Words} (path speed {Numbers.Of(turning.PathSpeedMPerS, "m/s")})",
            PlateExcitation.Moving { Source: var moving } => $"{moving.Words} passing at {Numbers.Of(moving.SpeedMPerS, "m/s")}",
            PlateExcitation.AcField field => $"AC field at {Numbers.Of(field.FrequencyHz, "Hz")}" + (field.FieldMapFile is { } map ? $" from the field-map file {map}" : " (uniform)"),
            _ => throw new ArgumentOutOfRangeException(nameof(p), p.Excitation.GetType().Name, "unknown plate excitation"),
        };
        var shape = p.Disc is { } disc ? $"disc {N(2 * disc.RadiusM * 1e3)} mm across" + (disc.BoreRadiusM > 0 ? $", bore {N(2 * disc.BoreRadiusM * 1e3)} mm" : "")
            : $"plate {N((max.X - min.X) * 1e3)} x {N((max.Y - min.Y) * 1e3)} mm";
        return $"{shape}; {source}; {Numbers.Celsius(p.TemperatureK)}; thicknesses "
            + string.Join(", ", p.ThicknessesM.Select(t => $"{N(t * 1e3)} mm")) + $"; materials {string.Join(", ", p.Materials)}; processes {string.Join(", ", p.Processes)}; "
            + (p.SlotFamilies.Count == 0 ? "no slot patterns" : string.Join(", ", p.SlotFamilies.Select(f => f.Rings is { } rings
                ? $"radial slots ({string.Join(", ", rings.Select(x => x.Count).Distinct())} round the disc)"
                : $"{SlotPatternCatalog.Of(f.Pattern).Words} slots from the {f.Edge.ToString().ToLowerInvariant()} edge")))
            + $"; uncut ligament at least {N(p.MinLigamentM * 1e3)} mm"
            + (p.MaxDragN is { } drag ? $"; drag limit {Numbers.Newtons(drag)}" : "")
            + (p.MaxTorqueNm is { } torque ? $"; torque limit {Numbers.Of(torque, "N m")}" : "")
            + (p.MinBraking is { } wanted ? $"; minimum {BrakingWords(wanted)} {Numbers.Of(wanted.Value, wanted.Unit)} at {Numbers.Of(wanted.Speed, wanted.SpeedUnit)}" : "")
            + (p.MaxLossW is { } loss ? $"; loss limit {Numbers.Watts(loss)}" : "")
            + (p.Thermal is { } th ? "; " + CoolingWords(th) : "");
    }

    /// <summary>A wanted braking quantity in the report's words: "drag", or "braking torque" for a disc.</summary>
    private static string BrakingWords(BrakingMinimum wanted) => wanted.Quantity == BrakingQuantity.Torque ? "braking torque" : wanted.Name;

    private static string CoolingWords(PartThermal th)
    {
        var c = th.Cooling;
        var medium = c.Medium switch { CoolingMedium.Air => "natural convection in air", CoolingMedium.Oil => "natural convection in oil", _ => $"h {N(c.FixedCoefficientWPerM2K!.Value)} W/m²K" };
        var limit = th.Limit.MaxTemperatureK is { } mt ? $"hottest point at most {Numbers.Celsius(mt)}" : th.Limit.MaxRiseK is { } mr ? $"hottest rise at most {Numbers.Kelvin(mr)}" : "no temperature limit";
        return $"cooled by {medium} at {Numbers.Celsius(c.AmbientK)}, {limit}";
    }

    private static IEnumerable<string> SharedLimitLines(Problem p)
    {
        if (p.Limits.Budget is { } budget) yield return $"build budget {Numbers.Money(budget, p.Economics.Currency)}";
        if (p.Limits.TotalLossCapW is { } cap) yield return $"total loss cap {Numbers.Watts(cap)}";
        foreach (var group in p.Limits.CoilGroups) yield return $"{string.Join(" and ", group)} cut from one coil (same grade and gauge)";
        if (p.Limits.MaxDistinctProcesses is { } n) yield return F($"at most {n} cutting processes");
    }

    private static void Result(RunResult r, List<ReportBlock> b)
    {
        b.Add(new Heading("The chosen design"));
        if (r.Chosen is null)
        {
            b.Add(new Paragraph(r.Outcome.Status == SelectionStatus.Infeasible
                ? "No design meets every limit: the diagnosis is under \"Which limits bind\", and the baselines below show how far today's designs are from the limits."
                : "The search ran out of its time budget before finding a design that meets every limit."));
            return;
        }
        b.Add(new Paragraph(r.Outcome.Status == SelectionStatus.FeasibleAtLimit
            ? "The search hit its time budget: the design below meets every limit, but a better one among the listed options may exist."
            : "The best among the listed options under the stated models, for the goal and within every limit (the search went through all of them; see the methods note)."));
        var withDrag = r.Chosen.Any(o => o.DragN is not null);
        var withTorque = r.Chosen.Any(o => o.TorqueNm is not null);
        var rows = new List<IReadOnlyList<string>>();
        IReadOnlyList<string> Row(string part, string which, EvaluatedOption o, string design) =>
            withTorque ? [part, which, design, N(o.Loss.TotalW), Drag(o.DragN), Drag(o.TorqueNm), N(o.BuildCost)]
            : withDrag ? [part, which, design, N(o.Loss.TotalW), Drag(o.DragN), N(o.BuildCost)] : [part, which, design, N(o.Loss.TotalW), N(o.BuildCost)];
        for (var i = 0; i < r.Chosen.Count; i++)
        {
            var c = r.Chosen[i];
            var reference = r.Parts[i].Reference;
            rows.Add(Row(c.PartName, "chosen", c, WorkshopWords.Of(c, r.Parts[i].Part)));
            rows.Add(Row("", r.Parts[i].ReferenceIsCurrent ? "current" : "baseline", reference, WorkshopWords.Of(reference, r.Parts[i].Part) + (reference.Rejection is null ? "" : $" (breaks: {reference.Rejection.Message})")));
        }
        b.Add(withTorque
            ? new Table(["part", "", "design", "loss (W)", "drag (N)", "torque (N m)", $"build cost ({Cur(r)})"], rows, [false, false, false, true, true, true, true])
            : withDrag
            ? new Table(["part", "", "design", "loss (W)", "drag (N)", $"build cost ({Cur(r)})"], rows, [false, false, false, true, true, true])
            : new Table(["part", "", "design", "loss (W)", $"build cost ({Cur(r)})"], rows, [false, false, false, true, true]));
        if (r.Confirmations.Count > 0)
        {
            var byModel = string.Join(", ", r.Parts.SelectMany(p => p.Options).Where(o => o.Model is not null).GroupBy(o => o.Model!.Name).OrderBy(g => g.Key, StringComparer.Ordinal).Select(g => $"{g.Key} {g.Count()}"));
            b.Add(new Paragraph("Every plate option that could be chosen or sit on the trade-off curve was ranked with the model its validity figures call for (resistance-limited where the plate's own field is negligible, own-field or thick where it is not) before the selection saw it; "
                + "the resistance-limited screen's number stands only where it is that model's or the option provably can be neither chosen nor on the curve (candidates.csv says which model gave each number). "
                + $"Options by the model that gave their number: {byModel}. The chosen plates, with their lift and grid error:"));
            b.Add(new BulletList(r.Confirmations.Select(ConfirmationLine).ToList()));
        }
        if (r.Heat.Count > 0)
        {
            b.Add(new Paragraph("Plate temperature: every option was screened with two thermal solves that bracket it (its loss with the resistivity at the ambient temperature, an upper bound; and at the upper bound's hottest point, a lower bound), "
                + "and options between the bounds at the limit were solved with loss and temperature coupled. The chosen and the reference plates are solved coupled, each cell's resistivity at its own temperature:"));
            b.Add(new BulletList(r.Heat.Select(HeatLine).ToList()));
        }
    }

    private static string HeatLine(PlateHeat h)
    {
        var who = h.Role == DesignRole.Chosen ? "chosen" : "reference";
        if (h.Heating is not { } heated) return $"{h.PartName}, {who} ({h.Option.Description}): no steady state ({h.Failure})";
        var t = heated.Temperature;
        return F($"{h.PartName}, {who} ({h.Option.Description}): hottest {Numbers.Celsius(t.HottestK)} (rise {Numbers.Kelvin(t.MaxRiseK)}) at x {N(t.HottestXM * 1e3)} mm, y {N(t.HottestYM * 1e3)} mm; mean rise {Numbers.Kelvin(t.MeanRiseK)} above {Numbers.Celsius(t.AmbientK)}; resistivity at {Numbers.Celsius(heated.LossWeightedTemperatureK)} (loss-weighted), coupled loss {Numbers.Watts(heated.LossW)}; ")
            + (h.Limit.IsSet ? h.Breach ?? "within the limit" : "no limit set");
    }

    /// <summary>One chosen plate as confirmed: which model ran, and its loss, drag and lift against the screen.</summary>
    private static string ConfirmationLine(PlateConfirmation c) => $"{c.PartName}: {ConfirmationText(c)}";

    /// <summary>A chosen plate as confirmed, in the words the report and the console share: which model ran, its loss, drag and lift against the screen, its grid error, and why that model.</summary>
    public static string ConfirmationText(PlateConfirmation c) =>
        $"{c.ModelWords}: loss {Numbers.Watts(c.LossW)}{(c.TorqueNm is { } t ? $", braking torque {Numbers.Of(t, "N m")}" : "")}{(c.DragN is { } d ? $", drag {Numbers.Newtons(d)}{(c.TorqueNm is null ? "" : " at the magnets' radius")}" : "")}{(c.LiftN is { } l ? $", lift {Numbers.Newtons(l)}" : "")} (resistance-limited screen: {Numbers.Watts(c.ResistanceLimitedLossW)}){(c.GridError is { } e ? $"; estimated grid error {Numbers.EstimatePercent(e.Relative)} ({e.Description})" : "")}. {c.Reason}";

    private static string Drag(double? dragN) => dragN is { } d ? N(d) : "";

    private static void Savings(RunResult r, List<ReportBlock> b)
    {
        var vpw = r.Problem.Economics.ValuePerWatt;
        var cur = Cur(r);
        b.Add(new Heading("Against the reference and the baselines"));
        if (r.HasDesign)
        {
            var reference = r.Reference;
            var savedW = reference.LossW - r.TotalLossW;
            var savedOwning = reference.OwningCost(r.Problem) - r.OwningCost;
            var extraCost = r.TotalBuildCost - reference.BuildCost;
            var text = savedW >= 0
                ? $"Against the {reference.Name}, the chosen design saves {Numbers.Watts(savedW)}"
                : $"Against the {reference.Name}, the chosen design loses {Numbers.Watts(-savedW)} more (a negative saving: the goal traded loss for build cost)";
            if (r.Problem.YearlyLossCost(reference.Options) is { } referenceYearly && r.Problem.YearlyLossCost(r.Chosen!) is { } chosenYearly)
            {
                var savedYearly = referenceYearly - chosenYearly;
                text += $" = {Money(r, savedYearly)} a year";
                if (extraCost > 0 && savedYearly > 0) text += $" (its extra build cost of {Money(r, extraCost)} is paid back in {Numbers.Estimate(extraCost / savedYearly)} years, undiscounted)";
            }
            else text += " (the energy price and hours are not given, so no figure per year)";
            text += F($", and {(savedOwning >= 0 ? "saves" : "adds")} {Money(r, Math.Abs(savedOwning))} of owning cost over the life ") + (r.Problem.Economics.SeparatesLoadLoss
                ? F($"(no-load loss at {N(vpw)} {cur}/W, load loss at {N(r.Problem.Economics.LoadValuePerWatt!.Value)} {cur}/W).")
                : $"(loss at {N(vpw)} {cur}/W).");
            b.Add(new Paragraph(text));
        }
        var rows = new List<IReadOnlyList<string>>();
        if (r.HasDesign) rows.Add(["chosen design", N(r.TotalLossW), N(r.TotalBuildCost), N(r.OwningCost), "meets every limit"]);
        foreach (var baseline in r.Baselines)
            rows.Add([baseline.Name, N(baseline.LossW), N(baseline.BuildCost), N(baseline.OwningCost(r.Problem)),
                BaselineBreaks.Of(r, baseline) is { Count: > 0 } broken ? string.Join("\n", broken) : "meets every limit"]);
        b.Add(new Table(["design", "loss (W)", $"build cost ({cur})", $"owning cost ({cur})", "limits it breaks"], rows, [false, true, true, true, false]));
        b.Add(new Paragraph("The baselines are whole-product designs: the first is the design the file calls current (or solid plates and the first grade listed); then every core at its thickest and at its thinnest gauge with every plate solid. They are checked against the parts' rules and limits, the budget and the loss cap; not against the coil and process-count limits."));
    }

    /// <summary>Every limit the chosen design is held to, with how much of it the design uses; empty when there is no design.</summary>
    private static IReadOnlyList<LimitCheck> LimitChecks(RunResult r)
    {
        var checks = new List<LimitCheck>();
        if (r.Chosen is not { } chosen) return checks;
        var limits = r.Problem.Limits;
        if (limits.Budget is { } budget) checks.Add(Against("build budget", r.TotalBuildCost, budget, Cur(r)));
        if (limits.TotalLossCapW is { } cap) checks.Add(Against("total loss cap", r.TotalLossW, cap, "W"));
        foreach (var group in limits.CoilGroups)
        {
            var coils = chosen.Where(o => group.Contains(o.PartName)).Select(o => o.Attributes.TryGetValue("coil", out var c) ? c : "?").Distinct().ToList();
            checks.Add(new LimitCheck($"one coil for {string.Join(" and ", group)}", $"one coil for {string.Join(" and ", group)}: {string.Join(", ", coils)}", false));
        }
        if (limits.MaxDistinctProcesses is { } n)
        {
            var used = chosen.Select(o => o.Attributes["process"]).Distinct().ToList();
            checks.Add(new LimitCheck("limit on cutting processes", F($"cutting processes: {used.Count} used ({string.Join(", ", used)}) of at most {n}") + (used.Count == n ? ": at the limit" : ""), used.Count == n));
        }
        for (var i = 0; i < chosen.Count; i++)
        {
            var part = r.Parts[i].Part;
            if (part is PlatePart { MaxDragN: { } maxDrag } && chosen[i].DragN is { } drag) checks.Add(Against($"{part.Name}: drag limit", drag, maxDrag, "N"));
            if (part.MaxLossW is { } maxLoss) checks.Add(Against($"{part.Name}: loss limit", chosen[i].Loss.TotalW, maxLoss, "W"));
            if (part is PlatePart { MaxTorqueNm: { } maxTorque } && chosen[i].TorqueNm is { } torque) checks.Add(Against($"{part.Name}: torque limit", torque, maxTorque, "N m"));
            if (r.Confirmation(part.Name)?.Minimum is { Wanted: var wanted } minimum)
                checks.Add(AtLeast($"{part.Name}: minimum {BrakingWords(wanted)} at {Numbers.Of(wanted.Speed, wanted.SpeedUnit)}", minimum.Achieved, wanted.Value, wanted.Unit));
            if (r.HeatOf(part.Name, DesignRole.Chosen) is { Heating: { } heated, Limit: var limit })
            {
                if (limit.MaxTemperatureK is { } maxK) checks.Add(Against($"{part.Name}: temperature limit", heated.Temperature.HottestK - 273.15, maxK - 273.15, "°C"));
                if (limit.MaxRiseK is { } maxRise) checks.Add(Against($"{part.Name}: temperature-rise limit", heated.Temperature.MaxRiseK, maxRise, "K"));
            }
        }
        return checks;
    }

    private static void Limits(RunResult r, IReadOnlyList<LimitCheck> checks, List<ReportBlock> b)
    {
        b.Add(new Heading("Which limits bind"));
        var lines = checks.Select(c => c.Text).ToList();
        if (r.HasDesign && lines.Count == 0) lines.Add("The problem sets no limits: the goal alone picked the design.");
        if (!r.HasDesign) lines.AddRange(r.Outcome.Diagnosis?.Explain() ?? ["no diagnosis: the search ran out of its time budget"]);
        b.Add(new BulletList(lines));
        if (r.HasDesign) b.Add(new Paragraph($"A limit is said to bind when the design uses it to within {N(BindingFraction * 100)} %; a limit with room left did not shape the choice."));
    }

    /// <summary>A limit used to within this fraction of itself is reported as binding.</summary>
    public const double BindingFraction = 0.01;

    private static LimitCheck Against(string name, double value, double limit, string unit)
    {
        var binds = limit - value <= BindingFraction * Math.Abs(limit);
        var text = binds
            ? $"{name}: {Numbers.Of(value, unit)} of {Numbers.Of(limit, unit)}: binds"
            : $"{name}: {Numbers.Of(value, unit)} of {Numbers.Of(limit, unit)}: {Numbers.Of(limit - value, unit)} of room";
        return new LimitCheck(name, text, binds);
    }

    /// <summary>A lower limit (a wanted force): it binds when the design exceeds it by no more than BindingFraction of it.</summary>
    private static LimitCheck AtLeast(string name, double value, double minimum, string unit)
    {
        var binds = value - minimum <= BindingFraction * Math.Abs(minimum);
        var text = value < minimum
            ? $"{name}: {Numbers.Of(value, unit)}, short of the required {Numbers.Of(minimum, unit)}"
            : $"{name}: {Numbers.Of(value, unit)} of at least {Numbers.Of(minimum, unit)}: " + (binds ? "binds" : $"{Numbers.Of(value - minimum, unit)} to spare");
        return new LimitCheck(name, text, binds);
    }

    /// <summary>A front point's owning cost: its totals at one value per watt, or each part's loss at its own kind's value.</summary>
    internal static double FrontOwningCost(RunResult r, FrontPoint p) => r.Problem.Economics.SeparatesLoadLoss
        ? r.Problem.OwningCost(p.CandidateIds.Select(r.Option))
        : p.BuildCost + r.Problem.Economics.ValuePerWatt * p.LossW;

    private static void Plots(RunResult r, ReportFigures figures, List<ReportBlock> b)
    {
        if (figures.TradeOff is { } tradeOff)
        {
            b.Add(new Heading("Trade-off: loss against build cost"));
            b.Add(new FigureBlock(tradeOff));
            
            var front = r.Outcome.Front!;
            var chosenIds = r.Chosen?.Select(o => o.Id).ToList() ?? [];
            var rows = front.Points.Select(p => (IReadOnlyList<string>)[p.CandidateIds.SequenceEqual(chosenIds) ? "chosen" : "", N(p.BuildCost), N(p.LossW), N(FrontOwningCost(r, p)),
                string.Join("\n", p.CandidateIds.Select(id => r.Parts.Count == 1 ? r.Option(id).Description : $"{r.Option(id).PartName}: {r.Option(id).Description}"))]).ToList();
            b.Add(new Paragraph($"{front.Points.Count} points{(front.IsCapped ? ", capped" : "")}{(front.Status == SelectionStatus.Optimal ? ", each the lowest loss among the listed options at its build cost or below" : ", some not searched to the end")}:"));
            b.Add(new Table(["", $"build cost ({Cur(r)})", "loss (W)", $"owning cost ({Cur(r)})", "design"], rows, [false, true, true, true, false]));
        }
        if (figures.LossBreakdown is { } breakdown)
        {
            b.Add(new Heading("Loss breakdown"));
            b.Add(new FigureBlock(breakdown));
        }
        foreach (var (curves, figure) in figures.LossFrequency)
        {
            b.Add(new Heading($"Loss against frequency: {curves.Part.Name}"));
            b.Add(new FigureBlock(figure));
            b.Add(new BulletList(curves.Crossings.Count == 0
                ? ["no gauge overtakes another between a tenth and ten times the operating frequency"]
                : curves.Crossings.Select(c => $"above {Numbers.Of(c.FrequencyHz, "Hz")} {c.BetterAbove} loses less than {c.BetterBelow} ({Numbers.Watts(c.LossW)} at the crossing)").ToList()));
        }
        foreach (var (part, figure) in figures.CurrentDensity)
        {
            b.Add(new Heading($"Current density: {part.Name}"));
            b.Add(new FigureBlock(figure));
        }
        foreach (var (part, figure) in figures.DragSpeed)
        {
            b.Add(new Heading($"Drag against speed: {part.Name}"));
            b.Add(new FigureBlock(figure));
        }
        foreach (var (part, figure) in figures.Temperature)
        {
            b.Add(new Heading($"Temperature: {part.Name}"));
            b.Add(new FigureBlock(figure));
        }
    }

    private static void Rejections(RunResult r, List<ReportBlock> b)
    {
        b.Add(new Heading("Options dropped by the rules"));
        var rows = r.Parts.SelectMany(p => p.RejectionCounts.Select(kv => (IReadOnlyList<string>)[p.Part.Name, kv.Key, kv.Value.ToString(Ci)])).ToList();
        if (rows.Count == 0) b.Add(new Paragraph("Every option passed the manufacturing rules and the parts' own limits."));
        else b.Add(new Table(["part", "rule", "options dropped"], rows, [false, false, true]));
        b.Add(new Paragraph("candidates.csv lists every option with the rule it broke."));
    }

    private static void Flags(RunResult r, List<ReportBlock> b)
    {
        b.Add(new Heading("Validity flags"));
        var lines = new List<string>();
        if (r.Chosen is { } chosen)
        {
            foreach (var o in chosen)
            {
                if (o.Attributes.TryGetValue("reynolds_number", out var rm)) lines.Add(F($"{o.PartName}: magnetic Reynolds number {rm} (limit of the low-speed, resistance-limited model: {r.Figures.LowSpeedReynoldsLimit})"));
                lines.AddRange(o.Flags.Select(f => $"{o.PartName}: {f}"));
            }
            if (!chosen.Any(o => o.Flags.Count > 0)) lines.Add("The chosen design raises no validity flag (flux below the knee, sheets thin against the skin depth, coefficients used near their data, Reynolds number below its limit).");
        }
        foreach (var p in r.Parts.Where(p => r.Chosen is null || !r.Chosen.Any(o => o.Id == p.Reference.Id)))
            lines.AddRange(p.Reference.Flags.Select(f => $"{p.Part.Name} ({(p.ReferenceIsCurrent ? "current" : "baseline")} design): {f}"));
        var all = r.Parts.SelectMany(p => p.Options).ToList();
        lines.Add(F($"{all.Count(o => o.Flags.Count > 0)} of {all.Count} evaluated options carry at least one flag (see the flags column of candidates.csv)."));
        b.Add(new BulletList(lines));
    }

    private static void Cautions(RunResult r, List<ReportBlock> b)
    {
        b.Add(new Heading("Assumptions and cautions"));
        var items = new List<string>
        {
            "The figures are engineering estimates from published loss models and a thin-plate eddy-current model; confirm them by test on the real part before relying on them.",
            "Core loss: loss separation (hysteresis, classical eddy with skin and finite-width corrections, excess) with coefficients derived from the grades' guaranteed limits, not measured on your steel, times the construction's building factor and the cut edges' degraded band (per process); burrs and stacking pressure add loss not modelled here.",
            "Plates: every option is screened with the resistance-limited thin-plate model (the eddy currents' own field neglected), which overstates loss and drag where the Reynolds number or thickness over skin depth is flagged; the chosen plates are then solved again with the model their validity figures call for (thin sheet with its own field, or layered thick plate), as \"The chosen design\" says. Plates are taken as non-magnetic and of uniform thickness.",
            "Prices in the built-in data are invented demo prices; the owning cost is only as good as the value per watt put on the loss.",
            "Braking and load-holding uses (eddy-current brakes, rails or plates whose drag stops or holds a load) need a certified safety analysis; the drag here is not a brake rating.",
            "Hot structural parts carry burn and fire hazards, and their resistivity, strength and loss change with temperature; check the temperature the loss itself causes.",
            "Cryogenic cooling brings its own hazards (asphyxiation, cold burns, pressure build-up on boil-off, embrittlement) and resistivities far below room-temperature values.",
            "High currents and strong fields need the usual electrical safety measures, and strong magnets pinch and attract tools.",
            "Follow local codes and licensed engineering practice; this report does not replace them.",
        };
        if (r.Problem.Parts.OfType<PlatePart>().Any(p => p.Excitation.IsMoving))
            items.Insert(4, "This problem has a moving source: if that drag ever slows, stops or holds a load, the design is part of a safety function and needs that analysis before use.");
        if (r.Problem.Parts.OfType<PlatePart>().Any(p => p.Excitation is PlateExcitation.Turning))
            items.Insert(4, "Turning discs: the braking torque is resistance-limited (the eddy currents' own field neglected), valid while the magnetic Reynolds number at the magnets' radius stays small; above that the real torque is lower and passes a maximum. A disc at speed also stores energy and carries hoop stress: its burst speed and guarding are outside this report.");
        if (r.Problem.Parts.OfType<PlatePart>().Any(p => p.MinBraking is { Quantity: BrakingQuantity.Torque }))
            items.Insert(4, "A minimum braking torque (min_torque) makes the disc a brake: if it slows, stops or holds a load, it is part of a safety function. The torque here is an estimate, not a brake rating: size a real brake with margins, test it, and follow local codes and licensed engineering practice for brakes and load-holding devices.");
        var temperatures = r.Problem.Parts.Select(p => p.TemperatureK).ToList();
        if (r.Problem.Parts.OfType<PlatePart>().Any(p => p.Thermal is not null))
            items.Insert(items.Count - 1, "Plate temperatures are steady-state estimates from natural-convection correlations for an isolated vertical plate in still fluid: real oil flow, nearby windings, tank walls and clamping structure change them, and the temperature limit applied is the problem file's reading of a standard. Whether a hot structural part is acceptable (insulation in contact, gassing of the oil, strength at temperature) is for local codes, the applicable standards and licensed engineering practice to decide, not this report.");
        if (temperatures.Any(t => t > 373.15)) items.Insert(items.Count - 1, "A part here runs above 100 °C: see the hot-part caution above.");
        if (temperatures.Any(t => t < 123)) items.Insert(items.Count - 1, "A part here runs at a cryogenic temperature: see the cryogenic caution above.");
        items.Add("Method: every listed option of every part is evaluated with the models above, then an exact search over the combinations (the CP-SAT constraint solver of Google OR-Tools, one worker, fixed seed) picks the design. \"Best\" means best among the listed options under the stated models and prices, not best over every design that could be made.");
        b.Add(new BulletList(items));
    }

    private static void Files(ReportFigures figures, List<ReportBlock> b)
    {
        b.Add(new Heading("Files in this folder"));
        var items = new List<string>
        {
            "index.html: this report, self-contained (plots embedded)",
            "summary.md: the same report as Markdown",
            "candidates.csv: every evaluated option, its inputs, loss, drag, cost, owning cost and the rule it broke",
            "result.json: the machine-readable result (as slotopt run --json prints it, without the wall-clock timings)",
        };
        items.AddRange(figures.All.Select(f => $"{f.PngFileName}, {f.SvgFileName}: {f.Title}"));
        b.Add(new BulletList(items));
    }
}
