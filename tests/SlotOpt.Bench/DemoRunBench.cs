using System.Diagnostics;
using System.Text.Json;
using SlotOpt.Input;
using SlotOpt.Runs;

namespace SlotOpt.Bench;

/// <summary>
/// The main job end to end on every demo problem (problems/*.toml): read, evaluate every option (screen and coupled ranking),
/// select, trace the front, confirm. Reports wall and CPU time, options, plate solves, how many options the plate models
/// ranked (own-field or thick: "coupled") and CP-SAT effort.
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
            Console.WriteLine("| problem | options | plate solves | coupled options | evaluation s | CP-SAT calls | CP-SAT s | total s | CPU s |");
            Console.WriteLine("|---|---:|---:|---:|---:|---:|---:|---:|---:|");
        }
        foreach (var file in files)
        {
            var clock = Stopwatch.StartNew();
            var cpu = Process.GetCurrentProcess().TotalProcessorTime;
            var result = DesignRun.Execute(ProblemReader.ReadFile(file));
            var total = clock.Elapsed.TotalSeconds;
            var cpuSeconds = (Process.GetCurrentProcess().TotalProcessorTime - cpu).TotalSeconds;
            var options = result.Parts.Sum(p => p.Options.Count);
            var coupled = result.Parts.Sum(p => p.Options.Count(o => o.Model is { Kind: not SlotOpt.Plates.SheetModelKind.ResistanceLimited }));
            var name = Path.GetFileName(file);
            if (json)
                Console.WriteLine(JsonSerializer.Serialize(new { problem = name, options, sheet_solves = result.SheetSolves, coupled_options = coupled, evaluation_seconds = result.EvaluationSeconds, cp_sat_calls = result.Outcome.Effort.SolverCalls, cp_sat_seconds = result.Outcome.Effort.WallSeconds, seconds = total, cpu_seconds = cpuSeconds }));
            else
                Console.WriteLine($"| {name} | {options} | {result.SheetSolves} | {coupled} | {result.EvaluationSeconds:0.00} | {result.Outcome.Effort.SolverCalls} | {result.Outcome.Effort.WallSeconds:0.00} | {total:0.00} | {cpuSeconds:0.00} |");
        }
        return 0;
    }
}
