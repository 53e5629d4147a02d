namespace SlotOpt.Selection.Search;

/// <summary>
/// One selection run over any search: the chosen design by the objective's ranking, the trade-off
/// front when wanted, and the diagnosis when nothing is feasible. Both selectors share it, so CP-SAT
/// and enumeration differ only in how a ranked search is done.
/// </summary>
internal static class SelectionRun
{
    public static SelectionOutcome Execute(IDesignSearch search, SelectionProblem problem, SelectionOptions? options)
    {
        options ??= new SelectionOptions();
        var scaled = ScaledProblem.From(problem);
        var chosen = search.Search(scaled, ObjectiveRanking.For(problem.Objective));
        var effort = chosen.Effort;
        var design = chosen.Choice is null ? null : scaled.Describe(chosen.Choice);

        InfeasibilityDiagnosis? diagnosis = null;
        if (chosen.Status == SelectionStatus.Infeasible)
        {
            var (found, diagnosisEffort) = InfeasibilityDiagnoser.Diagnose(search, scaled, problem);
            diagnosis = found;
            effort += diagnosisEffort;
        }

        TradeOffFront? front = null;
        if (problem.Objective == Objective.TradeOffCurve || options.IncludeFront)
        {
            if (chosen.Status == SelectionStatus.Infeasible)
                front = new TradeOffFront([], SelectionStatus.Infeasible, false, options.MaxFrontPoints);
            else
            {
                var (swept, sweepEffort) = EpsilonConstraintSweep.Run(search, scaled, options.MaxFrontPoints, options.FrontProgress);
                front = swept;
                effort += sweepEffort;
            }
        }

        return new SelectionOutcome(problem.Objective, chosen.Status, design, front, diagnosis, scaled.CentsPerKilowatt, effort);
    }
}
