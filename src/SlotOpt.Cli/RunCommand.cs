using System.CommandLine;
using System.Runtime.InteropServices;
using SlotOpt.Design.Limits;
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
            var evaluationLimits = limits.Start(parseResult);   // flags first: a bad flag is reported before any work
            using var deadline = evaluationLimits.Deadline!;
            var reportDir = parseResult.GetValue(outDir);
            var replace = parseResult.GetValue(force);
            if (replace && reportDir is null) throw new InputException("--force only applies with --out DIR");
            if (reportDir is not null) ReportFolder.CheckTarget(reportDir, replace, parseResult.GetValue(file)!);
            var problem = ProblemReader.ReadFile(parseResult.GetValue(file)!);
            foreach (var w in problem.Warnings) error.WriteLine($"warning: {w}");
            RunResult result;
            using (var bar = new ProgressBar("solving slot geometries", CandidateEvaluation.GeometryCount(problem), error))
                result = DesignRun.Execute(problem, limits.Search(parseResult), bar, evaluationLimits);
            if (parseResult.GetValue(json)) output.Write(ResultJson.From(result).Serialize());
            else RunText.Write(result, output);
            if (reportDir is not null)
            {
                if (WriteReport(result, reportDir, replace, deadline) is { } signalExit)
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

    /// <summary>Exit codes of a run stopped by a signal while it wrote the report: 128 + the signal's number, as shells report them.</summary>
    private const int InterruptedExit = 130, TerminatedExit = 143;

    /// <summary>
    /// Writes the report atomically. SIGINT or SIGTERM while it is written deletes the unfinished folder
    /// (the handlers are in place before the folder is made) and returns the exit code; null when written.
    /// The time limit passing while it is written deletes the folder too, and ends the run with the limit's error.
    /// </summary>
    private static int? WriteReport(RunResult result, string reportDir, bool replace, RunDeadline deadline)
    {
        deadline.Check("the report");
        using var folder = ReportFolder.Begin(reportDir, replace);
        using var onDeadline = deadline.Token.Register(folder.Abandon);
        int? signalExit = null;
        void Stop(PosixSignalContext context, int exitCode)
        {
            context.Cancel = true;
            signalExit = exitCode;
            folder.Abandon();
        }
        using var onInterrupt = PosixSignalRegistration.Create(PosixSignal.SIGINT, c => Stop(c, InterruptedExit));
        using var onTerminate = PosixSignalRegistration.Create(PosixSignal.SIGTERM, c => Stop(c, TerminatedExit));
        try
        {
            ReportWriter.Write(result, DateTimeOffset.UtcNow, folder);
            return null;
        }
        catch (InvalidOperationException) when (signalExit is not null)
        {
            return signalExit;   // the folder was abandoned under the writer
        }
        catch (InvalidOperationException) when (deadline.Token.IsCancellationRequested)
        {
            throw deadline.Passed("the report");   // abandoned under the writer by the deadline
        }
    }
}
