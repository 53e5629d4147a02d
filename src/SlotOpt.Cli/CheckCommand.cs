using System.CommandLine;
using SlotOpt.Design;
using SlotOpt.Design.Cores;
using SlotOpt.Input;
using SlotOpt.Reports;
using SlotOpt.Runs;

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
            var parts = problem.Parts.Select(p => new
            {
                name = p.Name,
                kind = p is CorePart ? "core" : "plate",
                options = ChoiceSpace.OptionCount(p),
                current = ReferenceDesigns.IsCurrent(p),
            }).ToList();
            var combinations = ChoiceSpace.Combinations(problem.Parts);
            if (parseResult.GetValue(json))
            {
                output.Write(JsonFormat.Serialize(new { problem = problem.Name, objective = problem.Goal, parts, combinations, warnings = problem.Warnings }));
                return ExitCodes.Success;
            }
            output.WriteLine($"{problem.SourcePath}: \"{problem.Name}\" is valid; objective {problem.Goal}");
            foreach (var p in parts)
                output.WriteLine($"  {p.kind,-5} {p.name,-24} {p.options,8} options{(p.current ? "  (current design given)" : "")}");
            output.WriteLine($"  combinations: {(combinations == long.MaxValue ? "more than 9.2e18" : combinations.ToString("N0", System.Globalization.CultureInfo.InvariantCulture))}");
            return ExitCodes.Success;
        }));
        return command;
    }
}
