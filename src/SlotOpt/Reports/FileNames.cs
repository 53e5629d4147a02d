namespace SlotOpt.Reports;

/// <summary>File-name pieces made from part names: lower case letters, digits and hyphens only.</summary>
public static class FileNames
{
    public static string Slug(string name)
    {
        var chars = name.ToLowerInvariant().Select(c => char.IsAsciiLetterOrDigit(c) ? c : '-').ToArray();
        var slug = string.Join('-', new string(chars).Split('-', StringSplitOptions.RemoveEmptyEntries));
        return slug.Length > 0 ? slug : "part";
    }
}
