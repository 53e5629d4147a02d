using SlotOpt.Tables;
using SlotOpt.Numerics;
using SlotOpt.Plates.Conductors;
using SlotOpt.Plates.Geometry;
using SlotOpt.Plates.Grid;
using SlotOpt.Plates.OwnField;
using SlotOpt.Plates.ReducedBasis;
using SlotOpt.Plates.ResistanceLimited;
using SlotOpt.Plates.Sources;
using SlotOpt.Plates.Sources.Magnets;
using SlotOpt.Plates.Sources.Rotation;
using SlotOpt.Plates.Thick;

namespace SlotOpt.Plates;

/// <summary>
/// The plate's models behind one call, for the run's confirmation and the `plate` command alike: chooses the model from the validity figures
/// (<see cref="ReactionModelChoice"/>) and returns loss, drag and lift. The resistance-limited path
/// solves at unit conductance and scales by G (cheap; cache the model per geometry); the reaction
/// path builds (or reuses) a <see cref="ReactionOperator"/> and solves per conductor. Beyond the thin
/// sheet (t/delta above the threshold) an AC case goes to the layered thick-plate solver
/// (<see cref="ThickPlateSolver.SolveAcConverged"/>) with the source's plane field used at every depth
/// (exact for a uniform field; for a non-uniform field it leaves out the field's decay with depth);
/// a moving case still returns the thin-sheet reaction answer with a warning (no layered moving solver).
/// </summary>
public static class PlateModels
{
    /// <param name="forcedKind">a model asked for by the user instead of the automatic choice (the reason then says what the figures call for)</param>
    /// <param name="fftThreads">FFT workers of the reaction operator built here when none is given (the run's --threads; answers are the same for any count)</param>
    public static PlateSolution SolveAc(SheetModel model, IAcFieldSource source, ConductingSheet conductor,
        double accuracy = ReactionModelChoice.DefaultAccuracy, ReactionOperator? reaction = null, ConvergenceCriterion? criterion = null, SheetModelKind? forcedKind = null,
        int fftThreads = 1)
    {
        CheckOperator(model, reaction);
        var choice = ReactionModelChoice.Forced(ReactionModelChoice.ForAc(conductor, source.FrequencyHz, model.Grid.Geometry.CharacteristicWidthM, accuracy), forcedKind);
        var notes = new List<string> { choice.Reason };
        if (choice.Kind == SheetModelKind.ResistanceLimited)
        {
            var low = ResistanceLimitedSolver.SolveAc(model, source, criterion);
            notes.AddRange(low.Notes);
            double p = low.LossW(conductor.SheetConductanceS);
            return new PlateSolution(choice, Array.Empty<double>(), new[] { p }, null, null, new[] { p }, notes, low.Iterations, low.RelativeResidual, low);
        }
        if (choice.Kind == SheetModelKind.BeyondThinSheet)
        {
            var depthSource = source as IDepthAcFieldSource ?? new DepthIndependentField(source);
            var thick = ThickPlateSolver.SolveAcConverged(model, depthSource, conductor, accuracy, criterion);
            notes.Add($"layered thick-plate model: {thick.Layers} layers (estimated layer error {Numbers.Percent(thick.LayerError)}); " +
                (source is IDepthAcFieldSource ? "the source's field at each layer's depth" : "the source's plane field is used at every depth"));
            return new PlateSolution(choice, Array.Empty<double>(), new[] { thick.LossW }, null, null, new[] { thick.ResistanceLimitedLossW }, notes, thick.Iterations, thick.RelativeResidual, null);
        }
        var s = ReactionSolver.SolveAc(reaction ?? ReactionOperator.Build(model, fftThreads), source, conductor, criterion);
        notes.AddRange(s.Notes);
        return new PlateSolution(choice, Array.Empty<double>(), new[] { s.LossW }, null, null, new[] { s.ResistanceLimitedLossW }, notes, s.Iterations, s.RelativeResidual, null);
    }

    /// <param name="sourceLengthM">the source's length scale for the moving skin depth: its height above the sheet, or the pole size</param>
    /// <param name="basis">a reduced basis of this model, source geometry and offsets (<see cref="MovingReducedBasis"/>): the coupled solve then reuses it across
    /// conductors and speeds instead of a GMRES solve per conductor (the same equations, to the same criterion)</param>
    /// <param name="fftThreads">FFT workers of the reaction operator built here when none is given (answers are the same for any count)</param>
    public static PlateSolution SolveMoving(SheetModel model, IMovingSheetSource source, ConductingSheet conductor, IReadOnlyList<double> offsetsXM, double sourceLengthM,
        double accuracy = ReactionModelChoice.DefaultAccuracy, ReactionOperator? reaction = null, ConvergenceCriterion? criterion = null, SheetModelKind? forcedKind = null,
        MovingReducedBasis? basis = null, int fftThreads = 1)
    {
        CheckOperator(model, reaction);
        if (basis is not null && (!ReferenceEquals(basis.Model, model) || !basis.OffsetsXM.SequenceEqual(offsetsXM)))
            throw new ArgumentException("the reduced basis was built for another sheet model or other offsets", nameof(basis));
        if (forcedKind == SheetModelKind.BeyondThinSheet) throw new InputException("the layered thick-plate model is for AC fields only: there is no layered moving solver (use auto, resistance-limited or own-field)");
        var choice = ReactionModelChoice.Forced(ReactionModelChoice.ForMoving(conductor, source.SpeedMPerS, sourceLengthM, accuracy), forcedKind);
        var notes = new List<string> { choice.Reason };
        double g = conductor.SheetConductanceS, v = source.SpeedMPerS;
        if (choice.Kind == SheetModelKind.ResistanceLimited)
        {
            var sweep = ResistanceLimitedSolver.SolveMoving(model, source, offsetsXM, criterion);
            notes.AddRange(sweep.Notes);
            double w = conductor.RecedingImageSpeedMPerS;
            var loss = sweep.LossPerSiemensW.Select(p => g * p).ToArray();         // P = G P_unit (resistance-limited scaling)
            var drag = loss.Select(p => p / v).ToArray();                          // F = P / v
            return new PlateSolution(choice, offsetsXM.ToArray(), loss, drag, drag.Select(d => d * v / w).ToArray(), loss, notes, sweep.IterationsPerOffset.Sum(), sweep.Peak.RelativeResidual, sweep.Peak);
        }
        var s = basis is not null ? basis.Solve(conductor, source.SpeedMPerS) : ReactionSolver.SolveMoving(reaction ?? ReactionOperator.Build(model, fftThreads), source, conductor, offsetsXM, criterion);
        notes.AddRange(s.Notes);
        if (choice.Kind == SheetModelKind.BeyondThinSheet) notes.Add("thick against the moving skin depth: the thin-sheet answer is outside its validity (no layered moving solver)");
        return new PlateSolution(choice, s.OffsetsXM, s.LossW, s.DragN, s.LiftN, s.ResistanceLimitedDragN.Select(d => d * v).ToArray(), notes, s.Iterations.Sum(), s.MaxRelativeResidual, null);
    }

    /// <summary>
    /// A thin disc turning under a fixed source (<see cref="RotatingSource"/>, at its own angular speed) at each of anglesRad: torque and loss from the
    /// model the validity figures call for at the source's path speed omega R (R = <see cref="RotatingSource.SourceRadiusM"/>, length scale
    /// <see cref="RotatingSource.LoopLengthM"/>): resistance-limited (<see cref="DiscTorque"/>, scaled by G) or own-field (<see cref="DiscReaction"/>).
    /// Beyond the thin sheet the own-field answer comes with a warning (no layered rotating solver).
    /// </summary>
    /// <param name="initialGuess">u = psi / G at the first angle for the own-field solve (<see cref="DiscSolution.OwnFieldU"/> of a nearby speed); ignored resistance-limited</param>
    /// <param name="fftThreads">FFT workers of the reaction operator built here when none is given, and of the source's edge moments (the run's --threads where one disc is solved at a time; answers are the same for any count)</param>
    public static DiscSolution SolveDisc(SheetModel model, RotatingSource source, ConductingSheet conductor, IReadOnlyList<double> anglesRad,
        double accuracy = ReactionModelChoice.DefaultAccuracy, ReactionOperator? reaction = null, ConvergenceCriterion? criterion = null, SheetModelKind? forcedKind = null,
        double[]? initialGuess = null, int fftThreads = 1)
    {
        CheckOperator(model, reaction);
        if (forcedKind == SheetModelKind.BeyondThinSheet) throw new InputException("the layered thick-plate model is for AC fields only: there is no layered rotating solver (use auto, resistance-limited or own-field)");
        double omega = source.AngularSpeedRadPerS, g = conductor.SheetConductanceS;
        var choice = ReactionModelChoice.Forced(ReactionModelChoice.ForMoving(conductor, omega * source.SourceRadiusM, source.LoopLengthM, accuracy), forcedKind);
        var notes = new List<string> { choice.Reason };
        if (choice.Kind == SheetModelKind.ResistanceLimited)
        {
            var low = DiscTorque.Solve(model, source, anglesRad, criterion, fftThreads);
            var loss = low.LossPerSiemensW.Select(p => g * p).ToArray();       // P = G P_unit (resistance-limited scaling)
            return new DiscSolution(choice, omega, anglesRad.ToArray(), loss, loss, notes, low.Iterations, low.MaxRelativeResidual, low, null);
        }
        var s = DiscReaction.Solve(reaction ?? ReactionOperator.Build(model, fftThreads), source, conductor, anglesRad, criterion, initialGuess, fftThreads);
        if (choice.Kind == SheetModelKind.BeyondThinSheet) notes.Add("thick against the moving skin depth: the thin-sheet answer is outside its validity (no layered rotating solver)");
        return new DiscSolution(choice, omega, s.AnglesRad, s.LossW, s.ResistanceLimitedLossW, notes, s.Iterations, s.MaxRelativeResidual, s.ResistanceLimited, s.FirstU);
    }

    /// <summary>Edge clearance, in far-face heights, beyond which the fringing field is a few per cent of its peak (common practice, no source: the field of a magnet face falls off as a dipole's beyond about its height).</summary>
    public const double SlabEdgeClearanceInSourceHeights = 3;

    /// <summary>
    /// Whether magnets sliding over a plate go to the exact laterally infinite slab (<see cref="SlabUnderMovingMagnets"/>, model thick-slab),
    /// with the reason; null when they do not. Chosen automatically when the validity figures find the plate beyond the thin-sheet models
    /// (t / delta_c above the threshold) or the plate is at least as thick as the gap (the field then changes across the thickness even at
    /// low speed), and the block is plain (no slots, cut-outs, cuts, grooves or zones), non-magnetic and wide: its edges lie at least
    /// <see cref="SlabEdgeClearanceInSourceHeights"/> times the magnets' far-face height (gap + magnet height) beyond the magnets' footprint at
    /// every travel offset. Asked for (<paramref name="forcedKind"/> thick-slab) where it cannot apply, it throws an InputException saying why.
    /// </summary>
    public static ModelChoice? ThickSlabChoice(PlateGeometry geometry, ConductingSheet sheet, IMovingSheetSource? source, IReadOnlyList<double> offsetsXM, SheetModelKind? forcedKind)
    {
        bool asked = forcedKind == SheetModelKind.ThickSlab;
        if (forcedKind is { } && !asked) return null;
        if (source is not SlidingMagnets magnets)
            return asked ? throw new InputException("--model thick-slab is for magnets sliding over a block ([source] kind = \"magnets\"); this [source] is not") : null;
        var auto = ReactionModelChoice.ForMoving(sheet, magnets.SpeedMPerS, magnets.LoopLengthXM);
        string? obstacle = SlabObstacle(geometry, sheet, magnets, offsetsXM);
        if (obstacle is not null)
            return asked ? throw new InputException($"--model thick-slab cannot be used: {obstacle}") : null;
        double gap = magnets.Magnets.GapM, t = sheet.ThicknessM;
        bool thickAgainstGap = t >= gap;
        if (!asked && auto.Kind != SheetModelKind.BeyondThinSheet && !thickAgainstGap) return null;
        string why = auto.Kind == SheetModelKind.BeyondThinSheet ? auto.Reason
            : thickAgainstGap ? $"the block ({Numbers.Of(t * 1e3, "mm")}) is at least as thick as the gap ({Numbers.Of(gap * 1e3, "mm")}): the field changes across it; {auto.Reason}"
            : $"asked for; the validity figures call for {ReactionModelChoice.Name(auto.Kind)} ({auto.Reason})";
        return auto with { Kind = SheetModelKind.ThickSlab, Reason = $"exact wide slab under sliding magnets, every depth and its own field: {why}" };
    }

    /// <summary>Why the slab does not describe this plate, or null: slots and holes, a magnetic block, edges too near the magnets.</summary>
    private static string? SlabObstacle(PlateGeometry g, ConductingSheet sheet, SlidingMagnets magnets, IReadOnlyList<double> offsetsXM)
    {
        if (g.Cutouts.Count + g.Slots.Count + g.Cuts.Count + g.Grooves.Count + g.Zones.Count + g.Patterns.Count > 0 || g.ConductivityFactorAt is not null)
            return "the plate has slots, cut-outs, cuts, grooves or zones, and the slab model is a plain block";
        if (sheet.RelativePermeability != 1) return $"the block is magnetic (relative permeability {Numbers.Sig(sheet.RelativePermeability)}) and the slab model is for mu = mu0";
        var array = magnets.Magnets;
        double reach = SlabEdgeClearanceInSourceHeights * (array.GapM + array.Magnets.Max(m => m.Magnet.HeightM));
        var (min, max) = g.Bounds;
        double left = array.ExtentX.MinXM + offsetsXM.Min() - min.X, right = max.X - (array.ExtentX.MaxXM + offsetsXM.Max());
        double bottom = array.Magnets.Min(m => m.Centre.Y - m.Magnet.HalfWidthYM) - min.Y, top = max.Y - array.Magnets.Max(m => m.Centre.Y + m.Magnet.HalfWidthYM);
        double clearance = Math.Min(Math.Min(left, right), Math.Min(bottom, top));
        return clearance < reach
            ? $"the plate's edge comes within {Numbers.Of(clearance * 1e3, "mm")} of the magnets' footprint, less than {SlabEdgeClearanceInSourceHeights} far-face heights ({Numbers.Of(reach * 1e3, "mm")}): the block is not wide against the magnets"
            : null;
    }

    /// <summary>
    /// The solution with its grid-error estimate (<see cref="DiscretisationError.Estimate"/>): the same model solved again on cells twice
    /// and, where that grid resolves the plate, four times as large, or, where it does not, half as large (solveOn gets each other model;
    /// refusesCell says why a grid of a cell would not fit the run's memory, or null); the caller shows
    /// <see cref="DiscretisationError.Warning"/> when it exceeds 1 %. Where no coarser grid exists (fewer than 2 cells across, or nothing conducting left) GridError stays null.
    /// </summary>
    public static PlateSolution WithGridError(PlateSolution fine, SheetModel model, Func<SheetModel, PlateSolution> solveOn, Func<double, string?>? refusesCell = null) =>
        fine with { GridError = DiscretisationError.Estimate(model, fine.MeanLossW, other => solveOn(other).MeanLossW, refusesCell) };

    private static void CheckOperator(SheetModel model, ReactionOperator? reaction)
    {
        if (reaction is not null && !ReferenceEquals(reaction.Model, model)) throw new ArgumentException("the reaction operator was built for another sheet model", nameof(reaction));
    }
}
