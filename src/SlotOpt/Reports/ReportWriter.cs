using SlotOpt.Reports.Plots;
using SlotOpt.Runs;
using SlotOpt.Reports.Json;

namespace SlotOpt.Reports;

/// <summary>
/// Writes a report into a folder, atomically: index.html and summary.md (one <see cref="ReportDocument"/> rendered twice), result.json,
/// every plot as PNG and SVG, and for a run candidates.csv. Two kinds: a finished run (`slotopt run FILE --out DIR`; result.json is
/// <see cref="ResultJson"/>, the document `run --json` prints) and one plate (`slotopt plate FILE --out DIR`; <see cref="PlateJson"/>,
/// as `plate --json` prints it). Reads the finished evaluation only; the one line that changes between runs is <see cref="ReportStamp"/>.
/// </summary>
public static class ReportWriter
{
    public const string HtmlFile = "index.html";
    public const string MarkdownFile = "summary.md";
    public const string CandidatesFile = "candidates.csv";
    public const string JsonFile = "result.json";

    /// <summary>The report of a finished run.</summary>
    public static void Write(RunResult r, DateTimeOffset generatedAt, ReportFolder folder)
    {
        var figures = ReportFigures.Of(r);
        Write(folder, [(JsonFile, ResultJson.From(r).Serialize()), (CandidatesFile, CandidatesCsv.Write(r))], figures.All,
            ReportContent.Build(r, figures, ReportStamp.Line(r, generatedAt)));
    }

    /// <summary>The report of one plate, with the numbers its plots show (<see cref="PlateFigures"/>, computed by the caller).</summary>
    public static void Write(PlateFileEvaluation evaluation, PlateFigures figures, DateTimeOffset generatedAt, ReportFolder folder)
    {
        var plots = PlateReportFigures.Of(figures, Path.GetFileNameWithoutExtension(evaluation.Case.Path), evaluation.Case.MovingSource is not null);
        Write(folder, [(JsonFile, PlateJson.From(evaluation).Serialize())], plots.All,
            PlateReportContent.Build(evaluation, figures, plots, ReportStamp.Line(evaluation, generatedAt)));
    }

    /// <summary>The data files, every figure's two images, the document as Markdown and HTML; then the folder is moved into place.</summary>
    private static void Write(ReportFolder folder, IReadOnlyList<(string FileName, string Text)> dataFiles, IEnumerable<Figure> figures, ReportDocument document)
    {
        foreach (var (fileName, text) in dataFiles) folder.WriteText(fileName, text);
        foreach (var figure in figures)
        {
            folder.WriteBytes(figure.PngFileName, figure.Png);
            folder.WriteText(figure.SvgFileName, figure.Svg);
        }
        folder.WriteText(MarkdownFile, MarkdownRenderer.Render(document));
        folder.WriteText(HtmlFile, HtmlRenderer.Render(document));
        folder.Commit();
    }
}
