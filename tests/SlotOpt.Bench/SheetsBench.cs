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
/// (uniform phase: one real solve). Times are the best of 3 runs. Memory: bytes retained on the managed
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
        var sizes = new[] { 128, 256, 512, 1024, 2048 };
        Measure(64);   // JIT warm-up
        var rows = sizes.Select(Measure).ToList();
        var c = CultureInfo.InvariantCulture;
        if (json)
        {
            foreach (var r in rows)
                Console.WriteLine(JsonSerializer.Serialize(new
                {
                    n = r.N, unknowns = r.Unknowns, seconds = r.SetupSeconds + r.SolveSeconds, setup_seconds = r.SetupSeconds,
                    solve_seconds = r.SolveSeconds, iterations = r.Iterations, loss_w = r.LossW, retained_bytes_per_unknown = r.RetainedBytes / (double)r.Unknowns, levels = r.Levels,
                    peak_working_set_growth_bytes = r.PeakGrowthBytes,
                }));
            return 0;
        }
        Console.WriteLine("| N | unknowns | levels | setup s | solve s | iterations | residual | us per unknown (setup+solve) | retained B/unknown (GC heap) | of which operator + multigrid (lattice) | peak working set growth MB | loss W (G = 1 S) |");
        Console.WriteLine("|---|---|---|---|---|---|---|---|---|---|---|---|");
        foreach (var r in rows)
            Console.WriteLine(string.Create(c,
                $"| {r.N} | {r.Unknowns} | {r.Levels} | {r.SetupSeconds:F3} | {r.SolveSeconds:F3} | {r.Iterations} | {r.Residual:E1} | {(r.SetupSeconds + r.SolveSeconds) / r.Unknowns * 1e6:F2} | {r.RetainedBytes / (double)r.Unknowns:F0} | {r.OperatorAndMultigridBytes / (double)r.Unknowns:F0} | {r.PeakGrowthBytes / 1e6:F0} | {r.LossW:G6} |"));
        return 0;
    }

    private sealed record Row(int N, int Unknowns, double SetupSeconds, double SolveSeconds, int Iterations, double Residual, long RetainedBytes, long OperatorAndMultigridBytes, int Levels, long PeakGrowthBytes, double LossW);

    private sealed record Single(int Unknowns, double SetupSeconds, double SolveSeconds, int Iterations, double Residual, long RetainedBytes, long OperatorAndMultigridBytes, int Levels, double LossW);

    /// <summary>One build and solve in its own frame, so nothing of an earlier run stays reachable when the heap is measured.</summary>
    [System.Runtime.CompilerServices.MethodImpl(System.Runtime.CompilerServices.MethodImplOptions.NoInlining)]
    private static Single Once(int n)
    {
        long before = GC.GetTotalMemory(true);
        var clock = Stopwatch.StartNew();
        var model = SheetModel.Build(Plate(), new GridOptions { CellSizeM = 1.0 / n });
        double setup = clock.Elapsed.TotalSeconds;
        clock.Restart();
        var solution = ResistanceLimitedSolver.SolveAc(model, new UniformAcField(1, 50));
        double solve = clock.Elapsed.TotalSeconds;
        long retained = GC.GetTotalMemory(true) - before;
        GC.KeepAlive(solution);
        return new Single(model.Unknowns, setup, solve, solution.Iterations, solution.RelativeResidual, retained,
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
        double bestSetup = double.MaxValue, bestSolve = double.MaxValue;
        Single? best = null;
        for (int rep = 0; rep < 3; rep++)
        {
            var run = Once(n);
            bestSetup = Math.Min(bestSetup, run.SetupSeconds);
            bestSolve = Math.Min(bestSolve, run.SolveSeconds);
            best = run;
        }
        process.Refresh();
        return new Row(n, best!.Unknowns, bestSetup, bestSolve, best.Iterations, best.Residual, best.RetainedBytes, best.OperatorAndMultigridBytes, best.Levels, process.PeakWorkingSet64 - peakBefore, best.LossW);
    }
}
