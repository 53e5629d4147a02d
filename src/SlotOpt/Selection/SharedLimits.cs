namespace SlotOpt.Selection;

/// <summary>Limits that bind the parts of one product together. Every member may be left out.</summary>
public sealed record SharedLimits
{
    /// <summary>Most the summed build cost may be, in the problem's currency.</summary>
    public double? Budget { get; init; }

    /// <summary>Most the summed loss may be, in W.</summary>
    public double? TotalLossCapW { get; init; }

    /// <summary>
    /// Each group lists part names that must all choose candidates with the same value of attribute
    /// <see cref="Candidate.CoilAttribute"/> (parts cut from one coil of steel).
    /// </summary>
    public IReadOnlyList<IReadOnlyList<string>> CoilGroups { get; init; } = [];

    /// <summary>Most distinct values of attribute <see cref="Candidate.ProcessAttribute"/> among the chosen candidates.</summary>
    public int? MaxDistinctProcesses { get; init; }
}
