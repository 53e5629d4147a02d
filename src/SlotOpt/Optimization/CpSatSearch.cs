using Google.OrTools.Sat;

namespace SlotOpt.Optimization;

/// <summary>
/// The ranked search as a CP-SAT model: one Boolean per (part, candidate), exactly one per part; the
/// shared limits as linear constraints and implications; one solve per ranking level, each fixing
/// the level's optimum before the next (lexicographic optimisation), then the candidate-order tie-break
/// part by part. Built in the order Data, Variables, Constraints, Objective, Solve, Read.
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

        // Objective and Solve, one level at a time; Read after each.
        using var solver = new CpSolver { StringParameters = CpSatParameters.Format(settings) };
        var effort = SolveEffort.None;
        int[] choice = [];
        foreach (var criterion in ranking)
        {
            var objective = criterion switch
            {
                Criterion.BuildCost => buildCost,
                Criterion.Loss => loss,
                Criterion.OwningCost => Total(pick, part => part.OwningMicrocents, parts),
                Criterion.DistinctProcesses => LinearExpr.Sum(processUsed),
                _ => throw new ArgumentOutOfRangeException(nameof(ranking), criterion, null),
            };
            var level = SolveLevel(model, solver, objective, pick, choice.Length == 0 ? null : choice, ref effort);
            if (level.Status != SelectionStatus.Optimal) return level with { Effort = effort };
            choice = level.Choice!;
            model.Add(objective <= problem.Totals(choice).Value(criterion));
        }

        // Tie-break: the earliest candidate of each part in turn among the designs still tied.
        for (var p = 0; p < parts.Length; p++)
        {
            if (choice[p] > 0)
            {
                var index = LinearExpr.WeightedSum(pick[p], Enumerable.Range(0, parts[p].Count).Select(k => (long)k));
                var level = SolveLevel(model, solver, index, pick, choice, ref effort);
                if (level.Status != SelectionStatus.Optimal) return level with { Effort = effort };
                choice = level.Choice!;
            }
            model.AddBoolAnd([pick[p][choice[p]]]);
        }

        return new SearchResult(SelectionStatus.Optimal, choice, effort);
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

    /// <summary>The candidate index chosen per part; called only after an Optimal or Feasible status.</summary>
    private static int[] Read(CpSolver solver, BoolVar[][] pick) =>
        pick.Select(candidates => Array.FindIndex(candidates, solver.BooleanValue)).ToArray();

    private static LinearExpr Total(BoolVar[][] pick, Func<ScaledPart, long[]> coefficient, ScaledPart[] parts) =>
        LinearExpr.WeightedSum(pick.SelectMany(c => c), parts.SelectMany(coefficient));
}
