using System.CommandLine;
using System.Globalization;
using SlotOpt.Optimization;
using SlotOpt.Problems;

namespace SlotOpt.Cli;

/// <summary>`slotopt run FILE`: the main job: search every part's options and pick the best owning cost under the limits.</summary>
public static class RunCommand
{
    public static Command Build()
    {
        var file = new Argument<string>("file") { Description = "Problem file (TOML)" };
        var json = new Option<bool>("--json") { Description = "Print one JSON object" };
        var command = new Command("run", "Search grade, gauge and slot pattern for the lowest owning cost under the limits, and trace the loss-cost trade-off");
        command.Arguments.Add(file);
        command.Options.Add(json);
        var limits = new RunLimitOptions();
        limits.AddTo(command);
        command.SetAction(parseResult => CommandRunner.Run(() =>
        {
            var evaluationLimits = limits.Evaluation(parseResult);   // flags first: a bad flag is reported before any work
            var problem = ProblemReader.ReadFile(parseResult.GetValue(file)!);
            foreach (var w in problem.Warnings) Console.Error.WriteLine($"warning: {w}");
            RunResult result;
            using (var bar = new ProgressBar("solving slot geometries", CandidateEvaluation.GeometryCount(problem)))
                result = DesignRun.Execute(problem, limits.Search(parseResult), bar, evaluationLimits);
            if (parseResult.GetValue(json)) JsonOutput.Write(RunJson.From(result));
            else RunText.Write(result, Console.Out);
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
