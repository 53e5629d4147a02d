using Google.OrTools.Sat;

namespace SlotOpt.Selection.Search;

/// <summary>
/// The ranked search as a CP-SAT model: one Boolean per (part, candidate), exactly one per part; the
/// shared limits as linear constraints and implications. Lexicographic optimisation: the ranking's
/// criteria and then candidate order are levels, minimised a group at a time (several levels merged into
/// one mixed-radix objective where that stays exact), each group's optimum fixed before the next.
/// Built in the order Data, Variables, Constraints, Objective, Solve, Read.
/// </summary>
internal sealed class CpSatSearch(CpSatSettings settings) : IDesignSearch
{
    public SearchResult Search(ScaledProblem problem, IReadOnlyList<Criterion> ranking, long? costCapCents = null)
    {
        // Data
        if (ranking.Count == 0) throw new ArgumentException("a ranking needs at least one criterion", nameof(ranking));
        var parts = problem.Parts;
        if (parts.Any(p => p.Count == 0)) return new SearchResult(SelectionStatus.Infeasible, null, SolveEffort.None);
        var needsProcessVariables = problem.MaxDistinctProcesses is not null || ranking.Contains(Criterion.DistinctProcesses);
        var model = new CpModel();

        // Variables
        var pick = parts
            .Select((part, p) => Enumerable.Range(0, part.Count).Select(k => model.NewBoolVar($"part_{p}_candidate_{k}")).ToArray())
            .ToArray();
        var processUsed = needsProcessVariables
            ? Enumerable.Range(0, problem.ProcessCount).Select(v => model.NewBoolVar($"process_{v}_used")).ToArray()
            : [];
        var groupCoil = problem.CoilGroups
            .Select((group, g) => group
                .SelectMany(p => parts[p].CoilValue).Distinct().Order()
                .ToDictionary(v => v, v => model.NewBoolVar($"group_{g}_coil_{v}")))
            .ToArray();

        // Constraints
        foreach (var candidates in pick) model.AddExactlyOne(candidates);
        var buildCost = Total(pick, part => part.Cents, parts);
        var loss = Total(pick, part => part.Milliwatts, parts);
        if (problem.BudgetCents is { } budget) model.Add(buildCost <= budget);
        if (costCapCents is { } costCap) model.Add(buildCost <= costCap);
        if (problem.LossCapMilliwatts is { } lossCap) model.Add(loss <= lossCap);
        for (var g = 0; g < problem.CoilGroups.Length; g++)
        {
            // The group takes exactly one coil value; a candidate of a member part implies its own value.
            model.AddExactlyOne(groupCoil[g].Values);
            foreach (var p in problem.CoilGroups[g])
                for (var k = 0; k < parts[p].Count; k++)
                    model.AddImplication(pick[p][k], groupCoil[g][parts[p].CoilValue[k]]);
        }
        if (needsProcessVariables)
        {
            for (var p = 0; p < parts.Length; p++)
                for (var k = 0; k < parts[p].Count; k++)
                    if (parts[p].Process[k] >= 0) model.AddImplication(pick[p][k], processUsed[parts[p].Process[k]]);
            if (problem.MaxDistinctProcesses is { } maxProcesses) model.Add(LinearExpr.Sum(processUsed) <= maxProcesses);
        }

        // Objective: the ranking's levels, then candidate order as a mixed-radix index over runs of parts.
        var levels = ranking
            .Select(criterion => criterion switch
            {
                Criterion.BuildCost => RankingLevel.PerCandidate(pick, parts, part => part.Cents),
                Criterion.Loss => RankingLevel.PerCandidate(pick, parts, part => part.Milliwatts),
                Criterion.OwningCost => RankingLevel.PerCandidate(pick, parts, part => part.OwningMicrocents),
                Criterion.DistinctProcesses => RankingLevel.Count(processUsed),
                _ => throw new ArgumentOutOfRangeException(nameof(ranking), criterion, null),
            })
            .Concat(TieBreakRuns(parts).Select(run => CandidateOrder(run, pick, parts)))
            .ToArray();

        // Solve and Read: levels merged into as few solves as stay exact; each group's values are fixed
        // before the next. A group already at zero in the incumbent (its least value) needs no solve.
        using var solver = new CpSolver { StringParameters = CpSatParameters.Format(settings) };
        var effort = SolveEffort.None;
        int[]? choice = null;
        foreach (var group in RankingLevel.MergeableGroups(levels))
        {
            if (choice is null || group.Any(level => solver.Value(level.Expression) > 0))
            {
                var result = SolveLevel(model, solver, RankingLevel.Merged(group), pick, choice, ref effort);
                if (result.Status != SelectionStatus.Optimal) return result with { Effort = effort };
                choice = result.Choice!;
            }
            foreach (var level in group) model.Add(level.Expression <= solver.Value(level.Expression));
        }

        return new SearchResult(SelectionStatus.Optimal, choice!, effort);
    }

    /// <summary>
    /// Minimises one objective from the incumbent (as a hint). When the budget runs out, the best design
    /// known (this solve's, else the incumbent) comes back with FeasibleAtLimit.
    /// </summary>
    private static SearchResult SolveLevel(CpModel model, CpSolver solver, LinearExpr objective, BoolVar[][] pick, int[]? incumbent, ref SolveEffort effort)
    {
        model.Minimize(objective);
        model.ClearHints();
        if (incumbent is not null)
            for (var p = 0; p < pick.Length; p++)
                for (var k = 0; k < pick[p].Length; k++)
                    model.AddHint(pick[p][k], incumbent[p] == k);

        var status = solver.Solve(model);
        var response = solver.Response ?? throw new InvalidOperationException("CP-SAT returned no response");
        effort += new SolveEffort(1, solver.WallTime(), response.DeterministicTime);
        switch (status)
        {
            case CpSolverStatus.Optimal:
                return new SearchResult(SelectionStatus.Optimal, Read(solver, pick), effort);
            case CpSolverStatus.Feasible:
                return new SearchResult(SelectionStatus.FeasibleAtLimit, Read(solver, pick), effort);
            case CpSolverStatus.Unknown:
                return incumbent is null
                    ? new SearchResult(SelectionStatus.LimitReachedWithoutDesign, null, effort)
                    : new SearchResult(SelectionStatus.FeasibleAtLimit, incumbent, effort);
            case CpSolverStatus.Infeasible when incumbent is null:
                return new SearchResult(SelectionStatus.Infeasible, null, effort);
            default:
                throw new InvalidOperationException($"CP-SAT answered {status} on the selection model: {model.Validate()}");
        }
    }

    /// <summary>Consecutive parts whose joint index space stays within <see cref="RankingLevel.LargestMergedSpan"/>.</summary>
    private static IEnumerable<int[]> TieBreakRuns(ScaledPart[] parts)
    {
        var run = new List<int>();
        long space = 1;
        for (var p = 0; p < parts.Length; p++)
        {
            if (run.Count > 0 && space > RankingLevel.LargestMergedSpan / parts[p].Count)
            {
                yield return run.ToArray();
                run.Clear();
                space = 1;
            }
            run.Add(p);
            space *= parts[p].Count;
        }
        if (run.Count > 0) yield return run.ToArray();
    }

    /// <summary>
    /// The candidate indices of a run of parts as one mixed-radix number (index_p times the product of the
    /// later parts' counts): smaller means earlier in lexicographic candidate order.
    /// </summary>
    private static RankingLevel CandidateOrder(int[] run, BoolVar[][] pick, ScaledPart[] parts)
    {
        var variables = new List<BoolVar>();
        var weights = new List<long>();
        long placeValue = 1;
        for (var i = run.Length - 1; i >= 0; i--)
        {
            var p = run[i];
            for (var k = 0; k < parts[p].Count; k++)
            {
                variables.Add(pick[p][k]);
                weights.Add(k * placeValue);
            }
            placeValue *= parts[p].Count;
        }
        return new RankingLevel(variables, weights, placeValue - 1);
    }

    /// <summary>The candidate index chosen per part; called only after an Optimal or Feasible status.</summary>
    private static int[] Read(CpSolver solver, BoolVar[][] pick) =>
        pick.Select(candidates => Array.FindIndex(candidates, solver.BooleanValue)).ToArray();

    private static LinearExpr Total(BoolVar[][] pick, Func<ScaledPart, long[]> coefficient, ScaledPart[] parts) =>
        LinearExpr.WeightedSum(pick.SelectMany(c => c), parts.SelectMany(coefficient));
}
