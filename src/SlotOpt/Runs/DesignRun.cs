using SlotOpt.Design.SolidParts;
using SlotOpt.Design.Limits;
using SlotOpt.Design;
using SlotOpt.Design.Cores;
using SlotOpt.Selection;
using SlotOpt.Selection.Search;

namespace SlotOpt.Runs;

/// <summary>
/// The main job: evaluate every option, select under the shared limits, trace the front, compare with the
/// baselines, confirm the chosen plates, solve the hot plates' temperature coupled (chosen and reference), and compute the numbers the report plots.
/// </summary>
public static class DesignRun
{
    /// <param name="limits">Threads, memory and wall time; the time limit covers every phase (evaluation, selection,
    /// the hot plates' coupled temperatures, confirmation with its speed sweep, the figures) and, when the caller
    /// started the deadline, whatever the caller does after.</param>
    public static RunResult Execute(Problem problem, CpSatSettings? settings = null, IProgress<int>? geometrySolved = null, EvaluationLimits? limits = null)
    {
        limits = (limits ?? EvaluationLimits.Default).Started(out var ownDeadline);
        using var _ = ownDeadline;
        var deadline = limits.Deadline!;
        var evaluated = CandidateEvaluation.Evaluate(problem, geometrySolved, limits);
        var parts = evaluated.Parts.ToList();
        var heat = new List<PlateHeat>();
        SelectionOutcome outcome;
        IReadOnlyList<EvaluatedOption>? chosen;
        // select; solve the chosen hot plates coupled; a chosen plate whose coupled temperature breaks its limit is dropped and the selection repeats
        while (true)
        {
            var selection = CandidateEvaluation.ToSelectionProblem(problem, parts);
            // the remaining time is CP-SAT's wall limit too; should it bind, the deadline has passed and the check after the phase ends the run
            var search = (settings ?? new CpSatSettings()) with { MaxWallSeconds = Math.Max(deadline.RemainingSeconds, 1e-3) };
            outcome = deadline.Run("the selection", () => new CpSatSelector(search).Select(selection, new SelectionOptions { IncludeFront = true }));
            chosen = null;
            heat.Clear();
            if (outcome.Design is not { } design) break;
            var byId = parts.SelectMany(p => p.Options).ToDictionary(o => o.Id);
            var picked = design.Choices.Select(c => byId[c.Candidate.Id]).ToList();
            chosen = picked;
            var broken = new List<(int Part, EvaluatedOption Option, string Reason)>();
            for (var i = 0; i < parts.Count; i++)
            {
                if (parts[i].Part is not PlatePart { Thermal: not null } hot) continue;
                var part = parts[i];
                var chosenHeat = deadline.Run($"the temperature of part {hot.Name}", () => PlateHeat.Of(hot, picked[i], DesignRole.Chosen, problem, limits));
                heat.Add(chosenHeat);
                heat.Add(deadline.Run($"the temperature of part {hot.Name}", () => PlateHeat.Of(hot, part.Reference, DesignRole.Reference, problem, limits)));
                if (chosenHeat.Breach is { } reason) broken.Add((i, picked[i], reason));
            }
            if (broken.Count == 0) break;
            foreach (var (i, option, reason) in broken)
                parts[i] = parts[i] with { Options = parts[i].Options.Select(o => o.Id == option.Id ? o with { Rejection = new RuleBreak(RuleKind.HotterThanLimit, $"{reason} (coupled solve of a plate the screen passed)") } : o).ToList() };
        }
        var confirmations = new List<PlateConfirmation>();
        var geometries = new SolvedGeometries(limits);      // the chosen, solid and reference plates' geometries, solved once for the confirmation and the figures
        if (chosen is not null)
            // the chosen plates with the model their validity calls for (the ranking's number), their lift, grid error and speed sweep
            foreach (var option in chosen)
                if (problem.Parts.First(p => p.Name == option.PartName) is PlatePart plate && option.Choice is PlateChoice)
                    confirmations.Add(deadline.Run($"the confirmation of part {plate.Name}", () => PlateConfirmation.Confirm(plate, option, problem.Library, geometries)));
        var figures = deadline.Run("the report's figures", () => RunFigures.Compute(problem, parts, chosen, heat, geometries));
        var baselines = deadline.Run("the baselines", () => Baselines(problem, parts, limits));
        return new RunResult(problem, parts, outcome, chosen, baselines, evaluated.SheetSolves, evaluated.Seconds, confirmations, figures, heat);
    }

    /// <summary>
    /// The reference (current design, else baseline), then "thickest gauge, solid plates" and "thinnest gauge,
    /// solid plates": per core the thickest (thinnest) grade listed, per plate solid at its thickest
    /// (thinnest) thickness in the first material and process. They may break limits; the report says so.
    /// Each carries the number of the model its validity calls for, as the chosen design does: a plate the ranking left with the
    /// screen's number (it could not be chosen) is evaluated again on its own.
    /// </summary>
    private static IReadOnlyList<Baseline> Baselines(Problem problem, IReadOnlyList<PartEvaluation> parts, EvaluationLimits limits)
    {
        var reference = new Baseline(parts.Any(p => p.ReferenceIsCurrent) ? "current design" : "baseline (solid plates, first grade)", parts.Select(p => p.Reference).ToList());
        var thickest = new Baseline("thickest gauge, solid plates", parts.Select(p => Modelled(problem, p, Extreme(problem, p, thickest: true), limits)).ToList());
        var thinnest = new Baseline("thinnest gauge, solid plates", parts.Select(p => Modelled(problem, p, Extreme(problem, p, thickest: false), limits)).ToList());
        return [reference, thickest, thinnest];
    }

    private static EvaluatedOption Modelled(Problem problem, PartEvaluation evaluation, EvaluatedOption option, EvaluationLimits limits) =>
        evaluation.Part is PlatePart plate && option.Model is { IsScreenOnly: true } && option.Choice is PlateChoice choice
            ? PlateOptions.EvaluateOne(plate, choice, problem.Library, problem.Shop, limits)
            : option;

    private static EvaluatedOption Extreme(Problem problem, PartEvaluation evaluation, bool thickest)
    {
        switch (evaluation.Part)
        {
            case CorePart core:
            {
                var steels = core.Grades.Select(g => problem.Library.GetSteel(g, core.Name)).ToList();
                var gauge = thickest ? steels.Max(s => s.ThicknessM) : steels.Min(s => s.ThicknessM);
                var steel = steels.First(s => s.ThicknessM == gauge);
                return evaluation.Options.First(o => o.Choice is CoreChoice c && c.Grade == steel.Grade && c.Process == core.Processes[0]);
            }
            case PlatePart plate:
            {
                var t = thickest ? plate.ThicknessesM.Max() : plate.ThicknessesM.Min();
                return evaluation.Options.First(o => o.Choice is PlateChoice c && c.Slots is null && c.ThicknessM == t && c.Material == plate.Materials[0] && c.Process == plate.Processes[0]);
            }
            default:
                throw new ArgumentOutOfRangeException(nameof(evaluation), evaluation.Part.GetType().Name, "unknown part kind");
        }
    }
}
