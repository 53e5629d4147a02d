using System.CommandLine;
using SlotOpt.Design.Limits;
using SlotOpt.Design;
using SlotOpt.Input;
using SlotOpt.Selection;

namespace SlotOpt.Cli;

/// <summary>The flags that bound a run's use of the machine: threads, memory, wall time, and the search's deterministic budget.</summary>
public sealed class RunLimitOptions
{
    private readonly Option<int?> threads = new("--threads") { HelpName = "N", Description = "Plate solves at once (default: the number of cores); results do not depend on it" };
    private readonly Option<string> maxMemory = QuantityOption.Create("--max-memory", "Memory the solves may take, e.g. 4GB (default 4 GiB); a run whose estimate is larger is refused before anything is built");
    private readonly Option<string> timeLimit = QuantityOption.Create("--time-limit", "Wall time the command may take, every phase and the report included, e.g. \"10 min\" (default 1 h); past it the command stops with exit code 5 and writes nothing");
    private readonly Option<double?> searchBudget = new("--search-budget") { HelpName = "SECONDS", Description = "Deterministic seconds each selection-solver call may take (default 10); reproducible on any machine" };

    /// <param name="parallel">The command solves several plates at once (--threads).</param>
    /// <param name="search">The command runs the CP-SAT search (--search-budget).</param>
    public void AddTo(Command command, bool parallel = true, bool search = true)
    {
        if (parallel) command.Options.Add(threads);
        command.Options.Add(maxMemory);
        command.Options.Add(timeLimit);
        if (search) command.Options.Add(searchBudget);
    }

    /// <summary>The limits with the wall-time deadline started now (the command's start); the caller disposes <see cref="EvaluationLimits.Deadline"/>.</summary>
    public EvaluationLimits Start(ParseResult parseResult)
    {
        var limits = Evaluation(parseResult);
        return limits with { Deadline = new RunDeadline(limits.MaxSeconds) };
    }

    public EvaluationLimits Evaluation(ParseResult parseResult)
    {
        var limits = EvaluationLimits.Default;
        if (parseResult.GetValue(threads) is { } n)
            limits = n is >= 1 and <= 256 ? limits with { Threads = n } : throw new InputException($"--threads: must be between 1 and 256, got {n}");
        if (QuantityOption.ReadPositive(parseResult, maxMemory, QuantityKind.Information) is { } bytes)
            limits = limits with { MaxMemoryBytes = (long)Math.Min(bytes, long.MaxValue / 2) };
        if (QuantityOption.ReadPositive(parseResult, timeLimit, QuantityKind.Duration) is { } seconds)
            limits = limits with { MaxSeconds = seconds };
        return limits;
    }

    public CpSatSettings Search(ParseResult parseResult)
    {
        var settings = new CpSatSettings();
        if (parseResult.GetValue(searchBudget) is { } budget)
            settings = budget is > 0 and <= 1e6 ? settings with { MaxDeterministicTimeSeconds = budget } : throw new InputException($"--search-budget: must be between 0 and 1e6 deterministic seconds, got {budget}");
        return settings;
    }
}
