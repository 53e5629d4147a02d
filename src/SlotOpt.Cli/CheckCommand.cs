using SlotOpt.Design.SolidParts;
using System.CommandLine;
using SlotOpt.Design;
using SlotOpt.Design.Cores;
using SlotOpt.Input;
using SlotOpt.Reports;
using SlotOpt.Runs;
using SlotOpt.Selection;
using SlotOpt.Tables;

namespace SlotOpt.Cli;

/// <summary>`slotopt check FILE`: validates a problem file and summarises its design space.</summary>
public static class CheckCommand
{
    public static Command Build()
    {
        var file = new Argument<string>("file") { Description = "Problem file (TOML)" };
        var json = new Option<bool>("--json") { Description = "Print one JSON object" };
        var list = new Option<bool>("--list") { Description = "List each part's choices (grades, processes, thicknesses, materials, slot patterns)" };
        var command = new Command("check", "Validate a problem file (every mistake at once, with line and key) and summarise its design space");
        command.Arguments.Add(file);
        command.Options.Add(json);
        command.Options.Add(list);
        command.SetAction(parseResult => CommandRunner.Run(parseResult, (output, error) =>
        {
            var problem = ProblemReader.ReadFile(parseResult.GetValue(file)!);
            foreach (var w in problem.Warnings) error.WriteLine($"warning: {w}");
            var parts = problem.Parts.Select(p => new CheckJson.Part(
                p.Name, p is CorePart ? "core" : "plate", ChoiceSpace.OptionCount(p), ReferenceDesigns.IsCurrent(p), parseResult.GetValue(list) ? Choices(p) : null)).ToList();
            var combinations = ChoiceSpace.Combinations(problem.Parts);
            if (parseResult.GetValue(json))
            {
                output.Write(new CheckJson(problem.Name, problem.Goal, parts, combinations, problem.Warnings).Serialize());
                return ExitCodes.Success;
            }
            output.WriteLine($"{problem.SourcePath}: \"{problem.Name}\" is valid; objective {ObjectiveWords(problem.Goal)}");
            foreach (var p in parts)
            {
                output.WriteLine($"  {p.Kind,-5} {p.Name,-24} {p.Options,8} options{(p.Current ? "  (current design given)" : "")}");
                foreach (var (key, values) in p.Choices ?? new Dictionary<string, IReadOnlyList<string>>())
                    output.WriteLine($"        {key,-14} {string.Join(", ", values)}");
            }
            output.WriteLine($"  combinations: {(combinations == long.MaxValue ? "more than 9.2e18" : combinations.ToString("N0", System.Globalization.CultureInfo.InvariantCulture))}");
            return ExitCodes.Success;
        }));
        return command;
    }

    /// <summary>A part's choices as the problem file lists them, lengths in mm.</summary>
    private static IReadOnlyDictionary<string, IReadOnlyList<string>> Choices(Part part)
    {
        static string Mm(double m) => Numbers.Sig(m * 1e3);
        var choices = new Dictionary<string, IReadOnlyList<string>>();
        switch (part)
        {
            case CorePart core:
                choices["grades"] = core.Grades;
                choices["processes"] = core.Processes;
                break;
            case PlatePart plate:
                choices["thicknesses_mm"] = plate.ThicknessesM.Select(Mm).ToList();
                choices["materials"] = plate.Materials;
                choices["processes"] = plate.Processes;
                choices["slots"] = plate.SlotFamilies.Select(f =>
                    $"{f.Pattern.ToString().ToLowerInvariant()} from the {f.Edge.ToString().ToLowerInvariant()} edge: pitch {string.Join("/", f.PitchesM.Select(Mm))} mm, depth {string.Join("/", f.DepthsM.Select(Mm))} mm, width {string.Join("/", f.WidthsM.Select(Mm))} mm").ToList();
                break;
        }
        return choices;
    }

    /// <summary>The objective in words ("lowest owning cost"), as the problem file spells it but with spaces.</summary>
    private static string ObjectiveWords(Objective goal) => System.Text.Json.JsonNamingPolicy.KebabCaseLower.ConvertName(goal.ToString()).Replace('-', ' ');
}
