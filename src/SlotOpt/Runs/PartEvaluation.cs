using SlotOpt.Design;

namespace SlotOpt.Runs;

/// <summary>Every option of one part, evaluated, with the design it is measured against.</summary>
public sealed record PartEvaluation(Part Part, IReadOnlyList<EvaluatedOption> Options, EvaluatedOption Reference, bool ReferenceIsCurrent)
{
    public IReadOnlyList<EvaluatedOption> Feasible => Options.Where(o => o.IsFeasible).ToList();

    /// <summary>How many options each broken rule removed, by the rule's first words.</summary>
    public IReadOnlyDictionary<string, int> RejectionCounts =>
        Options.Where(o => !o.IsFeasible).GroupBy(o => RuleName(o.Rejection!)).OrderBy(g => g.Key, StringComparer.Ordinal)
            .ToDictionary(g => g.Key, g => g.Count());

    /// <summary>A rejection message without its numbers: "slot width ... is below ..." -> "slot width below process minimum".</summary>
    private static string RuleName(string rejection)
    {
        if (rejection.StartsWith("slot width", StringComparison.Ordinal)) return "slot narrower than the process cuts";
        if (rejection.StartsWith("strip", StringComparison.Ordinal)) return "strip between slots too narrow";
        if (rejection.StartsWith("uncut ligament", StringComparison.Ordinal)) return "uncut ligament too small";
        if (rejection.Contains("slots exceed", StringComparison.Ordinal)) return "too many slots for the process";
        if (rejection.StartsWith("fingers", StringComparison.Ordinal)) return "fingers too slender (resonance)";
        if (rejection.StartsWith("drag", StringComparison.Ordinal)) return "drag above the part's limit";
        if (rejection.StartsWith("loss", StringComparison.Ordinal)) return "loss above the part's limit";
        if (rejection.StartsWith("peak", StringComparison.Ordinal)) return "flux beyond the grade";
        if (rejection.StartsWith(CoreOptions.GrainOrientedAcrossRollingDirection, StringComparison.Ordinal)) return CoreOptions.GrainOrientedAcrossRollingDirection;
        return "slot pattern does not fit the plate";
    }
}
