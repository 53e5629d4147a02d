namespace SlotOpt.Selection.Search;

/// <summary>Picks one candidate per part of a <see cref="SelectionProblem"/>.</summary>
public interface ISelector
{
    /// <summary>Throws <see cref="InputException"/> for a malformed problem (all mistakes at once).</summary>
    SelectionOutcome Select(SelectionProblem problem, SelectionOptions? options = null);
}
