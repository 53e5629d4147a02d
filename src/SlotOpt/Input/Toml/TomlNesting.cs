namespace SlotOpt.Input.Toml;

/// <summary>
/// Finds the first line where TOML arrays and inline tables ("[" and "{" outside strings and comments) nest
/// deeper than a limit, before the text reaches the parser: its own limit ends in an exception with no line.
/// </summary>
public static class TomlNesting
{
    /// <summary>The (1-based) line where the nesting first passes maxDepth, or null when it never does.</summary>
    public static int? FirstLineDeeperThan(string text, int maxDepth)
    {
        int depth = 0, line = 1;
        for (var i = 0; i < text.Length; i++)
        {
            var c = text[i];
            switch (c)
            {
                case '\n': line++; break;
                case '#': i = SkipUntil(text, i + 1, "\n", escapes: false, ref line) - 1; break;   // the newline itself is counted on the next pass
                case '"' or '\'':
                    var triple = i + 2 < text.Length && text[i + 1] == c && text[i + 2] == c;
                    var close = triple ? new string(c, 3) : c.ToString();
                    i = SkipUntil(text, i + close.Length, close, escapes: c == '"', ref line) + close.Length - 1;
                    break;
                case '[' or '{':
                    if (++depth > maxDepth) return line;
                    break;
                case ']' or '}':
                    depth = Math.Max(0, depth - 1);
                    break;
            }
        }
        return null;
    }

    /// <summary>Index of the next closing sequence from start (text.Length when there is none), counting the lines passed.</summary>
    private static int SkipUntil(string text, int start, string closing, bool escapes, ref int line)
    {
        for (var i = start; i < text.Length; i++)
        {
            if (escapes && text[i] == '\\') { if (i + 1 < text.Length && text[i + 1] == '\n') line++; i++; continue; }
            if (string.CompareOrdinal(text, i, closing, 0, closing.Length) == 0) return i;
            if (text[i] == '\n')
            {
                if (closing.Length == 1) return i;   // a one-line string or comment ends at the line's end at the latest
                line++;
            }
        }
        return text.Length;
    }
}
