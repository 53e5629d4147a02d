namespace SlotOpt;

/// <summary>
/// A user mistake in a file or a flag: the message names where (file:line key, or the flag) and
/// what was expected. The CLI prints it without a stack trace and exits with code 2.
/// </summary>
public class InputException : Exception
{
    public InputException(string message) : base(message) { }

    public InputException(IEnumerable<string> messages) : base(string.Join(Environment.NewLine, messages)) { }
}
