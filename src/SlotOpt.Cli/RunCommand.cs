using System.CommandLine;
using SlotOpt.Design;
using SlotOpt.Input;
using SlotOpt.Reports;
using SlotOpt.Runs;
using SlotOpt.Selection;
using SlotOpt.Reports.Json;

namespace SlotOpt.Cli;

/// <summary>`slotopt run FILE [--out DIR [--force]]`: the main job: search every part's options, pick the best owning cost under the limits, and write the report.</summary>
public static class RunCommand
{
    public static Command Build()
    {
        var file = new Argument<string>("file") { Description = "Problem file (TOML)" };
        var json = new Option<bool>("--json") { Description = "Print one JSON object" };
        var outDir = new Option<string?>("--out") { HelpName = "DIR", Description = "Write the report (index.html, summary.md, candidates.csv, result.json, plots) into this folder" };
        var force = new Option<bool>("--force") { Description = "With --out: replace the folder if it exists" };
        var command = new Command("run", "Search grade, gauge and slot pattern for the lowest owning cost under the limits, and trace the loss-cost trade-off");
        command.Arguments.Add(file);
        command.Options.Add(json);
        command.Options.Add(outDir);
        command.Options.Add(force);
        var limits = new RunLimitOptions();
        limits.AddTo(command);
        command.SetAction(parseResult => CommandRunner.Run(parseResult, (output, error) =>
        {
            var reportDir = parseResult.GetValue(outDir);
            var evaluationLimits = limits.Start(parseResult) with { WritesReport = reportDir is not null };   // flags first: a bad flag is reported before any work
            using var deadline = evaluationLimits.Deadline!;
            var replace = parseResult.GetValue(force);
            ReportOutput.Check(reportDir, replace, parseResult.GetValue(file)!);
            var problem = ProblemReader.ReadFile(parseResult.GetValue(file)!);
            foreach (var w in problem.Warnings) error.WriteLine($"warning: {w}");
            RunResult result;
            using (var bar = new ProgressBar("solving slot geometries", CandidateEvaluation.GeometryCount(problem), error))
                result = DesignRun.Execute(problem, limits.Search(parseResult), bar, evaluationLimits);
            if (parseResult.GetValue(json)) output.Write(ResultJson.From(result).Serialize());
            else RunText.Write(result, output);
            if (reportDir is not null)
            {
                if (ReportOutput.Write(reportDir, replace, deadline, folder => ReportWriter.Write(result, DateTimeOffset.UtcNow, folder)) is { } signalExit)
                {
                    error.WriteLine("interrupted: the report was not written");
                    return signalExit;
                }
                error.WriteLine($"report: {Path.Combine(reportDir, ReportWriter.HtmlFile)}");
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
}
