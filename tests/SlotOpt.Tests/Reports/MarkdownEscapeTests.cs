using SlotOpt.Reports;

namespace SlotOpt.Tests.Reports;

/// <summary>
/// Issue 17: summary.md without stray escapes. Rules from CommonMark 0.31 (J. MacFarlane, 2024): an underscore
/// between two alphanumerics opens no emphasis (section 6.2, rule for "_"); "[1]" with no following "(" , "[" or
/// ":" is not a link (sections 6.3 and 4.7); "<" opens a tag only before a letter, "/", "!" or "?" (sections 6.5, 6.6);
/// a pipe outside a table row is text (GitHub Flavored Markdown 0.29, section 4.10); "*" always may act, so it stays
/// escaped. Exact strings.
/// </summary>
public class MarkdownEscapeTests
{
    private static string Paragraph(string text) =>
        MarkdownRenderer.Render(new ReportDocument("t", [new Paragraph(text)])).Split('\n').Last(l => l.Length > 0);

    [Theory]
    [InlineData("parts[1].peak_flux_density: above the knee", "parts[1].peak_flux_density: above the knee")]
    [InlineData("a *bold* claim", "a \\*bold\\* claim")]
    [InlineData("_leading underscore", "\\_leading underscore")]
    [InlineData("[x](y)", "[x\\](y)")]
    [InlineData("# not a heading", "\\# not a heading")]
    [InlineData("2 < 3 | 4", "2 < 3 | 4")]
    [InlineData("Rm = 0.0553 <= 0.1", "Rm = 0.0553 <= 0.1")]
    [InlineData("a <b> tag", "a \\<b> tag")]
    public void Only_characters_that_would_act_are_escaped(string text, string expected) =>
        Assert.Equal(expected, Paragraph(text));
}
