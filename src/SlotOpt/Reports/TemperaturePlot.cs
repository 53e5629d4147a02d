using System.Globalization;
using ScottPlot;
using SlotOpt.Design;
using SlotOpt.Runs;

namespace SlotOpt.Reports;

/// <summary>
/// The temperature of the chosen plate below the reference plate (current design or baseline), each in its own panel
/// on true coordinates (the y axis is labelled per panel), on one colour scale in °C, with the hottest point marked,
/// from the run's coupled solves (<see cref="TemperatureMaps"/>).
/// </summary>
public static class TemperaturePlot
{
    public static string FileStemFor(int partIndex, PlatePart part) => $"temperature-{partIndex + 1}-{FileNames.Slug(part.Name)}";

    public static Figure Build(int partIndex, PlatePart part, TemperatureMaps maps, bool referenceIsCurrent)
    {
        var ci = CultureInfo.InvariantCulture;
        var panels = maps.Panels;
        var (min, max) = part.Outline.Bounds;
        double x0 = min.X * 1e3, y0 = min.Y * 1e3, widthMm = (max.X - min.X) * 1e3, heightMm = (max.Y - min.Y) * 1e3, gapMm = Math.Max(heightMm * 0.6, widthMm * 0.08);
        var plot = PlotStyle.NewPlot($"{part.Name}: temperature, {(referenceIsCurrent ? "current" : "baseline")} and chosen plate", "x (mm)", "y (mm), each panel from its own plate's edge");
        // the colour scale: ambient to the hotter plate's hottest point (a flat plate still gets a visible range)
        double low = maps.ScaleMinC, high = Math.Max(maps.ScaleMaxC, maps.ScaleMinC + 0.1);
        var ticks = new ScottPlot.TickGenerators.NumericManual();
        var step = NiceStep(heightMm);
        ScottPlot.Plottables.Heatmap? last = null;
        for (var k = 0; k < panels.Count; k++)
        {
            var shiftMm = (panels.Count - 1 - k) * (heightMm + gapMm);   // the reference on top
            var panel = panels[k];
            last = AddMap(plot, panel, shiftMm, low, high);
            DrawGeometry(plot, panel.Drawing, shiftMm);
            for (var y = Math.Ceiling(y0 / step) * step; y <= y0 + heightMm + 1e-9; y += step) ticks.AddMajor(y + shiftMm, y.ToString("0.#", ci));
            var marker = plot.Add.Marker(panel.HottestXMm, panel.HottestYMm + shiftMm, MarkerShape.OpenCircle, 12, PlotStyle.Black);
            marker.LineWidth = 2;
            var option = panel.Option;
            var who = panel.Role == DesignRole.Chosen ? "chosen" : referenceIsCurrent ? "current" : "baseline";
            var text = plot.Add.Text(string.Create(ci,
                $"{who}: {option.Description}\nhottest {panel.HottestC:0.#} °C (circled) at x {panel.HottestXMm:0} mm, y {panel.HottestYMm:0} mm; mean rise {panel.MeanRiseK:0.#} K"),
                x0, y0 + heightMm + shiftMm + gapMm * 0.08);
            text.LabelFontSize = 13;
            text.LabelFontName = PlotStyle.FontName;
            text.LabelAlignment = Alignment.LowerLeft;
        }
        plot.Axes.Left.TickGenerator = ticks;
        var bar = plot.Add.ColorBar(last!);
        bar.Label = "temperature (°C)";
        bar.LabelStyle.FontSize = 13;
        plot.Axes.SquareUnits();
        plot.Axes.SetLimits(x0 - widthMm * 0.02, x0 + widthMm * 1.02, y0 - heightMm * 0.1, y0 + heightMm + (panels.Count - 1) * (heightMm + gapMm) + gapMm * 0.8);
        var caption = "Steady temperature in the cooling medium, each plate's resistivity at its own local temperature (the coupled solve). "
            + string.Create(ci, $"Both plates share one colour scale, from the ambient {low:0.#} °C to the hotter plate's hottest point {maps.ScaleMaxC:0.#} °C")
            + (maps.LimitC is { } limit ? string.Create(ci, $"; the part's limit is {limit:0.#} °C") : "") + ". "
            + "Each panel's y axis reads from its own plate's lower edge; slots are drawn white with a black edge"
            + (part.Excitation.IsMoving ? "; under moving poles the heat is the mean over the travel positions." : ".");
        var heightPx = (int)Math.Clamp((PlotStyle.WidthPx - 200) * ((panels.Count * heightMm + (panels.Count - 0.2) * gapMm + 0.1 * heightMm) / (1.04 * widthMm)) + 110, 320, 1000);
        return PlotStyle.Render(plot, FileStemFor(partIndex, part), $"Temperature: {part.Name}", caption, heightPx: heightPx);
    }

    /// <summary>A tick step of 1, 2 or 5 times a power of ten giving three to six ticks over the plate's height.</summary>
    private static double NiceStep(double spanMm)
    {
        var raw = spanMm / 4;
        var power = Math.Pow(10, Math.Floor(Math.Log10(raw)));
        return new[] { 1.0, 2, 5, 10 }.Select(m => m * power).First(s => s >= raw);
    }

    private static ScottPlot.Plottables.Heatmap AddMap(Plot plot, TemperatureMaps.Panel panel, double shiftMm, double low, double high)
    {
        int ny = panel.YMm.Length, nx = panel.XMm.Length;
        double hx = nx > 1 ? panel.XMm[1] - panel.XMm[0] : 0, hy = ny > 1 ? panel.YMm[1] - panel.YMm[0] : 0;
        var heatmap = plot.Add.Heatmap(panel.TemperatureC);   // NaN off the metal: blank
        heatmap.FlipVertically = true;   // row 0 is the lowest y
        heatmap.Rectangle = new CoordinateRect(panel.XMm[0] - hx / 2, panel.XMm[^1] + hx / 2, panel.YMm[0] - hy / 2 + shiftMm, panel.YMm[^1] + hy / 2 + shiftMm);
        heatmap.Colormap = new ScottPlot.Colormaps.Inferno();
        heatmap.ManualRange = new ScottPlot.Range(low, high);
        heatmap.NaNCellColor = Colors.Transparent;
        return heatmap;
    }

    private static void DrawGeometry(Plot plot, PlateDrawing drawing, double shiftMm)
    {
        Coordinates[] Points(IReadOnlyList<Plates.Geometry.Vec2> vertices) => vertices.Select(v => new Coordinates(v.X * 1e3, v.Y * 1e3 + shiftMm)).ToArray();
        var outline = plot.Add.Polygon(Points(drawing.Outline));
        outline.FillColor = Colors.Transparent;
        outline.LineColor = PlotStyle.Black;
        outline.LineWidth = 1.5f;
        foreach (var slot in drawing.Slots)
        {
            var shape = plot.Add.Polygon(Points(slot));
            shape.FillColor = Colors.White;
            shape.LineColor = PlotStyle.Black;
            shape.LineWidth = 0.6f;
        }
        foreach (var groove in drawing.Grooves)
        {
            var shape = plot.Add.Polygon(Points(groove));
            shape.FillColor = Colors.Transparent;
            shape.LineColor = PlotStyle.Grey;
            shape.LineWidth = 1;
        }
    }
}
