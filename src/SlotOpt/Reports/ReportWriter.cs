using SlotOpt.Reports.Plots;
using SlotOpt.Runs;
using SlotOpt.Reports.Json;

namespace SlotOpt.Reports;

/// <summary>
/// Writes the report of a finished run into a folder, atomically: index.html, summary.md, candidates.csv,
/// result.json (<see cref="ResultJson"/>, the document `run --json` prints) and every plot as PNG and SVG.
/// Reads the run only; the one line that changes between runs is <see cref="ReportStamp"/>.
/// </summary>
public static class ReportWriter
{
    public const string HtmlFile = "index.html";
    public const string MarkdownFile = "summary.md";
    public const string CandidatesFile = "candidates.csv";
    public const string JsonFile = "result.json";

    public static void Write(RunResult r, DateTimeOffset generatedAt, ReportFolder folder)
    {
        folder.WriteText(JsonFile, ResultJson.From(r).Serialize());
        folder.WriteText(CandidatesFile, CandidatesCsv.Write(r));
        var figures = ReportFigures.Of(r);
        foreach (var figure in figures.All)
        {
            folder.WriteBytes(figure.PngFileName, figure.Png);
            folder.WriteText(figure.SvgFileName, figure.Svg);
        }
        var document = ReportContent.Build(r, figures, ReportStamp.Line(r, generatedAt));
        folder.WriteText(MarkdownFile, MarkdownRenderer.Render(document));
        folder.WriteText(HtmlFile, HtmlRenderer.Render(document));
        folder.Commit();
    }
}
