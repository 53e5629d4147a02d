using System.Globalization;
using System.Runtime;

namespace SlotOpt.Bench;

/// <summary>
/// The benches' warm-up, so the timed runs measure the code and not its compiling: round after round until one compiles no new method
/// (<see cref="JitInfo.GetCompiledMethodCount"/>) after a pause longer than the runtime's tiering delay (100 ms: calls are counted only once
/// no method has been compiled for that long, and a method called 30 times is then recompiled optimised in the background; common practice,
/// no source), at most a given number of rounds. One small solve alone left the grid builders, the FFT's and the cycle's loops to tier-0 code
/// and on-stack replacement inside the first timed solves (2026-12-03, HISTORY.md): a process pays that once, on its first plates.
/// </summary>
public static class JitWarmUp
{
    /// <summary>The pause after a round: longer than the runtime's 100 ms tiering delay.</summary>
    private const int PauseMs = 250;

    /// <summary>Runs <paramref name="round"/> until a round compiles no new method after the pause, at most <paramref name="maxRounds"/> times.</summary>
    public static void UntilSettled(Action round, int maxRounds)
    {
        for (int r = 0; r < maxRounds; r++)
        {
            long compiled = JitInfo.GetCompiledMethodCount();
            round();
            Thread.Sleep(PauseMs);
            if (r > 0 && JitInfo.GetCompiledMethodCount() == compiled) return;
        }
    }

    /// <summary>The JIT's totals now, to say after the timed runs how much compiling was left inside them.</summary>
    public static Mark Start() => new(JitInfo.GetCompilationTime(), JitInfo.GetCompiledMethodCount());

    public readonly record struct Mark(TimeSpan CompilationTime, long CompiledMethods)
    {
        /// <summary>"JIT after the warm-up, inside the timed {what}: 105 ms compiling 167 methods".</summary>
        public string Since(string what) => string.Create(CultureInfo.InvariantCulture,
            $"JIT after the warm-up, inside the timed {what}: {(JitInfo.GetCompilationTime() - CompilationTime).TotalMilliseconds:F0} ms compiling {JitInfo.GetCompiledMethodCount() - CompiledMethods} methods");
    }
}
