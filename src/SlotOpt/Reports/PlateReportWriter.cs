using SlotOpt.Reports.Plots;
using SlotOpt.Runs;

namespace SlotOpt.Reports;

/// <summary>
/// Writes the report of one plate (`slotopt plate FILE --out DIR`) into a folder, atomically: index.html, summary.md,
/// result.json (the document `slotopt plate --json` prints, given by the caller) and every plot as PNG and SVG.
/// Reads the evaluation only; the one line that changes between runs is the stamp.
/// </summary>
public static class PlateReportWriter
{
    public static void Write(PlateFileEvaluation evaluation, PlateFigures figures, string resultJson, DateTimeOffset generatedAt, ReportFolder folder)
    {
        folder.WriteText(ReportWriter.JsonFile, resultJson);
        var plots = PlateReportFigures.Of(figures, Path.GetFileNameWithoutExtension(evaluation.Case.Path), evaluation.Case.MovingSource is not null);
        foreach (var figure in plots.All)
        {
            folder.WriteBytes(figure.PngFileName, figure.Png);
            folder.WriteText(figure.SvgFileName, figure.Svg);
        }
        var document = PlateReportContent.Build(evaluation, figures, plots, PlateReportContent.StampLine(evaluation, generatedAt));
        folder.WriteText(ReportWriter.MarkdownFile, MarkdownRenderer.Render(document));
        folder.WriteText(ReportWriter.HtmlFile, HtmlRenderer.Render(document));
        folder.Commit();
    }
}
