namespace SlotOpt;

/// <summary>
/// A run that would exceed a resource limit the user set (or its default): memory or wall time.
/// The CLI prints the message, which names the limit and the estimate, and exits with code 5.
/// </summary>
public class ResourceLimitException : Exception
{
    public ResourceLimitException(string message) : base(message) { }
}
