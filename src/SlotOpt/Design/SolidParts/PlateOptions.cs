using SlotOpt.Tables;
using System.Globalization;
using SlotOpt.Design.Limits;
using SlotOpt.Materials;
using SlotOpt.Plates;
using SlotOpt.Plates.Conductors;
using SlotOpt.Plates.Geometry;
using SlotOpt.Plates.Grid;
using SlotOpt.Plates.ResistanceLimited;
using SlotOpt.Plates.Sources;
using SlotOpt.Plates.Sources.Rotation;
using SlotOpt.Plates.Thermal;

namespace SlotOpt.Design.SolidParts;

/// <summary>
/// Enumerates and evaluates every option of a plate part. The thin-plate solve is resistance-limited,
/// so loss and drag scale with the sheet conductance sigma t: one solve per slot geometry serves every
/// thickness and material (Plates/ResistanceLimited/UnitConductanceSolution), and only the rules and the cost differ.
/// </summary>
public static class PlateOptions
{
    /// <summary>One solved slot geometry at unit sheet conductance.</summary>
    /// <param name="UnitCellLossW">With [parts.thermal]: the loss per cell at 1 S (moving poles: the mean over the travel offsets), else null.</param>
    public sealed record SolvedGeometry(SlotChoice? Slots, SlotPattern? Pattern, PlateGeometry? Geometry, double LossPerSiemensW, UnitConductanceSolution? Peak, int Iterations, int Unknowns, RuleBreak? Failure,
        double[]? UnitCellLossW = null);

    /// <param name="processCapped">whether the problem caps the number of distinct processes (the ranking's dominance pruning then compares within one process)</param>
    public static IReadOnlyList<EvaluatedOption> Evaluate(PlatePart part, MaterialLibrary library, ManufacturingSettings shop, IProgress<int>? solved = null, EvaluationLimits? limits = null,
        bool processCapped = true)
    {
        limits = (limits ?? EvaluationLimits.Default).Started(out var ownDeadline);
        using var _ = ownDeadline;
        var deadline = limits.Deadline!;
        var geometries = SlotChoices(part).ToList();
        limits.CheckGrid(part.Name, part.Outline, part.CellSizeM, WorkloadOf(part, geometries));
        var solvedGeometries = new SolvedGeometry[geometries.Count];
        var heat = new Dictionary<(double, string), TemperatureBracket.Outcome>[geometries.Count];
        var done = 0;
        var failures = new Exception?[geometries.Count];
        Parallel.For(0, geometries.Count, new ParallelOptions { MaxDegreeOfParallelism = Math.Max(limits.Threads, 1) }, (i, loop) =>
        {
            try
            {
                var phase = $"the plate solves of part {part.Name} ({Volatile.Read(ref done)} of {geometries.Count} done)";
                solvedGeometries[i] = deadline.Run(phase, () => Solve(part, geometries[i], limits));
                heat[i] = deadline.Run(phase, () => Heat(part, solvedGeometries[i], library, limits));
                Interlocked.Increment(ref done);
                solved?.Report(1);
            }
            catch (Exception e)
            {
                failures[i] = e;
                if (e is ResourceLimitException or OperationCanceledException) loop.Stop();
            }
        });
        // the first failure in geometry order, rethrown as itself (not wrapped), so the message and exit code are the same on every run
        if (failures.FirstOrDefault(f => f is not null) is { } first) System.Runtime.ExceptionServices.ExceptionDispatchInfo.Capture(first).Throw();
        // screen every option, then give each that can be chosen the number of the model its validity figures call for (PlateModelRanking)
        var screened = new List<EvaluatedOption>[geometries.Count];
        for (var g = 0; g < geometries.Count; g++)
        {
            var processes = geometries[g] is null ? part.Processes : part.SlotFamilies.First(f => Belongs(f, geometries[g]!)).Processes;
            screened[g] = [];
            foreach (var thickness in part.ThicknessesM)
            foreach (var materialName in part.Materials)
            foreach (var processName in processes)
                screened[g].Add(Scale(part, solvedGeometries[g], thickness, library.GetConductor(materialName, part.Name), shop.Processes[processName], shop,
                    heat[g].GetValueOrDefault((thickness, materialName))));
        }
        return PlateModelRanking.Rank(part, solvedGeometries, screened, library, shop, heat, limits, mayPrune: part.Thermal is null && part.MinBraking is null, processCapped);
    }

    /// <summary>With [parts.thermal]: the temperature verdict of every thickness and material of one solved geometry (the process does not heat the plate).</summary>
    private static Dictionary<(double, string), TemperatureBracket.Outcome> Heat(PlatePart part, SolvedGeometry solved, MaterialLibrary library, EvaluationLimits limits)
    {
        var verdicts = new Dictionary<(double, string), TemperatureBracket.Outcome>();
        if (part.Thermal is null || solved.Failure is not null) return verdicts;
        var screen = Screen(part, solved);
        foreach (var thickness in part.ThicknessesM)
        foreach (var materialName in part.Materials)
            verdicts[(thickness, materialName)] = Heat(part, solved, thickness, library.GetConductor(materialName, part.Name), limits, screen);
        return verdicts;
    }

    /// <summary>The thermal solves of one solved geometry, shared by its thicknesses and materials (one network and preconditioner, warm starts).</summary>
    private static ThermalScreen Screen(PlatePart part, SolvedGeometry solved) =>
        new((solved.Peak?.Model ?? throw new InvalidOperationException($"{part.Name}: no solved geometry to heat")).Grid, part.Thermal!.Cooling.Edges);

    /// <summary>One thickness and material of a solved geometry heated by its loss: bracketed, coupled only where the bracket straddles the limit.</summary>
    private static TemperatureBracket.Outcome Heat(PlatePart part, SolvedGeometry solved, double thicknessM, Conductor material, EvaluationLimits limits, ThermalScreen screen)
    {
        var thermal = part.Thermal!;
        return TemperatureBracket.Find(screen, solved.UnitCellLossW!, ThermalConductivityTable.Of(material.Name, part.Name), thicknessM,
            k => material.ConductivityAt(k) * thicknessM, thermal.Cooling, thermal.Limit, () => SolveHeated(part, solved.Slots, thicknessM, material, limits));
    }

    /// <summary>
    /// One plate design with loss and temperature solved together (<see cref="PlateHeating"/>) on the grid the screen used, its
    /// resistivity referred to the part's temperature (the sheet the selection prices), so `slotopt plate` gives the same answer on the same plate.
    /// </summary>
    public static HeatedPlate SolveHeated(PlatePart part, SlotChoice? slots, double thicknessM, Conductor material, EvaluationLimits limits)
    {
        var thermal = part.Thermal ?? throw new InvalidOperationException($"{part.Name} has no [parts.thermal]");
        var (geometry, _) = PlateGeometryFactory.Build(part, slots);
        var sheet = new ConductingSheet(material.ConductivityAt(part.TemperatureK), thicknessM, material.RelativePermeability);
        var thermalMaterial = PartThermal.MaterialOf(material, part.TemperatureK, part.Name);
        var grid = GridOf(part, limits);
        return part.Excitation switch
        {
            PlateExcitation.AcField ac => PlateHeating.SolveAc(geometry, grid, ac.Source, sheet, thermalMaterial, thermal.Cooling),
            PlateExcitation.Moving moving => PlateHeating.SolveMoving(geometry, grid, moving.Source, TravelOffsets(part, slots), sheet, thermalMaterial, thermal.Cooling),
            _ => throw new ArgumentOutOfRangeException(nameof(part), part.Excitation.GetType().Name, "unknown plate excitation"),
        };
    }

    /// <summary>The solid plate (null) and every distinct slot choice of every family, in file order.</summary>
    public static IEnumerable<SlotChoice?> SlotChoices(PlatePart part)
    {
        yield return null;
        var seen = new HashSet<SlotChoice>();
        foreach (var family in part.SlotFamilies)
        {
            if (family.Rings is { } rings)
            {
                var disc = part.Disc ?? throw new InvalidOperationException($"part {part.Name}: radial slots need a disc");
                foreach (var ring in rings)
                foreach (var width in family.WidthsM)
                    if (SlotChoice.RadialOn(disc, ring, width) is var radial && seen.Add(radial)) yield return radial;
                continue;
            }
        foreach (var pitch in family.PitchesM)
        foreach (var depth in family.DepthsM)
        foreach (var width in family.WidthsM)
        {
            var choice = new SlotChoice(family.Pattern, family.Edge, pitch, depth, width, family.RemainingThicknessFraction);
            if (seen.Add(choice)) yield return choice;
        }
        }
    }

    /// <summary>Solves one slot geometry at unit sheet conductance; a pattern that does not fit is a failure in words.</summary>
    public static SolvedGeometry Solve(PlatePart part, SlotChoice? slots, EvaluationLimits? limits = null)
    {
        limits ??= EvaluationLimits.Default;
        PlateGeometry geometry;
        SlotPattern? pattern;
        try { (geometry, pattern) = PlateGeometryFactory.Build(part, slots); }
        catch (InputException e) { return new SolvedGeometry(slots, null, null, double.NaN, null, 0, 0, new RuleBreak(RuleKind.PatternDoesNotFit, e.Message)); }
        var model = BuildModel(part, geometry, limits);
        switch (part.Excitation)
        {
            case PlateExcitation.Moving moving when part.Thermal is not null:
                var (unitMap, mapped) = PlateHeating.MeanCellLoss(model, moving.Source, TravelOffsets(part, slots));
                return new SolvedGeometry(slots, pattern, geometry, mapped.MeanLossPerSiemensW, mapped.Peak, mapped.IterationsPerOffset.Sum(), model.Unknowns, null, unitMap);
            case PlateExcitation.Moving moving:
                var sweep = ResistanceLimitedSolver.SolveMoving(model, moving.Source, TravelOffsets(part, slots));
                return new SolvedGeometry(slots, pattern, geometry, sweep.MeanLossPerSiemensW, sweep.Peak, sweep.IterationsPerOffset.Sum(), model.Unknowns, null);
            case PlateExcitation.Turning turning:
                return SolveTurning(turning, slots, pattern, geometry, model);
            case PlateExcitation.AcField field:
                var ac = ResistanceLimitedSolver.SolveAc(model, field.Source);
                return new SolvedGeometry(slots, pattern, geometry, ac.LossPerSiemensW, ac, ac.Iterations, model.Unknowns, null, part.Thermal is null ? null : CellLossMap.Of(ac, 1.0));
            default:
                throw new ArgumentOutOfRangeException(nameof(part), part.Excitation.GetType().Name, "unknown plate excitation");
        }
    }

    /// <summary>
    /// A disc under its turning magnets at unit sheet conductance (<see cref="DiscTorque"/>, resistance-limited): the mean loss over the disc's
    /// angles, and as Peak the angle with the most loss (its travel offset the arc the magnets' centre moved, as `slotopt plate` reports it).
    /// threads: workers for the source's edge moments, where the caller solves one disc at a time (the screen solves geometries in parallel: 1 there).
    /// </summary>
    public static SolvedGeometry SolveTurning(PlateExcitation.Turning turning, SlotChoice? slots, SlotPattern? pattern, PlateGeometry geometry, SheetModel model, int threads = 1)
    {
        var angles = turning.Angles(slots?.Radial);
        var disc = DiscTorque.Solve(model, turning.Source, angles, threads: threads);
        var peak = new UnitConductanceSolution(model, SourceKind.Moving, disc.PeakPsiPerSiemens, null, disc.LossPerSiemensW[disc.PeakIndex], 0, turning.PathSpeedMPerS,
            angles[disc.PeakIndex] * turning.Source.SourceRadiusM, disc.Iterations, disc.MaxRelativeResidual, []);
        return new SolvedGeometry(slots, pattern, geometry, disc.LossPerSiemensW.Average(), peak, disc.Iterations, model.Unknowns, null);
    }

    /// <summary>The solver model of one slot geometry: the part's cell size (automatic: resolving the plate's and the poles' features), automatic grids capped so that the part's run fits the memory limit.</summary>
    public static SheetModel BuildModel(PlatePart part, PlateGeometry geometry, EvaluationLimits limits) => SheetModel.Build(geometry, GridOf(part, limits));

    /// <summary>
    /// The part's run in the memory model's counts for these slot geometries: with [parts.thermal] the thicknesses x materials heated on
    /// each, for a moving source the travel positions its coupled ranking keeps per geometry, for a turning disc one lattice per slot
    /// geometry at its angles.
    /// </summary>
    private static PartWorkload WorkloadOf(PlatePart part, IReadOnlyList<SlotChoice?> geometries) => new(
        geometries.Count,
        part.Thermal is null ? 0 : part.ThicknessesM.Count * part.Materials.Count,
        part.Excitation is PlateExcitation.Moving moving ? moving.Positions : 0,
        part.Excitation is PlateExcitation.Turning turning ? geometries.Sum(g => turning.Angles(g?.Radial).Count) : 0);

    /// <summary>The grid every solve of the part uses: its cell size, automatic grids capped so that the part's run fits the memory limit.</summary>
    public static GridOptions GridOf(PlatePart part, EvaluationLimits limits)
    {
        var features = part.Excitation switch
        {
            PlateExcitation.Moving m => m.Source.GridFeatures,
            PlateExcitation.Turning t => t.Source.GridFeatures,
            _ => [],
        };
        var grid = new GridOptions { CellSizeM = part.CellSizeM, SourceFeatures = features };
        var cap = limits.CellCap(WorkloadOf(part, SlotChoices(part).ToList()));
        if (cap < 4) limits.CheckMemory($"part {part.Name}: even the coarsest grid", MemoryModel.RuntimeBytes * MemoryModel.Margin, "raise the limit");
        return grid with { MaxAutoCells = Math.Min(grid.MaxAutoCells, cap) };
    }

    /// <summary>
    /// Travel offsets of a moving source for one slot choice: over its slot pitch; a solid plate uses the widest
    /// pitch of the part's families (any window serves a long solid plate, see PlateExcitation.Offsets).
    /// </summary>
    public static IReadOnlyList<double> TravelOffsets(PlatePart part, SlotChoice? slots) =>
        (part.Excitation as PlateExcitation.Moving ?? throw new InvalidOperationException("travel offsets belong to moving sources"))
            .Offsets(part.Outline, slots?.PitchM ?? (part.SlotFamilies.Count > 0 ? part.SlotFamilies.SelectMany(f => f.PitchesM).Max() : null));

    /// <summary>Evaluates one fixed design of the plate (which need not lie in the part's slot families).</summary>
    public static EvaluatedOption EvaluateOne(PlatePart part, PlateChoice choice, MaterialLibrary library, ManufacturingSettings shop, EvaluationLimits? limits = null)
    {
        limits ??= EvaluationLimits.Default;
        limits.CheckGrid(part.Name, part.Outline, part.CellSizeM, WorkloadOf(part, [choice.Slots]));
        var solved = Solve(part, choice.Slots, limits);
        var material = library.GetConductor(choice.Material, part.Name);
        var heat = part.Thermal is not null && solved.Failure is null ? Heat(part, solved, choice.ThicknessM, material, limits, Screen(part, solved)) : null;
        var screened = Scale(part, solved, choice.ThicknessM, material, shop.Processes[choice.Process], shop, heat);
        var verdicts = heat is null ? new Dictionary<(double, string), TemperatureBracket.Outcome>() : new() { [(choice.ThicknessM, choice.Material)] = heat };
        return PlateModelRanking.Rank(part, [solved], [[screened]], library, shop, [verdicts], limits, mayPrune: false, processCapped: true)[0];
    }

    /// <summary>Scales a unit-conductance solve to one thickness and material and prices it with one process.</summary>
    /// <param name="heat">With [parts.thermal]: the option's temperature and whether it breaks the part's limit.</param>
    /// <param name="model">The model behind the option's number (<see cref="PlateModelRanking"/>); the resistance-limited screen when null.</param>
    /// <param name="modelLossW">The loss (W) that model gave, when it is not the screen (moving poles: the drag is loss / v); the screen's own scaled loss otherwise.
    /// The drag and loss limits are checked on the number the option carries.</param>
    public static EvaluatedOption Scale(PlatePart part, SolvedGeometry solved, double thicknessM, Conductor material, CuttingProcess process, ManufacturingSettings shop,
        TemperatureBracket.Outcome? heat = null, OptionModel? model = null, double? modelLossW = null)
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
        if (slots?.Radial is { } ring)
        {
            attributes["pattern"] = slots.Pattern.ToString();
            attributes["radial_slots"] = ring.Count.ToString(ci);
            attributes["from_mm"] = (ring.FromM * 1e3).ToString("0.###", ci);
            attributes["to_mm"] = ring.ToM is { } to ? (to * 1e3).ToString("0.###", ci) : "rim";
            attributes["width_mm"] = (slots.WidthM * 1e3).ToString("0.###", ci);
        }
        else if (slots is not null)
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
        var lossW = modelLossW ?? solved.LossPerSiemensW * sheet.SheetConductanceS;
        var moving = part.Excitation as PlateExcitation.Moving;
        var acField = part.Excitation as PlateExcitation.AcField;
        var turning = part.Excitation as PlateExcitation.Turning;
        double? torque = turning is null ? null : lossW / turning.AngularSpeedRadPerS;                          // T = P / omega (steady rotation)
        // drag: the force opposing the motion; on a disc the tangential force at the magnets' radius, F = T / r
        double? drag = moving is not null ? lossW / moving.SpeedMPerS : torque / turning?.Source.SourceRadiusM;
        var loss = new LossBreakdown(0, 0, 0, lossW, acField is null ? lossW : 0);
        var validity = acField is null
            ? Validity.ForMoving(sheet, moving?.SpeedMPerS ?? turning!.PathSpeedMPerS)
            : Validity.ForAc(sheet, acField.FrequencyHz, solved.Geometry!.CharacteristicWidthM);
        // the validity warnings say the resistance-limited numbers are overstated: moot once the option carries another model's
        var otherModel = modelLossW is not null && model?.Kind != SheetModelKind.ResistanceLimited;
        var flags = otherModel || (modelLossW is not null && turning is null) ? [] : validity.Warnings.ToList();
        if (material.IsMagnetic) flags.Add($"{material.Name} is magnetic: the thin-plate model assumes a non-magnetic plate, so its loss here is indicative only");
        attributes["reynolds_number"] = validity.ReynoldsNumber.ToString("0.###", ci);

        RuleBreak? rejection = null;
        if (slots is not null)
            rejection = PlateRules.FirstBroken(slots, solved.Pattern!, thicknessM, material, process, part.MinLigamentM, acField?.FrequencyHz);
        if (rejection is null && part.MaxDragN is { } maxDrag && drag > maxDrag)
            rejection = new(RuleKind.DragAboveLimit, string.Create(ci, $"drag {Numbers.Of(drag!.Value, "N")} exceeds the part's limit of {Numbers.Of(maxDrag, "N")}"));
        if (rejection is null && part.MaxTorqueNm is { } maxTorque && torque > maxTorque)
            rejection = new(RuleKind.TorqueAboveLimit, string.Create(ci, $"torque {Numbers.Of(torque!.Value, "N m")} exceeds the part's limit of {Numbers.Of(maxTorque, "N m")}"));
        if (rejection is null && part.MinBraking is { } minimum && (minimum.Quantity == BrakingQuantity.Drag ? drag : torque) is { } braking)
        {
            // the source's own speed (m/s, or rpm for a disc) and the plate's path speed at the minimum's speed, for the validity there
            var (sourceSpeed, pathSpeedMPerS) = minimum.Quantity == BrakingQuantity.Drag ? (moving!.SpeedMPerS, minimum.Speed)
                : (turning!.Rpm, turning.PathSpeedMPerS * minimum.Speed / turning.Rpm);
            rejection = minimum.Check(braking, sourceSpeed);
            if (rejection is null && minimum.Speed != sourceSpeed)
                flags.AddRange(Validity.ForMoving(sheet, pathSpeedMPerS).Warnings.Select(w => $"at {minimum.SpeedWords}: {w}"));
        }
        if (rejection is null && part.MaxLossW is { } maxLoss && loss.TotalW > maxLoss)
            rejection = new(RuleKind.LossAboveLimit, string.Create(ci, $"loss {Numbers.Watts(loss.TotalW)} exceeds the part's limit of {Numbers.Watts(maxLoss)}"));
        if (heat is { Failure: { } why, Breach: null }) flags.Add($"temperature not computed: {why}");
        if (rejection is null && heat?.Breach is { } hot) rejection = new(RuleKind.HotterThanLimit, hot);
        var temperature = heat?.Temperature is { } t ? OptionTemperature.Of(t, heat.ResistivityK, heat.Method) : null;
        return new EvaluatedOption(part.Name, id, choice, description, attributes, cost.Total, loss, drag, flags, rejection, temperature)
        {
            Model = model ?? new OptionModel(SheetModelKind.ResistanceLimited, "the resistance-limited screen"),
            TorqueNm = torque,
        };
    }

    public static string Describe(SlotChoice s) => s.Radial is { } ring
        ? string.Create(CultureInfo.InvariantCulture, $"{ring.Count} radial slots from {ring.FromM * 1e3:0.###} mm {(ring.ToM is { } to ? $"to {to * 1e3:0.###} mm" : "through the rim")}, width {s.WidthM * 1e3:0.###} mm")
        : string.Create(CultureInfo.InvariantCulture,
        $"{SlotPatternCatalog.Of(s.Pattern).Words} from {SlotPatternCatalog.Word(s.Edge)}, pitch {s.PitchM * 1e3:0.###} mm, depth {s.DepthM * 1e3:0.###} mm, width {s.WidthM * 1e3:0.###} mm{(s.Pattern == SlotPatternKind.Grooves ? $", {s.RemainingThicknessFraction:0.##} of thickness left" : "")}");

    private static bool Belongs(SlotFamily family, SlotChoice choice) =>
        family.Rings is { } rings ? choice.Radial is { } ring && rings.Contains(ring) && family.WidthsM.Contains(choice.WidthM)
        : family.Pattern == choice.Pattern && family.Edge == choice.Edge && family.PitchesM.Contains(choice.PitchM)
        && family.DepthsM.Contains(choice.DepthM) && family.WidthsM.Contains(choice.WidthM);
}
