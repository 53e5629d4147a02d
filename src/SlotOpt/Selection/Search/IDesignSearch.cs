namespace SlotOpt.Selection.Search;

/// <summary>
/// Finds the best design of a scaled problem under a lexicographic ranking: minimise the first
/// criterion, then the next among the designs tied on it, and so on; remaining ties go to the
/// lexicographically smallest candidate-index vector in part order (the earliest candidate of the
/// first part, then of the second, ...). Every shared limit of the problem holds, and the summed
/// build cost stays at or below <c>costCapCents</c> when it is given (the trade-off sweep's epsilon).
/// </summary>
internal interface IDesignSearch
{
    SearchResult Search(ScaledProblem problem, IReadOnlyList<Criterion> ranking, long? costCapCents = null);
}
