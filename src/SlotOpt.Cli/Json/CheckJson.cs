using SlotOpt.Selection;
using SlotOpt.Reports.Json;

namespace SlotOpt.Cli;

/// <summary>`slotopt check --json`: the problem, its parts with their option counts, the number of combinations, the warnings.</summary>
public sealed record CheckJson(string Problem, Objective Objective, IReadOnlyList<CheckJson.Part> Parts, long Combinations, IReadOnlyList<string> Warnings) : VersionedJson
{
    /// <summary>One part: core or plate, how many options it has, whether its current design is given, and (with --list) its choices by key.</summary>
    public sealed record Part(string Name, string Kind, long Options, bool Current, IReadOnlyDictionary<string, IReadOnlyList<string>>? Choices);
}
