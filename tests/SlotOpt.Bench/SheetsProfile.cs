using System.Diagnostics;
using System.Globalization;
using System.Runtime.InteropServices;
using SlotOpt.Numerics;
using SlotOpt.Plates.Grid;
using SlotOpt.Plates.Sources;

namespace SlotOpt.Bench;

/// <summary>
/// Where the thin-plate solve's time goes (`sheets --profile [--sizes 256,1024]`): the plate of <see cref="SheetsBench"/>, phase by
/// phase (grid, merged regions, multigrid hierarchy, right-hand side, conjugate gradients), and inside the solve the preconditioner,
/// the production solve (conjugate gradients on the lattice) against the generic <see cref="ConjugateGradient"/> with the same operator and
/// V-cycle, split into preconditioner, operator and the rest (vector work); all times in CPU seconds of the
/// solving thread (steadier than wall time on a shared machine), beside the process's CPU seconds up to the production solve; best of 3.
/// </summary>
public static class SheetsProfile
{
    public static int Run(int[] sizes)
    {
        SheetsBench.WarmUp(n => Once(n));
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
                $"| {n} | {best![0]:F3} | {best[1]:F3} | {best[2]:F3} | {best[3]:F3} | {best[4]:F3} | {best[5]} ({Math.Pow(best[11], 1 / best[5]):F3}) | {best[6]:F3} | {best[7]:F3} | {best[8]:F3} | {best[9]:F3} | {best[7] - best[8] - best[9]:F3} | {best[10]} |"));
        }
        return 0;
    }

    private static double[] Once(int n)
    {
        GC.Collect();
        var process = Process.GetCurrentProcess();
        var cpu = process.TotalProcessorTime;
        var clock = new ThreadClock();
        var grid = PlateGrid.Build(SheetsBench.Plate(), new GridOptions { CellSizeM = 1.0 / n });
        double tGrid = clock.Seconds; clock.Restart();
        var regions = NodeRegions.Build(grid);
        double tRegions = clock.Seconds; clock.Restart();
        var mg = StructuredMultigrid.Build(grid, regions);
        double tMg = clock.Seconds; clock.Restart();
        var l = grid.Lattice;
        var re = new double[l.NodeCount]; var im = new double[l.NodeCount];
        new UniformAcField(1, 50).Integrate(l, 0, re, im);
        var source = re.Any(v => v != 0) ? re : im;
        var b = new double[regions.UnknownCount];
        var map = regions.NodeUnknown;
        for (int p = 0; p < map.Length; p++) if (map[p] >= 0) b[map[p]] -= source[p];
        double tRhs = clock.Seconds; clock.Restart();
        var psi = new double[b.Length];
        if (!mg.TrySolve(b, psi, ConvergenceCriterion.Default, out var report)) throw new InvalidOperationException(report.Reason);
        double tSolve = clock.Seconds;
        process.Refresh();
        double cpuSeconds = (process.TotalProcessorTime - cpu).TotalSeconds;
        clock.Restart();
        var a = new TimedOperator(mg.Operator);
        var m = new TimedPreconditioner(mg);
        Array.Clear(psi);
        var generic = ConjugateGradient.Solve(a, b, psi, m, ConvergenceCriterion.Default);
        double tCg = clock.Seconds;
        return [tGrid, tRegions, tMg, tRhs, tSolve, report.Iterations, cpuSeconds, tCg, m.Seconds, a.Seconds, generic.Iterations, report.RelativeResidual];
    }

    private sealed class TimedOperator(ILinearOperator inner) : ILinearOperator
    {
        public double Seconds { get; private set; }
        public int Rows => inner.Rows;
        public void Multiply(ReadOnlySpan<double> x, Span<double> y) { double t = ThreadClock.Now(); inner.Multiply(x, y); Seconds += ThreadClock.Now() - t; }
        public void Residual(ReadOnlySpan<double> b, ReadOnlySpan<double> x, Span<double> r) { double t = ThreadClock.Now(); inner.Residual(b, x, r); Seconds += ThreadClock.Now() - t; }
    }

    private sealed class TimedPreconditioner(IPreconditioner inner) : IPreconditioner
    {
        public double Seconds { get; private set; }
        public void Apply(ReadOnlySpan<double> r, Span<double> z) { double t = ThreadClock.Now(); inner.Apply(r, z); Seconds += ThreadClock.Now() - t; }
    }

    /// <summary>CPU seconds of the calling thread (Linux clock_gettime(CLOCK_THREAD_CPUTIME_ID)): steadier than wall time on a loaded machine.</summary>
    private sealed class ThreadClock
    {
        private double _start = Now();
        public double Seconds => Now() - _start;
        public void Restart() => _start = Now();

        [StructLayout(LayoutKind.Sequential)]
        private struct TimeSpec { public long Seconds; public long Nanoseconds; }

        [DllImport("libc", EntryPoint = "clock_gettime")]
        private static extern int ClockGetTime(int clock, out TimeSpec time);

        private const int ThreadCpuTime = 3;

        public static double Now() => ClockGetTime(ThreadCpuTime, out var t) == 0 ? t.Seconds + 1e-9 * t.Nanoseconds : throw new InvalidOperationException("clock_gettime failed");
    }
}
