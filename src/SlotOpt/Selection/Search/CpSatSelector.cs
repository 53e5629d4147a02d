namespace SlotOpt.Selection.Search;

/// <summary>
/// The selection engine: CP-SAT, one worker, a fixed seed and a deterministic-time budget per solver
/// call, so the same problem gives the same answer on every run.
/// </summary>
public sealed class CpSatSelector(CpSatSettings? settings = null) : ISelector
{
    private readonly CpSatSearch search = new(settings ?? new CpSatSettings());

    public SelectionOutcome Select(SelectionProblem problem, SelectionOptions? options = null) =>
        SelectionRun.Execute(search, problem, options);
}
