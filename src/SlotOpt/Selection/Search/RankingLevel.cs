using Google.OrTools.Sat;

namespace SlotOpt.Selection.Search;

/// <summary>
/// One quantity of a lexicographic ranking in a CP-SAT model: a weighted sum of Booleans whose value
/// lies in [0, Span] for every design (per-candidate weights are taken relative to the part's smallest,
/// which shifts the quantity by a constant and leaves its order alone).
/// </summary>
internal sealed record RankingLevel(IReadOnlyList<BoolVar> Variables, IReadOnlyList<long> Weights, long Span)
{
    /// <summary>Largest span a merged objective may have: exact in the doubles CP-SAT bounds objectives with (2^53).</summary>
    public const long LargestMergedSpan = 1L << 50;

    public LinearExpr Expression => LinearExpr.WeightedSum(Variables, Weights);

    /// <summary>A total over the chosen candidates: the sum of coefficient[part][chosen candidate].</summary>
    public static RankingLevel PerCandidate(BoolVar[][] pick, ScaledPart[] parts, Func<ScaledPart, long[]> coefficient)
    {
        var variables = new List<BoolVar>();
        var weights = new List<long>();
        long span = 0;
        for (var p = 0; p < parts.Length; p++)
        {
            var values = coefficient(parts[p]);
            var smallest = values.Min();
            span = checked(span + values.Max() - smallest);
            variables.AddRange(pick[p]);
            weights.AddRange(values.Select(v => v - smallest));
        }
        return new RankingLevel(variables, weights, span);
    }

    /// <summary>How many of the Booleans are true.</summary>
    public static RankingLevel Count(IReadOnlyList<BoolVar> variables) =>
        new(variables, variables.Select(_ => 1L).ToArray(), variables.Count);

    /// <summary>
    /// Consecutive levels grouped so each group can be minimised in one solve: a group of several levels
    /// is kept while the product of (span + 1) stays within <see cref="LargestMergedSpan"/>.
    /// </summary>
    public static IEnumerable<RankingLevel[]> MergeableGroups(IReadOnlyList<RankingLevel> levels)
    {
        var group = new List<RankingLevel>();
        Int128 product = 1;
        foreach (var level in levels)
        {
            var next = product * ((Int128)level.Span + 1);
            if (group.Count > 0 && next - 1 > LargestMergedSpan)
            {
                yield return group.ToArray();
                group.Clear();
                next = (Int128)level.Span + 1;
            }
            group.Add(level);
            product = next;
        }
        if (group.Count > 0) yield return group.ToArray();
    }

    /// <summary>
    /// One objective ordering designs like the group's levels in turn: sum of level_i * product over the
    /// later levels j of (span_j + 1), a mixed-radix number whose digits are the level values.
    /// </summary>
    public static LinearExpr Merged(RankingLevel[] group)
    {
        var variables = new List<BoolVar>();
        var weights = new List<long>();
        long placeValue = 1;
        for (var i = group.Length - 1; i >= 0; i--)
        {
            variables.AddRange(group[i].Variables);
            weights.AddRange(group[i].Weights.Select(w => checked(w * placeValue)));
            if (i > 0) placeValue = checked(placeValue * (group[i].Span + 1));
        }
        return LinearExpr.WeightedSum(variables, weights);
    }
}
