using System.Text;

namespace SlotOpt.Reports;

/// <summary>summary.md: the report as Markdown, plots linked as the PNG files beside it.</summary>
public static class MarkdownRenderer
{
    public static string Render(ReportDocument document)
    {
        var s = new StringBuilder();
        s.Append("# ").Append(Escape(document.Title)).Append('\n');
        foreach (var block in document.Blocks)
        {
            s.Append('\n');
            switch (block)
            {
                case Heading h: s.Append("## ").Append(Escape(h.Text)).Append('\n'); break;
                case Paragraph p: s.Append(Escape(p.Text)).Append('\n'); break;
                case StampLine t: s.Append('_').Append(Escape(t.Text)).Append("_\n"); break;
                case BulletList l: foreach (var item in l.Items) s.Append("- ").Append(Escape(item)).Append('\n'); break;
                case Table t:
                    s.Append("| ").Append(string.Join(" | ", t.Header.Select(Cell))).Append(" |\n");
                    s.Append('|').Append(string.Join('|', t.RightAligned.Select(r => r ? "---:" : "---"))).Append("|\n");
                    foreach (var row in t.Rows) s.Append("| ").Append(string.Join(" | ", row.Select(Cell))).Append(" |\n");
                    break;
                case FigureBlock f:
                    s.Append("![").Append(Escape(f.Figure.Title)).Append("](").Append(f.Figure.PngFileName).Append(")\n\n");
                    s.Append(Escape(f.Figure.Caption)).Append($" ([SVG]({f.Figure.SvgFileName}))\n");
                    break;
                default: throw new ArgumentOutOfRangeException(nameof(document), block.GetType().Name, "unknown report block");
            }
        }
        return s.ToString();
    }

    /// <summary>Markdown's active characters in running text, backslash-escaped.</summary>
    private static string Escape(string text)
    {
        var s = new StringBuilder(text.Length);
        foreach (var c in text)
        {
            if (c is '\\' or '*' or '_' or '`' or '[' or ']' or '<' or '>' or '#' or '|') s.Append('\\');
            s.Append(c);
        }
        return s.ToString();
    }

    /// <summary>A table cell: Markdown tables cannot break a line inside a cell, so the lines of a cell are joined by "; ".</summary>
    private static string Cell(string text) => Escape(text).Replace("\n", "; ");
}
