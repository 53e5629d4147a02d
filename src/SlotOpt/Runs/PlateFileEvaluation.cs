using System.Diagnostics;
using SlotOpt.Input;
using SlotOpt.Numerics;
using SlotOpt.Plates.Grid;
using SlotOpt.Plates.ResistanceLimited;
using SlotOpt.Plates.Thermal;

namespace SlotOpt.Runs;

/// <summary>
/// Evaluates one plate file: builds the model once, solves at unit reference sheet conductance and
/// scales to the file's material and thickness. For moving poles: loss and drag at every travel
/// offset and their means; the result (map, peak current density) is that of the offset with the largest loss.
/// With [thermal] the plate is solved with its resistivity at its own temperature (<see cref="PlateHeating"/>).
/// </summary>
public sealed record PlateFileEvaluation(
    PlateFile File,
    PlateResult Result,
    double LossW,
    double? MeanDragN,
    IReadOnlyList<double> OffsetsXM,
    IReadOnlyList<double> DragPerOffsetN,
    IReadOnlyList<double> LossPerOffsetW,
    int TotalIterations,
    double SetupSeconds,
    double SolveSeconds,
    HeatedPlate? Heating = null)
{
    public static PlateFileEvaluation Evaluate(PlateFile file, ConvergenceCriterion? criterion = null)
    {
        if (file.Thermal is not null) return EvaluateHeated(file, criterion);
        var model = SheetModel.Build(file.Geometry, file.Grid);
        var clock = Stopwatch.StartNew();
        double g = file.Sheet.SheetConductanceS;
        if (file.AcSource is { } ac)
        {
            var solution = PlateSolver.SolveAc(model, ac, criterion);
            var result = solution.ScaleTo(file.Sheet);
            return new PlateFileEvaluation(file, result, result.LossW, null, Array.Empty<double>(), Array.Empty<double>(), Array.Empty<double>(),
                solution.Iterations, model.SetupSeconds, clock.Elapsed.TotalSeconds);
        }
        var poles = file.MovingSource ?? throw new InputException($"{file.Path}: [source] defines neither an AC field nor moving poles");
        var sweep = PlateSolver.SolveMoving(model, poles, file.OffsetsXM, criterion);
        var peak = sweep.Peak.ScaleTo(file.Sheet);
        return new PlateFileEvaluation(file, peak, sweep.MeanLossW(g), sweep.MeanDragN(g), sweep.OffsetsXM, sweep.DragN(g),
            sweep.LossPerSiemensW.Select(p => p * g).ToArray(), sweep.IterationsPerOffset.Sum(), model.SetupSeconds, clock.Elapsed.TotalSeconds);
    }

    /// <summary>With [thermal]: loss and temperature solved together, the resistivity at each cell's temperature.</summary>
    private static PlateFileEvaluation EvaluateHeated(PlateFile file, ConvergenceCriterion? criterion)
    {
        var thermal = file.Thermal!;
        var clock = Stopwatch.StartNew();
        double g = file.Sheet.SheetConductanceS;
        if (file.AcSource is { } ac)
        {
            var heated = PlateHeating.SolveAc(file.Geometry, file.Grid, ac, file.Sheet, thermal.Material, thermal.Cooling, criterion);
            var result = heated.Ac!.ScaleTo(file.Sheet);
            return new PlateFileEvaluation(file, result, result.LossW, null, Array.Empty<double>(), Array.Empty<double>(), Array.Empty<double>(),
                heated.Ac.Iterations, heated.Model.SetupSeconds, clock.Elapsed.TotalSeconds - heated.Model.SetupSeconds, heated);
        }
        var poles = file.MovingSource ?? throw new InputException($"{file.Path}: [source] defines neither an AC field nor moving poles");
        var hot = PlateHeating.SolveMoving(file.Geometry, file.Grid, poles, file.OffsetsXM, file.Sheet, thermal.Material, thermal.Cooling, criterion);
        var sweep = hot.Sweep!;
        var peak = sweep.Peak.ScaleTo(file.Sheet);
        return new PlateFileEvaluation(file, peak, sweep.MeanLossW(g), sweep.MeanDragN(g), sweep.OffsetsXM, sweep.DragN(g),
            sweep.LossPerSiemensW.Select(p => p * g).ToArray(), sweep.IterationsPerOffset.Sum(), hot.Model.SetupSeconds, clock.Elapsed.TotalSeconds - hot.Model.SetupSeconds, hot);
    }
}
