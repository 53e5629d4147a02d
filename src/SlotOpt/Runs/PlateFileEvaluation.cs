using System.Diagnostics;
using SlotOpt.Design.Limits;
using SlotOpt.Design;
using SlotOpt.Numerics;
using SlotOpt.Plates;
using SlotOpt.Plates.Grid;
using SlotOpt.Plates.ResistanceLimited;
using SlotOpt.Plates.Thermal;

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
    /// <summary>The grid-error estimate of the loss and mean drag (Richardson against cells twice as large); null with [thermal].</summary>
    public DiscretisationError? GridError { get; init; }

    /// <param name="forcedKind">the model asked for (--model); null lets the validity figures choose</param>
    /// <param name="limits">Memory: the estimate of the case's solve is checked before anything is built.</param>
    public static PlateFileEvaluation Evaluate(PlateCase plate, ConvergenceCriterion? criterion = null, SheetModelKind? forcedKind = null, EvaluationLimits? limits = null)
    {
        plate = WithinMemory(plate, limits ?? EvaluationLimits.Default);
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
            var solution = PlateModels.SolveAc(model, ac, plate.Sheet, criterion: criterion, forcedKind: forcedKind);
            solution = PlateModels.WithGridError(solution, model, m => PlateModels.SolveAc(m, ac, plate.Sheet, criterion: criterion, forcedKind: solution.Choice.Kind));
            var result = MapSolution(solution, () => ResistanceLimitedSolver.SolveAc(model, ac, criterion)).ScaleTo(plate.Sheet);
            return new PlateFileEvaluation(plate, solution.Choice, WithSolutionNotes(result, solution), solution.MeanLossW, null,
                Array.Empty<double>(), Array.Empty<double>(), Array.Empty<double>(), solution.Iterations, solution.RelativeResidual, model.SetupSeconds, clock.Elapsed.TotalSeconds)
                { GridError = solution.GridError };
        }
        var source = plate.MovingSource ?? throw new InputException($"{plate.Path}: [source] defines neither an AC field nor a moving source");
        var moving = PlateModels.SolveMoving(model, source, plate.Sheet, plate.OffsetsXM, source.LoopLengthXM, criterion: criterion, forcedKind: forcedKind);
        moving = PlateModels.WithGridError(moving, model, m => PlateModels.SolveMoving(m, source, plate.Sheet, plate.OffsetsXM, source.LoopLengthXM, criterion: criterion, forcedKind: moving.Choice.Kind));
        var peak = MapSolution(moving, () => ResistanceLimitedSolver.SolveMoving(model, source, plate.OffsetsXM, criterion).Peak).ScaleTo(plate.Sheet);
        return new PlateFileEvaluation(plate, moving.Choice, WithSolutionNotes(peak, moving), moving.MeanLossW, moving.MeanDragN, moving.OffsetsXM, moving.DragN!,
            moving.LossW, moving.Iterations, moving.RelativeResidual, model.SetupSeconds, clock.Elapsed.TotalSeconds)
            { GridError = moving.GridError };
    }

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
            var (min, max) = plate.Geometry.Bounds;
            var (nx, ny) = (Math.Ceiling((max.X - min.X) / h), Math.Ceiling((max.Y - min.Y) / h));
            var estimate = MemoryModel.OwnField((int)Math.Min(nx + 1, int.MaxValue / 4), (int)Math.Min(ny + 1, int.MaxValue / 4));
            limits.CheckMemory($"{plate.Path}: [grid] cell: a {h * 1e3:G4} mm grid ({nx * ny:E2} cells) solved with the plate's own field", estimate, "choose a larger cell");
            return plate;
        }
        return plate with { Grid = plate.Grid with { MaxAutoCells = Math.Min(plate.Grid.MaxAutoCells, limits.CellCap(1)) } };
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
