using System.Globalization;
using SlotOpt.Materials;
using SlotOpt.Plates.Conductors;
using SlotOpt.Plates.Geometry;
using SlotOpt.Plates.Grid;
using SlotOpt.Plates.ResistanceLimited;

namespace SlotOpt.Design;

/// <summary>
/// Enumerates and evaluates every option of a plate part. The thin-plate solve is resistance-limited,
/// so loss and drag scale with the sheet conductance sigma t: one solve per slot geometry serves every
/// thickness and material (Plates/ResistanceLimited/UnitConductanceSolution), and only the rules and the cost differ.
/// </summary>
public static class PlateOptions
{
    /// <summary>One solved slot geometry at unit sheet conductance.</summary>
    public sealed record SolvedGeometry(SlotChoice? Slots, SlotPattern? Pattern, PlateGeometry? Geometry, double LossPerSiemensW, UnitConductanceSolution? Peak, int Iterations, int Unknowns, RuleBreak? Failure);

    public static IReadOnlyList<EvaluatedOption> Evaluate(PlatePart part, MaterialLibrary library, ManufacturingSettings shop, IProgress<int>? solved = null, EvaluationLimits? limits = null)
    {
        limits ??= EvaluationLimits.Default;
        limits.CheckGrid(part.Name, part.Outline, part.CellSizeM);
        var geometries = SlotChoices(part).ToList();
        var solvedGeometries = new SolvedGeometry[geometries.Count];
        var clock = System.Diagnostics.Stopwatch.StartNew();
        var done = 0;
        var failures = new Exception?[geometries.Count];
        Parallel.For(0, geometries.Count, new ParallelOptions { MaxDegreeOfParallelism = Math.Max(limits.Threads, 1) }, (i, loop) =>
        {
            try
            {
                limits.CheckTime(clock, Volatile.Read(ref done), geometries.Count);
                solvedGeometries[i] = Solve(part, geometries[i], limits);
                Interlocked.Increment(ref done);
                solved?.Report(1);
            }
            catch (Exception e)
            {
                failures[i] = e;
                if (e is ResourceLimitException) loop.Stop();
            }
        });
        // the first failure in geometry order, rethrown as itself (not wrapped), so the message and exit code are the same on every run
        if (failures.FirstOrDefault(f => f is not null) is { } first) System.Runtime.ExceptionServices.ExceptionDispatchInfo.Capture(first).Throw();
        var options = new List<EvaluatedOption>();
        for (var g = 0; g < geometries.Count; g++)
        {
            var solvedGeometry = solvedGeometries[g];
            var processes = geometries[g] is null ? part.Processes : part.SlotFamilies.First(f => Belongs(f, geometries[g]!)).Processes;
            foreach (var thickness in part.ThicknessesM)
            foreach (var materialName in part.Materials)
            foreach (var processName in processes)
                options.Add(Scale(part, solvedGeometry, thickness, library.GetConductor(materialName, part.Name), shop.Processes[processName], shop));
        }
        return options;
    }

    /// <summary>The solid plate (null) and every distinct slot choice of every family, in file order.</summary>
    public static IEnumerable<SlotChoice?> SlotChoices(PlatePart part)
    {
        yield return null;
        var seen = new HashSet<SlotChoice>();
        foreach (var family in part.SlotFamilies)
        foreach (var pitch in family.PitchesM)
        foreach (var depth in family.DepthsM)
        foreach (var width in family.WidthsM)
        {
            var choice = new SlotChoice(family.Pattern, family.Edge, pitch, depth, width, family.RemainingThicknessFraction);
            if (seen.Add(choice)) yield return choice;
        }
    }

    /// <summary>Solves one slot geometry at unit sheet conductance; a pattern that does not fit is a failure in words.</summary>
    public static SolvedGeometry Solve(PlatePart part, SlotChoice? slots, EvaluationLimits? limits = null)
    {
        limits ??= EvaluationLimits.Default;
        PlateGeometry geometry;
        SlotPattern? pattern;
        try { (geometry, pattern) = PlateGeometryFactory.Build(part.Outline, slots); }
        catch (InputException e) { return new SolvedGeometry(slots, null, null, double.NaN, null, 0, 0, new RuleBreak(RuleKind.PatternDoesNotFit, e.Message)); }
        var model = BuildModel(part, geometry, limits);
        switch (part.Excitation)
        {
            case PlateExcitation.Moving moving:
                var sweep = ResistanceLimitedSolver.SolveMoving(model, moving.Poles, TravelOffsets(part, slots));
                return new SolvedGeometry(slots, pattern, geometry, sweep.MeanLossPerSiemensW, sweep.Peak, sweep.IterationsPerOffset.Sum(), model.Unknowns, null);
            case PlateExcitation.AcField field:
                var ac = ResistanceLimitedSolver.SolveAc(model, field.Source);
                return new SolvedGeometry(slots, pattern, geometry, ac.LossPerSiemensW, ac, ac.Iterations, model.Unknowns, null);
            default:
                throw new ArgumentOutOfRangeException(nameof(part), part.Excitation.GetType().Name, "unknown plate excitation");
        }
    }

    /// <summary>The solver model of one slot geometry: the part's cell size, automatic grids capped by the memory limit.</summary>
    public static SheetModel BuildModel(PlatePart part, PlateGeometry geometry, EvaluationLimits limits)
    {
        var grid = new GridOptions { CellSizeM = part.CellSizeM };
        return SheetModel.Build(geometry, grid with { MaxAutoCells = Math.Min(grid.MaxAutoCells, limits.MaxCellsPerSolve) });
    }

    /// <summary>
    /// Travel offsets of a moving source for one slot choice: over its slot pitch; a solid plate uses the widest
    /// pitch of the part's families (any window serves a long solid plate, see PlateExcitation.Offsets).
    /// </summary>
    public static IReadOnlyList<double> TravelOffsets(PlatePart part, SlotChoice? slots) =>
        (part.Excitation as PlateExcitation.Moving ?? throw new InvalidOperationException("travel offsets belong to moving sources"))
            .Offsets(part.Outline, slots?.PitchM ?? (part.SlotFamilies.Count > 0 ? part.SlotFamilies.SelectMany(f => f.PitchesM).Max() : null));

    /// <summary>Evaluates one fixed design of the plate (which need not lie in the part's slot families).</summary>
    public static EvaluatedOption EvaluateOne(PlatePart part, PlateChoice choice, MaterialLibrary library, ManufacturingSettings shop) =>
        Scale(part, Solve(part, choice.Slots), choice.ThicknessM, library.GetConductor(choice.Material, part.Name), shop.Processes[choice.Process], shop);

    /// <summary>Scales a unit-conductance solve to one thickness and material and prices it with one process.</summary>
    public static EvaluatedOption Scale(PlatePart part, SolvedGeometry solved, double thicknessM, Conductor material, CuttingProcess process, ManufacturingSettings shop)
    {
        var ci = CultureInfo.InvariantCulture;
        var slots = solved.Slots;
        var slotText = slots is null ? "solid" : Describe(slots);
        var id = string.Create(ci, $"{part.Name}/{material.Name}/{thicknessM * 1e3:0.###}mm/{slotText}/{process.Name}");
        var description = string.Create(ci, $"{material.Name} {thicknessM * 1e3:0.###} mm, {slotText}, {process.Name}");
        var choice = new PlateChoice(thicknessM, material.Name, process.Name, slots);
        var attributes = new Dictionary<string, string>
        {
            ["material"] = material.Name,
            ["thickness_mm"] = (thicknessM * 1e3).ToString("0.###", ci),
            ["process"] = process.Name,
            ["slots"] = slotText,
        };
        if (slots is not null)
        {
            attributes["pattern"] = slots.Pattern.ToString();
            attributes["edge"] = slots.Edge.ToString();
            attributes["pitch_mm"] = (slots.PitchM * 1e3).ToString("0.###", ci);
            attributes["depth_mm"] = (slots.DepthM * 1e3).ToString("0.###", ci);
            attributes["width_mm"] = (slots.WidthM * 1e3).ToString("0.###", ci);
        }
        if (solved.Failure is not null)
            return new EvaluatedOption(part.Name, id, choice, description, attributes, 0, LossBreakdown.Zero, null, [], solved.Failure);

        var slotCount = solved.Pattern is null ? 0 : solved.Pattern.Slots.Count + solved.Pattern.Grooves.Count;
        attributes["slot_count"] = slotCount.ToString(ci);
        var slotCut = solved.Pattern is null ? 0 : solved.Pattern.Slots.Sum(s => PlateCost.SlotCutLength((s.End - s.Start).Length, s.WidthM, process))
            + solved.Pattern.Grooves.Sum(g => PlateCost.Perimeter(g.Area));
        var cost = PlateCost.Of(part.Outline, thicknessM, material, process, slotCut, slotCount, shop);

        var sigma = material.ConductivityAt(part.TemperatureK);
        var sheet = new ConductingSheet(sigma, thicknessM, material.RelativePermeability);
        var lossW = solved.LossPerSiemensW * sheet.SheetConductanceS;
        var moving = part.Excitation as PlateExcitation.Moving;
        var acField = part.Excitation as PlateExcitation.AcField;
        double? drag = moving is null ? null : lossW / moving.SpeedMPerS;
        var loss = new LossBreakdown(0, 0, 0, lossW, moving is null ? 0 : lossW);
        var validity = moving is not null
            ? Validity.ForMoving(sheet, moving.SpeedMPerS)
            : Validity.ForAc(sheet, acField!.FrequencyHz, solved.Geometry!.CharacteristicWidthM);
        var flags = validity.Warnings.ToList();
        if (material.IsMagnetic) flags.Add($"{material.Name} is magnetic: the thin-plate model assumes a non-magnetic plate, so its loss here is indicative only");
        attributes["reynolds_number"] = validity.ReynoldsNumber.ToString("0.###", ci);

        RuleBreak? rejection = null;
        if (slots is not null)
            rejection = PlateRules.FirstBroken(slots, solved.Pattern!, thicknessM, material, process, part.MinLigamentM, acField?.FrequencyHz);
        if (rejection is null && part.MaxDragN is { } maxDrag && drag > maxDrag)
            rejection = new(RuleKind.DragAboveLimit, string.Create(ci, $"drag {drag:0.###} N exceeds the part's limit of {maxDrag:0.###} N"));
        if (rejection is null && part.MaxLossW is { } maxLoss && loss.TotalW > maxLoss)
            rejection = new(RuleKind.LossAboveLimit, string.Create(ci, $"loss {loss.TotalW:0.###} W exceeds the part's limit of {maxLoss:0.###} W"));
        return new EvaluatedOption(part.Name, id, choice, description, attributes, cost.Total, loss, drag, flags, rejection);
    }

    public static string Describe(SlotChoice s) => string.Create(CultureInfo.InvariantCulture,
        $"{SlotPatternCatalog.Of(s.Pattern).Words} from {SlotPatternCatalog.Word(s.Edge)}, pitch {s.PitchM * 1e3:0.###} mm, depth {s.DepthM * 1e3:0.###} mm, width {s.WidthM * 1e3:0.###} mm{(s.Pattern == SlotPatternKind.Grooves ? $", {s.RemainingThicknessFraction:0.##} of thickness left" : "")}");

    private static bool Belongs(SlotFamily family, SlotChoice choice) =>
        family.Pattern == choice.Pattern && family.Edge == choice.Edge && family.PitchesM.Contains(choice.PitchM)
        && family.DepthsM.Contains(choice.DepthM) && family.WidthsM.Contains(choice.WidthM);
}
