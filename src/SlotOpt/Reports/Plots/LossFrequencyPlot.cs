using System.Globalization;
using ScottPlot;
using SlotOpt.Tables;
using SlotOpt.Design;
using SlotOpt.Design.Cores;
using SlotOpt.Runs;

namespace SlotOpt.Reports.Plots;

/// <summary>Loss of one core part against frequency per candidate gauge, on log-log axes, with the operating frequency and the crossings marked.</summary>
public static class LossFrequencyPlot
{
    public static string FileStemFor(int partIndex, CorePart part) => $"loss-frequency-{partIndex + 1}-{FileNames.Slug(part.Name)}";

    public static Figure Build(int partIndex, LossFrequencyCurves curves, string? chosenGrade)
    {
        var part = curves.Part;
        var f0 = part.Flux.FundamentalHz;
        var plot = PlotStyle.NewPlot($"{part.Name}: core loss against frequency, one line per grade", "frequency (Hz, log scale)", "core loss of the part (W, log scale)");
        var x = LogAxis.Log10(curves.FrequenciesHz);
        for (var i = 0; i < curves.Curves.Count; i++)
        {
            var c = curves.Curves[i];
            var line = plot.Add.ScatterLine(x, LogAxis.Log10(c.LossW));
            line.Color = PlotStyle.Series[i % PlotStyle.Series.Count];
            line.LineWidth = c.Grade == chosenGrade ? 4 : 2;
            line.LegendText = $"core loss with {c.Grade} ({Numbers.Sig(c.GaugeMm)} mm gauge){(c.Grade == chosenGrade ? ", the chosen grade" : "")}";
        }
        var operating = plot.Add.VerticalLine(Math.Log10(f0), 1.5f, PlotStyle.Black);
        operating.LegendText = $"operating frequency {Numbers.Of(f0, "Hz")}";
        if (curves.Crossings.Count > 0)
        {
            var marks = plot.Add.Markers(LogAxis.Log10(curves.Crossings.Select(c => c.FrequencyHz)), LogAxis.Log10(curves.Crossings.Select(c => c.LossW)), MarkerShape.OpenCircle, 11, PlotStyle.Black);
            marks.LegendText = "where one grade overtakes another";
        }
        LogAxis.Apply(plot.Axes.Bottom, curves.FrequenciesHz);
        LogAxis.Apply(plot.Axes.Left, curves.Curves.SelectMany(c => c.LossW));
        var legendPx = PlotStyle.LegendBelow(plot);
        var caption = string.Create(CultureInfo.InvariantCulture,
            $"The part's own flux waveform (peak {Numbers.Of(part.Flux.PeakT, "T")}, {(part.Flux.IsSinusoidal ? "sine" : "non-sinusoidal")}) moved to each frequency, times each grade's steel mass in the part; same temperature and feature width. ")
            + (curves.Crossings.Count > 0 ? "Open circles mark where two curves cross; the list below says which grade loses less above each crossing." : "No two curves cross in this range: the order of the grades holds from a tenth to ten times the operating frequency.");
        return PlotStyle.Render(plot, FileStemFor(partIndex, part), $"Loss against frequency: {part.Name}", caption, heightPx: PlotStyle.HeightPx + legendPx);
    }
}
