namespace SlotOpt.Bench;

/// <summary>Benchmark console: `dotnet run -c Release --project tests/SlotOpt.Bench -- CASE [--json]`.</summary>
public static class Program
{
    public static int Main(string[] args)
    {
        var benchCase = args.Length > 0 ? args[0] : "";
        var rest = args.Skip(1).ToArray();
        switch (benchCase)
        {
            case "lamination": return LaminationBench.Run(rest);
            case "demos": return DemoRunBench.Run(rest);
            case "sheets": return SheetsBench.Run(rest);
            case "selection": return SelectionBench.Run(rest);
            case "reaction": return ReactionBench.Run(rest);
            case "thermal": return ThermalBench.Run(rest);
            case "peer": return PeerBench.Run(rest);
            default:
                Console.Error.WriteLine("usage: SlotOpt.Bench CASE [--json]   (cases: lamination, sheets, peer, selection, reaction, thermal, demos)");
                return 2;
        }
    }
}
