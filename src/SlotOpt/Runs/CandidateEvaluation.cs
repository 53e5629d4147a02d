using SlotOpt.Design.SolidParts;
using System.Diagnostics;
using SlotOpt.Design;
using SlotOpt.Design.Cores;
using SlotOpt.Selection;

namespace SlotOpt.Runs;

/// <summary>
/// Evaluates every option of every part once: cores through the lamination model, plates through one
/// thin-plate solve per slot geometry, scaled to every thickness and material (resistance-limited: loss
/// and drag are proportional to sigma t). Options that break a rule are kept, with the reason, for the report.
/// </summary>
public static class CandidateEvaluation
{
    public sealed record Evaluated(IReadOnlyList<PartEvaluation> Parts, int SheetSolves, double Seconds);

    /// <param name="geometrySolved">Told once per slot geometry solved (for a progress bar).</param>
    public static Evaluated Evaluate(Problem problem, IProgress<int>? geometrySolved = null, EvaluationLimits? limits = null)
    {
        var clock = Stopwatch.StartNew();
        var parts = new List<PartEvaluation>();
        var solves = 0;
        foreach (var part in problem.Parts)
        {
            IReadOnlyList<EvaluatedOption> options = part switch
            {
                CorePart core => CoreOptions.Evaluate(core, problem.Library, problem.Shop),
                PlatePart plate => PlateOptions.Evaluate(plate, problem.Library, problem.Shop, geometrySolved, limits, processCapped: problem.Limits.MaxDistinctProcesses is not null),
                _ => throw new ArgumentOutOfRangeException(nameof(problem), part.GetType().Name, "unknown part kind"),
            };
            if (part is PlatePart p) solves += PlateOptions.SlotChoices(p).Count();
            parts.Add(new PartEvaluation(part, options, ReferenceDesigns.CurrentOrBaseline(part, problem), ReferenceDesigns.IsCurrent(part)));
        }
        return new Evaluated(parts, solves, clock.Elapsed.TotalSeconds);
    }

    /// <summary>Slot geometries a problem will solve (for sizing a progress bar).</summary>
    public static int GeometryCount(Problem problem) => problem.Parts.OfType<PlatePart>().Sum(p => PlateOptions.SlotChoices(p).Count());

    /// <summary>The selection's view: the feasible options of each part, as candidates.</summary>
    public static SelectionProblem ToSelectionProblem(Problem problem, IReadOnlyList<PartEvaluation> parts) => new(
        parts.Select(p => new PartChoices(p.Part.Name, p.Feasible.Select(o => new Candidate(o.Id, o.BuildCost, o.Loss.TotalW, o.DragN, o.Attributes)).ToList())
        {
            ValuePerWatt = problem.Economics.SeparatesLoadLoss ? problem.Economics.ValuePerWattFor(p.Part.LossKind) : null,
        }).ToList(),
        new SharedLimits
        {
            Budget = problem.Limits.Budget,
            TotalLossCapW = problem.Limits.TotalLossCapW,
            CoilGroups = problem.Limits.CoilGroups,
            MaxDistinctProcesses = problem.Limits.MaxDistinctProcesses,
        },
        problem.Goal,
        problem.Economics.ValuePerWatt);
}
