namespace SlotOpt.Selection;

/// <summary>
/// Work spent by the searches of one run, summed over every solver call. For CP-SAT the times are
/// the solver's own wall and deterministic times; enumeration reports its wall time and no deterministic time.
/// </summary>
public sealed record SolveEffort(int SolverCalls, double WallSeconds, double DeterministicSeconds)
{
    public static readonly SolveEffort None = new(0, 0, 0);

    public static SolveEffort operator +(SolveEffort a, SolveEffort b) =>
        new(a.SolverCalls + b.SolverCalls, a.WallSeconds + b.WallSeconds, a.DeterministicSeconds + b.DeterministicSeconds);
}
