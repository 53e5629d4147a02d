namespace SlotOpt;

/// <summary>
/// A computation that did not converge or produced NaN/Inf. Never turned into a number: the CLI
/// prints the message and exits with code 4.
/// </summary>
public class NumericalFailureException : Exception
{
    public NumericalFailureException(string message) : base(message) { }
}
