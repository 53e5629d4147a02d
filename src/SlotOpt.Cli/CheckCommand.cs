using System.CommandLine;
using SlotOpt.Design;
using SlotOpt.Input;
using SlotOpt.Reports;
using SlotOpt.Runs;
using SlotOpt.Selection;

namespace SlotOpt.Cli;

/// <summary>`slotopt check FILE`: validates a problem file and summarises its design space.</summary>
public static class CheckCommand
{
    public static Command Build()
    {
        var file = new Argument<string>("file") { Description = "Problem file (TOML)" };
        var json = new Option<bool>("--json") { Description = "Print one JSON object" };
        var command = new Command("check", "Validate a problem file (every mistake at once, with line and key) and summarise its design space");
        command.Arguments.Add(file);
        command.Options.Add(json);
        command.SetAction(parseResult => CommandRunner.Run(parseResult, (output, error) =>
        {
            var problem = ProblemReader.ReadFile(parseResult.GetValue(file)!);
            foreach (var w in problem.Warnings) error.WriteLine($"warning: {w}");
            var parts = problem.Parts.Select(p => new CheckJson.Part(
                p.Name, p is CorePart ? "core" : "plate", ChoiceSpace.OptionCount(p), ReferenceDesigns.IsCurrent(p))).ToList();
            var combinations = ChoiceSpace.Combinations(problem.Parts);
            if (parseResult.GetValue(json))
            {
                output.Write(new CheckJson(problem.Name, problem.Goal, parts, combinations, problem.Warnings).Serialize());
                return ExitCodes.Success;
            }
            output.WriteLine($"{problem.SourcePath}: \"{problem.Name}\" is valid; objective {ObjectiveWords(problem.Goal)}");
            foreach (var p in parts)
                output.WriteLine($"  {p.Kind,-5} {p.Name,-24} {p.Options,8} options{(p.Current ? "  (current design given)" : "")}");
            output.WriteLine($"  combinations: {(combinations == long.MaxValue ? "more than 9.2e18" : combinations.ToString("N0", System.Globalization.CultureInfo.InvariantCulture))}");
            return ExitCodes.Success;
        }));
        return command;
    }

    /// <summary>The objective in words ("lowest owning cost"), as the problem file spells it but with spaces.</summary>
    private static string ObjectiveWords(Objective goal) => System.Text.Json.JsonNamingPolicy.KebabCaseLower.ConvertName(goal.ToString()).Replace('-', ' ');
}
