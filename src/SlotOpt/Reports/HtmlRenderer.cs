using SlotOpt.Reports.Plots;
using System.Globalization;
using System.Net;
using System.Text;

namespace SlotOpt.Reports;

/// <summary>
/// index.html: one self-contained page. Plots are embedded as PNG data URIs (no file, font or script
/// is fetched), the style sheet is inline, and the only links point to the files beside it. The trade-off's
/// points name their designs when pointed at (an inline SVG layer of titled circles; no script).
/// </summary>
public static class HtmlRenderer
{
    private const string Style = """
        body { font-family: "DejaVu Sans", Verdana, sans-serif; max-width: 960px; margin: 2em auto; padding: 0 1em; color: #1a1a1a; line-height: 1.45; }
        h1 { font-size: 1.6em; margin-bottom: 0.2em; }
        h2 { font-size: 1.25em; margin-top: 1.8em; border-bottom: 1px solid #bbb; padding-bottom: 0.15em; }
        p.stamp { color: #555; font-size: 0.9em; margin-top: 0; }
        p.verdict { font-size: 1.08em; font-weight: bold; background: #eef5fb; border-left: 4px solid #0072B2; padding: 0.5em 0.8em; margin: 0.6em 0 0; }
        table { border-collapse: collapse; margin: 0.8em 0; font-size: 0.92em; }
        th, td { border: 1px solid #c8c8c8; padding: 0.25em 0.55em; vertical-align: top; }
        th { background: #f0f0f0; text-align: left; }
        td.num { text-align: right; font-variant-numeric: tabular-nums; white-space: nowrap; }
        figure { margin: 1.2em 0; }
        figure img { max-width: 100%; height: auto; border: 1px solid #ddd; }
        figcaption { font-size: 0.9em; color: #333; }
        div.pointable { position: relative; display: inline-block; max-width: 100%; }
        div.pointable img { display: block; }
        svg.tips { position: absolute; left: 1px; top: 1px; width: calc(100% - 2px); height: calc(100% - 2px); }
        svg.tips circle { fill: transparent; stroke: none; pointer-events: all; cursor: help; }
        svg.tips circle:hover { stroke: #D55E00; stroke-width: 3; }
        """;

    public static string Render(ReportDocument document)
    {
        var s = new StringBuilder();
        s.Append("<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n<meta charset=\"utf-8\">\n");
        s.Append("<meta http-equiv=\"Content-Security-Policy\" content=\"default-src 'none'; img-src data:; style-src 'unsafe-inline'\">\n");
        s.Append("<title>").Append(E(document.Title)).Append("</title>\n<style>\n").Append(Style).Append("</style>\n</head>\n<body>\n");
        s.Append("<h1>").Append(E(document.Title)).Append("</h1>\n");
        foreach (var block in document.Blocks)
        {
            switch (block)
            {
                case Heading h: s.Append("<h2>").Append(E(h.Text)).Append("</h2>\n"); break;
                case Paragraph p: s.Append("<p>").Append(E(p.Text)).Append("</p>\n"); break;
                case StampLine t: s.Append("<p class=\"stamp\">").Append(E(t.Text)).Append("</p>\n"); break;
                case Verdict v: s.Append("<p class=\"verdict\" id=\"verdict\">").Append(E(v.Text)).Append("</p>\n"); break;
                case BulletList l:
                    s.Append("<ul>\n");
                    foreach (var item in l.Items) s.Append("<li>").Append(E(item)).Append("</li>\n");
                    s.Append("</ul>\n");
                    break;
                case Table t:
                    s.Append("<table>\n<tr>");
                    foreach (var h in t.Header) s.Append("<th>").Append(E(h)).Append("</th>");
                    s.Append("</tr>\n");
                    foreach (var row in t.Rows)
                    {
                        s.Append("<tr>");
                        for (var i = 0; i < row.Count; i++)
                            s.Append(t.RightAligned[i] ? "<td class=\"num\">" : "<td>").Append(E(row[i]).Replace("\n", "<br>")).Append("</td>");
                        s.Append("</tr>\n");
                    }
                    s.Append("</table>\n");
                    break;
                case FigureBlock f:
                    s.Append("<figure>\n");
                    if (f.Figure.Tips is { } tips) s.Append("<div class=\"pointable\">\n");
                    s.Append("<img alt=\"").Append(E(f.Figure.Title)).Append("\" src=\"data:image/png;base64,")
                        .Append(Convert.ToBase64String(f.Figure.Png)).Append("\">\n");
                    if (f.Figure.Tips is { } points) AppendTips(s, points);
                    s.Append("<figcaption>").Append(E(f.Figure.Caption)).Append(" Files: <a href=\"").Append(E(f.Figure.PngFileName)).Append("\">PNG</a>, <a href=\"")
                        .Append(E(f.Figure.SvgFileName)).Append("\">SVG</a>.</figcaption>\n</figure>\n");
                    break;
                default: throw new ArgumentOutOfRangeException(nameof(document), block.GetType().Name, "unknown report block");
            }
        }
        s.Append("</body>\n</html>\n");
        return s.ToString();
    }

    /// <summary>
    /// An SVG layer over the image, scaled with it (same viewBox as the image's pixels): one circle a point, whose
    /// title the browser shows when the pointer rests on it. No script, so the page stays a still, offline file.
    /// </summary>
    private static void AppendTips(StringBuilder s, PointTips tips)
    {
        s.Append(CultureInfo.InvariantCulture, $"<svg class=\"tips\" viewBox=\"0 0 {tips.WidthPx} {tips.HeightPx}\" preserveAspectRatio=\"none\">\n");
        foreach (var (x, y, text) in tips.Points)
            s.Append(CultureInfo.InvariantCulture, $"<circle cx=\"{x:0.#}\" cy=\"{y:0.#}\" r=\"9\"><title>").Append(E(text)).Append("</title></circle>\n");
        s.Append("</svg>\n</div>\n");
    }

    private static string E(string text) => WebUtility.HtmlEncode(text);
}
