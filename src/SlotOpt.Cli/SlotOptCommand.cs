using System.CommandLine;

namespace SlotOpt.Cli;

/// <summary>The root command: wires the engine's commands together.</summary>
public static class SlotOptCommand
{
    public static RootCommand Build()
    {
        var root = new RootCommand("SlotOpt: lamination grade and gauge, and slot patterns for solid parts, against eddy-current loss, drag and cost.");
        root.Subcommands.Add(PlateCommand.Build());
        return root;
    }
}
