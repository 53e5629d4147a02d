using System.Text.RegularExpressions;

namespace SlotOpt.Reports.Plots;

/// <summary>
/// SkiaSharp's SVG canvas names clip paths and embedded images from process-wide counters ("cl_16",
/// "img_2d"), so the same plot rendered second in a process gets other ids than when rendered first.
/// Renumbering them in order of first appearance ("cl-1", "img-1") makes an SVG depend on its plot alone.
/// </summary>
public static partial class SvgIds
{
    [GeneratedRegex(@"\b(cl|img)_[0-9a-f]+\b")]
    private static partial Regex CounterId();

    public static string Renumber(string svg)
    {
        var names = new Dictionary<string, string>(StringComparer.Ordinal);
        var perPrefix = new Dictionary<string, int>(StringComparer.Ordinal);
        return CounterId().Replace(svg, m =>
        {
            if (names.TryGetValue(m.Value, out var name)) return name;
            var prefix = m.Groups[1].Value;
            var n = perPrefix[prefix] = perPrefix.GetValueOrDefault(prefix) + 1;
            return names[m.Value] = $"{prefix}-{n}";
        });
    }
}
