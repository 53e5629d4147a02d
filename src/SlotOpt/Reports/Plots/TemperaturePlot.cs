using SlotOpt.Design.SolidParts;
using System.Globalization;
using ScottPlot;
using SlotOpt.Tables;
using SlotOpt.Design;
using SlotOpt.Runs;

namespace SlotOpt.Reports.Plots;

/// <summary>
/// The temperature of the reference plate (current design or baseline) above the chosen plate, each in its own panel
/// on the plate's true coordinates (mm), one colour scale in °C for both (the bar beside the lower panel), with the
/// hottest point marked, from the run's coupled solves (<see cref="TemperatureMaps"/>).
/// </summary>
public static class TemperaturePlot
{
    public static string FileStemFor(int partIndex, PlatePart part) => $"temperature-{partIndex + 1}-{FileNames.Slug(part.Name)}";

    /// <summary>The fixed margins of every panel (pixels): the y axis on the left, the colour bar on the right, a two-line title on top, the x axis below.</summary>
    private static readonly PixelPadding Margins = new(left: 80, right: 170, bottom: 55, top: 70);

    /// <summary>Pixels between the plate's outline and the panel's frame: more than the hottest-point circle's radius (6 px) and its line.</summary>
    private const int ClearancePx = 10;
    private const float HottestCircleDiameterPx = 12;

    public static Figure Build(int partIndex, PlatePart part, TemperatureMaps maps, bool referenceIsCurrent)
    {
        var panels = maps.Panels;
        var (min, max) = part.Outline.Bounds;
        double widthMm = (max.X - min.X) * 1e3, heightMm = (max.Y - min.Y) * 1e3;
        var dataWidthPx = PlotStyle.WidthPx - Margins.Left - Margins.Right;
        var dataHeightPx = (int)Math.Clamp(dataWidthPx * heightMm / widthMm + 2 * ClearancePx, 60, 420);   // square units where the clamp allows
        // room round the plate for the hottest-point circle, which may sit on the outline
        double xPad = ClearancePx * widthMm / (dataWidthPx - 2 * ClearancePx), yPad = ClearancePx * heightMm / (dataHeightPx - 2 * ClearancePx);
        double xLow = min.X * 1e3 - xPad, xHigh = max.X * 1e3 + xPad, yLow = min.Y * 1e3 - yPad, yHigh = max.Y * 1e3 + yPad;
        var panelHeightPx = (int)(dataHeightPx + Margins.Top + Margins.Bottom);
        // the colour scale: ambient to the hotter plate's hottest point (a flat plate still gets a visible range)
        double low = maps.ScaleMinC, high = Math.Max(maps.ScaleMaxC, maps.ScaleMinC + 0.1);
        var plots = new List<Plot>();
        for (var k = 0; k < panels.Count; k++)
        {
            var panel = panels[k];
            var option = panel.Option;
            var who = panel.Role == DesignRole.Chosen ? "chosen" : referenceIsCurrent ? "current" : "baseline";
            var plot = PlotStyle.NewPlot(string.Create(CultureInfo.InvariantCulture,
                $"{who}: {option.Description}\nhottest {panel.HottestC:0.0} °C (circled) at x {Numbers.Of(panel.HottestXMm, "mm")}, y {Numbers.Of(panel.HottestYMm, "mm")}; mean rise {Numbers.Kelvin(panel.MeanRiseK)}"), "x (mm)", "y (mm)");
            plot.Axes.Title.Label.FontSize = 13;
            var heatmap = AddMap(plot, panel, low, high);
            PlateOutlineLayer.Draw(plot, panel.Drawing);
            var marker = plot.Add.Marker(panel.HottestXMm, panel.HottestYMm, MarkerShape.OpenCircle, HottestCircleDiameterPx, PlotStyle.Black);
            marker.LineWidth = 2;
            plot.Axes.SetLimits(xLow, xHigh, yLow, yHigh);
            plot.Layout.Fixed(Margins);
            if (k == panels.Count - 1)
            {
                var bar = plot.Add.ColorBar(heatmap);
                bar.Label = "temperature (°C)";
                bar.LabelStyle.FontSize = 13;
            }
            plots.Add(plot);
        }
        var caption = "Steady temperature in the cooling medium, each plate's resistivity at its own local temperature (the coupled solve). "
            + string.Create(CultureInfo.InvariantCulture, $"Both plates share one colour scale (the bar beside the lower panel), from the ambient {low:0.0} °C to the hotter plate's hottest point {maps.ScaleMaxC:0.0} °C")
            + (maps.LimitC is { } limit ? string.Create(CultureInfo.InvariantCulture, $"; the part's limit is {limit:0.0} °C") : "") + ". "
            + "Slots are drawn white with a black edge"
            + (part.Excitation.IsMoving ? "; under moving poles the heat is the mean over the travel positions." : ".");
        return PlotStyle.RenderPanels(plots, FileStemFor(partIndex, part), $"Temperature: {part.Name}", caption, panelHeightPx);
    }

    private static ScottPlot.Plottables.Heatmap AddMap(Plot plot, TemperatureMaps.Panel panel, double low, double high)
    {
        int ny = panel.YMm.Length, nx = panel.XMm.Length;
        double hx = nx > 1 ? panel.XMm[1] - panel.XMm[0] : 0, hy = ny > 1 ? panel.YMm[1] - panel.YMm[0] : 0;
        var heatmap = plot.Add.Heatmap(panel.TemperatureC);   // NaN off the metal: blank
        heatmap.FlipVertically = true;   // row 0 is the lowest y
        heatmap.Rectangle = new CoordinateRect(panel.XMm[0] - hx / 2, panel.XMm[^1] + hx / 2, panel.YMm[0] - hy / 2, panel.YMm[^1] + hy / 2);
        heatmap.Colormap = new ScottPlot.Colormaps.Inferno();
        heatmap.ManualRange = new ScottPlot.Range(low, high);
        heatmap.NaNCellColor = Colors.Transparent;
        return heatmap;
    }
}
