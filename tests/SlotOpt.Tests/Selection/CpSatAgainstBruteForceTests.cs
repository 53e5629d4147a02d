using SlotOpt.Selection;
using SlotOpt.Selection.Search;

namespace SlotOpt.Tests.Selection;

/// <summary>
/// CP-SAT against exhaustive enumeration on seeded random problems (invented, see
/// <see cref="RandomSelectionProblems"/>) for every objective and every combination of shared limits:
/// the same status, the same chosen ids and integer totals (so the same tie-break), the same front point
/// for point, and the same diagnosis when infeasible. Enumeration is the outside reference: it visits
/// every design and keeps the first best in candidate order.
/// </summary>
public class CpSatAgainstBruteForceTests
{
    public static TheoryData<int, Objective> Cases()
    {
        var cases = new TheoryData<int, Objective>();
        foreach (var objective in Enum.GetValues<Objective>())
            for (var seed = 1; seed <= 6; seed++)
                cases.Add(seed, objective);
        return cases;
    }

    [Theory]
    [MemberData(nameof(Cases))]
    public void Same_answer_for_every_combination_of_limits(int seed, Objective objective)
    {
        for (var mix = LimitMix.None; mix <= LimitMix.All; mix++)
        {
            var problem = RandomSelectionProblems.Make(seed * 100 + (int)mix, mix, objective);
            var options = new SelectionOptions { IncludeFront = true };
            var expected = new BruteForceSelector().Select(problem, options);
            var actual = new CpSatSelector().Select(problem, options);
            var context = $"seed {seed * 100 + (int)mix}, limits {mix}, {objective}";

            Assert.True(expected.Status == actual.Status, $"{context}: status {actual.Status}, enumeration {expected.Status}");
            AssertSameDesign(expected.Design, actual.Design, context);
            Assert.True(expected.Front!.Points.Count == actual.Front!.Points.Count, $"{context}: front of {actual.Front.Points.Count} points, enumeration {expected.Front.Points.Count}");
            Assert.Equal(expected.Front.Status, actual.Front.Status);
            for (var i = 0; i < expected.Front.Points.Count; i++)
                AssertSameDesign(expected.Front.Points[i].Design, actual.Front.Points[i].Design, $"{context}, front point {i}");
            AssertSameDiagnosis(expected.Diagnosis, actual.Diagnosis, context);
        }
    }

    private static void AssertSameDesign(SelectedDesign? expected, SelectedDesign? actual, string context)
    {
        Assert.True((expected is null) == (actual is null), $"{context}: one search found a design, the other none");
        if (expected is null || actual is null) return;
        Assert.True(expected.CandidateIds.SequenceEqual(actual.CandidateIds),
            $"{context}: CP-SAT chose {string.Join(",", actual.CandidateIds)}, enumeration {string.Join(",", expected.CandidateIds)}");
        Assert.Equal(expected.BuildCostCents, actual.BuildCostCents);
        Assert.Equal(expected.LossMilliwatts, actual.LossMilliwatts);
        Assert.Equal(expected.OwningCostMicrocents, actual.OwningCostMicrocents);
        Assert.Equal(expected.DistinctProcesses, actual.DistinctProcesses);
    }

    private static void AssertSameDiagnosis(InfeasibilityDiagnosis? expected, InfeasibilityDiagnosis? actual, string context)
    {
        Assert.True((expected is null) == (actual is null), $"{context}: one search diagnosed, the other not");
        if (expected is null || actual is null) return;
        Assert.Equal(expected.PartsWithoutCandidates, actual.PartsWithoutCandidates);
        Assert.Equal(expected.Relaxations.Count, actual.Relaxations.Count);
        for (var i = 0; i < expected.Relaxations.Count; i++)
        {
            Assert.Equal(expected.Relaxations[i].Kind, actual.Relaxations[i].Kind);
            Assert.Equal(expected.Relaxations[i].StatusWithoutLimit, actual.Relaxations[i].StatusWithoutLimit);
            AssertSameDesign(expected.Relaxations[i].NearestDesign, actual.Relaxations[i].NearestDesign, $"{context}, without {expected.Relaxations[i].Description}");
        }
    }
}
