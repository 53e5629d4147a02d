namespace SlotOpt.Input;

/// <summary>
/// Collects every mistake found in one input so that all are reported at once, each as
/// "file:line: key: what is wrong, what was expected".
/// </summary>
public sealed class InputErrors
{
    private readonly List<InputError> errors = new();
    private readonly List<string> warnings = new();

    /// <summary>Each mistake as printed: "file:line: key: message".</summary>
    public IReadOnlyList<string> Messages => errors.Select(e => e.ToString()).ToList();
    public IReadOnlyList<string> Warnings => warnings;
    public bool Any => errors.Count > 0;

    public void Add(string fileName, int line, string key, string message) =>
        errors.Add(new InputError(fileName, line, key.Length > 0 ? key : null, message));

    public void Warn(string fileName, int line, string key, string message) =>
        warnings.Add(new InputError(fileName, line, key.Length > 0 ? key : null, message).ToString());

    /// <summary>Throws one <see cref="InputException"/> listing every message in line order (stable within a line), if there are any.</summary>
    public void ThrowIfAny()
    {
        if (errors.Count > 0) throw new InputException(errors.OrderBy(e => e.File, StringComparer.Ordinal).ThenBy(e => e.Line).ToList());   // in line order, as the file reads
    }
}
