using SlotOpt.Tables;

namespace SlotOpt.Selection;

/// <summary>
/// The user mistakes a selection problem can hold, all collected into one <see cref="InputException"/>.
/// A part without candidates is not among them: that is an infeasibility the diagnosis names.
/// </summary>
internal static class SelectionProblemValidation
{
    public static void ThrowIfInvalid(SelectionProblem problem)
    {
        var errors = new List<string>();
        var limits = problem.Limits;
        var partNames = new HashSet<string>();
        foreach (var part in problem.Parts)
        {
            if (!partNames.Add(part.PartName)) errors.Add($"part '{part.PartName}' appears twice");
            var ids = new HashSet<string>();
            foreach (var candidate in part.Candidates)
            {
                var where = $"part '{part.PartName}', candidate '{candidate.Id}'";
                if (!ids.Add(candidate.Id)) errors.Add($"{where}: the id appears twice in this part");
                if (!IsScalable(candidate.BuildCost)) errors.Add($"{where}: build cost {candidate.BuildCost} ({Expected})");
                if (!IsScalable(candidate.LossW)) errors.Add($"{where}: loss {candidate.LossW} W ({Expected})");
                if (limits.MaxDistinctProcesses is not null && !candidate.Attributes.ContainsKey(Candidate.ProcessAttribute))
                    errors.Add($"{where}: no '{Candidate.ProcessAttribute}' attribute, needed by the distinct-process limit");
            }
        }

        if (!IsScalable(problem.ValuePerWatt)) errors.Add($"value per watt {problem.ValuePerWatt} ({Expected})");
        foreach (var part in problem.Parts.Where(p => p.ValuePerWatt is { } own && !IsScalable(own)))
            errors.Add($"part {part.PartName}: value per watt {part.ValuePerWatt} ({Expected})");
        if (limits.Budget is { } budget && !IsScalable(budget)) errors.Add($"budget {budget} ({Expected})");
        if (limits.TotalLossCapW is { } cap && !IsScalable(cap)) errors.Add($"total loss cap {cap} W ({Expected})");
        if (limits.MaxDistinctProcesses is < 1)
            errors.Add($"at most {limits.MaxDistinctProcesses} distinct processes (1 or more expected)");
        if (problem.Objective == Objective.LowestLossWithinBudget && limits.Budget is null)
            errors.Add("objective 'lowest loss within budget' needs a budget");
        if (problem.Objective == Objective.LowestCostWithinLossCap && limits.TotalLossCapW is null)
            errors.Add("objective 'lowest cost within loss cap' needs a total loss cap");

        for (var g = 0; g < limits.CoilGroups.Count; g++)
        {
            if (limits.CoilGroups[g].Count == 0) errors.Add($"coil group {g + 1} names no part");
            foreach (var name in limits.CoilGroups[g])
            {
                var part = problem.Parts.FirstOrDefault(p => p.PartName == name);
                if (part is null)
                {
                    errors.Add($"coil group {g + 1} names part '{name}', which is not in the problem{NameSuggestion.DidYouMean(name, partNames)}");
                    continue;
                }
                foreach (var candidate in part.Candidates.Where(c => !c.Attributes.ContainsKey(Candidate.CoilAttribute)))
                    errors.Add($"part '{name}', candidate '{candidate.Id}': no '{Candidate.CoilAttribute}' attribute, needed by coil group {g + 1}");
            }
        }

        if (errors.Count > 0) throw new InputException(errors);
    }

    private static readonly string Expected = FormattableString.Invariant($"0 to {IntegerScale.LargestScalable:0e0} expected");

    private static bool IsScalable(double value) => double.IsFinite(value) && value >= 0 && value <= IntegerScale.LargestScalable;
}
