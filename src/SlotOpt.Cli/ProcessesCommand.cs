using System.CommandLine;
using System.Globalization;
using SlotOpt.Design;
using SlotOpt.Reports;
using SlotOpt.Tables;

namespace SlotOpt.Cli;

/// <summary>`slotopt processes [--json]`: the built-in cutting processes with their rules, prices and sources.</summary>
public static class ProcessesCommand
{
    public static Command Build()
    {
        var json = new Option<bool>("--json") { Description = "Print one JSON object" };
        var command = new Command("processes", "List the built-in cutting processes: the slots each can make, what cutting costs, and where the numbers come from");
        command.Options.Add(json);
        command.SetAction(parseResult => CommandRunner.Run(parseResult, (output, error) =>
        {
            var processes = CuttingProcessLibrary.BuiltIn.Values.OrderBy(p => p.Name, StringComparer.Ordinal).ToList();
            if (parseResult.GetValue(json))
            {
                output.Write(new ProcessesJson(processes.Select(p => new ProcessesJson.Process(
                    p.Name, p.MinSlotWidthM * 1e3, p.MinStripOverThickness, p.MinLigamentOverThickness, p.MaxSlots,
                    p.CostPerMetrePerMmThickness, p.CostPerSlot, p.SetupCost, p.CostPerSheet, p.Origin)).ToList()).Serialize());
                return ExitCodes.Success;
            }
            var ci = CultureInfo.InvariantCulture;
            output.WriteLine("Cutting processes (a problem file may override any value in [manufacturing])");
            output.WriteLine($"{"name",-14} {"min slot mm",11} {"strip/t",7} {"ligament/t",10} {"max slots",9} {"per m per mm",12} {"per slot",8} {"setup",7} {"per sheet",9}");
            foreach (var p in processes)
                output.WriteLine(string.Create(ci, $"{p.Name,-14} {Numbers.Sig(p.MinSlotWidthM * 1e3),11} {Numbers.Sig(p.MinStripOverThickness),7} {Numbers.Sig(p.MinLigamentOverThickness),10} {p.MaxSlots,9} {Numbers.Sig(p.CostPerMetrePerMmThickness),12} {Numbers.Sig(p.CostPerSlot),8} {Numbers.Sig(p.SetupCost),7} {Numbers.Sig(p.CostPerSheet),9}"));
            output.WriteLine();
            output.WriteLine("Sources:");
            foreach (var p in processes) output.WriteLine($"  {p.Name}: {p.Origin}");
            return ExitCodes.Success;
        }));
        return command;
    }
}
