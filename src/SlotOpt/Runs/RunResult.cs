using SlotOpt.Design;
using SlotOpt.Selection;

namespace SlotOpt.Runs;

/// <summary>
/// Everything a run found, for the console and the reports: every evaluated option, the selection
/// (design, front, diagnosis), the baselines, the chosen plates confirmed, the numbers behind the plots,
/// and the effort spent. Reports render it; they compute nothing of their own.
/// </summary>
public sealed record RunResult(
    Problem Problem,
    IReadOnlyList<PartEvaluation> Parts,
    SelectionOutcome Outcome,
    IReadOnlyList<EvaluatedOption>? Chosen,
    IReadOnlyList<Baseline> Baselines,
    int SheetSolves,
    double EvaluationSeconds,
    IReadOnlyList<PlateConfirmation> Confirmations,
    RunFigures Figures)
{
    /// <summary>The design the user has today (or the baseline where the file gives none).</summary>
    public Baseline Reference => Baselines[0];

    public bool HasDesign => Chosen is not null;
    public double TotalLossW => Chosen?.Sum(o => o.Loss.TotalW) ?? double.NaN;
    public double TotalBuildCost => Chosen?.Sum(o => o.BuildCost) ?? double.NaN;
    public double OwningCost => Chosen is null ? double.NaN : Problem.OwningCost(Chosen);

    /// <summary>The chosen plate of a part confirmed with the model its validity calls for, if it is a plate.</summary>
    public PlateConfirmation? Confirmation(string partName) => Confirmations.FirstOrDefault(c => c.PartName == partName);

    /// <summary>The evaluated option behind a candidate id.</summary>
    public EvaluatedOption Option(string id) => Parts.SelectMany(p => p.Options).First(o => o.Id == id);
}
