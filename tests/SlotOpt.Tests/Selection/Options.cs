using SlotOpt.Design;
using SlotOpt.Selection;

namespace SlotOpt.Tests.Selection;

/// <summary>Short-hand for the invented candidates of the optimisation tests.</summary>
internal static class Options
{
    public static Candidate Option(string id, double cost, double lossW, string? coil = null, string? process = null)
    {
        var attributes = new Dictionary<string, string>();
        if (coil is not null) attributes[Candidate.CoilAttribute] = coil;
        if (process is not null) attributes[Candidate.ProcessAttribute] = process;
        return new Candidate(id, cost, lossW, null, attributes);
    }

    public static PartChoices Part(string name, params Candidate[] candidates) => new(name, candidates);
}
