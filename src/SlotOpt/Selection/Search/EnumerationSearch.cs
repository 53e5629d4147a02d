using System.Diagnostics;

namespace SlotOpt.Selection.Search;

/// <summary>
/// Exact search by visiting every design: the reference the CP-SAT search is tested against.
/// Designs are visited in lexicographic order of their candidate-index vectors (last part fastest)
/// and only a strictly better one replaces the best so far, so of tied designs the first visited,
/// the lexicographically smallest, is kept: the tie-break of <see cref="IDesignSearch"/>.
/// </summary>
internal sealed class EnumerationSearch(long maxDesigns) : IDesignSearch
{
    public SearchResult Search(ScaledProblem problem, IReadOnlyList<Criterion> ranking, long? costCapCents = null)
    {
        var watch = Stopwatch.StartNew();
        var parts = problem.Parts;
        if (parts.Any(p => p.Count == 0)) return new SearchResult(SelectionStatus.Infeasible, null, Effort(watch));
        ThrowIfTooMany(parts);

        var choice = new int[parts.Length];
        int[]? best = null;
        var bestKey = new long[ranking.Count];
        var key = new long[ranking.Count];
        do
        {
            if (!problem.IsFeasible(choice, costCapCents)) continue;
            var totals = problem.Totals(choice);
            for (var level = 0; level < ranking.Count; level++) key[level] = totals.Value(ranking[level]);
            if (best is null || IsLexicographicallyLess(key, bestKey))
            {
                best = (int[])choice.Clone();
                (bestKey, key) = (key, bestKey);
            }
        }
        while (Advance(choice, parts));

        return best is null
            ? new SearchResult(SelectionStatus.Infeasible, null, Effort(watch))
            : new SearchResult(SelectionStatus.Optimal, best, Effort(watch));
    }

    private void ThrowIfTooMany(ScaledPart[] parts)
    {
        long designs = 1;
        foreach (var part in parts)
        {
            designs = designs > maxDesigns / part.Count ? long.MaxValue : designs * part.Count;
            if (designs > maxDesigns)
                throw new ArgumentException($"enumeration visits every design; this problem has more than {maxDesigns} of them");
        }
    }

    /// <summary>The next candidate-index vector in lexicographic order, last part fastest; false after the last.</summary>
    private static bool Advance(int[] choice, ScaledPart[] parts)
    {
        for (var p = parts.Length - 1; p >= 0; p--)
        {
            if (++choice[p] < parts[p].Count) return true;
            choice[p] = 0;
        }
        return false;
    }

    private static bool IsLexicographicallyLess(long[] a, long[] b)
    {
        for (var i = 0; i < a.Length; i++)
            if (a[i] != b[i]) return a[i] < b[i];
        return false;
    }

    private static SolveEffort Effort(Stopwatch watch) => new(0, watch.Elapsed.TotalSeconds, 0);
}
