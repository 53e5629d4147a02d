using SlotOpt.Design;

namespace SlotOpt.Runs;

/// <summary>Every option of one part, evaluated, with the design it is measured against.</summary>
public sealed record PartEvaluation(Part Part, IReadOnlyList<EvaluatedOption> Options, EvaluatedOption Reference, bool ReferenceIsCurrent)
{
    public IReadOnlyList<EvaluatedOption> Feasible => Options.Where(o => o.IsFeasible).ToList();

    /// <summary>How many options each kind of broken rule removed, by the rule's short name.</summary>
    public IReadOnlyDictionary<string, int> RejectionCounts =>
        Options.Where(o => !o.IsFeasible).GroupBy(o => o.Rejection!.ShortName).OrderBy(g => g.Key, StringComparer.Ordinal)
            .ToDictionary(g => g.Key, g => g.Count());
}
