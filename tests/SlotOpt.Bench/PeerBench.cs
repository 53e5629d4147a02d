using System.Diagnostics;
using System.Globalization;
using System.Text;
using System.Text.Json;
using SlotOpt.Numerics;
using SlotOpt.Plates.Grid;
using SlotOpt.Plates.ResistanceLimited;
using SlotOpt.Plates.Sources;

namespace SlotOpt.Bench;

/// <summary>
/// SlotOpt's thin-plate solver against general-purpose algebraic multigrid on the identical linear system:
/// the comb-slotted plate of <see cref="SheetsBench"/> in a uniform 50 Hz field on N x N grids. For each N the
/// bench writes the matrix A and right-hand side b it solves (Matrix Market, coordinate / array real general)
/// and peer/solve_peer.py solves the same A x = b with CG + hypre BoomerAMG and CG + PETSc GAMG through
/// petsc4py (one process, OMP_NUM_THREADS=1, default options of each, true relative residual 1e-8, as SlotOpt).
/// Repeats interleave (SlotOpt, hypre, GAMG, SlotOpt, ...) so machine noise hits all sides alike; the table
/// shows the best of the repeats, in wall seconds and in the process's CPU seconds (steadier on a shared machine: Process.TotalProcessorTime
/// for SlotOpt, Python's time.process_time for the peers, each over the same span as its wall time). The peers' seconds are
/// preconditioner setup plus solve, their matrix assembled before the clock starts. SlotOpt is timed over two spans: the like-for-like
/// one ("assembled": plate grid, merged regions and right-hand side built before the clock, then multigrid setup plus solve, the span
/// the peers get), on which the ratios are judged, and end to end beside it (grid from the outline, merged regions, multigrid,
/// right-hand side, the solve and its post-processing in ResistanceLimitedSolver.SolveAc).
/// After each row, on standard error (the table on standard output stays whole), the assembled span's minor page faults (first touches of memory the process has not used before: the kernel
/// zeroes each 4 kB page, a few microseconds apiece) and the bytes it allocates, per repeat (Linux /proc/self/stat field 10, minflt).
/// Without petsc4py the SlotOpt columns still run and the bench says why the peer columns are missing.
/// Usage: `SlotOpt.Bench peer [--sizes 256,512,1024] [--repeats 3]`.
/// </summary>
public static class PeerBench
{
    public static int Run(string[] args)
    {
        var sizes = Option(args, "--sizes")?.Split(',').Select(s => int.Parse(s, CultureInfo.InvariantCulture)).ToArray() ?? new[] { 256, 512, 1024 };
        int repeats = int.Parse(Option(args, "--repeats") ?? "3", CultureInfo.InvariantCulture);
        using var peer = PeerProcess.TryStart(out string whyNot);
        if (peer is null) Console.WriteLine($"peer columns left out: {whyNot}");
        SheetsBench.WarmUp(n => { SlotOptOnce(n); SlotOptAssembledOnce(n); });
        var c = CultureInfo.InvariantCulture;
        Console.WriteLine($"load average at start: {LoadAverage()}");
        Console.WriteLine("| N | unknowns | SlotOpt assembled s | SlotOpt end to end s | SlotOpt iterations | hypre BoomerAMG + CG s | hypre iterations | PETSc GAMG + CG s | GAMG iterations | hypre / SlotOpt assembled | hypre / SlotOpt end to end | GAMG / SlotOpt assembled | SlotOpt assembled CPU s | SlotOpt end to end CPU s | hypre CPU s | GAMG CPU s | hypre / SlotOpt assembled CPU | hypre / SlotOpt end to end CPU | GAMG / SlotOpt assembled CPU |");
        Console.WriteLine("|---|---|---|---|---|---|---|---|---|---|---|---|---|---|---|---|---|---|---|");
        var directory = Directory.CreateTempSubdirectory("slotopt-peer-");
        try
        {
            foreach (int n in sizes)
            {
                var model = SheetModel.Build(SheetsBench.Plate(), new GridOptions { CellSizeM = 1.0 / n });
                bool peerReady = false;
                if (peer is not null)
                {
                    string matrixPath = Path.Combine(directory.FullName, $"sheet{n}.mtx");
                    string rhsPath = Path.Combine(directory.FullName, $"sheet{n}_rhs.mtx");
                    WriteMatrix(model.Operator.Matrix, matrixPath);
                    WriteVector(RightHandSide(model.Grid, model.Regions), rhsPath);
                    var loaded = peer.Ask($"load {matrixPath} {rhsPath}");
                    peerReady = loaded.GetProperty("ok").GetBoolean();
                    if (!peerReady) Console.WriteLine($"peer could not load N = {n}: {loaded}");
                    File.Delete(matrixPath);
                    File.Delete(rhsPath);
                }
                int unknowns = model.Unknowns;
                model = null;
                GC.Collect();
                var ours = new Best(); var assembled = new Best(); var hypre = new Best(); var gamg = new Best();
                var touches = new List<string>();
                for (int rep = 0; rep < repeats; rep++)
                {
                    var (seconds, cpuSeconds, iterations) = SlotOptOnce(n);
                    ours.Add(seconds, cpuSeconds, iterations);
                    (seconds, cpuSeconds, iterations, long faults, long bytes) = SlotOptAssembledOnce(n);
                    assembled.Add(seconds, cpuSeconds, iterations);
                    touches.Add(string.Create(c, $"{faults} faults, {bytes / 1e6:F1} MB"));
                    if (!peerReady) continue;
                    hypre.Add(peer!.Solve("hypre"));
                    gamg.Add(peer.Solve("gamg"));
                }
                Console.WriteLine(string.Create(c,
                    $"| {n} | {unknowns} | {assembled.Text} | {ours.Text} | {assembled.Iterations} | {hypre.Text} | {hypre.IterationText} | {gamg.Text} | {gamg.IterationText} | {Ratio(hypre, assembled)} | {Ratio(hypre, ours)} | {Ratio(gamg, assembled)} | {assembled.CpuText} | {ours.CpuText} | {hypre.CpuText} | {gamg.CpuText} | {CpuRatio(hypre, assembled)} | {CpuRatio(hypre, ours)} | {CpuRatio(gamg, assembled)} |"));
                Console.Error.WriteLine($"N = {n}: SlotOpt assembled span, minor page faults and bytes allocated per repeat: {string.Join("; ", touches)}");
            }
        }
        finally { directory.Delete(true); }
        Console.WriteLine($"load average at end: {LoadAverage()}");
        return 0;
    }

    private static string? Option(string[] args, string name)
    {
        int i = Array.IndexOf(args, name);
        return i >= 0 && i + 1 < args.Length ? args[i + 1] : null;
    }

    private static string Ratio(Best peer, Best ours) => peer.Valid ? (peer.Seconds / ours.Seconds).ToString("F2", CultureInfo.InvariantCulture) : "-";

    private static string CpuRatio(Best peer, Best ours) => peer.Valid ? (peer.CpuSeconds / ours.CpuSeconds).ToString("F2", CultureInfo.InvariantCulture) : "-";

    /// <summary>The process's minor page faults so far (/proc/self/stat field 10, after the parenthesised command name); -1 where there is no /proc.</summary>
    private static long MinorFaults()
    {
        if (!File.Exists("/proc/self/stat")) return -1;
        string stat = File.ReadAllText("/proc/self/stat");
        return long.Parse(stat[(stat.LastIndexOf(')') + 2)..].Split(' ')[7], CultureInfo.InvariantCulture);
    }

    private static string LoadAverage() => File.Exists("/proc/loadavg") ? string.Join(' ', File.ReadAllText("/proc/loadavg").Split(' ').Take(3)) : "unknown";

    /// <summary>SlotOpt end to end, as SheetsBench times it: build the model, one AC solve; wall seconds and the process's CPU seconds.</summary>
    private static (double Seconds, double CpuSeconds, int Iterations) SlotOptOnce(int n)
    {
        GC.Collect();
        var process = Process.GetCurrentProcess();
        var cpu = process.TotalProcessorTime;
        var clock = Stopwatch.StartNew();
        var model = SheetModel.Build(SheetsBench.Plate(), new GridOptions { CellSizeM = 1.0 / n });
        var solution = ResistanceLimitedSolver.SolveAc(model, new UniformAcField(1, 50));
        double seconds = clock.Elapsed.TotalSeconds;
        process.Refresh();
        return (seconds, (process.TotalProcessorTime - cpu).TotalSeconds, solution.Iterations);
    }

    /// <summary>
    /// SlotOpt over the peers' span: the plate grid, its merged regions and the right-hand side (the system the peers load) built
    /// before the clock; timed, the multigrid setup from the grid and the solve, as the peers' preconditioner setup and solve.
    /// </summary>
    private static (double Seconds, double CpuSeconds, int Iterations, long MinorFaults, long AllocatedBytes) SlotOptAssembledOnce(int n)
    {
        var grid = PlateGrid.Build(SheetsBench.Plate(), new GridOptions { CellSizeM = 1.0 / n });
        var regions = NodeRegions.Build(grid);
        var b = RightHandSide(grid, regions);
        var psi = new double[b.Length];
        GC.Collect();
        var process = Process.GetCurrentProcess();
        var cpu = process.TotalProcessorTime;
        long faults = MinorFaults(), bytes = GC.GetAllocatedBytesForCurrentThread();
        var clock = Stopwatch.StartNew();
        var mg = StructuredMultigrid.Build(grid, regions);
        bool converged = mg.TrySolve(b, psi, ConvergenceCriterion.Default, out var report);
        double seconds = clock.Elapsed.TotalSeconds;
        faults = MinorFaults() - faults;
        bytes = GC.GetAllocatedBytesForCurrentThread() - bytes;
        process.Refresh();
        if (!converged) throw new NumericalFailureException($"N = {n}: {report.Reason}");
        return (seconds, (process.TotalProcessorTime - cpu).TotalSeconds, report.Iterations, faults, bytes);
    }

    /// <summary>The right-hand side ResistanceLimitedSolver.SolveAc solves for a uniform field: its phase is uniform, so one real part.</summary>
    private static double[] RightHandSide(PlateGrid grid, NodeRegions regions)
    {
        var l = grid.Lattice;
        var re = new double[l.NodeCount];
        var im = new double[l.NodeCount];
        new UniformAcField(1, 50).Integrate(l, 0, re, im);
        var source = re.Any(v => v != 0) ? re : im;
        var b = new double[regions.UnknownCount];
        var map = regions.NodeUnknown;
        for (int p = 0; p < map.Length; p++) if (map[p] >= 0) b[map[p]] -= source[p];   // as SheetModel.RightHandSide
        return b;
    }

    private static void WriteMatrix(CsrMatrix a, string path)
    {
        using var w = new StreamWriter(path, false, new UTF8Encoding(false), 1 << 20);
        w.Write("%%MatrixMarket matrix coordinate real general\n");
        w.Write(string.Create(CultureInfo.InvariantCulture, $"{a.Rows} {a.Columns} {a.NonZeros}\n"));
        for (int i = 0; i < a.Rows; i++)
            for (int k = a.RowStart[i]; k < a.RowStart[i + 1]; k++)
                w.Write(string.Create(CultureInfo.InvariantCulture, $"{i + 1} {a.ColumnIndex[k] + 1} {a.Value[k]:R}\n"));
    }

    private static void WriteVector(double[] b, string path)
    {
        using var w = new StreamWriter(path, false, new UTF8Encoding(false), 1 << 20);
        w.Write("%%MatrixMarket matrix array real general\n");
        w.Write(string.Create(CultureInfo.InvariantCulture, $"{b.Length} 1\n"));
        foreach (double v in b) w.Write(string.Create(CultureInfo.InvariantCulture, $"{v:R}\n"));
    }

    private sealed class Best
    {
        public double Seconds { get; private set; } = double.PositiveInfinity;
        /// <summary>The least CPU seconds of the repeats (taken on its own: the run with the least wall time need not have the least CPU time).</summary>
        public double CpuSeconds { get; private set; } = double.PositiveInfinity;
        public int Iterations { get; private set; }
        public bool Valid => double.IsFinite(Seconds);
        public string Text => Valid ? Seconds.ToString("F3", CultureInfo.InvariantCulture) : "-";
        public string CpuText => Valid ? CpuSeconds.ToString("F3", CultureInfo.InvariantCulture) : "-";
        public string IterationText => Valid ? Iterations.ToString(CultureInfo.InvariantCulture) : "-";

        public void Add(double seconds, double cpuSeconds, int iterations)
        {
            if (seconds < Seconds) { Seconds = seconds; Iterations = iterations; }
            CpuSeconds = Math.Min(CpuSeconds, cpuSeconds);
        }

        public void Add(JsonElement reply)
        {
            if (!reply.GetProperty("ok").GetBoolean()) { Console.WriteLine($"peer solve failed: {reply}"); return; }
            Add(reply.GetProperty("seconds").GetDouble(), reply.GetProperty("cpu_seconds").GetDouble(), reply.GetProperty("iterations").GetInt32());
        }
    }

    /// <summary>The long-lived peer: Debian's python3 with petsc4py from PETSc's own directory on PYTHONPATH.</summary>
    private sealed class PeerProcess : IDisposable
    {
        private readonly Process _process;
        private PeerProcess(Process process) => _process = process;

        public static PeerProcess? TryStart(out string whyNot)
        {
            const string python = "/usr/bin/python3";
            string script = Path.Combine(AppContext.BaseDirectory, "peer", "solve_peer.py");
            var module = Directory.Exists("/usr/lib/petscdir")
                ? Directory.EnumerateFiles("/usr/lib/petscdir", "__init__.py", SearchOption.AllDirectories)
                    .FirstOrDefault(p => p.EndsWith("/petsc4py/__init__.py") && p.Contains("-real/"))
                : null;
            if (module is null) { whyNot = "petsc4py not found under /usr/lib/petscdir (install Debian's python3-petsc4py-real)"; return null; }
            if (!File.Exists(python)) { whyNot = $"{python} not found"; return null; }
            if (!File.Exists(script)) { whyNot = $"{script} not found"; return null; }
            var start = new ProcessStartInfo(python, new[] { script })
            {
                RedirectStandardInput = true, RedirectStandardOutput = true, RedirectStandardError = true, UseShellExecute = false,
            };
            start.Environment["PYTHONPATH"] = Path.GetDirectoryName(Path.GetDirectoryName(module))!;
            start.Environment["OMP_NUM_THREADS"] = "1";
            var process = Process.Start(start)!;
            process.ErrorDataReceived += (_, e) => { if (e.Data is { Length: > 0 }) Console.Error.WriteLine($"peer: {e.Data}"); };
            process.BeginErrorReadLine();
            var peer = new PeerProcess(process);
            try { peer.Ask("solve none"); }   // answers with an error once petsc4py has imported; fails if it could not
            catch (InvalidOperationException e) { peer.Dispose(); whyNot = e.Message; return null; }
            whyNot = "";
            return peer;
        }

        public JsonElement Ask(string command)
        {
            _process.StandardInput.WriteLine(command);
            _process.StandardInput.Flush();
            string? line = _process.StandardOutput.ReadLine();
            if (line is null) throw new InvalidOperationException("the peer process ended (petsc4py could not be imported? see its messages above)");
            return JsonDocument.Parse(line).RootElement.Clone();
        }

        public JsonElement Solve(string preconditioner) => Ask($"solve {preconditioner}");

        public void Dispose()
        {
            try { if (!_process.HasExited) { _process.StandardInput.WriteLine("quit"); _process.WaitForExit(5000); } }
            finally { if (!_process.HasExited) _process.Kill(); _process.Dispose(); }
        }
    }
}
