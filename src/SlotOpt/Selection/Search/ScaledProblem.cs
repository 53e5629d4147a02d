namespace SlotOpt.Selection.Search;

/// <summary>
/// A validated selection problem in the exact integer units of <see cref="IntegerScale"/>: the one
/// input both searches (CP-SAT and enumeration) read, so they judge every design alike.
/// </summary>
internal sealed record ScaledProblem
{
    public required ScaledPart[] Parts { get; init; }
    public required long CentsPerKilowatt { get; init; }
    public long? BudgetCents { get; init; }
    public long? LossCapMilliwatts { get; init; }

    /// <summary>Each group: indices of parts that must share one coil value.</summary>
    public required int[][] CoilGroups { get; init; }

    public int? MaxDistinctProcesses { get; init; }

    /// <summary>How many distinct process values the candidates name; Process indices run below it.</summary>
    public required int ProcessCount { get; init; }

    /// <summary>Most the owning cost of any design may reach, leaving the long range a margin of four.</summary>
    private const long LargestExactTotal = long.MaxValue / 4;

    public static ScaledProblem From(SelectionProblem problem)
    {
        SelectionProblemValidation.ThrowIfInvalid(problem);
        var rate = IntegerScale.ToCentsPerKilowatt(problem.ValuePerWatt);
        var coilValues = new Dictionary<string, int>();
        var processes = new Dictionary<string, int>();
        var parts = problem.Parts.Select(p => ScalePart(p, p.ValuePerWatt is { } own ? IntegerScale.ToCentsPerKilowatt(own) : rate, coilValues, processes)).ToArray();

        Int128 largest = 0;
        foreach (var part in parts)
            largest += part.Count == 0 ? 0 : part.OwningMicrocents.Max();
        if (largest > LargestExactTotal)
            throw new InputException(FormattableString.Invariant(
                $"costs and losses too large to rank exactly in integers: the highest owning cost of a design would be {(double)largest / (100.0 * IntegerScale.MicrocentsPerCent):0.###e0}, at most {(double)LargestExactTotal / (100.0 * IntegerScale.MicrocentsPerCent):0.###e0} can be ranked"));

        var partIndex = problem.Parts.Select((p, i) => (p.PartName, i)).ToDictionary(t => t.PartName, t => t.i);
        return new ScaledProblem
        {
            Parts = parts,
            CentsPerKilowatt = rate,
            BudgetCents = problem.Limits.Budget is { } budget ? IntegerScale.ToCents(budget) : null,
            LossCapMilliwatts = problem.Limits.TotalLossCapW is { } cap ? IntegerScale.ToMilliwatts(cap) : null,
            CoilGroups = problem.Limits.CoilGroups.Select(g => g.Select(name => partIndex[name]).Distinct().ToArray()).ToArray(),
            MaxDistinctProcesses = problem.Limits.MaxDistinctProcesses,
            ProcessCount = processes.Count,
        };
    }

    public DesignTotals Totals(IReadOnlyList<int> choice)
    {
        long cents = 0, milliwatts = 0, owning = 0;
        var processesUsed = new HashSet<int>();
        for (var p = 0; p < Parts.Length; p++)
        {
            var k = choice[p];
            cents += Parts[p].Cents[k];
            milliwatts += Parts[p].Milliwatts[k];
            owning += Parts[p].OwningMicrocents[k];
            if (Parts[p].Process[k] >= 0) processesUsed.Add(Parts[p].Process[k]);
        }
        return new DesignTotals(cents, milliwatts, owning, processesUsed.Count);
    }

    /// <summary>Whether a design meets every shared limit and, when given, the cost cap of a trade-off sweep.</summary>
    public bool IsFeasible(IReadOnlyList<int> choice, long? costCapCents)
    {
        var totals = Totals(choice);
        if (BudgetCents is { } budget && totals.Cents > budget) return false;
        if (costCapCents is { } costCap && totals.Cents > costCap) return false;
        if (LossCapMilliwatts is { } lossCap && totals.Milliwatts > lossCap) return false;
        if (MaxDistinctProcesses is { } maxProcesses && totals.DistinctProcesses > maxProcesses) return false;
        foreach (var group in CoilGroups)
        {
            var first = Parts[group[0]].CoilValue[choice[group[0]]];
            if (group.Any(p => Parts[p].CoilValue[choice[p]] != first)) return false;
        }
        return true;
    }

    public SelectedDesign Describe(IReadOnlyList<int> choice)
    {
        var totals = Totals(choice);
        var chosen = Parts.Select((part, p) => new ChosenCandidate(part.Name, choice[p], part.Candidates[choice[p]])).ToArray();
        return new SelectedDesign(chosen, totals.Cents, totals.Milliwatts, totals.OwningMicrocents, totals.DistinctProcesses);
    }

    private static ScaledPart ScalePart(PartChoices part, long rate, Dictionary<string, int> coilValues, Dictionary<string, int> processes)
    {
        var candidates = part.Candidates;
        var cents = candidates.Select(c => IntegerScale.ToCents(c.BuildCost)).ToArray();
        var milliwatts = candidates.Select(c => IntegerScale.ToMilliwatts(c.LossW)).ToArray();
        var owning = cents.Zip(milliwatts, (c, mw) => IntegerScale.OwningMicrocents(c, mw, rate)).ToArray();
        var coil = candidates.Select(c => IndexOf(c, Candidate.CoilAttribute, coilValues)).ToArray();
        var process = candidates.Select(c => IndexOf(c, Candidate.ProcessAttribute, processes)).ToArray();
        return new ScaledPart(part.PartName, candidates, cents, milliwatts, owning, coil, process);
    }

    private static int IndexOf(Candidate candidate, string attribute, Dictionary<string, int> values)
    {
        if (!candidate.Attributes.TryGetValue(attribute, out var value)) return -1;
        if (!values.TryGetValue(value, out var index)) values[value] = index = values.Count;
        return index;
    }
}
