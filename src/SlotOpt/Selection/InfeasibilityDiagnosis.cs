using System.Globalization;
using SlotOpt.Tables;

namespace SlotOpt.Selection;

/// <summary>
/// Why no design meets every limit. Parts left without any candidate (every option broke a
/// manufacturing rule) are named directly, and then no relaxation is tried; otherwise each shared limit
/// is dropped in turn and the ones whose removal alone restores feasibility are the binding limits.
/// An empty <see cref="BindingLimits"/> with relaxations tried means the limits conflict only in
/// combination: no single one can be blamed.
/// </summary>
public sealed record InfeasibilityDiagnosis(
    IReadOnlyList<string> PartsWithoutCandidates,
    IReadOnlyList<LimitRelaxation> Relaxations)
{
    public IReadOnlyList<LimitRelaxation> BindingLimits => Relaxations.Where(r => r.RestoresFeasibility).ToArray();

    /// <summary>One sentence a line, for a report or the console.</summary>
    public IReadOnlyList<string> Explain()
    {
        if (PartsWithoutCandidates.Count > 0)
            return PartsWithoutCandidates.Select(p => $"part '{p}' has no candidate left: every option broke a manufacturing rule").ToArray();
        var lines = new List<string>();
        foreach (var relaxation in BindingLimits)
        {
            var design = relaxation.NearestDesign!;
            FormattableString line = relaxation.Kind switch
            {
                SharedLimitKind.Budget => $"the {relaxation.Description} binds: the cheapest design within the other limits costs {design.BuildCost:0.00}",
                SharedLimitKind.TotalLossCap => $"the {relaxation.Description} binds: the lowest-loss design within the other limits loses {Numbers.Watts(design.LossW)}",
                SharedLimitKind.MaxDistinctProcesses => $"the limit of {relaxation.Description} binds: the fewest within the other limits is {design.DistinctProcesses}",
                _ => $"{relaxation.Description} binds: without it the best design costs {design.BuildCost:0.00} and loses {Numbers.Watts(design.LossW)}",
            };
            lines.Add(line.ToString(CultureInfo.InvariantCulture));
        }
        if (lines.Count == 0)
            lines.Add(Relaxations.Any(r => r.StatusWithoutLimit == SelectionStatus.LimitReachedWithoutDesign)
                ? "no single limit could be shown to bind: some relaxed searches ran out of time"
                : "no single shared limit binds: the limits conflict only in combination");
        return lines;
    }
}
