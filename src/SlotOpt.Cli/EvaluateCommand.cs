using System.CommandLine;
using System.Globalization;
using SlotOpt.Tables;
using SlotOpt.Design;
using SlotOpt.Input;
using SlotOpt.Reports;
using SlotOpt.Runs;

namespace SlotOpt.Cli;

/// <summary>`slotopt evaluate FILE`: loss, drag (and a turning disc's torque) and cost of the design the file fixes (or the baseline).</summary>
public static class EvaluateCommand
{
    public static Command Build()
    {
        var file = new Argument<string>("file") { Description = "Problem file (TOML)" };
        var json = new Option<bool>("--json") { Description = "Print one JSON object" };
        var command = new Command("evaluate", "Evaluate the current design of every part (or the baseline: solid plates, the first grade): loss, drag, cost");
        command.Arguments.Add(file);
        command.Options.Add(json);
        var limitOptions = new RunLimitOptions();
        limitOptions.AddTo(command, parallel: false, search: false);
        command.SetAction(parseResult => CommandRunner.Run(parseResult, (output, error) =>
        {
            var limits = limitOptions.Start(parseResult) with { Threads = 1 };   // the parts are evaluated one after another
            using var deadline = limits.Deadline!;
            var problem = ProblemReader.ReadFile(parseResult.GetValue(file)!);
            foreach (var w in problem.Warnings) error.WriteLine($"warning: {w}");
            var rows = deadline.Run("the evaluation", () => problem.Parts
                .Select(p => (Part: p, Option: ReferenceDesigns.CurrentOrBaseline(p, problem, limits), IsCurrent: ReferenceDesigns.IsCurrent(p))).ToList());
            var totalLoss = rows.Sum(r => r.Option.Loss.TotalW);
            var totalCost = rows.Sum(r => r.Option.BuildCost);
            var owning = problem.OwningCost(rows.Select(r => r.Option));
            if (parseResult.GetValue(json))
            {
                output.Write(new EvaluateJson(
                    problem.Name,
                    problem.Economics.Currency,
                    rows.Select(r => new EvaluateJson.Part(
                        r.Part.Name, r.IsCurrent ? "current" : "baseline", r.Option.Description,
                        r.Option.Loss.TotalW, r.Option.Loss.HysteresisW, r.Option.Loss.ClassicalW, r.Option.Loss.ExcessW, r.Option.Loss.PlateEddyW,
                        r.Option.DragN, r.Option.BuildCost, r.Option.Rejection?.Message, r.Option.Flags) { TorqueNm = r.Option.TorqueNm }).ToList(),
                    totalLoss,
                    totalCost,
                    problem.Economics.ValuePerWatt,
                    owning).Serialize());
                return ExitCodes.Success;
            }
            var ci = CultureInfo.InvariantCulture;
            var cur = problem.Economics.Currency;
            output.WriteLine($"{problem.Name}");
            foreach (var r in rows)
            {
                output.WriteLine(string.Create(ci, $"  {r.Part.Name} ({(r.IsCurrent ? "current design" : "baseline")}): {r.Option.Description}"));
                // a turning disc: its braking torque, and its drag is the tangential force at the magnets' radius
                var torque = r.Option.TorqueNm is { } t ? $"   torque {Numbers.Of(t, "N m")}" : "";
                var drag = r.Option.DragN is { } d ? $"   drag {Numbers.Newtons(d)}{(r.Option.TorqueNm is null ? "" : " at the magnets' radius")}" : "";
                output.WriteLine($"      loss {Numbers.Watts(r.Option.Loss.TotalW),12}{torque}{drag}   build cost {Numbers.Money(r.Option.BuildCost, cur),12}");
                if (r.Option.Rejection is { } broken) output.WriteLine($"      breaks a rule: {broken.Message}");
                foreach (var flag in r.Option.Flags) output.WriteLine($"      warning: {flag}");
            }
            output.WriteLine($"  total: loss {Numbers.Watts(totalLoss)}, build cost {Numbers.Money(totalCost, cur)}, owning cost {Numbers.Money(owning, cur)} (at {Numbers.Sig(problem.Economics.ValuePerWatt)} {cur}/W)");
            return ExitCodes.Success;
        }));
        return command;
    }
}
