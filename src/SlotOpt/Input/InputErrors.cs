namespace SlotOpt.Input;

/// <summary>
/// Collects every mistake found in one input so that all are reported at once, each as
/// "file:line: key: what is wrong, what was expected".
/// </summary>
public sealed class InputErrors
{
    private readonly List<string> messages = new();
    private readonly List<string> warnings = new();

    public IReadOnlyList<string> Messages => messages;
    public IReadOnlyList<string> Warnings => warnings;
    public bool Any => messages.Count > 0;

    public void Add(string fileName, int line, string key, string message) =>
        messages.Add(key.Length > 0 ? $"{fileName}:{line}: {key}: {message}" : $"{fileName}:{line}: {message}");

    public void Warn(string fileName, int line, string key, string message) =>
        warnings.Add(key.Length > 0 ? $"{fileName}:{line}: {key}: {message}" : $"{fileName}:{line}: {message}");

    /// <summary>Throws one <see cref="InputException"/> listing every message, if there are any.</summary>
    public void ThrowIfAny()
    {
        if (messages.Count > 0) throw new InputException(messages);
    }
}
