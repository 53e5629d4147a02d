using System.Diagnostics;
using SlotOpt.Design.Limits;
using SlotOpt.Design;
using SlotOpt.Numerics;
using SlotOpt.Plates;
using SlotOpt.Plates.Grid;
using SlotOpt.Plates.ResistanceLimited;
using SlotOpt.Plates.Sources;
using SlotOpt.Plates.Sources.Magnets;
using SlotOpt.Plates.Thermal;
using SlotOpt.Plates.Thick;
using SlotOpt.Tables;

namespace SlotOpt.Runs;

/// <summary>
/// Evaluates one plate case through the same model choice as the run's confirmation
/// (<see cref="PlateModels"/>): loss (and for moving poles drag at every travel offset and their means)
/// from the model the validity figures call for, with Choice saying which and why. Result (map, peak
/// and RMS current density, validity) is the resistance-limited solution scaled to the case's material
/// and thickness (moving poles: the offset with the largest loss); when another model ran it is solved
/// for the map alone, and a note says so. TotalIterations and RelativeResidual are those of the model that ran.
/// With [thermal] the plate is solved with its resistivity at its own temperature (<see cref="PlateHeating"/>).
/// </summary>
public sealed record PlateFileEvaluation(
    PlateCase Case,
    ModelChoice Choice,
    PlateResult Result,
    double LossW,
    double? MeanDragN,
    IReadOnlyList<double> OffsetsXM,
    IReadOnlyList<double> DragPerOffsetN,
    IReadOnlyList<double> LossPerOffsetW,
    int TotalIterations,
    double RelativeResidual,
    double SetupSeconds,
    double SolveSeconds,
    HeatedPlate? Heating = null)
{
    /// <summary>The grid-error estimate of the loss and mean drag (DiscretisationError.Estimate: cells of 2h and 4h, or h/2 where 2h does not resolve the plate); null with [thermal].</summary>
    public DiscretisationError? GridError { get; init; }

    /// <summary>A turning disc: the mean braking torque (N m); MeanDragN is then the torque over the magnets' radius, the force along their path.</summary>
    public double? TorqueNm { get; init; }

    /// <summary>A turning disc with a sweep: torque against speed with the model per point, and the peak when the sweep brackets it.</summary>
    public DiscSpeedCurve? SpeedCurve { get; init; }

    /// <summary>Magnets approaching: the damping force at each gap of the case (MeanDragN is the one at the first gap).</summary>
    public IReadOnlyList<GapPoint>? ApproachCurve { get; init; }

    /// <summary>Magnets sliding over a wide block (thick-slab): drag, lift and loss at speeds around the case's (<see cref="PlateThickSlab"/>).</summary>
    public IReadOnlyList<SlabForces>? SlabSpeedCurve { get; init; }

    /// <param name="forcedKind">the model asked for (--model); null lets the validity figures choose</param>
    /// <param name="limits">Memory: the estimate of the case's solve is checked before anything is built.</param>
    /// <param name="discSweep">a turning disc: torque against speed and its peak as well (null: the file's speed only); refused for other plates</param>
    public static PlateFileEvaluation Evaluate(PlateCase plate, ConvergenceCriterion? criterion = null, SheetModelKind? forcedKind = null, EvaluationLimits? limits = null,
        DiscSweep? discSweep = null)
    {
        limits ??= EvaluationLimits.Default;
        plate = WithinMemory(plate, limits);
        if (forcedKind == SheetModelKind.ThickSlab && plate.MovingSource is null)
            throw new InputException($"{plate.Path}: --model thick-slab is for magnets sliding over a block; this plate's source is not a sliding one");
        if (discSweep is not null && plate.Rotation is null) throw new InputException($"{plate.Path}: a torque-speed sweep (--speeds) is for a turning disc (motion = \"rotation\")");
        if (plate.Rotation is { } rotation) return EvaluateRotation(plate, rotation, criterion, forcedKind, discSweep, limits);
        if (plate.Approach is { } approach) return EvaluateApproach(plate, approach, criterion, forcedKind, limits);
        if (plate.Thermal is not null)
        {
            if (forcedKind is { } k && k != SheetModelKind.ResistanceLimited)
                throw new InputException($"{plate.Path}: [thermal] couples loss and temperature through the resistance-limited model only; --model {ReactionModelChoice.Name(k)} cannot be used with it");
            return EvaluateHeated(plate, criterion);
        }
        var model = SheetModel.Build(plate.Geometry, GridFor(plate));
        var clock = Stopwatch.StartNew();
        if (plate.AcSource is { } ac)
        {
            var solution = PlateModels.SolveAc(model, ac, plate.Sheet, criterion: criterion, forcedKind: forcedKind, fftThreads: limits.Threads);
            solution = PlateModels.WithGridError(solution, model, m => PlateModels.SolveAc(m, ac, plate.Sheet, criterion: criterion, forcedKind: solution.Choice.Kind, fftThreads: limits.Threads),
                cell => limits.RefusesGrid(model, cell));
            var result = MapSolution(solution, () => ResistanceLimitedSolver.SolveAc(model, ac, criterion)).ScaleTo(plate.Sheet);
            return new PlateFileEvaluation(plate, solution.Choice, WithSolutionNotes(result, solution), solution.MeanLossW, null,
                Array.Empty<double>(), Array.Empty<double>(), Array.Empty<double>(), solution.Iterations, solution.RelativeResidual, model.SetupSeconds, clock.Elapsed.TotalSeconds)
                { GridError = solution.GridError };
        }
        var source = plate.MovingSource ?? throw new InputException($"{plate.Path}: [source] defines neither an AC field nor a moving source");
        if (PlateThickSlab.Wanted(plate, forcedKind) is { } slab) return PlateThickSlab.Evaluate(plate, slab, model, criterion);
        var moving = PlateModels.SolveMoving(model, source, plate.Sheet, plate.OffsetsXM, source.LoopLengthXM, criterion: criterion, forcedKind: forcedKind, fftThreads: limits.Threads);
        moving = PlateModels.WithGridError(moving, model, m => PlateModels.SolveMoving(m, source, plate.Sheet, plate.OffsetsXM, source.LoopLengthXM, criterion: criterion, forcedKind: moving.Choice.Kind, fftThreads: limits.Threads),
            cell => limits.RefusesGrid(model, cell));
        var peak = MapSolution(moving, () => ResistanceLimitedSolver.SolveMoving(model, source, plate.OffsetsXM, criterion).Peak).ScaleTo(plate.Sheet);
        return new PlateFileEvaluation(plate, moving.Choice, WithSolutionNotes(peak, moving), moving.MeanLossW, moving.MeanDragN, moving.OffsetsXM, moving.DragN!,
            moving.LossW, moving.Iterations, moving.RelativeResidual, model.SetupSeconds, clock.Elapsed.TotalSeconds)
            { GridError = moving.GridError };
    }

    /// <summary>
    /// A disc turning under fixed magnets (<see cref="PlateModels.SolveDisc"/>: resistance-limited or own-field, as the validity figures of a slide at the
    /// magnets' path speed omega R call for, or as asked): torque, the force along the magnets' path (torque over their radius), loss, and the map at the
    /// angle with the most loss (resistance-limited: the own-field solve's starts when that model ran, and a note says so). With a sweep, torque against
    /// speed and its peak (<see cref="DiscSpeedCurve"/>). The limits' threads are the reaction operators' FFT workers (--threads; answers are the same for any count);
    /// its memory limit bounds the grid-error estimate's finer grid.
    /// </summary>
    private static PlateFileEvaluation EvaluateRotation(PlateCase plate, DiscRotation rotation, ConvergenceCriterion? criterion, SheetModelKind? forcedKind, DiscSweep? sweep,
        EvaluationLimits limits)
    {
        var fftThreads = limits.Threads;
        if (plate.Thermal is not null) throw new InputException($"{plate.Path}: [thermal] is for plates under sliding sources and AC fields; a turning disc has no temperature coupling");
        if (forcedKind == SheetModelKind.BeyondThinSheet) throw new InputException($"{plate.Path}: --model thick is for AC fields only: there is no layered rotating solver (use auto, resistance-limited or own-field)");
        var source = rotation.Source;
        var model = SheetModel.Build(plate.Geometry, plate.Grid with { SourceFeatures = source.GridFeatures });
        var clock = Stopwatch.StartNew();
        double g = plate.Sheet.SheetConductanceS, pathSpeed = source.AngularSpeedRadPerS * source.SourceRadiusM;
        var disc = PlateModels.SolveDisc(model, source, plate.Sheet, rotation.AnglesRad, criterion: criterion, forcedKind: forcedKind, fftThreads: fftThreads);
        var gridError = DiscretisationError.Estimate(model, disc.MeanLossW,
            m => PlateModels.SolveDisc(m, source, plate.Sheet, rotation.AnglesRad, criterion: criterion, forcedKind: disc.Choice.Kind, fftThreads: fftThreads).MeanLossW,
            cell => limits.RefusesGrid(model, cell));
        var low = disc.ResistanceLimited;
        var notes = disc.Notes.Skip(1).ToList();
        if (disc.Choice.Kind != SheetModelKind.ResistanceLimited) notes.Add("the current-density map and its peak and RMS are from the resistance-limited model, which overstates them here; torque and loss are from the model that ran");
        var peak = new UnitConductanceSolution(model, SourceKind.Moving, low.PeakPsiPerSiemens, null, low.LossPerSiemensW[low.PeakIndex], 0, pathSpeed,
            rotation.AnglesRad[low.PeakIndex] * source.SourceRadiusM, low.Iterations, low.MaxRelativeResidual, notes).ScaleTo(plate.Sheet);
        var torque = disc.TorqueNm;
        var curve = sweep is null ? null
            : DiscSpeedCurve.Solve(model, source, plate.Sheet, rotation.AnglesRad, sweep.SpeedsRadPerS ?? DiscSpeedCurve.DefaultSpeedsRadPerS(source, plate.Sheet), criterion: criterion,
                forcedKind: forcedKind, fftThreads: fftThreads);
        return new PlateFileEvaluation(plate, disc.Choice, WithGridNote(peak, gridError), disc.MeanLossW, disc.MeanTorqueNm / source.SourceRadiusM,
            rotation.AnglesRad.Select(a => a * source.SourceRadiusM).ToArray(), torque.Select(t => t / source.SourceRadiusM).ToArray(),
            disc.LossW, disc.Iterations, disc.RelativeResidual, model.SetupSeconds, clock.Elapsed.TotalSeconds)
            { GridError = gridError, TorqueNm = disc.MeanTorqueNm, SpeedCurve = curve };
    }

    /// <summary>
    /// Magnets approaching the plate, resistance-limited (<see cref="ApproachDamping"/>): the damping force F = P / v at each gap of the case; the
    /// map is the one at the first gap. Where the validity figures at the approach speed call for the plate's own field, a note says the force is overstated.
    /// </summary>
    private static PlateFileEvaluation EvaluateApproach(PlateCase plate, MagnetApproach approach, ConvergenceCriterion? criterion, SheetModelKind? forcedKind, EvaluationLimits limits)
    {
        ResistanceLimitedOnly(plate, forcedKind, "an approaching magnet");
        var first = approach.Magnets;
        var model = SheetModel.Build(plate.Geometry, plate.Grid with { SourceFeatures = new SlidingMagnets(first, approach.SpeedMPerS).GridFeatures });
        var clock = Stopwatch.StartNew();
        double g = plate.Sheet.SheetConductanceS, v = approach.SpeedMPerS;
        var wanted = ReactionModelChoice.ForMoving(plate.Sheet, v, first.SmallestLengthXM);
        var curve = new List<GapPoint>();
        ApproachDampingSolution? atFirst = null;
        int iterations = 0;
        double residual = 0;
        foreach (var gap in approach.GapsM)
        {
            var s = ApproachDamping.Solve(model, new MagnetArray(first.Magnets, gap, first.LineQuadratureOrder), v, criterion);
            atFirst ??= s;
            iterations += s.Iterations;
            residual = Math.Max(residual, s.RelativeResidual);
            curve.Add(new GapPoint(gap, s.DampingForceN(g), g * s.LossPerSiemensW));
        }
        var gridError = DiscretisationError.Estimate(model, curve[0].LossW, m => g * ApproachDamping.Solve(m, first, v, criterion).LossPerSiemensW, cell => limits.RefusesGrid(model, cell));
        var notes = new List<string> { "the damping force is normal to the plate: it pushes the magnets back as they approach" };
        if (wanted.Kind != SheetModelKind.ResistanceLimited)
            notes.Add($"the approach is solved resistance-limited (there is no own-field model for it), but at this speed the validity calls for another ({wanted.Reason}): the force is overstated");
        var map = new UnitConductanceSolution(model, SourceKind.Moving, atFirst!.PsiPerSiemens, null, atFirst.LossPerSiemensW, 0, v, 0, atFirst.Iterations, atFirst.RelativeResidual, notes).ScaleTo(plate.Sheet);
        var choice = wanted with { Kind = SheetModelKind.ResistanceLimited, Reason = "resistance-limited (the only model for an approach): " + wanted.Reason };
        return new PlateFileEvaluation(plate, choice, WithGridNote(map, gridError), curve[0].LossW, curve[0].ForceN, [0.0], [curve[0].ForceN], [curve[0].LossW],
            iterations, residual, model.SetupSeconds, clock.Elapsed.TotalSeconds) { GridError = gridError, ApproachCurve = curve };
    }

    private static void ResistanceLimitedOnly(PlateCase plate, SheetModelKind? forcedKind, string what)
    {
        if (forcedKind is { } k && k != SheetModelKind.ResistanceLimited)
            throw new InputException($"{plate.Path}: {what} is solved resistance-limited only; --model {ReactionModelChoice.Name(k)} cannot be used with it");
        if (plate.Thermal is not null) throw new InputException($"{plate.Path}: [thermal] is for plates under sliding sources and AC fields; {what} has no temperature coupling");
    }

    private static PlateResult WithGridNote(PlateResult result, DiscretisationError? error) =>
        error switch
        {
            null => result with { Notes = result.Notes.Append("no grid error estimate: the grid cannot be coarsened to twice its cell").ToList() },
            { IsLarge: true } e => result with { Notes = result.Notes.Append(e.Warning).ToList() },
            _ => result,
        };

    /// <summary>The map's notes, the grid-error warning (or that there is no estimate), and, when another model ran, that the map is the resistance-limited one.</summary>
    private static PlateResult WithSolutionNotes(PlateResult result, PlateSolution solution)
    {
        string? grid = solution.GridError switch
        {
            null => "no grid error estimate: the grid cannot be coarsened to twice its cell",
            { IsLarge: true } e => e.Warning,
            _ => null,
        };
        return WithMapNote(grid is null ? result : result with { Notes = result.Notes.Append(grid).ToList() }, solution);
    }

    /// <summary>The case with an automatic grid capped to fit the memory limit; an explicit grid that does not fit is refused before it is built.</summary>
    private static PlateCase WithinMemory(PlateCase plate, EvaluationLimits limits)
    {
        if (plate.Grid.CellSizeM is { } h)
        {
            var grid = GridSize.Over(plate.Geometry.Outline, h);
            limits.CheckMemory($"{plate.Path}: [grid] cell: a {Numbers.Of(h * 1e3, "mm")} grid ({grid.Cells:N0} cells) solved with the plate's own field", grid.OwnFieldBytes, "choose a larger cell");
            return plate;
        }
        return plate with { Grid = plate.Grid with { MaxAutoCells = Math.Min(plate.Grid.MaxAutoCells, limits.CellCap(new PartWorkload(1))) } };
    }

    private static UnitConductanceSolution MapSolution(PlateSolution solution, Func<UnitConductanceSolution> resistanceLimited) =>
        solution.ResistanceLimited ?? resistanceLimited();

    /// <summary>The file's grid choice with the moving source's widths and gaps to resolve (GridOptions.SourceFeatures).</summary>
    private static GridOptions GridFor(PlateCase plate) =>
        plate.MovingSource is { } source ? plate.Grid with { SourceFeatures = source.GridFeatures } : plate.Grid;

    private static PlateResult WithMapNote(PlateResult result, PlateSolution solution) =>
        solution.ResistanceLimited is not null ? result
            : result with { Notes = result.Notes.Append("the current-density map and its peak and RMS are from the resistance-limited model, which overstates them here; loss and drag are from the model that ran").ToList() };

    /// <summary>With [thermal]: loss and temperature solved together, the resistivity at each cell's temperature.</summary>
    private static PlateFileEvaluation EvaluateHeated(PlateCase plate, ConvergenceCriterion? criterion)
    {
        var thermal = plate.Thermal!;
        var clock = Stopwatch.StartNew();
        double g = plate.Sheet.SheetConductanceS;
        if (plate.AcSource is { } ac)
        {
            var choice = ReactionModelChoice.ForAc(plate.Sheet, ac.FrequencyHz, plate.Geometry.CharacteristicWidthM);
            var heated = PlateHeating.SolveAc(plate.Geometry, GridFor(plate), ac, plate.Sheet, thermal.Material, thermal.Cooling, criterion);
            var result = heated.Ac!.ScaleTo(plate.Sheet);
            return new PlateFileEvaluation(plate, choice, WithHeatingNote(result, choice), result.LossW, null, Array.Empty<double>(), Array.Empty<double>(), Array.Empty<double>(),
                heated.Ac.Iterations, heated.Ac.RelativeResidual, heated.Model.SetupSeconds, clock.Elapsed.TotalSeconds - heated.Model.SetupSeconds, heated);
        }
        var source = plate.MovingSource ?? throw new InputException($"{plate.Path}: [source] defines neither an AC field nor a moving source");
        var movingChoice = ReactionModelChoice.ForMoving(plate.Sheet, source.SpeedMPerS, source.LoopLengthXM);
        var hot = PlateHeating.SolveMoving(plate.Geometry, GridFor(plate), source, plate.OffsetsXM, plate.Sheet, thermal.Material, thermal.Cooling, criterion);
        var sweep = hot.Sweep!;
        var peak = sweep.Peak.ScaleTo(plate.Sheet);
        return new PlateFileEvaluation(plate, movingChoice, WithHeatingNote(peak, movingChoice), sweep.MeanLossW(g), sweep.MeanDragN(g), sweep.OffsetsXM, sweep.DragN(g),
            sweep.LossPerSiemensW.Select(p => p * g).ToArray(), sweep.IterationsPerOffset.Sum(), sweep.Peak.RelativeResidual, hot.Model.SetupSeconds, clock.Elapsed.TotalSeconds - hot.Model.SetupSeconds, hot);
    }

    /// <summary>The temperature coupling runs the resistance-limited model; where the validity figures call for another, say so.</summary>
    private static PlateResult WithHeatingNote(PlateResult result, ModelChoice choice) =>
        choice.Kind == SheetModelKind.ResistanceLimited ? result
            : result with { Notes = result.Notes.Append($"loss and temperature are coupled through the resistance-limited model, but this plate's validity calls for another ({choice.Reason}): both are overstated").ToList() };
}
