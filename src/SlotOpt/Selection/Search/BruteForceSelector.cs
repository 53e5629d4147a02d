namespace SlotOpt.Selection.Search;

/// <summary>
/// Exact selection by enumerating every design: the reference for tests and for tiny problems.
/// Same rankings, tie-break and integer scaling as <see cref="CpSatSelector"/>; refuses (ArgumentException)
/// a problem with more than <paramref name="maxDesigns"/> designs.
/// </summary>
public sealed class BruteForceSelector(long maxDesigns = 1_000_000) : ISelector
{
    private readonly EnumerationSearch search = new(maxDesigns);

    public SelectionOutcome Select(SelectionProblem problem, SelectionOptions? options = null) =>
        SelectionRun.Execute(search, problem, options);
}
