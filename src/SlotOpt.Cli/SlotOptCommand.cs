using System.CommandLine;

namespace SlotOpt.Cli;

/// <summary>The root command: wires the engine's commands together.</summary>
public static class SlotOptCommand
{
    public static RootCommand Build()
    {
        var root = new RootCommand("SlotOpt: lamination grade and gauge, and slot patterns for solid parts, against eddy-current loss, drag and cost.");
        root.Subcommands.Add(MaterialsCommand.Build());
        root.Subcommands.Add(CoreLossCommand.Build());
        root.Subcommands.Add(FitCommand.Build());
        root.Subcommands.Add(CheckCommand.Build());
        root.Subcommands.Add(EvaluateCommand.Build());
        root.Subcommands.Add(RunCommand.Build());
        root.Subcommands.Add(PlateCommand.Build());
        root.Subcommands.Add(ProcessesCommand.Build());
        return root;
    }
}
