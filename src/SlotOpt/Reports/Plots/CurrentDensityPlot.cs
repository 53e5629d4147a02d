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
        var panelHeightPx = PanelHeightPx(part.Outline.Bounds);
        var plots = panels.Select((panel, k) => Panel(
            $"{Label(panel.Role)}: {panel.Option.Description}\nloss {Numbers.Watts(panel.Option.Loss.TotalW)}{(panel.Option.DragN is { } d ? $", drag {Numbers.Newtons(d)}" : "")}, peak {Numbers.CurrentDensity(panel.PeakAPerM2)}",
            panel.Map, panel.Drawing, part.Outline.Bounds, peakAPerMm2, colourBar: k == panels.Count - 1)).ToList();
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

    /// <summary>
    /// One plate's map as a figure of one panel (the plate command's report): the same drawing as a run's panels, on the
    /// plate's true coordinates with its outline and slots, the colour scale from zero to the map's peak.
    /// </summary>
    public static Figure BuildSingle(string fileStem, string figureTitle, string panelTitle, string caption, CurrentDensityMap map, PlateDrawing drawing, double peakAPerM2)
    {
        var bounds = Bounds(drawing.Outline);
        var plot = Panel(panelTitle, map, drawing, bounds, peakAPerM2 / 1e6, colourBar: true);
        return PlotStyle.RenderPanels([plot], fileStem, figureTitle, caption, PanelHeightPx(bounds));
    }

    private static (Vec2 Min, Vec2 Max) Bounds(IReadOnlyList<Vec2> outline) =>
        (new Vec2(outline.Min(v => v.X), outline.Min(v => v.Y)), new Vec2(outline.Max(v => v.X), outline.Max(v => v.Y)));

    /// <summary>
    /// The plot limits around a plate's bounds (mm): a small margin on every side, and square units: where the data area's
    /// height is held to 60-420 px (<see cref="DataHeightPx"/>), the other axis is widened about its centre so a millimetre
    /// is as long across as up (a disc stays round).
    /// </summary>
    private static (double XLow, double XHigh, double YLow, double YHigh) LimitsMm((Vec2 Min, Vec2 Max) bounds)
    {
        var (xLow, xHigh, yLow, yHigh) = WithMarginsMm(bounds);
        double mmPerPxAcross = (xHigh - xLow) / DataWidthPx, mmPerPxUp = (yHigh - yLow) / DataHeightPx(xHigh - xLow, yHigh - yLow);
        if (mmPerPxUp > mmPerPxAcross)
        {
            var half = mmPerPxUp * DataWidthPx / 2;
            (xLow, xHigh) = ((xLow + xHigh) / 2 - half, (xLow + xHigh) / 2 + half);
        }
        else
        {
            var half = mmPerPxAcross * DataHeightPx(xHigh - xLow, yHigh - yLow) / 2;
            (yLow, yHigh) = ((yLow + yHigh) / 2 - half, (yLow + yHigh) / 2 + half);
        }
        return (xLow, xHigh, yLow, yHigh);
    }

    /// <summary>The plate's bounds in mm with a margin of 2 % of its width on each side and 5 % of its height above and below.</summary>
    private static (double XLow, double XHigh, double YLow, double YHigh) WithMarginsMm((Vec2 Min, Vec2 Max) bounds)
    {
        var (min, max) = bounds;
        double widthMm = (max.X - min.X) * 1e3, heightMm = (max.Y - min.Y) * 1e3;
        return (min.X * 1e3 - widthMm * 0.02, max.X * 1e3 + widthMm * 0.02, min.Y * 1e3 - heightMm * 0.05, max.Y * 1e3 + heightMm * 0.05);
    }

    private static int DataWidthPx => PlotStyle.WidthPx - (int)Margins.Left - (int)Margins.Right;

    /// <summary>The data area's height (pixels): as tall as the plate at the scale the width sets, within 60-420 px.</summary>
    private static int DataHeightPx(double widthMm, double heightMm) => (int)Math.Clamp(DataWidthPx * heightMm / widthMm, 60, 420);

    /// <summary>A panel's height in pixels: the data area (<see cref="DataHeightPx"/>) and the margins.</summary>
    private static int PanelHeightPx((Vec2 Min, Vec2 Max) bounds)
    {
        var (xLow, xHigh, yLow, yHigh) = WithMarginsMm(bounds);
        return (int)(DataHeightPx(xHigh - xLow, yHigh - yLow) + Margins.Top + Margins.Bottom);
    }

    /// <summary>One panel: the map, the outline, slots and grooves, and (on the last panel of a figure) the colour bar.</summary>
    private static Plot Panel(string title, CurrentDensityMap map, PlateDrawing drawing, (Vec2 Min, Vec2 Max) bounds, double peakAPerMm2, bool colourBar)
    {
        var plot = PlotStyle.NewPlot(title, "x (mm)", "y (mm)");
        plot.Axes.Title.Label.FontSize = 13;
        var heatmap = AddMap(plot, map, drawing, peakAPerMm2);
        PlateOutlineLayer.Draw(plot, drawing);
        var (xLow, xHigh, yLow, yHigh) = LimitsMm(bounds);
        plot.Axes.SetLimits(xLow, xHigh, yLow, yHigh);
        plot.Layout.Fixed(Margins);
        if (colourBar)
        {
            var bar = plot.Add.ColorBar(heatmap);
            bar.Label = "|J| (A/mm²)";
            bar.LabelStyle.FontSize = 13;
        }
        return plot;
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
}
