namespace SlotOpt.Selection;

/// <summary>The candidate picked for one part; <paramref name="CandidateIndex"/> is its place in the part's list.</summary>
public sealed record ChosenCandidate(string PartName, int CandidateIndex, Candidate Candidate);
