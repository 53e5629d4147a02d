using System.Diagnostics;
using SlotOpt.Numerics;
using SlotOpt.Plates;
using SlotOpt.Plates.Grid;
using SlotOpt.Plates.ResistanceLimited;

namespace SlotOpt.Runs;

/// <summary>
/// Evaluates one plate case through the same model choice as the run's confirmation
/// (<see cref="PlateModels"/>): loss (and for moving poles drag at every travel offset and their means)
/// from the model the validity figures call for, with Choice saying which and why. Result (map, peak
/// and RMS current density, validity) is the resistance-limited solution scaled to the case's material
/// and thickness (moving poles: the offset with the largest loss); when another model ran it is solved
/// for the map alone, and a note says so. TotalIterations and RelativeResidual are those of the model that ran.
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
    double SolveSeconds)
{
    public static PlateFileEvaluation Evaluate(PlateCase plate, ConvergenceCriterion? criterion = null)
    {
        var grid = plate.MovingSource is { } source ? plate.Grid with { SourceFeatures = source.GridFeatures } : plate.Grid;
        var model = SheetModel.Build(plate.Geometry, grid);
        var clock = Stopwatch.StartNew();
        if (plate.AcSource is { } ac)
        {
            var solution = PlateModels.SolveAc(model, ac, plate.Sheet, criterion: criterion);
            var result = MapSolution(solution, () => ResistanceLimitedSolver.SolveAc(model, ac, criterion)).ScaleTo(plate.Sheet);
            return new PlateFileEvaluation(plate, solution.Choice, WithMapNote(result, solution), solution.MeanLossW, null,
                Array.Empty<double>(), Array.Empty<double>(), Array.Empty<double>(), solution.Iterations, solution.RelativeResidual, model.SetupSeconds, clock.Elapsed.TotalSeconds);
        }
        var poles = plate.MovingSource ?? throw new InputException($"{plate.Path}: [source] defines neither an AC field nor moving poles");
        var moving = PlateModels.SolveMoving(model, poles, plate.Sheet, plate.OffsetsXM, poles.PoleSizeXM, criterion: criterion);
        var peak = MapSolution(moving, () => ResistanceLimitedSolver.SolveMoving(model, poles, plate.OffsetsXM, criterion).Peak).ScaleTo(plate.Sheet);
        return new PlateFileEvaluation(plate, moving.Choice, WithMapNote(peak, moving), moving.MeanLossW, moving.MeanDragN, moving.OffsetsXM, moving.DragN!,
            moving.LossW, moving.Iterations, moving.RelativeResidual, model.SetupSeconds, clock.Elapsed.TotalSeconds);
    }

    private static UnitConductanceSolution MapSolution(PlateSolution solution, Func<UnitConductanceSolution> resistanceLimited) =>
        solution.ResistanceLimited ?? resistanceLimited();

    private static PlateResult WithMapNote(PlateResult result, PlateSolution solution) =>
        solution.ResistanceLimited is not null ? result
            : result with { Notes = result.Notes.Append("the current-density map and its peak and RMS are from the resistance-limited model, which overstates them here; loss and drag are from the model that ran").ToList() };
}
