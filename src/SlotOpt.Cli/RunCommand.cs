using System.CommandLine;
using System.Runtime.InteropServices;
using System.Text.Json;
using SlotOpt.Optimization;
using SlotOpt.Problems;
using SlotOpt.Reports;

namespace SlotOpt.Cli;

/// <summary>`slotopt run FILE [--out DIR [--force]]`: the main job: search every part's options, pick the best owning cost under the limits, and write the report.</summary>
public static class RunCommand
{
    public static Command Build()
    {
        var file = new Argument<string>("file") { Description = "Problem file (TOML)" };
        var json = new Option<bool>("--json") { Description = "Print one JSON object" };
        var outDir = new Option<string?>("--out") { Description = "Write the report (index.html, summary.md, candidates.csv, result.json, plots) into this folder" };
        var force = new Option<bool>("--force") { Description = "With --out: replace the folder if it exists" };
        var command = new Command("run", "Search grade, gauge and slot pattern for the lowest owning cost under the limits, and trace the loss-cost trade-off");
        command.Arguments.Add(file);
        command.Options.Add(json);
        command.Options.Add(outDir);
        command.Options.Add(force);
        var limits = new RunLimitOptions();
        limits.AddTo(command);
        command.SetAction(parseResult => CommandRunner.Run(() =>
        {
            var evaluationLimits = limits.Evaluation(parseResult);   // flags first: a bad flag is reported before any work
            var reportDir = parseResult.GetValue(outDir);
            var replace = parseResult.GetValue(force);
            if (replace && reportDir is null) throw new InputException("--force only applies with --out DIR");
            if (reportDir is not null) ReportFolder.CheckTarget(reportDir, replace);
            var problem = ProblemReader.ReadFile(parseResult.GetValue(file)!);
            foreach (var w in problem.Warnings) Console.Error.WriteLine($"warning: {w}");
            RunResult result;
            using (var bar = new ProgressBar("solving slot geometries", CandidateEvaluation.GeometryCount(problem)))
                result = DesignRun.Execute(problem, limits.Search(parseResult), bar, evaluationLimits);
            if (parseResult.GetValue(json)) JsonOutput.Write(RunJson.From(result));
            else RunText.Write(result, Console.Out);
            if (reportDir is not null)
            {
                WriteReport(result, reportDir, replace);
                Console.Error.WriteLine($"report: {Path.Combine(reportDir, ReportWriter.HtmlFile)}");
            }
            return result.Outcome.Status switch
            {
                SelectionStatus.Infeasible => ExitCodes.Infeasible,
                SelectionStatus.LimitReachedWithoutDesign => ExitCodes.NumericalFailure,
                _ => ExitCodes.Success,
            };
        }));
        return command;
    }

    /// <summary>Writes the report atomically; an interrupt or termination while it is written deletes the unfinished folder.</summary>
    private static void WriteReport(RunResult result, string reportDir, bool replace)
    {
        using var folder = ReportFolder.Begin(reportDir, replace);
        using var onInterrupt = PosixSignalRegistration.Create(PosixSignal.SIGINT, _ => folder.Abandon());
        using var onTerminate = PosixSignalRegistration.Create(PosixSignal.SIGTERM, _ => folder.Abandon());
        ReportWriter.Write(result, ReportJson(result), DateTimeOffset.UtcNow, folder);
    }

    /// <summary>The object `run --json` prints (it holds no wall-clock times, so two runs give the same file).</summary>
    public static string ReportJson(RunResult result) =>
        JsonSerializer.Serialize(RunJson.From(result), JsonOutput.Options) + Environment.NewLine;
}
