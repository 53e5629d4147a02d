using SlotOpt.Selection;

namespace SlotOpt.Tests.Selection;

/// <summary>
/// Every design of a problem that meets its shared limits, written out in the test's own plain code
/// (nested choice, limits checked on the attribute strings), as a check on the engine from outside.
/// Totals use the documented scaling: cents and milliwatts of each candidate, summed.
/// </summary>
internal static class FeasibleDesigns
{
    public sealed record Design(IReadOnlyList<Candidate> Chosen, long Cents, long Milliwatts);

    public static List<Design> Of(SelectionProblem problem)
    {
        var designs = new List<Design>();
        void Choose(int part, List<Candidate> chosen)
        {
            if (part == problem.Parts.Count)
            {
                if (MeetsLimits(problem, chosen))
                    designs.Add(new Design(chosen.ToArray(), chosen.Sum(c => IntegerScale.ToCents(c.BuildCost)), chosen.Sum(c => IntegerScale.ToMilliwatts(c.LossW))));
                return;
            }
            foreach (var candidate in problem.Parts[part].Candidates)
            {
                chosen.Add(candidate);
                Choose(part + 1, chosen);
                chosen.RemoveAt(chosen.Count - 1);
            }
        }
        Choose(0, []);
        return designs;
    }

    private static bool MeetsLimits(SelectionProblem problem, List<Candidate> chosen)
    {
        var limits = problem.Limits;
        if (limits.Budget is { } budget && chosen.Sum(c => IntegerScale.ToCents(c.BuildCost)) > IntegerScale.ToCents(budget)) return false;
        if (limits.TotalLossCapW is { } cap && chosen.Sum(c => IntegerScale.ToMilliwatts(c.LossW)) > IntegerScale.ToMilliwatts(cap)) return false;
        if (limits.MaxDistinctProcesses is { } most && chosen.Select(c => c.Attributes[Candidate.ProcessAttribute]).Distinct().Count() > most) return false;
        foreach (var group in limits.CoilGroups)
        {
            var coils = group.Select(name => chosen[IndexOfPart(problem, name)].Attributes[Candidate.CoilAttribute]).Distinct();
            if (coils.Count() > 1) return false;
        }
        return true;
    }

    private static int IndexOfPart(SelectionProblem problem, string name)
    {
        for (var p = 0; p < problem.Parts.Count; p++)
            if (problem.Parts[p].PartName == name) return p;
        throw new ArgumentException($"no part {name}");
    }
}
