using System.Diagnostics;
using System.Globalization;
using SlotOpt.Numerics;
using SlotOpt.Plates.Conductors;
using SlotOpt.Plates.Geometry;
using SlotOpt.Plates.Grid;
using SlotOpt.Plates.OwnField;
using SlotOpt.Plates.ResistanceLimited;
using SlotOpt.Plates.Sources;
using SlotOpt.Plates.Thick;

namespace SlotOpt.Bench;

/// <summary>
/// Coupled (reaction-field) thin-sheet solver. AC: a 1 m square plate with a comb of slots from its lower
/// edge (pitch 100 mm, depth 700 mm, width 20 mm) in a uniform 50 Hz field, 3 mm Al 1350 (35.38 MS/m,
/// 61 % IACS, the conductivity class of IEC 60889 hard-drawn aluminium wire), on N x N cells, GMRES to a relative residual of 1e-8. Setup = sheet model (grid,
/// regions, operator, multigrid) + reaction operator (kernel and FFT spectrum on the padded lattice); the AC preconditioner's coarse
/// level (the plate 4 times coarser) is built in the first AC solve, so the solve time includes it; "next" is a second solve on the same
/// operator (3 -> 3.5 mm, as a run's next thickness on one geometry), which finds the coarse level built.
/// Moving: one circular pole (radius 20 mm, 0.5 T) at v = w over a 0.8 m x 0.2 m plate (4 mm cells),
/// 50 travel offsets in one sweep (each offset warm-started from the last); its padded FFT column shows Dx R's lattice and the preconditioner's (Phi). Thick: a 0.4 m x 0.2 m copper
/// plate, 20 mm thick, uniform 50 Hz field (t/delta = 2.1), 128 x 64 cells per layer, layer count chosen and
/// checked to 1 % (the time includes the L/2 and L solves). Times are wall clock, one run, on whatever cores
/// the machine gives (2 here, shared), after the same solves on small grids (compiling the code); the AC and moving solves run with 1 and with 2 FFT workers
/// (<see cref="ReactionOperator.Build"/>'s threads), whose answers are identical. The padded FFT's kernels run 512 bits wide where the
/// processor has AVX-512; the "fft" case times them against the portable width (DOTNET_EnableAVX512F=0 runs every case portable). "Solve CPU s" is the process's CPU time over
/// the solve: on a shared machine it shows the work done, which wall clock (waiting for a core) does not.
/// </summary>
public static class ReactionBench
{
    /// <param name="args">the cases to run, any of "ac", "moving", "thick", "fft" (all when none is named), e.g. to time one case against another build</param>
    public static int Run(string[] args)
    {
        var cases = new[] { "ac", "moving", "thick", "fft" };
        var unknown = args.Where(a => !cases.Contains(a)).ToArray();
        if (unknown.Length > 0) { Console.Error.WriteLine($"reaction: unknown case {unknown[0]} (cases: {string.Join(", ", cases)})"); return 2; }
        bool Runs(string name) => args.Length == 0 || args.Contains(name);
        var c = CultureInfo.InvariantCulture;
        var conductor = new ConductingSheet(35.38e6, 3e-3);
        if (Runs("ac") || Runs("moving")) WarmUp(conductor);
        var jit = JitWarmUp.Start();
        Console.WriteLine("| case | grid | unknowns | padded FFT | FFT threads | setup s | solve s | solve CPU s | iterations | residual | loss or drag ratio (coupled / resistance-limited) |");
        Console.WriteLine("|---|---|---|---|---|---|---|---|---|---|---|");
        foreach (int n in Runs("ac") ? new[] { 256, 512 } : [])
        foreach (int threads in new[] { 1, 2 })
        {
            var clock = Stopwatch.StartNew();
            var plate = PlateGeometry.Rectangle(1, 1);
            plate.AddPattern(SlotPatterns.Comb(plate.Outline, PlateEdge.Bottom, 0.1, 0.7, 0.02));
            var model = SheetModel.Build(plate, new GridOptions { CellSizeM = 1.0 / n });
            var reaction = ReactionOperator.Build(model, threads);
            double setup = clock.Elapsed.TotalSeconds;
            clock.Restart();
            var cpu = Process.GetCurrentProcess().TotalProcessorTime;
            var s = ReactionSolver.SolveAc(reaction, new UniformAcField(0.01, 50), conductor);
            double solve = clock.Elapsed.TotalSeconds, solveCpu = (Process.GetCurrentProcess().TotalProcessorTime - cpu).TotalSeconds;
            // the next option on the same geometry (3.5 mm): the coarse level and the buffers are the first solve's
            clock.Restart();
            cpu = Process.GetCurrentProcess().TotalProcessorTime;
            var next = ReactionSolver.SolveAc(reaction, new UniformAcField(0.01, 50), new ConductingSheet(conductor.ConductivitySPerM, 3.5e-3));
            double nextSolve = clock.Elapsed.TotalSeconds, nextCpu = (Process.GetCurrentProcess().TotalProcessorTime - cpu).TotalSeconds;
            Console.WriteLine(string.Create(c, $"| AC 50 Hz, slotted 1 m plate | {n} x {n} | {model.Unknowns} | {reaction.PaddedX} x {reaction.PaddedY} | {threads} | {setup:F2} | {solve:F2}; next {nextSolve:F2} | {solveCpu:F2}; next {nextCpu:F2} | {s.Iterations}; next {next.Iterations} | {s.RelativeResidual:E1} | {s.LossRatio:F4} |"));
        }
        foreach (int threads in Runs("moving") ? new[] { 1, 2 } : [])
        {
            var clock = Stopwatch.StartNew();
            var model = SheetModel.Build(new PlateGeometry(Polygon.Rectangle(-0.6, -0.1, 0.2, 0.1)), new GridOptions { CellSizeM = 0.004 });
            var reaction = ReactionOperator.Build(model, threads);
            double setup = clock.Elapsed.TotalSeconds;
            double w = 2 / (Validity.Mu0 * conductor.SheetConductanceS);
            var poles = new MovingPoles(new[] { new Pole(PoleFace.Circle(0.02), new Vec2(0, 0), 0.5) }, w);
            var offsets = MovingSweepSolution.OffsetsAcross(-0.05, 0.05, 50);
            clock.Restart();
            var cpu = Process.GetCurrentProcess().TotalProcessorTime;
            var s = ReactionSolver.SolveMoving(reaction, poles, conductor, offsets);
            double solve = clock.Elapsed.TotalSeconds, solveCpu = (Process.GetCurrentProcess().TotalProcessorTime - cpu).TotalSeconds;
            Console.WriteLine(string.Create(c, $"| moving pole at v = w ({w:F1} m/s), 50 offsets | {model.Lattice.Nx} x {model.Lattice.Ny} | {model.Unknowns} | {reaction.ConvectedLattice.X} x {reaction.ConvectedLattice.Y} (Phi {reaction.FactorLattice.X} x {reaction.FactorLattice.Y}) | {threads} | {setup:F2} | {solve:F2} ({solve / 50:F3} per offset) | {solveCpu:F2} ({solveCpu / 50:F3} per offset) | {s.Iterations.Sum()} ({s.Iterations.Average():F1} per offset) | {s.MaxRelativeResidual:E1} | {s.DragRatio:F4} |"));
        }
        if (Runs("thick"))
        {
            var clock = Stopwatch.StartNew();
            var model = SheetModel.Build(PlateGeometry.Rectangle(0.4, 0.2), new GridOptions { CellSizeM = 0.4 / 128 });
            double setup = clock.Elapsed.TotalSeconds;
            clock.Restart();
            var cpu = Process.GetCurrentProcess().TotalProcessorTime;
            var s = ThickPlateSolver.SolveAcConverged(model, new DepthIndependentField(new UniformAcField(0.01, 50)), new ConductingSheet(1 / 0.017241e-6, 0.02), 0.01);
            double solve = clock.Elapsed.TotalSeconds, solveCpu = (Process.GetCurrentProcess().TotalProcessorTime - cpu).TotalSeconds;
            Console.WriteLine(string.Create(c, $"| thick Cu 20 mm, 50 Hz, {s.Layers} layers (error {s.LayerError:P1}) | 128 x 64 x {s.Layers} | {model.Unknowns * s.Layers} | 256 x 128 | 1 | {setup:F2} | {solve:F2} (with kernels, L/2 and L) | {solveCpu:F2} | {s.Iterations} | {s.RelativeResidual:E1} | {s.LossRatio:F4} |"));
        }
        Console.WriteLine(jit.Since("cases"));
        if (Runs("fft")) FftLanes();
        return 0;
    }

    /// <summary>
    /// The padded FFT convolution alone on the lattices of the solves above, one worker, its kernels 512 bits wide (where the processor
    /// has AVX-512) against the portable Vector&lt;T&gt; width, the two alternating in rounds so that load hits both alike: CPU ms a
    /// convolution (process CPU time over about 10^7 / lattice points convolutions a round, 0.1-0.5 s, so the clock's 10 ms ticks do not
    /// matter; best and median of 7 rounds after one that compiles) and their ratio.
    /// </summary>
    private static void FftLanes()
    {
        var c = CultureInfo.InvariantCulture;
        Console.WriteLine();
        Console.WriteLine("| convolution | region | lattice | lanes wide / portable | wide CPU ms (best; median) | portable CPU ms (best; median) | median portable / wide |");
        Console.WriteLine("|---|---|---|---|---|---|---|");
        foreach (var (name, nx, ny, mx, my, real) in new[]
        {
            ("moving: Dx R, real", 199, 49, 512, 96, true),
            ("moving: factor Phi, real, circular", 199, 49, 256, 96, true),
            ("AC 256^2: R, complex", 255, 255, 512, 512, false),
        })
        {
            var lanes = new[] { true, false }.Select(wide => new PaddedConvolution(nx, ny, mx, my, 1, wide)).ToArray();
            var spectra = lanes.Select(l => l.Spectrum(nx - 1, ny - 1, (dx, dy) => 1 / Math.Sqrt(1 + dx * dx + dy * dy))).ToArray();
            var random = new Random(1);
            var field = Enumerable.Range(0, nx * ny).Select(_ => random.NextDouble()).ToArray();
            var times = new[] { new List<double>(), new List<double>() };
            int reps = Math.Max(20, 10_000_000 / (mx * my));
            for (int round = 0; round < 8; round++)
                for (int w = 0; w < 2; w++)
                {
                    var cpu = Process.GetCurrentProcess().TotalProcessorTime;
                    for (int rep = 0; rep < reps; rep++)
                    {
                        var conv = lanes[w];
                        for (int j = 0; j < ny; j++) { Array.Copy(field, j * nx, conv.Re, j * mx, nx); Array.Copy(field, j * nx, conv.Im, j * mx, nx); }
                        if (real) conv.ConvolveReal(spectra[w]); else conv.ConvolveComplex(spectra[w]);
                    }
                    if (round > 0) times[w].Add((Process.GetCurrentProcess().TotalProcessorTime - cpu).TotalMilliseconds / reps);   // round 0 compiles
                }
            double Median(List<double> t) => t.Order().ElementAt(t.Count / 2);
            Console.WriteLine(string.Create(c, $"| {name} | {nx} x {ny} | {mx} x {my} | {lanes[0].Lanes} / {lanes[1].Lanes} | {times[0].Min():F2}; {Median(times[0]):F2} | {times[1].Min():F2}; {Median(times[1]):F2} | {Median(times[1]) / Median(times[0]):F2} |"));
        }
    }

    /// <summary>Warm-up rounds at most: a round is the small solves once. At the default tiering the count of compiled methods still creeps at round 8 (a few a round), while the first 256² AC solve stops gaining after about 4.</summary>
    private const int WarmUpRounds = 8;

    /// <summary>
    /// The same solves on small grids first, round after round until a round compiles nothing new (<see cref="JitWarmUp"/>). A one-round
    /// warm-up left the loops of the FFT and the cycle to on-stack replacement inside the first timed solve (about 0.1 s of a 0.3 s solve
    /// at 256²): a process pays that once.
    /// </summary>
    private static void WarmUp(ConductingSheet conductor)
    {
        var plate = PlateGeometry.Rectangle(1, 1);
        plate.AddPattern(SlotPatterns.Comb(plate.Outline, PlateEdge.Bottom, 0.1, 0.7, 0.02));
        JitWarmUp.UntilSettled(() =>
        {
            foreach (int threads in new[] { 1, 2 })
            {
                ReactionSolver.SolveAc(ReactionOperator.Build(SheetModel.Build(plate, new GridOptions { CellSizeM = 1.0 / 64 }), threads), new UniformAcField(0.01, 50), conductor);
                var model = SheetModel.Build(new PlateGeometry(Polygon.Rectangle(-0.6, -0.1, 0.2, 0.1)), new GridOptions { CellSizeM = 0.01 });
                var poles = new MovingPoles(new[] { new Pole(PoleFace.Circle(0.02), new Vec2(0, 0), 0.5) }, 2 / (Validity.Mu0 * conductor.SheetConductanceS));
                ReactionSolver.SolveMoving(ReactionOperator.Build(model, threads), poles, conductor, new[] { 0.0, 0.002 });
            }
        }, WarmUpRounds);
    }
}