using SlotOpt.Design.SolidParts;
using SlotOpt.Design;
using SlotOpt.Materials;
using SlotOpt.Plates;
using SlotOpt.Plates.Conductors;
using SlotOpt.Plates.Grid;
using SlotOpt.Plates.OwnField;
using SlotOpt.Plates.ReducedBasis;
using SlotOpt.Plates.Sources;

namespace SlotOpt.Runs;

/// <summary>
/// A chosen plate design with what the report shows beyond its ranked number: the model its validity figures call for
/// (the same model, and the same loss and drag, the ranking gave it: <see cref="PlateModelRanking"/>), its lift, its grid error
/// (from the solves on cells twice and four times as large, or half as large where twice does not resolve the plate: <see cref="DiscretisationError"/>), and under moving poles drag and lift
/// against speed with the plate's own field. ResistanceLimitedLossW is the screen's number of the same plate.
/// </summary>
public sealed record PlateConfirmation(
    string PartName,
    SheetModelKind Model,
    string Reason,
    double LossW,
    double? DragN,
    double? LiftN,
    double ResistanceLimitedLossW,
    IReadOnlyList<string> Notes,
    IReadOnlyList<SpeedPoint>? SpeedSweep,
    DiscretisationError? GridError = null)
{
    /// <summary>
    /// Speeds of the sweep, as multiples of the receding-image speed w = 2/(mu0 sigma t): a solid sheet's drag peaks
    /// near 1.27 w (for a source symmetric about the sheet normal, F_D = (w/v) F0 [1 - w/sqrt(v^2 + w^2)] peaks at v = w sqrt(golden ratio):
    /// Reitz, "Forces on moving magnets due to eddy currents", J. Appl. Phys. 41:2067, 1970, re-derived); slots push the peak higher. Beyond about 5 w the coupled solve converges slowly.
    /// </summary>
    public static readonly double[] SweepOverW = [0.05, 0.1, 0.2, 0.4, 0.7, 1.0, 1.5, 2.2, 3.3, 5.0];

    /// <summary>Travel positions each sweep speed averages (a window of the run's offsets; the sweep shows the trend, the run's offsets give the figures).</summary>
    public const int SweepPositions = 2;
    /// <summary>
    /// Solves the chosen option with the model its validity figures call for (accuracy 1 %, ReactionModelChoice), on the part's grid and on coarser
    /// (or finer) ones for its grid error. A turning disc's geometry comes from (and stays in) geometries, and its number at the run's speed is the ranking's, not solved again.
    /// </summary>
    public static PlateConfirmation Confirm(PlatePart part, EvaluatedOption chosen, MaterialLibrary library, SolvedGeometries geometries)
    {
        var limits = geometries.Limits;
        var choice = (PlateChoice)chosen.Choice;
        var material = library.GetConductor(choice.Material, part.Name);
        var conductor = new ConductingSheet(material.ConductivityAt(part.TemperatureK), choice.ThicknessM, material.RelativePermeability);
        if (part.Excitation is PlateExcitation.Turning turning)
            return ConfirmDisc(part, chosen, choice, turning, conductor, geometries);
        var (geometry, _) = PlateGeometryFactory.Build(part, choice.Slots);
        var model = PlateOptions.BuildModel(part, geometry, limits);
        PlateSolution solution;
        IReadOnlyList<SpeedPoint>? sweep = null;
        BrakingMinimumCheck? minimum = null;
        if (part.Excitation is PlateExcitation.Moving { Source: var source })
        {
            var offsets = PlateOptions.TravelOffsets(part, choice.Slots);
            var reaction = ReactionOperator.Build(model, limits.Threads);
            PlateSolution SolveOn(SheetModel m, ReactionOperator r) =>
                PlateModels.SolveMoving(m, source, conductor, offsets, source.LoopLengthXM, reaction: r, basis: MovingReducedBasis.Start(r, source, offsets));
            solution = PlateModels.WithGridError(SolveOn(model, reaction), model, other => SolveOn(other, ReactionOperator.Build(other, limits.Threads)), cell => limits.RefusesGrid(model, cell));
            sweep = Sweep(reaction, source, conductor, offsets);
            if (part.MinBraking is { } wanted) minimum = CheckMinimumDrag(wanted, model, reaction, source, conductor, offsets, solution);
        }
        else if (part.Excitation is PlateExcitation.AcField field)
        {
            solution = PlateModels.WithGridError(PlateModels.SolveAc(model, field.Source, conductor, fftThreads: limits.Threads), model,
                m => PlateModels.SolveAc(m, field.Source, conductor, fftThreads: limits.Threads), cell => limits.RefusesGrid(model, cell));
        }
        else throw new ArgumentOutOfRangeException(nameof(part), part.Excitation.GetType().Name, "unknown plate excitation");
        var ranked = PlateModelRanking.ModelOf(solution.Choice, part.Excitation.IsMoving);
        var notes = solution.Notes.ToList();
        if (solution.GridError is { IsLarge: true } large) notes.Add(large.Warning);
        return new PlateConfirmation(part.Name, ranked.Kind, ranked.Reason, solution.MeanLossW, solution.MeanDragN, solution.MeanLiftN,
            solution.ResistanceLimitedLossW.Average(), notes, sweep, solution.GridError) { Minimum = minimum };
    }

    /// <summary>
    /// A turning disc: its number through the one seam (<see cref="TurningDiscModel"/>: the ranking's number, which the chosen option carries),
    /// the tangential force at the magnets' radius as its drag, and the grid error from the same disc solved on coarser (or finer) cells (<see cref="DiscretisationError.Estimate"/>); with
    /// min_torque, the torque at its speed.
    /// </summary>
    private static PlateConfirmation ConfirmDisc(PlatePart part, EvaluatedOption chosen, PlateChoice choice, PlateExcitation.Turning turning, ConductingSheet conductor,
        SolvedGeometries geometries)
    {
        var solved = geometries.Of(part, choice.Slots);
        if (solved.Failure is { } failure) throw new InvalidOperationException($"{part.Name}: the chosen disc no longer solves: {failure.Message}");
        var model = solved.Peak!.Model;
        var threads = geometries.Limits.Threads;
        var number = new DiscNumber(chosen.Model ?? throw new InvalidOperationException($"{part.Name}: the chosen disc carries no model"), chosen.Loss.TotalW,
            chosen.TorqueNm ?? throw new InvalidOperationException($"{part.Name}: the chosen disc carries no torque"));
        var notes = new List<string>();
        var gridError = DiscretisationError.Estimate(model, number.LossW,
            other => new TurningDiscModel(part, PlateOptions.SolveTurning(turning, choice.Slots, solved.Pattern, solved.Geometry!, other, threads), threads).Evaluate(conductor).LossW,
            cell => geometries.Limits.RefusesGrid(model, cell));
        if (gridError is null) notes.Add("no grid error estimate: the grid cannot be coarsened to twice its cell");
        else if (gridError.IsLarge) notes.Add(gridError.Warning);
        // min_torque: the disc solved at the minimum's own speed by the model its validity calls for there (the screen scaled linearly,
        // which the own field does not: as a min_drag is confirmed at its speed)
        BrakingMinimumCheck? minimum = part.MinBraking is { } wanted && new TurningDiscModel(part, solved, threads).Evaluate(conductor, wanted.Speed) is var atWanted
            ? new BrakingMinimumCheck(wanted, atWanted.TorqueNm, atWanted.Model.Kind)
            : null;
        return new PlateConfirmation(part.Name, number.Model.Kind, number.Model.Reason, number.LossW, number.TorqueNm / turning.Source.SourceRadiusM, null, solved.LossPerSiemensW * conductor.SheetConductanceS,
            notes, null, gridError) { TorqueNm = number.TorqueNm, Minimum = minimum };
    }

    /// <summary>A turning disc: the braking torque (N m); DragN is then the tangential force at the magnets' radius.</summary>
    public double? TorqueNm { get; init; }

    /// <summary>With min_drag or min_torque: the chosen design's drag or torque at the minimum's speed with the model its validity calls for there.</summary>
    public BrakingMinimumCheck? Minimum { get; init; }

    /// <summary>The chosen design's drag at the minimum's speed with the model its validity calls for there (the screen's resistance-limited drag overstates it once the own field matters).</summary>
    private static BrakingMinimumCheck CheckMinimumDrag(BrakingMinimum wanted, Plates.Grid.SheetModel model, ReactionOperator reaction, ITravellingSource source, ConductingSheet conductor,
        IReadOnlyList<double> offsets, PlateSolution atSourceSpeed)
    {
        var at = wanted.Speed == source.SpeedMPerS ? atSourceSpeed
            : PlateModels.SolveMoving(model, source.AtSpeed(wanted.Speed), conductor, offsets, source.LoopLengthXM, reaction: reaction);
        return new BrakingMinimumCheck(wanted, at.MeanDragN!.Value, at.Choice.Kind);
    }

    /// <summary>
    /// Drag and lift against speed with the plate's own field, over SweepOverW multiples of w, from one reduced basis of the window's positions
    /// (<see cref="MovingReducedBasis"/>: every speed is a small projected solve once the basis holds it).
    /// </summary>
    private static IReadOnlyList<SpeedPoint> Sweep(ReactionOperator reaction, ITravellingSource source, ConductingSheet conductor, IReadOnlyList<double> offsets)
    {
        var w = conductor.RecedingImageSpeedMPerS;
        var basis = MovingReducedBasis.Start(reaction, source, offsets.Take(SweepPositions).ToList());
        var points = new List<SpeedPoint>();
        foreach (var m in SweepOverW)
        {
            // the sweep illustrates the trend: it ends at the first speed the coupled solve does not converge at, never with a guessed number
            if (!basis.TrySolve(conductor, m * w, out var s, out _)) break;
            points.Add(new SpeedPoint(m * w, s!.MeanDragN, s.MeanLiftN, s.ResistanceLimitedDragN.Average()));
        }
        return points;
    }

    /// <summary>The model's name as `plate --model` and every output spell it.</summary>
    public string ModelName => ReactionModelChoice.Name(Model);

    /// <summary>The model in words for the console and the report.</summary>
    public string ModelWords => Model switch
    {
        SheetModelKind.ResistanceLimited => "resistance-limited (the plate's own field is negligible)",
        SheetModelKind.ThinSheetReaction => "own-field (thin sheet with its own field)",
        _ => "thick (layered thick plate)",
    };
}

/// <summary>The chosen design's confirmed drag (N) or torque (N m) at a min_drag's or min_torque's speed, the minimum it must reach, and the model that gave it.</summary>
public sealed record BrakingMinimumCheck(BrakingMinimum Wanted, double Achieved, SheetModelKind Model)
{
    public bool Reached => Achieved >= Wanted.Value;
}
