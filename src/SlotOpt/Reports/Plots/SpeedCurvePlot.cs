using SlotOpt.Tables;
using SlotOpt.Runs;

namespace SlotOpt.Reports.Plots;

/// <summary>
/// A force or torque against speed (<see cref="SpeedCurve"/>: a neutral series, whatever sweep made it): the points marked
/// and joined, one colour a model (where the models differ along the sweep), and the peak marked where the curve has one.
/// Linear axes, so a value proportional to speed reads as the straight line it is.
/// </summary>
public static class SpeedCurvePlot
{
    public const string FileStem = "speed-curve";

    public static Figure Build(SpeedCurve curve)
    {
        var speeds = curve.Points.Select(p => p.Speed).ToArray();
        var values = curve.Points.Select(p => p.Value).ToArray();
        var plot = PlotStyle.NewPlot($"{Capitalised(curve.ValueName)} against {curve.SpeedName}", $"{curve.SpeedName} ({curve.SpeedUnit})", $"{curve.ValueName} ({curve.ValueUnit})");
        var line = plot.Add.ScatterLine(speeds, values);
        line.Color = PlotStyle.Grey;
        line.LineWidth = 1.5f;
        line.LegendText = $"{curve.ValueName}, the line between points only guides the eye";
        var models = curve.Points.Select(p => p.Model).Distinct().ToList();
        for (var k = 0; k < models.Count; k++)
        {
            var ofModel = curve.Points.Where(p => p.Model == models[k]).ToList();
            var marks = plot.Add.Markers(ofModel.Select(p => p.Speed).ToArray(), ofModel.Select(p => p.Value).ToArray(), ScottPlot.MarkerShape.FilledCircle, 8, PlotStyle.Series[k % PlotStyle.Series.Count]);
            marks.LegendText = $"evaluated: {models[k]}";
        }
        if (curve.Peak is { } peak)
        {
            var mark = plot.Add.Marker(peak.Speed, peak.Value, ScottPlot.MarkerShape.OpenCircle, 18, PlotStyle.Black);
            mark.LegendText = $"peak {Numbers.Of(peak.Value, curve.ValueUnit)} at {Numbers.Of(peak.Speed, curve.SpeedUnit)}";
        }
        plot.Axes.SetLimits(0, speeds.Max() * 1.03, Math.Min(0, values.Min() * 1.1), values.Max() * 1.15);
        var legendPx = PlotStyle.LegendBelow(plot);
        var caption = $"{Capitalised(curve.ValueName)} at {curve.Points.Count} speeds, each point from the model its colour names; "
            + (curve.Peak is { } p ? $"it peaks at {Numbers.Of(p.Value, curve.ValueUnit)} near {Numbers.Of(p.Speed, curve.SpeedUnit)}." : "it has no peak within the speeds evaluated.")
            + " Not a brake rating: braking and load-holding uses need a certified safety analysis.";
        return PlotStyle.Render(plot, FileStem, $"{Capitalised(curve.ValueName)} against {curve.SpeedName}", caption, heightPx: PlotStyle.HeightPx + legendPx);
    }

    private static string Capitalised(string text) => text.Length == 0 ? text : char.ToUpperInvariant(text[0]) + text[1..];
}
