using System.Diagnostics;
using System.Globalization;
using System.Text.Json;
using SlotOpt.Plates.Geometry;
using SlotOpt.Plates.Grid;
using SlotOpt.Plates.ResistanceLimited;
using SlotOpt.Plates.Sources;

namespace SlotOpt.Bench;

/// <summary>
/// Thin-plate solver on N x N grids (N = 128 ... 2048): a 1 m square plate with a comb of slots from its
/// lower edge (pitch 100 mm, depth 700 mm, width 20 mm) in a uniform 50 Hz field, solved to a relative
/// residual of 1e-8. Setup = grid, merged regions, operator and multigrid hierarchy; solve = one PCG solve
/// (uniform phase: one real solve). Times are the best of 3 runs, wall seconds and the process's CPU seconds over setup and solve
/// (Process.TotalProcessorTime: steadier than wall time on a shared machine; it includes the runtime's own threads). Memory: bytes retained on the managed
/// heap by the model and its solution (GC.GetTotalMemory(true) after minus before), and the growth of the
/// process's peak working set during that size's runs (sizes run in increasing order).
/// Targets (issue 18): time per unknown flat from 128^2 to 2048^2, under 150 bytes per unknown; the ratios to
/// general-purpose algebraic multigrid on the identical system are in <see cref="PeerBench"/>.
/// </summary>
public static class SheetsBench
{
    public static int Run(string[] args)
    {
        if (args.Contains("--profile"))
        {
            int at = Array.IndexOf(args, "--sizes");
            return SheetsProfile.Run(at >= 0 && at + 1 < args.Length ? args[at + 1].Split(',').Select(s => int.Parse(s, CultureInfo.InvariantCulture)).ToArray() : [256, 1024]);
        }
        bool json = args.Contains("--json");
        int sizesAt = Array.IndexOf(args, "--sizes");
        var sizes = sizesAt >= 0 && sizesAt + 1 < args.Length ? args[sizesAt + 1].Split(',').Select(s => int.Parse(s, CultureInfo.InvariantCulture)).ToArray() : [128, 256, 512, 1024, 2048];
        WarmUp(n => Once(n));
        var jit = JitWarmUp.Start();
        var rows = sizes.Select(Measure).ToList();
        string jitLeft = jit.Since("sizes");
        var c = CultureInfo.InvariantCulture;
        if (json)
        {
            foreach (var r in rows)
                Console.WriteLine(JsonSerializer.Serialize(new
                {
                    n = r.N, unknowns = r.Unknowns, seconds = r.SetupSeconds + r.SolveSeconds, setup_seconds = r.SetupSeconds,
                    solve_seconds = r.SolveSeconds, cpu_seconds = r.CpuSeconds, iterations = r.Iterations, loss_w = r.LossW, retained_bytes_per_unknown = r.RetainedBytes / (double)r.Unknowns, levels = r.Levels,
                    peak_working_set_growth_bytes = r.PeakGrowthBytes,
                }));
            Console.Error.WriteLine(jitLeft);
            return 0;
        }
        Console.WriteLine("| N | unknowns | levels | setup s | solve s | iterations | residual | us per unknown (setup+solve) | CPU us per unknown | retained B/unknown (GC heap) | of which operator + multigrid (lattice) | peak working set growth MB | loss W (G = 1 S) |");
        Console.WriteLine("|---|---|---|---|---|---|---|---|---|---|---|---|---|");
        foreach (var r in rows)
            Console.WriteLine(string.Create(c,
                $"| {r.N} | {r.Unknowns} | {r.Levels} | {r.SetupSeconds:F3} | {r.SolveSeconds:F3} | {r.Iterations} | {r.Residual:E1} | {(r.SetupSeconds + r.SolveSeconds) / r.Unknowns * 1e6:F2} | {r.CpuSeconds / r.Unknowns * 1e6:F2} | {r.RetainedBytes / (double)r.Unknowns:F0} | {r.OperatorAndMultigridBytes / (double)r.Unknowns:F0} | {r.PeakGrowthBytes / 1e6:F0} | {r.LossW:G6} |"));
        Console.WriteLine(jitLeft);
        return 0;
    }

    /// <summary>Warm-up rounds at most. On this plate the count of compiled methods stops growing after 4-6 rounds.</summary>
    private const int WarmUpRounds = 10;

    /// <summary>Solves of each warm-up plate a round: three rounds of call counting take a method called once a solve past the runtime's 30 calls.</summary>
    private const int SolvesPerRound = 10;

    /// <summary>
    /// The warm-up's plates: 64² and 100², the smallest of the bench's plate with a level below the first two coarse ones and above the
    /// coarsest (the levels whose sweeps come in symmetric pairs), so every kernel of the timed solves has run.
    /// </summary>
    private static readonly int[] WarmUpSizes = [64, 100];

    /// <summary>
    /// Solves the small plates of <see cref="WarmUpSizes"/> with <paramref name="solve"/>, <see cref="SolvesPerRound"/> times a round, until a
    /// round compiles nothing new (<see cref="JitWarmUp"/>). One 64² solve alone left the grid and region builders to tier-0 code and on-stack
    /// replacement inside the timed 128² and 256² runs (128²: 14 ms CPU against 9 ms with tiering off, 2026-12-03) and never ran the symmetric
    /// sweeps; one solve a round stopped after two rounds with a few hundred small methods still to be recompiled inside the timed sizes.
    /// </summary>
    internal static void WarmUp(Action<int> solve) => JitWarmUp.UntilSettled(() =>
    {
        for (int k = 0; k < SolvesPerRound; k++)
            foreach (int n in WarmUpSizes) solve(n);
    }, WarmUpRounds);

    private sealed record Row(int N, int Unknowns, double SetupSeconds, double SolveSeconds, double CpuSeconds, int Iterations, double Residual, long RetainedBytes, long OperatorAndMultigridBytes, int Levels, long PeakGrowthBytes, double LossW);

    private sealed record Single(int Unknowns, double SetupSeconds, double SolveSeconds, double CpuSeconds, int Iterations, double Residual, long RetainedBytes, long OperatorAndMultigridBytes, int Levels, double LossW);

    /// <summary>One build and solve in its own frame, so nothing of an earlier run stays reachable when the heap is measured.</summary>
    [System.Runtime.CompilerServices.MethodImpl(System.Runtime.CompilerServices.MethodImplOptions.NoInlining)]
    private static Single Once(int n)
    {
        long before = GC.GetTotalMemory(true);
        var process = Process.GetCurrentProcess();
        var cpu = process.TotalProcessorTime;
        var clock = Stopwatch.StartNew();
        var model = SheetModel.Build(Plate(), new GridOptions { CellSizeM = 1.0 / n });
        double setup = clock.Elapsed.TotalSeconds;
        clock.Restart();
        var solution = ResistanceLimitedSolver.SolveAc(model, new UniformAcField(1, 50));
        double solve = clock.Elapsed.TotalSeconds;
        process.Refresh();
        double cpuSeconds = (process.TotalProcessorTime - cpu).TotalSeconds;
        long retained = GC.GetTotalMemory(true) - before;
        GC.KeepAlive(solution);
        return new Single(model.Unknowns, setup, solve, cpuSeconds, solution.Iterations, solution.RelativeResidual, retained,
            model.Multigrid.Bytes, model.Multigrid.LevelCount, solution.LossW(1));
    }

    internal static PlateGeometry Plate()
    {
        var g = PlateGeometry.Rectangle(1, 1);
        g.AddPattern(SlotPatterns.Comb(g.Outline, PlateEdge.Bottom, 0.1, 0.7, 0.02));
        return g;
    }

    private static Row Measure(int n)
    {
        var process = Process.GetCurrentProcess();
        process.Refresh();
        long peakBefore = process.PeakWorkingSet64;
        double bestSetup = double.MaxValue, bestSolve = double.MaxValue, bestCpu = double.MaxValue;
        Single? best = null;
        for (int rep = 0; rep < 3; rep++)
        {
            var run = Once(n);
            bestSetup = Math.Min(bestSetup, run.SetupSeconds);
            bestSolve = Math.Min(bestSolve, run.SolveSeconds);
            bestCpu = Math.Min(bestCpu, run.CpuSeconds);
            best = run;
        }
        process.Refresh();
        return new Row(n, best!.Unknowns, bestSetup, bestSolve, bestCpu, best.Iterations, best.Residual, best.RetainedBytes, best.OperatorAndMultigridBytes, best.Levels, process.PeakWorkingSet64 - peakBefore, best.LossW);
    }
}
