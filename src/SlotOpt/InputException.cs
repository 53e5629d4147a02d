namespace SlotOpt;

/// <summary>
/// A user mistake in a file or a flag: each <see cref="InputError"/> names where (file, line and key, or the
/// flag) and what was expected. The CLI prints it without a stack trace and exits with code 2.
/// </summary>
public class InputException : Exception
{
    public IReadOnlyList<InputError> Errors { get; }

    public InputException(string message) : base(message) => Errors = [InputError.FromText(message)];

    public InputException(IEnumerable<string> messages) : this(messages.Select(InputError.FromText).ToList()) { }

    public InputException(IReadOnlyList<InputError> errors) : base(string.Join(Environment.NewLine, errors)) => Errors = errors;
}
