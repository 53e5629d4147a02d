namespace SlotOpt.Selection;

/// <summary>
/// How each CP-SAT call runs. One worker and a fixed seed make a run reproducible; the budget is
/// deterministic time (the solver's own work measure, the same on any machine), never wall time.
/// The budget applies to every solver call of a run (a ranking takes one call per level).
/// </summary>
public sealed record CpSatSettings
{
    /// <summary>Deterministic-time budget of one solver call, in the solver's deterministic seconds.</summary>
    public double MaxDeterministicTimeSeconds { get; init; } = 10;

    public int RandomSeed { get; init; }

    /// <summary>
    /// Wall-time cap of one solver call (seconds), from the run's time limit; null for none. It binds only when the run is out
    /// of time, and the run then ends with the time limit, so it never changes an answer that is reported.
    /// </summary>
    public double? MaxWallSeconds { get; init; }
}
