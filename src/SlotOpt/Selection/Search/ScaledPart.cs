namespace SlotOpt.Selection.Search;

/// <summary>
/// One part in integer units, arrays indexed like its candidate list. CoilValue and Process hold an
/// index into the problem's value lists, or -1 where the candidate has no such attribute.
/// </summary>
internal sealed record ScaledPart(
    string Name,
    IReadOnlyList<Candidate> Candidates,
    long[] Cents,
    long[] Milliwatts,
    long[] OwningMicrocents,
    int[] CoilValue,
    int[] Process)
{
    public int Count => Candidates.Count;
}
