using SlotOpt.Design.SolidParts;
using System.Globalization;
using ScottPlot;
using SlotOpt.Tables;
using SlotOpt.Design;
using SlotOpt.Plates.Geometry;
using SlotOpt.Plates.ResistanceLimited;
using SlotOpt.Runs;

namespace SlotOpt.Reports.Plots;

/// <summary>
/// Current density in the chosen plate and in the solid plate cut from the same sheet, each in its own panel on
/// the plate's true coordinates (mm), one colour scale for both (the bar beside the lower panel), with the outline
/// and the slots drawn, from the maps the run computed (<see cref="CurrentDensityMaps"/>). Metal carrying no current
/// takes the colour map's zero colour; only cut-away metal (slots, and outside the outline) is left white.
/// </summary>
public static class CurrentDensityPlot
{
    public static string FileStemFor(int partIndex, PlatePart part) => $"current-density-{partIndex + 1}-{FileNames.Slug(part.Name)}";

    /// <summary>The fixed margins of every panel (pixels): the y axis on the left, the colour bar on the right, a two-line title on top, the x axis below.</summary>
    private static readonly PixelPadding Margins = new(left: 80, right: 170, bottom: 55, top: 70);

    public static Figure Build(int partIndex, PlatePart part, CurrentDensityMaps maps)
    {
        var panels = maps.Panels;
        var peakAPerMm2 = panels.Max(p => p.PeakAPerM2) / 1e6;
        var (min, max) = part.Outline.Bounds;
        double widthMm = (max.X - min.X) * 1e3, heightMm = (max.Y - min.Y) * 1e3;
        double xLow = min.X * 1e3 - widthMm * 0.02, xHigh = max.X * 1e3 + widthMm * 0.02, yLow = min.Y * 1e3 - heightMm * 0.05, yHigh = max.Y * 1e3 + heightMm * 0.05;
        // square units: the data area is as tall as the plate at the scale the width sets
        var dataWidthPx = PlotStyle.WidthPx - Margins.Left - Margins.Right;
        var dataHeightPx = (int)Math.Clamp(dataWidthPx * (yHigh - yLow) / (xHigh - xLow), 60, 420);
        var panelHeightPx = (int)(dataHeightPx + Margins.Top + Margins.Bottom);

        var plots = new List<Plot>();
        for (var k = 0; k < panels.Count; k++)
        {
            var panel = panels[k];
            var option = panel.Option;
            var plot = PlotStyle.NewPlot($"{Label(panel.Role)}: {option.Description}\nloss {Numbers.Watts(option.Loss.TotalW)}{(option.DragN is { } d ? $", drag {Numbers.Newtons(d)}" : "")}, peak {Numbers.CurrentDensity(panel.PeakAPerM2)}", "x (mm)", "y (mm)");
            plot.Axes.Title.Label.FontSize = 13;
            var heatmap = AddMap(plot, panel.Map, panel.Drawing, peakAPerMm2);
            DrawGeometry(plot, panel.Drawing);
            plot.Axes.SetLimits(xLow, xHigh, yLow, yHigh);
            plot.Layout.Fixed(Margins);
            if (k == panels.Count - 1)
            {
                var bar = plot.Add.ColorBar(heatmap);
                bar.Label = "|J| (A/mm²)";
                bar.LabelStyle.FontSize = 13;
            }
            plots.Add(plot);
        }
        var moving = part.Excitation.IsMoving;
        var caption = (part.Excitation is PlateExcitation.Turning
                ? "The instantaneous current density at the disc angle with the largest loss (the disc turns under fixed magnets). "
                : moving
                ? "The instantaneous current density at the travel position with the largest loss (the poles move along x). "
                : "The amplitude of the current density in the AC field. ")
            + (panels.Count > 1 ? "Both plates share the sheet (thickness and alloy) and one colour scale, so the colours compare directly; " : "")
            + "one colour bar (beside the lower panel) serves both; metal with no current takes the scale's zero colour; slots are drawn white with a black edge, grooves with a grey edge. "
            + "Loss and drag are the means the search used.";
        return PlotStyle.RenderPanels(plots, FileStemFor(partIndex, part), $"Current density: {part.Name}", caption, panelHeightPx);
    }

    private static string Label(DesignRole role) => role == DesignRole.Chosen ? "chosen" : "solid plate, same sheet";

    private static ScottPlot.Plottables.Heatmap AddMap(Plot plot, CurrentDensityMap map, PlateDrawing drawing, double peakAPerMm2)
    {
        int ny = map.YM.Length, nx = map.XM.Length;
        var values = new double[ny, nx];
        for (var j = 0; j < ny; j++)
            for (var i = 0; i < nx; i++)
            {
                // the map holds 0 both in metal without current and where there is no metal: the drawing tells them apart
                var metal = map.ValueAPerM2[j, i] > 0 || IsMetal(drawing, map.XM[i], map.YM[j]);
                values[j, i] = metal ? map.ValueAPerM2[j, i] / 1e6 : double.NaN;
            }
        double hx = nx > 1 ? map.XM[1] - map.XM[0] : 0, hy = ny > 1 ? map.YM[1] - map.YM[0] : 0;
        var heatmap = plot.Add.Heatmap(values);
        heatmap.FlipVertically = true;   // row 0 is the lowest y
        heatmap.Rectangle = new CoordinateRect((map.XM[0] - hx / 2) * 1e3, (map.XM[^1] + hx / 2) * 1e3, (map.YM[0] - hy / 2) * 1e3, (map.YM[^1] + hy / 2) * 1e3);
        heatmap.Colormap = new ScottPlot.Colormaps.Viridis();
        heatmap.ManualRange = new ScottPlot.Range(0, peakAPerMm2);
        heatmap.NaNCellColor = Colors.Transparent;
        return heatmap;
    }

    /// <summary>A cell centre inside the outline and outside every through slot (grooves leave metal under them).</summary>
    private static bool IsMetal(PlateDrawing drawing, double xM, double yM) =>
        Inside(drawing.Outline, xM, yM) && !drawing.Slots.Any(s => Inside(s, xM, yM));

    /// <summary>Point in polygon by the even-odd crossing rule (a ray along +x crosses the boundary an odd number of times; common practice, no source).</summary>
    private static bool Inside(IReadOnlyList<Vec2> polygon, double x, double y)
    {
        var inside = false;
        for (int i = 0, j = polygon.Count - 1; i < polygon.Count; j = i++)
        {
            var (a, b) = (polygon[i], polygon[j]);
            if ((a.Y > y) != (b.Y > y) && x < (b.X - a.X) * (y - a.Y) / (b.Y - a.Y) + a.X) inside = !inside;
        }
        return inside;
    }

    private static void DrawGeometry(Plot plot, PlateDrawing drawing)
    {
        Coordinates[] Points(IReadOnlyList<Vec2> vertices) => vertices.Select(v => new Coordinates(v.X * 1e3, v.Y * 1e3)).ToArray();
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
