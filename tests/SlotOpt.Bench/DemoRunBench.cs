using System.Diagnostics;
using System.Text.Json;
using SlotOpt.Input;
using SlotOpt.Runs;

namespace SlotOpt.Bench;

/// <summary>
/// The main job end to end on every demo problem (problems/*.toml): read, evaluate every option,
/// select, trace the front. Reports wall time, options, plate solves and CP-SAT effort.
/// </summary>
public static class DemoRunBench
{
    public static int Run(string[] args)
    {
        var json = args.Contains("--json");
        var folder = args.FirstOrDefault(a => !a.StartsWith("--", StringComparison.Ordinal)) ?? "problems";
        var files = Directory.GetFiles(folder, "*.toml").Order(StringComparer.Ordinal).ToList();
        if (files.Count == 0) { Console.Error.WriteLine($"no problems in {folder}"); return 2; }
        if (!json)
        {
            Console.WriteLine("| problem | options | plate solves | evaluation s | CP-SAT calls | CP-SAT s | total s |");
            Console.WriteLine("|---|---:|---:|---:|---:|---:|---:|");
        }
        foreach (var file in files)
        {
            var clock = Stopwatch.StartNew();
            var result = DesignRun.Execute(ProblemReader.ReadFile(file));
            var total = clock.Elapsed.TotalSeconds;
            var options = result.Parts.Sum(p => p.Options.Count);
            var name = Path.GetFileName(file);
            if (json)
                Console.WriteLine(JsonSerializer.Serialize(new { problem = name, options, sheet_solves = result.SheetSolves, evaluation_seconds = result.EvaluationSeconds, cp_sat_calls = result.Outcome.Effort.SolverCalls, cp_sat_seconds = result.Outcome.Effort.WallSeconds, seconds = total }));
            else
                Console.WriteLine($"| {name} | {options} | {result.SheetSolves} | {result.EvaluationSeconds:0.00} | {result.Outcome.Effort.SolverCalls} | {result.Outcome.Effort.WallSeconds:0.00} | {total:0.00} |");
        }
        return 0;
    }
}
