using System.Diagnostics;
using System.Globalization;
using SlotOpt.Numerics;
using SlotOpt.Plates.Grid;
using SlotOpt.Plates.Sources;

namespace SlotOpt.Bench;

/// <summary>
/// Where the thin-plate solve's time goes (`sheets --profile [--sizes 256,1024]`): the plate of <see cref="SheetsBench"/>, phase by
/// phase (grid, merged regions, multigrid hierarchy, right-hand side, conjugate gradients), and inside the solve the preconditioner,
/// the production solve (conjugate gradients on the lattice) against the generic <see cref="ConjugateGradient"/> with the same operator and
/// V-cycle, split into preconditioner, operator and the rest (vector work); process CPU seconds of the phases up to the production solve; best of 3.
/// </summary>
public static class SheetsProfile
{
    public static int Run(int[] sizes)
    {
        Once(64);
        Console.WriteLine("| N | grid s | regions s | multigrid s | rhs s | lattice CG s | iterations | CPU s (all before) | generic CG s | of which preconditioner s | operator s | vector work s | iterations |");
        Console.WriteLine("|---|---|---|---|---|---|---|---|---|---|---|---|---|");
        foreach (int n in sizes)
        {
            double[]? best = null;
            for (int rep = 0; rep < 3; rep++)
            {
                var t = Once(n);
                best = best is null ? t : best.Zip(t, Math.Min).ToArray();
            }
            Console.WriteLine(string.Create(CultureInfo.InvariantCulture,
                $"| {n} | {best![0]:F3} | {best[1]:F3} | {best[2]:F3} | {best[3]:F3} | {best[4]:F3} | {best[5]} | {best[6]:F3} | {best[7]:F3} | {best[8]:F3} | {best[9]:F3} | {best[7] - best[8] - best[9]:F3} | {best[10]} |"));
        }
        return 0;
    }

    private static double[] Once(int n)
    {
        GC.Collect();
        var process = Process.GetCurrentProcess();
        var cpu = process.TotalProcessorTime;
        var clock = Stopwatch.StartNew();
        var grid = PlateGrid.Build(SheetsBench.Plate(), new GridOptions { CellSizeM = 1.0 / n });
        double tGrid = clock.Elapsed.TotalSeconds; clock.Restart();
        var regions = NodeRegions.Build(grid);
        double tRegions = clock.Elapsed.TotalSeconds; clock.Restart();
        var mg = StructuredMultigrid.Build(grid, regions);
        double tMg = clock.Elapsed.TotalSeconds; clock.Restart();
        var l = grid.Lattice;
        var re = new double[l.NodeCount]; var im = new double[l.NodeCount];
        new UniformAcField(1, 50).Integrate(l, 0, re, im);
        var source = re.Any(v => v != 0) ? re : im;
        var b = new double[regions.UnknownCount];
        var map = regions.NodeUnknown;
        for (int p = 0; p < map.Length; p++) if (map[p] >= 0) b[map[p]] -= source[p];
        double tRhs = clock.Elapsed.TotalSeconds; clock.Restart();
        var psi = new double[b.Length];
        if (!mg.TrySolve(b, psi, ConvergenceCriterion.Default, out var report)) throw new InvalidOperationException(report.Reason);
        double tSolve = clock.Elapsed.TotalSeconds;
        process.Refresh();
        double cpuSeconds = (process.TotalProcessorTime - cpu).TotalSeconds;
        clock.Restart();
        var a = new TimedOperator(mg.Operator);
        var m = new TimedPreconditioner(mg);
        Array.Clear(psi);
        var generic = ConjugateGradient.Solve(a, b, psi, m, ConvergenceCriterion.Default);
        double tCg = clock.Elapsed.TotalSeconds;
        return [tGrid, tRegions, tMg, tRhs, tSolve, report.Iterations, cpuSeconds, tCg, m.Seconds, a.Seconds, generic.Iterations];
    }

    private sealed class TimedOperator(ILinearOperator inner) : ILinearOperator
    {
        private readonly Stopwatch _clock = new();
        public double Seconds => _clock.Elapsed.TotalSeconds;
        public int Rows => inner.Rows;
        public void Multiply(ReadOnlySpan<double> x, Span<double> y) { _clock.Start(); inner.Multiply(x, y); _clock.Stop(); }
        public void Residual(ReadOnlySpan<double> b, ReadOnlySpan<double> x, Span<double> r) { _clock.Start(); inner.Residual(b, x, r); _clock.Stop(); }
    }

    private sealed class TimedPreconditioner(IPreconditioner inner) : IPreconditioner
    {
        private readonly Stopwatch _clock = new();
        public double Seconds => _clock.Elapsed.TotalSeconds;
        public void Apply(ReadOnlySpan<double> r, Span<double> z) { _clock.Start(); inner.Apply(r, z); _clock.Stop(); }
    }
}
