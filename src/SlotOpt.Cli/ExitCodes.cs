namespace SlotOpt.Cli;

/// <summary>Process exit codes, documented in the README.</summary>
public static class ExitCodes
{
    public const int Success = 0;
    public const int InternalError = 1;
    public const int InvalidInput = 2;
    public const int Infeasible = 3;
    public const int NumericalFailure = 4;
    public const int ResourceLimit = 5;
}
