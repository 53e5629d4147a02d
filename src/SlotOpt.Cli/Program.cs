namespace SlotOpt.Cli;

public static class Program
{
    public static int Main(string[] args) => SlotOptCommand.Build().Parse(args).Invoke();
}
