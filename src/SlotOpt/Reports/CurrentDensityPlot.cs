using System.Globalization;
using ScottPlot;
using SlotOpt.Design;
using SlotOpt.Plates.Geometry;
using SlotOpt.Plates.ResistanceLimited;
using SlotOpt.Runs;

namespace SlotOpt.Reports;

/// <summary>
/// Current density in the chosen plate beside (above) the solid plate cut from the same sheet, on one colour
/// scale, with the outline and the slots drawn, from the maps the run computed (<see cref="CurrentDensityMaps"/>).
/// </summary>
public static class CurrentDensityPlot
{
    public static string FileStemFor(int partIndex, PlatePart part) => $"current-density-{partIndex + 1}-{FileNames.Slug(part.Name)}";

    public static Figure Build(int partIndex, PlatePart part, CurrentDensityMaps maps)
    {
        var panels = maps.Panels;
        var peakAPerMm2 = panels.Max(p => p.PeakAPerM2) / 1e6;

        var (min, max) = part.Outline.Bounds;
        double widthMm = (max.X - min.X) * 1e3, heightMm = (max.Y - min.Y) * 1e3, gapMm = Math.Max(heightMm * 0.6, widthMm * 0.08);
        var plot = PlotStyle.NewPlot($"{part.Name}: current density, chosen plate and solid plate", "x (mm)", "y (mm)");
        ScottPlot.Plottables.Heatmap? last = null;
        for (var k = 0; k < panels.Count; k++)
        {
            var shiftMm = (panels.Count - 1 - k) * (heightMm + gapMm);   // the solid plate on top
            var panel = panels[k];
            last = AddMap(plot, panel.Map, shiftMm, peakAPerMm2);
            DrawGeometry(plot, panel.Drawing, shiftMm);
            var option = panel.Option;
            var text = plot.Add.Text(string.Create(CultureInfo.InvariantCulture,
                $"{Label(panel.Role)}: {option.Description}\nloss {option.Loss.TotalW:0.##} W{(option.DragN is { } d ? $", drag {d:0.##} N" : "")}, peak {panel.PeakAPerM2 / 1e6:0.##} A/mm²"),
                min.X * 1e3, max.Y * 1e3 + shiftMm + gapMm * 0.08);
            text.LabelFontSize = 13;
            text.LabelFontName = PlotStyle.FontName;
            text.LabelAlignment = Alignment.LowerLeft;
        }
        var bar = plot.Add.ColorBar(last!);
        bar.Label = "current density |J| (A/mm²)";
        bar.LabelStyle.FontSize = 13;
        plot.Axes.SquareUnits();
        plot.Axes.SetLimits(min.X * 1e3 - widthMm * 0.02, max.X * 1e3 + widthMm * 0.02, min.Y * 1e3 - heightMm * 0.1, max.Y * 1e3 + (panels.Count - 1) * (heightMm + gapMm) + gapMm * 0.8);
        var moving = part.Excitation.IsMoving;
        var caption = (moving
                ? "The instantaneous current density at the travel position with the largest loss (the poles move along x). "
                : "The amplitude of the current density in the AC field. ")
            + "Both plates share the sheet (thickness and alloy) and one colour scale, so the colours compare directly; slots are drawn white with a black edge, grooves with a grey edge. "
            + "Loss and drag are the means the search used.";
        // square units: the plot is as tall as the plates' stack at the scale the width sets (about 200 px go to the colour bar and the y axis, 110 to the title and the x axis)
        var heightPx = (int)Math.Clamp((PlotStyle.WidthPx - 200) * ((panels.Count * heightMm + (panels.Count - 0.2) * gapMm + 0.1 * heightMm) / (1.04 * widthMm)) + 110, 320, 1000);
        return PlotStyle.Render(plot, FileStemFor(partIndex, part), $"Current density: {part.Name}", caption, heightPx: heightPx);
    }

    private static string Label(DesignRole role) => role == DesignRole.Chosen ? "chosen" : "solid plate, same sheet";

    private static ScottPlot.Plottables.Heatmap AddMap(Plot plot, CurrentDensityMap map, double shiftMm, double peakAPerMm2)
    {
        int ny = map.YM.Length, nx = map.XM.Length;
        var values = new double[ny, nx];
        for (var j = 0; j < ny; j++)
            for (var i = 0; i < nx; i++)
                values[j, i] = map.ValueAPerM2[j, i] > 0 ? map.ValueAPerM2[j, i] / 1e6 : double.NaN;   // non-conducting cells hold 0: leave them blank
        double hx = nx > 1 ? map.XM[1] - map.XM[0] : 0, hy = ny > 1 ? map.YM[1] - map.YM[0] : 0;
        var heatmap = plot.Add.Heatmap(values);
        heatmap.FlipVertically = true;   // row 0 is the lowest y
        heatmap.Rectangle = new CoordinateRect((map.XM[0] - hx / 2) * 1e3, (map.XM[^1] + hx / 2) * 1e3, (map.YM[0] - hy / 2) * 1e3 + shiftMm, (map.YM[^1] + hy / 2) * 1e3 + shiftMm);
        heatmap.Colormap = new ScottPlot.Colormaps.Viridis();
        heatmap.ManualRange = new ScottPlot.Range(0, peakAPerMm2);
        heatmap.NaNCellColor = Colors.Transparent;
        return heatmap;
    }

    private static void DrawGeometry(Plot plot, PlateDrawing drawing, double shiftMm)
    {
        Coordinates[] Points(IReadOnlyList<Vec2> vertices) => vertices.Select(v => new Coordinates(v.X * 1e3, v.Y * 1e3 + shiftMm)).ToArray();
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
