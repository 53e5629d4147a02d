namespace SlotOpt.Bench;

public static class Program
{
    public static int Main(string[] args) => 0;
}
