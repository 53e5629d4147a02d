namespace SlotOpt.Input;

/// <summary>Reads a user's input file; a missing or unreadable file is an <see cref="InputException"/> naming it.</summary>
public static class InputFile
{
    /// <param name="what">The file's role in words, e.g. "problem file", "waveform file".</param>
    public static string ReadAllText(string path, string what)
    {
        try { return File.ReadAllText(path); }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException or ArgumentException or NotSupportedException)
        {
            throw new InputException($"{path}: cannot read the {what} ({e.Message})");
        }
    }
}
