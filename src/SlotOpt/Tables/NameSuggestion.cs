namespace SlotOpt.Tables;

/// <summary>Finds the nearest valid name to a misspelt one (Levenshtein distance, case-blind).</summary>
public static class NameSuggestion
{
    /// <summary>" (did you mean X?)" when a close name exists, else "".</summary>
    public static string DidYouMean(string given, IEnumerable<string> valid)
    {
        var best = Nearest(given, valid);
        return best is null ? "" : $" (did you mean {best}?)";
    }

    public static string? Nearest(string given, IEnumerable<string> valid)
    {
        string? best = null;
        var bestDistance = int.MaxValue;
        foreach (var name in valid)
        {
            var d = Distance(given.ToLowerInvariant(), name.ToLowerInvariant());
            if (d < bestDistance) { bestDistance = d; best = name; }
        }
        // Accept a suggestion only when it is closer than half the name's length.
        return best is not null && bestDistance <= Math.Max(2, given.Length / 2) ? best : null;
    }

    private static int Distance(string a, string b)
    {
        var previous = new int[b.Length + 1];
        var current = new int[b.Length + 1];
        for (var j = 0; j <= b.Length; j++) previous[j] = j;
        for (var i = 1; i <= a.Length; i++)
        {
            current[0] = i;
            for (var j = 1; j <= b.Length; j++)
            {
                var cost = a[i - 1] == b[j - 1] ? 0 : 1;
                current[j] = Math.Min(Math.Min(current[j - 1] + 1, previous[j] + 1), previous[j - 1] + cost);
            }
            (previous, current) = (current, previous);
        }
        return previous[b.Length];
    }
}
