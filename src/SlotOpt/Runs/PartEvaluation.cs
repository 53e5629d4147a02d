using SlotOpt.Design;

namespace SlotOpt.Runs;

/// <summary>Every option of one part, evaluated, with the design it is measured against.</summary>
public sealed record PartEvaluation(Part Part, IReadOnlyList<EvaluatedOption> Options, EvaluatedOption Reference, bool ReferenceIsCurrent)
{
    public IReadOnlyList<EvaluatedOption> Feasible => Options.Where(o => o.IsFeasible).ToList();

    /// <summary>How many options each kind of broken rule removed, named by the kind's short name, in name order.</summary>
    public IReadOnlyDictionary<string, int> RejectionCounts =>
        Options.Where(o => !o.IsFeasible).GroupBy(o => o.Rejection!.Kind)
            .Select(g => (Name: RuleBreak.ShortNameOf(g.Key), Count: g.Count())).OrderBy(c => c.Name, StringComparer.Ordinal)
            .ToDictionary(c => c.Name, c => c.Count);
}
