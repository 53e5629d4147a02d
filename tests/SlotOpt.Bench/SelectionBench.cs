using System.Diagnostics;
using System.Globalization;
using System.Text.Json;
using SlotOpt.Selection;
using SlotOpt.Selection.Search;

namespace SlotOpt.Bench;

/// <summary>
/// CP-SAT selection on a synthetic product (invented for the bench, seeded): 6 parts x 200 candidates
/// (5 gauges x 4 grades x 2 processes x 5 variants), two coil groups (parts 1-3 and 4-5 each from one
/// coil), at most 2 distinct processes, 8 currency/W. Times the best owning cost, the front capped at
/// 60 points, and the full front.
/// </summary>
public static class SelectionBench
{
    private static readonly double[] GaugesMm = [0.23, 0.27, 0.35, 0.50, 0.65];
    private static readonly string[] Grades = ["M235", "M270", "M330", "M400"];
    private static readonly string[] Processes = ["laser", "punch", "wire", "waterjet"];

    public static int Run(string[] args)
    {
        var json = args.Contains("--json");
        var problem = SyntheticProduct(seed: 5);
        var selector = new CpSatSelector();
        var rows = new[]
        {
            Measure("best owning cost", () => selector.Select(problem)),
            Measure("front, at most 60 points", () => selector.Select(problem with { Objective = Objective.TradeOffCurve })),
            Measure("full front", () => selector.Select(problem with { Objective = Objective.TradeOffCurve }, new SelectionOptions { MaxFrontPoints = 100_000 })),
        };
        if (json)
        {
            foreach (var r in rows) Console.WriteLine(JsonSerializer.Serialize(r));
            return 0;
        }
        var candidates = problem.Parts.Sum(p => p.Candidates.Count);
        Console.WriteLine($"{problem.Parts.Count} parts, {candidates} candidates, 2 coil groups, at most 2 processes, one CP-SAT worker, seed 0");
        Console.WriteLine();
        Console.WriteLine("| case | status | front points | solver calls | CP-SAT wall s | deterministic s | elapsed s |");
        Console.WriteLine("|---|---|---:|---:|---:|---:|---:|");
        foreach (var r in rows)
            Console.WriteLine(string.Create(CultureInfo.InvariantCulture,
                $"| {r.Case} | {r.Status} | {r.FrontPoints?.ToString(CultureInfo.InvariantCulture) ?? "-"}{(r.Capped ? " (capped)" : "")} | {r.SolverCalls} | {r.WallSeconds:0.000} | {r.DeterministicSeconds:0.000} | {r.ElapsedSeconds:0.000} |"));
        return 0;
    }

    private sealed record Row(string Case, string Status, int? FrontPoints, bool Capped, int SolverCalls, double WallSeconds, double DeterministicSeconds, double ElapsedSeconds);

    private static Row Measure(string name, Func<SelectionOutcome> select)
    {
        var watch = Stopwatch.StartNew();
        var outcome = select();
        var elapsed = watch.Elapsed.TotalSeconds;
        var status = outcome.Front is { } front ? $"{outcome.Status}, front {front.Status}" : outcome.Status.ToString();
        return new Row(name, status, outcome.Front?.Points.Count, outcome.Front?.IsCapped ?? false,
            outcome.Effort.SolverCalls, outcome.Effort.WallSeconds, outcome.Effort.DeterministicSeconds, elapsed);
    }

    /// <summary>
    /// Loss grows with the square of the gauge (classical eddy loss, d^2) and with a poorer grade; cost
    /// grows as the gauge thins and the grade improves; each process and variant shifts both a little.
    /// </summary>
    private static SelectionProblem SyntheticProduct(int seed)
    {
        var random = new Random(seed);
        var parts = new List<PartChoices>();
        for (var p = 0; p < 6; p++)
        {
            var baseLossW = 20 + 40 * random.NextDouble();
            var baseCost = 200 + 400 * random.NextDouble();
            var processes = new[] { Processes[p % 4], Processes[(p + 1) % 4] };
            var candidates = new List<Candidate>();
            foreach (var gauge in GaugesMm)
                for (var g = 0; g < Grades.Length; g++)
                    foreach (var process in processes)
                        for (var variant = 0; variant < 5; variant++)
                        {
                            var lossW = baseLossW * Math.Pow(gauge / 0.35, 2) * (1 + 0.25 * g) * (0.85 + 0.3 * random.NextDouble());
                            var cost = baseCost * (1 + 0.12 * (0.65 / gauge - 1)) * (1.3 - 0.1 * g) * (0.9 + 0.2 * random.NextDouble());
                            var attributes = new Dictionary<string, string>
                            {
                                [Candidate.CoilAttribute] = $"{Grades[g]}-{gauge:0.00}",
                                [Candidate.ProcessAttribute] = process,
                            };
                            candidates.Add(new Candidate($"part{p}-{Grades[g]}-{gauge:0.00}-{process}-v{variant}", Math.Round(cost, 2), lossW, null, attributes));
                        }
            parts.Add(new PartChoices($"part{p}", candidates));
        }
        var limits = new SharedLimits
        {
            CoilGroups = [["part0", "part1", "part2"], ["part3", "part4"]],
            MaxDistinctProcesses = 2,
        };
        return new SelectionProblem(parts, limits, Objective.LowestOwningCost, ValuePerWatt: 8);
    }
}
