using SlotOpt.Selection;

namespace SlotOpt.Tests.Selection;

/// <summary>Which shared limits a generated problem carries; any combination.</summary>
[Flags]
public enum LimitMix
{
    None = 0,
    Budget = 1,
    LossCap = 2,
    CoilGroup = 4,
    ProcessLimit = 8,
    All = Budget | LossCap | CoilGroup | ProcessLimit,
}

/// <summary>
/// Seeded random problems small enough to enumerate: 2-4 parts of 2-6 invented candidates. Costs are
/// whole or half currency units and losses quarter watts, so exact ties in cost, loss and owning cost
/// are common, and a third of the candidates are cost-and-loss twins of an earlier one, so the
/// candidate-order tie-break gets exercised; three coil values and three processes.
/// </summary>
internal static class RandomSelectionProblems
{
    public static SelectionProblem Make(int seed, LimitMix mix, Objective objective)
    {
        var random = new Random(seed);
        var parts = new List<PartChoices>();
        var partCount = random.Next(2, 5);
        for (var p = 0; p < partCount; p++)
        {
            var candidates = new List<Candidate>();
            var candidateCount = random.Next(2, 7);
            for (var k = 0; k < candidateCount; k++)
            {
                var attributes = new Dictionary<string, string>
                {
                    [Candidate.CoilAttribute] = $"coil-{random.Next(3)}",
                    [Candidate.ProcessAttribute] = $"process-{random.Next(3)}",
                };
                var cost = random.Next(5, 40) + 0.5 * random.Next(2);
                var lossW = 0.25 * random.Next(0, 40);
                if (k > 0 && random.Next(3) == 0)
                {
                    // A twin of an earlier candidate, other attributes alike or not: only candidate order can part them.
                    var twin = candidates[random.Next(k)];
                    (cost, lossW) = (twin.BuildCost, twin.LossW);
                }
                candidates.Add(new Candidate($"p{p}c{k}", cost, lossW, null, attributes));
            }
            parts.Add(new PartChoices($"part-{p}", candidates));
        }

        // Limits placed between the smallest and the largest total, so some bind and some problems are
        // infeasible; half of them exactly at the total of some design, to test the boundary (<=, not <).
        double Between(Func<Candidate, double> value)
        {
            if (random.Next(2) == 0) return parts.Sum(p => value(p.Candidates[random.Next(p.Candidates.Count)]));
            var low = parts.Sum(p => p.Candidates.Min(value));
            var high = parts.Sum(p => p.Candidates.Max(value));
            return Math.Round(low + (0.2 + 0.5 * random.NextDouble()) * (high - low), 2);
        }
        var budget = Between(c => c.BuildCost);
        var lossCap = Between(c => c.LossW);
        var groupSize = random.Next(2, partCount + 1);
        var limits = new SharedLimits
        {
            Budget = mix.HasFlag(LimitMix.Budget) || objective == Objective.LowestLossWithinBudget ? budget : null,
            TotalLossCapW = mix.HasFlag(LimitMix.LossCap) || objective == Objective.LowestCostWithinLossCap ? lossCap : null,
            CoilGroups = mix.HasFlag(LimitMix.CoilGroup) ? [parts.Take(groupSize).Select(p => p.PartName).ToArray()] : [],
            MaxDistinctProcesses = mix.HasFlag(LimitMix.ProcessLimit) ? random.Next(1, 3) : null,
        };
        return new SelectionProblem(parts, limits, objective, ValuePerWatt: 0.5 * random.Next(1, 8));
    }
}
