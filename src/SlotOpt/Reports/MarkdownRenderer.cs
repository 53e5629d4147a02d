using SlotOpt.Reports.Plots;
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
                case Verdict v: s.Append("**").Append(Escape(v.Text)).Append("**\n"); break;
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

    /// <summary>
    /// Markdown's active characters in running text, backslash-escaped only where they would act (CommonMark 0.31,
    /// J. MacFarlane, 2024: an underscore inside a word opens no emphasis (section 6.2), brackets make a link only
    /// as "](", "][" or "]:" (sections 6.3, 4.7), # and &gt; act only at the start of a line, &lt; opens a tag or an
    /// autolink only before a letter, "/", "!" or "?" (sections 6.5, 6.6); a pipe acts only inside a table row
    /// (GitHub Flavored Markdown 0.29, section 4.10)), so that "parts[1].peak_flux_density" and "Rm &lt;= 0.1" read
    /// as written in the plain text too.
    /// </summary>
    private static string Escape(string text, bool inTable = false)
    {
        var s = new StringBuilder(text.Length);
        for (var i = 0; i < text.Length; i++)
        {
            var c = text[i];
            var previous = i > 0 ? text[i - 1] : ' ';
            var next = i + 1 < text.Length ? text[i + 1] : ' ';
            var acts = c switch
            {
                '\\' or '*' or '`' => true,
                '<' => char.IsAsciiLetter(next) || next is '/' or '!' or '?',
                '|' => inTable,
                '_' => !(char.IsLetterOrDigit(previous) && char.IsLetterOrDigit(next)),
                ']' => next is '(' or '[' or ':',
                '#' or '>' => i == 0,
                _ => false,
            };
            if (acts) s.Append('\\');
            s.Append(c);
        }
        return s.ToString();
    }

    /// <summary>A table cell: Markdown tables cannot break a line inside a cell, so the lines of a cell are joined by "; ".</summary>
    private static string Cell(string text) => Escape(text, inTable: true).Replace("\n", "; ");
}
