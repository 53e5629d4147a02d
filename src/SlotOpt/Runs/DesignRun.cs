using SlotOpt.Design;
using SlotOpt.Design.Cores;
using SlotOpt.Selection;
using SlotOpt.Selection.Search;

namespace SlotOpt.Runs;

/// <summary>
/// The main job: evaluate every option, select under the shared limits, trace the front, compare with the
/// baselines, confirm the chosen plates, and compute the numbers the report plots.
/// </summary>
public static class DesignRun
{
    public static RunResult Execute(Problem problem, CpSatSettings? settings = null, IProgress<int>? geometrySolved = null, EvaluationLimits? limits = null)
    {
        var evaluated = CandidateEvaluation.Evaluate(problem, geometrySolved, limits);
        var selection = CandidateEvaluation.ToSelectionProblem(problem, evaluated.Parts);
        var outcome = new CpSatSelector(settings).Select(selection, new SelectionOptions { IncludeFront = true });
        IReadOnlyList<EvaluatedOption>? chosen = null;
        var confirmations = new List<PlateConfirmation>();
        if (outcome.Design is { } design)
        {
            var byId = evaluated.Parts.SelectMany(p => p.Options).ToDictionary(o => o.Id);
            chosen = design.Choices.Select(c => byId[c.Candidate.Id]).ToList();
            // screen with the fast resistance-limited model, confirm the chosen plates with the model their validity calls for
            foreach (var option in chosen)
                if (problem.Parts.First(p => p.Name == option.PartName) is PlatePart plate && option.Choice is PlateChoice choice)
                    confirmations.Add(PlateConfirmation.Confirm(plate, choice, problem.Library, limits));
        }
        var figures = RunFigures.Compute(problem, evaluated.Parts, chosen, limits);
        return new RunResult(problem, evaluated.Parts, outcome, chosen, Baselines(problem, evaluated.Parts), evaluated.SheetSolves, evaluated.Seconds, confirmations, figures);
    }

    /// <summary>
    /// The reference (current design, else baseline), then "thickest gauge, solid plates" and "thinnest gauge,
    /// solid plates": per core the thickest (thinnest) grade listed, per plate solid at its thickest
    /// (thinnest) thickness in the first material and process. They may break limits; the report says so.
    /// </summary>
    private static IReadOnlyList<Baseline> Baselines(Problem problem, IReadOnlyList<PartEvaluation> parts)
    {
        var reference = new Baseline(parts.Any(p => p.ReferenceIsCurrent) ? "current design" : "baseline (solid plates, first grade)", parts.Select(p => p.Reference).ToList());
        var thickest = new Baseline("thickest gauge, solid plates", parts.Select(p => Extreme(problem, p, thickest: true)).ToList());
        var thinnest = new Baseline("thinnest gauge, solid plates", parts.Select(p => Extreme(problem, p, thickest: false)).ToList());
        return [reference, thickest, thinnest];
    }

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
