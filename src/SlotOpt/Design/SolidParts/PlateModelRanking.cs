using System.Globalization;
using SlotOpt.Materials;
using SlotOpt.Plates;
using SlotOpt.Plates.Conductors;
using SlotOpt.Plates.OwnField;
using SlotOpt.Plates.ReducedBasis;
using SlotOpt.Plates.Thermal;

namespace SlotOpt.Design.SolidParts;

/// <summary>
/// Gives every plate option that can be chosen, or sit on the trade-off curve, the number of the model its validity figures call for
/// (<see cref="ReactionModelChoice"/> at 1 %: resistance-limited, thin sheet with its own field, layered thick plate) before the selection
/// sees it. The resistance-limited screen's number stays only where it already is that model's, or where the option provably can be
/// neither chosen nor on the curve; its <see cref="EvaluatedOption.Model"/> then says why:
/// <list type="bullet">
/// <item>a rule that does not depend on loss (slot width, strip, ligament, finger resonance, pattern, the screen's temperature) removed
/// every process of that thickness and material: no model changes the verdict;</item>
/// <item>moving sources: the option's loss lies between rigorous bounds from two reduced-basis steps (<see cref="MovingReducedBasis.LossBounds"/>),
/// and its lower bound already breaks the part's drag or loss limit, or it is dominated: another option of the part, within the limits
/// even at its upper bound, costs no more to build and loses less at its upper bound than this one at its lower bound (and, where the
/// problem caps the number of processes, uses the same process). Swapping in the dominating option keeps every shared limit (budget, loss
/// cap, processes) and lowers the loss at no extra cost, so the dominated one is never optimal and never on the loss-cost front. Parts
/// with [parts.thermal] are not pruned (the run may still reject a chosen plate on its coupled temperature), nor parts with a min_drag
/// (a lower limit the bounds would have to meet from below).</item>
/// </list>
/// Options a loss or drag limit removed are re-solved unless their lower bound breaks it too: the coupled number is lower and may pass.
/// <para>The screen's own bound, tested in PlateModelRankingTests: the resistance-limited loss is an upper bound of the coupled loss at the same
/// applied field. AC: (A + j omega G R) u = -s with A symmetric positive definite and R symmetric positive semi-definite (the mutual
/// inductance of the hat loops): in A-orthonormal coordinates u = (I + j omega G K)^-1 u0 with K symmetric, each mode scaled by
/// 1/(1 + j omega G k_i), so |u|_A &lt;= |u0|_A (the eddy currents' field opposes the applied field, Lenz). Moving: (A - v G Dx R) u = -s with
/// Dx R skew-symmetric, so (I - c K) with K skew has singular values &gt;= 1 and again |u|_A &lt;= |u0|_A. Hence an option the screen passed
/// within a loss or drag limit stays within it, and the screen's temperature (from its loss) is an upper bound.</para>
/// Reuse: the screen's sheet model, one <see cref="ReactionOperator"/> per geometry (turning discs: in their <see cref="TurningDiscModel"/>), and one reduced basis per geometry serving every
/// thickness and material: <see cref="MovingReducedBasis"/> (bounds first, grown to the converged solve only for the options that need it)
/// or <see cref="AcReducedBasis"/> (thin sheets with their own field in an AC field; thick plates go to the layered solver one by one).
/// </summary>
public static class PlateModelRanking
{
    /// <summary>Whether a broken rule could heal under a model with a lower loss: the part's loss and drag limits.</summary>
    public static bool DependsOnLoss(RuleKind kind) => kind is RuleKind.DragAboveLimit or RuleKind.LossAboveLimit;

    /// <summary>One thickness and material of one geometry: the model its validity figures call for, and what is known of its loss.</summary>
    private sealed class Group(int geometry, double thicknessM, string material, ConductingSheet sheet, ModelChoice choice)
    {
        public int Geometry { get; } = geometry;
        public double ThicknessM { get; } = thicknessM;
        public string Material { get; } = material;
        public ConductingSheet Sheet { get; } = sheet;
        public ModelChoice Choice { get; } = choice;
        /// <summary>Final: the screen's number stands, for this reason.</summary>
        public OptionModel? Kept { get; set; }
        public (double LowerW, double UpperW)? Bounds { get; set; }
        public (OptionModel Model, double LossW)? Solved { get; set; }
        public bool Needed { get; set; }
    }

    /// <summary>Moving sources: the reduced basis of one geometry, kept from its bounds to its converged solves.</summary>
    private sealed class GeometryBasis
    {
        public MovingReducedBasis? Basis { get; set; }
    }

    /// <param name="screened">the screen's options of each solved geometry (every thickness, material and process), in geometry order</param>
    /// <param name="heat">with [parts.thermal]: the screen's temperature verdict per geometry, thickness and material</param>
    /// <param name="mayPrune">whether options may be pruned by bounds (false for one fixed design, or a part whose chosen plate the run may still reject)</param>
    /// <param name="processCapped">whether the problem caps the number of distinct processes (dominance then only within one process)</param>
    public static IReadOnlyList<EvaluatedOption> Rank(PlatePart part, IReadOnlyList<PlateOptions.SolvedGeometry> solved, IReadOnlyList<IReadOnlyList<EvaluatedOption>> screened,
        MaterialLibrary library, ManufacturingSettings shop, IReadOnlyList<IReadOnlyDictionary<(double, string), TemperatureBracket.Outcome>> heat, EvaluationLimits limits,
        bool mayPrune, bool processCapped)
    {
        var deadline = limits.Deadline;
        var groups = new List<Group>[solved.Count];
        for (var g = 0; g < solved.Count; g++) groups[g] = Groups(part, g, solved[g], screened[g], library);
        var parallel = new ParallelOptions { MaxDegreeOfParallelism = Math.Max(limits.Threads, 1) };
        var moving = part.Excitation as PlateExcitation.Moving;
        var bases = Enumerable.Range(0, solved.Count).Select(_ => new GeometryBasis()).ToArray();
        if (mayPrune && moving is not null)
        {
            // bounds from two reduced-basis steps a position, then the options that must be solved to convergence (their bases grow on)
            Run(solved.Count, parallel, g => Bound(part, solved[g], groups[g], bases[g]));
            MarkNeeded(part, screened, groups, processCapped);
            for (var g = 0; g < solved.Count; g++) if (!groups[g].Any(x => x.Needed)) bases[g].Basis = null;
        }
        else
            foreach (var group in groups.SelectMany(x => x)) group.Needed = group.Kept is null;
        Run(solved.Count, parallel, g => { Solve(part, solved[g], groups[g], bases[g]); bases[g].Basis = null; });
        var ranked = new List<EvaluatedOption>();
        for (var g = 0; g < solved.Count; g++)
        {
            if (solved[g].Failure is not null) { ranked.AddRange(screened[g]); continue; }
            foreach (var o in screened[g])
            {
                var c = (PlateChoice)o.Choice;
                var group = groups[g].First(x => x.ThicknessM == c.ThicknessM && x.Material == c.Material);
                var (model, lossW) = Number(group);
                ranked.Add(PlateOptions.Scale(part, solved[g], c.ThicknessM, library.GetConductor(c.Material, part.Name), shop.Processes[c.Process], shop,
                    heat[g].GetValueOrDefault((c.ThicknessM, c.Material)), model, lossW));
            }
        }
        return ranked;

        void Run(int count, ParallelOptions options, Action<int> work)
        {
            var failures = new Exception?[count];
            Parallel.For(0, count, options, (g, loop) =>
            {
                try { if (deadline is null) work(g); else deadline.Run($"the coupled ranking of part {part.Name}", () => { work(g); return 0; }); }
                catch (Exception e)
                {
                    failures[g] = e;
                    if (e is ResourceLimitException or OperationCanceledException) loop.Stop();
                }
            });
            // the first failure in geometry order, rethrown as itself, so the message and exit code are the same on every run
            if (failures.FirstOrDefault(f => f is not null) is { } first) System.Runtime.ExceptionServices.ExceptionDispatchInfo.Capture(first).Throw();
        }
    }

    /// <summary>The model that gave a solution's number: beyond the thin sheet a moving case still gets the thin-sheet answer (no layered moving solver), and says so.</summary>
    public static OptionModel ModelOf(ModelChoice choice, bool moving) =>
        moving && choice.Kind == SheetModelKind.BeyondThinSheet
            ? new OptionModel(SheetModelKind.ThinSheetReaction, $"{choice.Reason}; there is no layered moving solver, so the thin sheet with its own field gave the number (outside its validity)")
            : new OptionModel(choice.Kind, choice.Reason);

    private static List<Group> Groups(PlatePart part, int g, PlateOptions.SolvedGeometry solved, IReadOnlyList<EvaluatedOption> screened, MaterialLibrary library)
    {
        var groups = new List<Group>();
        if (solved.Failure is not null || solved.Peak is null) return groups;
        foreach (var options in screened.GroupBy(o => (((PlateChoice)o.Choice).ThicknessM, ((PlateChoice)o.Choice).Material)))
        {
            var (thicknessM, materialName) = options.Key;
            var material = library.GetConductor(materialName, part.Name);
            var sheet = new ConductingSheet(material.ConductivityAt(part.TemperatureK), thicknessM, material.RelativePermeability);
            var choice = part.Excitation switch
            {
                PlateExcitation.Moving moving => ReactionModelChoice.ForMoving(sheet, moving.SpeedMPerS, moving.Source.LoopLengthXM),
                PlateExcitation.Turning turning => TurningDiscModel.ValidityOf(turning, sheet),
                PlateExcitation.AcField field => ReactionModelChoice.ForAc(sheet, field.FrequencyHz, solved.Geometry!.CharacteristicWidthM),
                _ => throw new ArgumentOutOfRangeException(nameof(part), part.Excitation.GetType().Name, "unknown plate excitation"),
            };
            var group = new Group(g, thicknessM, materialName, sheet, choice);
            if (part.Excitation is PlateExcitation.Turning) { groups.Add(group); continue; }     // every disc number passes its one seam (TurningDiscModel)
            if (choice.Kind == SheetModelKind.ResistanceLimited)
                group.Kept = new OptionModel(SheetModelKind.ResistanceLimited, choice.Reason);
            else if (options.All(o => o.Rejection is { } broken && !DependsOnLoss(broken.Kind)))
                group.Kept = Screen(choice, "a rule that does not depend on loss removes it under any model");
            groups.Add(group);
        }
        return groups;
    }

    private static OptionModel Screen(ModelChoice choice, string why) =>
        new(SheetModelKind.ResistanceLimited, $"the resistance-limited screen, not re-solved: {why} (its validity figures call for {ReactionModelChoice.Name(choice.Kind)}: {choice.Reason})", IsScreenOnly: true);

    /// <summary>Moving sources: the loss bounds of every open group of one geometry from one reduced basis.</summary>
    private static void Bound(PlatePart part, PlateOptions.SolvedGeometry solved, List<Group> groups, GeometryBasis kept)
    {
        if (groups.All(x => x.Kept is not null)) return;
        var source = ((PlateExcitation.Moving)part.Excitation).Source;
        var basis = kept.Basis = MovingReducedBasis.Start(ReactionOperator.Build(solved.Peak!.Model), source, PlateOptions.TravelOffsets(part, solved.Slots));
        foreach (var group in groups.Where(x => x.Kept is null))
            group.Bounds = basis.LossBounds(group.Sheet, source.SpeedMPerS);
    }

    /// <summary>Marks the groups whose options may be chosen or sit on the front: not surely beyond a limit, not dominated (see the type's summary).</summary>
    private static void MarkNeeded(PlatePart part, IReadOnlyList<IReadOnlyList<EvaluatedOption>> screened, List<Group>[] groups, bool processCapped)
    {
        var speed = ((PlateExcitation.Moving)part.Excitation).SpeedMPerS;
        var rows = new List<(EvaluatedOption Option, Group Group, double Lower, double Upper)>();
        for (var g = 0; g < screened.Count; g++)
            foreach (var o in screened[g])
            {
                if (o.Rejection is { } broken && !DependsOnLoss(broken.Kind)) continue;      // removed under any model
                var c = (PlateChoice)o.Choice;
                var group = groups[g].FirstOrDefault(x => x.ThicknessM == c.ThicknessM && x.Material == c.Material);
                if (group is null) continue;
                var (lower, upper) = group.Bounds ?? (o.Loss.TotalW, o.Loss.TotalW);         // kept groups: the screen's number is the model's
                rows.Add((o, group, lower, upper));
            }
        bool Within(double lossW) => (part.MaxLossW is not { } maxLoss || lossW <= maxLoss) && (part.MaxDragN is not { } maxDrag || lossW / speed <= maxDrag);
        var surelyFeasible = rows.Where(r => Within(r.Upper)).ToList();
        foreach (var row in rows.Where(r => r.Group.Kept is null))
        {
            if (!Within(row.Lower)) continue;                                                // beyond a limit even at its lower bound
            var dominated = surelyFeasible.Any(a => a.Option.BuildCost <= row.Option.BuildCost && a.Upper < row.Lower
                && (!processCapped || ((PlateChoice)a.Option.Choice).Process == ((PlateChoice)row.Option.Choice).Process));
            // a dominated option the screen put beyond a limit its bounds do not settle is solved all the same, so its rejection is never the screen's word alone
            if (!dominated || !Within(row.Upper)) row.Group.Needed = true;
        }
        foreach (var group in groups.SelectMany(x => x).Where(x => x.Kept is null && !x.Needed))
        {
            var (lower, upper) = group.Bounds!.Value;
            group.Kept = Screen(group.Choice, string.Create(CultureInfo.InvariantCulture,
                $"its loss lies between {lower:G6} and {upper:G6} W (reduced-basis bounds), so every process of it is beyond a limit or dominated by a cheaper option that loses less"));
        }
    }

    /// <summary>The converged solve of every needed group of one geometry with the model its figures call for.</summary>
    private static void Solve(PlatePart part, PlateOptions.SolvedGeometry solved, List<Group> groups, GeometryBasis kept)
    {
        if (!groups.Any(x => x.Needed)) return;
        var model = solved.Peak!.Model;
        MovingReducedBasis? basis = kept.Basis;
        AcReducedBasis? acBasis = null;
        ReactionOperator? reaction = basis?.Reaction;
        TurningDiscModel? disc = null;                  // one per geometry: its reaction operator serves every thickness and material
        foreach (var group in groups.Where(x => x.Needed))
        {
            PlateSolution solution;
            switch (part.Excitation)
            {
                case PlateExcitation.Moving moving:
                    reaction ??= ReactionOperator.Build(model);
                    var offsets = PlateOptions.TravelOffsets(part, solved.Slots);
                    basis ??= MovingReducedBasis.Start(reaction, moving.Source, offsets);
                    // loss and drag are what the selection sees: the lift is left to the chosen plate's confirmation
                    var coupled = basis.Solve(group.Sheet, moving.SpeedMPerS, withLift: false);
                    group.Solved = (ModelOf(group.Choice, moving: true), coupled.MeanLossW);
                    continue;
                case PlateExcitation.Turning:
                    disc ??= new TurningDiscModel(part, solved);
                    var number = disc.Evaluate(group.Sheet);
                    group.Solved = (number.Model, number.LossW);
                    continue;
                case PlateExcitation.AcField field when group.Choice.Kind == SheetModelKind.ThinSheetReaction:
                    // one reduced basis of the geometry serves every thickness and material (the same equations as ReactionSolver.SolveAc, to the same criterion)
                    reaction ??= ReactionOperator.Build(model);
                    acBasis ??= AcReducedBasis.Start(reaction, field.Source);
                    group.Solved = (ModelOf(group.Choice, moving: false), acBasis.Solve(group.Sheet).LossW);
                    continue;
                case PlateExcitation.AcField field:
                    solution = PlateModels.SolveAc(model, field.Source, group.Sheet);
                    break;
                default:
                    throw new ArgumentOutOfRangeException(nameof(part), part.Excitation.GetType().Name, "unknown plate excitation");
            }
            group.Solved = (ModelOf(solution.Choice, part.Excitation.IsMoving), solution.MeanLossW);
        }
    }

    private static (OptionModel Model, double? LossW) Number(Group group) =>
        group.Solved is { } solved ? (solved.Model, solved.LossW) : (group.Kept!, null);
}
