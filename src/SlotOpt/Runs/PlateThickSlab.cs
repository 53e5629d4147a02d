using System.Diagnostics;
using SlotOpt.Numerics;
using SlotOpt.Plates;
using SlotOpt.Plates.Grid;
using SlotOpt.Plates.ResistanceLimited;
using SlotOpt.Plates.Sources.Magnets;
using SlotOpt.Plates.Thick;

namespace SlotOpt.Runs;

/// <summary>
/// Magnets sliding over a wide plain block, solved as the exact laterally infinite slab (<see cref="SlabUnderMovingMagnets"/>,
/// model "thick-slab"): drag, lift and loss at the case's speed and at 1/8 to 8 times it. When the slab is chosen is the plates'
/// choice (<see cref="PlateModels.ThickSlabChoice"/>). The slab neglects the edges (the currents' return paths and the vertical
/// currents there); the map printed beside it is the thin-sheet resistance-limited one and says so.
/// </summary>
public static class PlateThickSlab
{
    /// <summary>Speeds of the curve, in multiples of the case's speed.</summary>
    public static readonly double[] SpeedFactors = [0.125, 0.25, 0.5, 1, 2, 4, 8];

    /// <summary>The sliding magnets and the model choice when this case goes to the slab (<see cref="PlateModels.ThickSlabChoice"/>); null when it does not. Refuses --model thick-slab where it cannot apply, naming the file.</summary>
    public static (SlidingMagnets Source, ModelChoice Choice)? Wanted(PlateCase plate, SheetModelKind? forcedKind)
    {
        ModelChoice? choice;
        try { choice = PlateModels.ThickSlabChoice(plate.Geometry, plate.Sheet, plate.MovingSource, plate.OffsetsXM, forcedKind); }
        catch (InputException e) { throw new InputException($"{plate.Path}: {e.Message}"); }
        return choice is { } c ? ((SlidingMagnets)plate.MovingSource!, c) : null;
    }

    public static PlateFileEvaluation Evaluate(PlateCase plate, (SlidingMagnets Source, ModelChoice Choice) wanted, SheetModel model, ConvergenceCriterion? criterion)
    {
        var (source, choice) = wanted;
        var clock = Stopwatch.StartNew();
        double v = source.SpeedMPerS;
        var slab = new SlabUnderMovingMagnets(plate.Sheet.ConductivitySPerM, plate.Sheet.ThicknessM);
        var curve = slab.Solve(SurfaceFieldSpectrum.Of(source.Magnets), SpeedFactors.Select(f => f * v).ToArray());
        var atSpeed = curve[Array.IndexOf(SpeedFactors, 1.0)];
        var map = ResistanceLimitedSolver.SolveMoving(model, source, plate.OffsetsXM, criterion);
        var peak = map.Peak.ScaleTo(plate.Sheet);
        var notes = peak.Notes.Concat(new[]
        {
            $"thick-slab: drag, lift and loss are the laterally infinite block's (wavenumber quadrature error below {curve.Max(f => f.RelativeErrorEstimate):E1}); the plate's edges are neglected, and the block is the same at every travel offset",
            "the current-density map and its peak and RMS are the thin-sheet resistance-limited ones, for orientation only; loss and drag are from the model that ran",
        }).ToList();
        var result = peak with { Validity = peak.Validity with { Warnings = Array.Empty<string>() }, Notes = notes };
        return new PlateFileEvaluation(plate, choice, result, atSpeed.LossW, atSpeed.DragN, plate.OffsetsXM, plate.OffsetsXM.Select(_ => atSpeed.DragN).ToArray(),
            plate.OffsetsXM.Select(_ => atSpeed.LossW).ToArray(), map.IterationsPerOffset.Sum(), map.Peak.RelativeResidual, model.SetupSeconds, clock.Elapsed.TotalSeconds)
            { SlabSpeedCurve = curve };
    }
}
