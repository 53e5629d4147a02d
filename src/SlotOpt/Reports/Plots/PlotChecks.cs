using System.Text.RegularExpressions;
using ScottPlot;

namespace SlotOpt.Reports.Plots;

/// <summary>
/// What every report plot must satisfy once rendered, checked as it is drawn (a failure is a programming error,
/// so it throws): no legend box covers a plotted point (a marker, a line's vertex, a bar's top), a single marker drawn
/// inside the data area lies wholly inside it (not cut by the frame), and every numeric axis is labelled with its unit
/// in parentheses, "speed (m/s)".
/// </summary>
public static partial class PlotChecks
{
    /// <summary>"loss (W)", "speed (m/s, log scale)", "current density |J| (A/mm²)": words, then the unit in parentheses.</summary>
    [GeneratedRegex(@"^\S.*\s\((?!log)[^()\s,][^()]*\)$")]
    private static partial Regex LabelWithUnit();

    public static bool HasUnit(string axisLabel) => LabelWithUnit().IsMatch(axisLabel);

    /// <summary>Throws when a numeric axis has no label with a unit; <paramref name="categoricalX"/>: the x axis names categories (bars), so it needs a label but no unit.</summary>
    public static void AxisLabels(Plot plot, string fileStem, bool categoricalX)
    {
        var x = plot.Axes.Bottom.Label.Text;
        var y = plot.Axes.Left.Label.Text;
        if (!HasUnit(y)) throw new InvalidOperationException($"{fileStem}: the y axis label \"{y}\" names no unit");
        if (categoricalX ? string.IsNullOrWhiteSpace(x) : !HasUnit(x)) throw new InvalidOperationException($"{fileStem}: the x axis label \"{x}\" {(categoricalX ? "is empty" : "names no unit")}");
    }

    /// <summary>
    /// The pixel rectangles of the legends of the last render of <paramref name="plot"/>: the legend panels outside the
    /// data area, and the legend inside it when it is shown there.
    /// </summary>
    public static IReadOnlyList<PixelRect> LegendBoxes(Plot plot)
    {
        var last = plot.RenderManager.LastRender;
        var boxes = new List<PixelRect>();
        using var paint = Paint.NewDisposablePaint();
        foreach (var panel in plot.Axes.GetPanels().Where(p => p.IsVisible && p.GetType().Name.Contains("Legend", StringComparison.Ordinal)))
            boxes.Add(panel.GetPanelRect(last.DataRect, last.Layout.PanelSizes[panel], last.Layout.PanelOffsets[panel], paint));
        if (plot.Legend.IsVisible)
        {
            // the inside legend: its own image's size, at its corner of the data area, inset by its margin
            var image = plot.Legend.GetImage();
            var (w, h) = (image.Width, image.Height);
            var d = last.DataRect;
            var m = plot.Legend.Margin;
            var left = plot.Legend.Alignment switch
            {
                Alignment.UpperLeft or Alignment.MiddleLeft or Alignment.LowerLeft => d.Left + m.Left,
                Alignment.UpperRight or Alignment.MiddleRight or Alignment.LowerRight => d.Right - m.Right - w,
                _ => d.HorizontalCenter - w / 2f,
            };
            var top = plot.Legend.Alignment switch
            {
                Alignment.UpperLeft or Alignment.UpperCenter or Alignment.UpperRight => d.Top + m.Top,
                Alignment.LowerLeft or Alignment.LowerCenter or Alignment.LowerRight => d.Bottom - m.Bottom - h,
                _ => d.VerticalCenter - h / 2f,
            };
            boxes.Add(new PixelRect(left, left + w, top + h, top));
        }
        return boxes;
    }

    /// <summary>Where every plotted point of the last render lands (pixels), points off the axes' limits left out: they are not drawn.</summary>
    public static IReadOnlyList<Pixel> PlottedPoints(Plot plot)
    {
        var coordinates = new List<Coordinates>();
        foreach (var p in plot.GetPlottables().Where(p => p.IsVisible))
        {
            switch (p)
            {
                case ScottPlot.Plottables.Scatter s: coordinates.AddRange(s.Data.GetScatterPoints()); break;
                case ScottPlot.Plottables.Markers m: coordinates.AddRange(m.Data.GetScatterPoints()); break;
                case ScottPlot.Plottables.Marker m: coordinates.Add(m.Location); break;
                case ScottPlot.Plottables.BarPlot b: coordinates.AddRange(b.Bars.Select(bar => new Coordinates(bar.Position, bar.Value))); break;
            }
        }
        var d = plot.RenderManager.LastRender.DataRect;
        return coordinates.Select(c => plot.GetPixel(c)).Where(px => px.X >= d.Left && px.X <= d.Right && px.Y >= d.Top && px.Y <= d.Bottom).ToList();
    }

    /// <summary>Throws when a legend box of the last render covers a plotted point.</summary>
    public static void LegendClearOfData(Plot plot, string fileStem)
    {
        var points = PlottedPoints(plot);
        foreach (var box in LegendBoxes(plot))
            foreach (var px in points)
                if (px.X >= box.Left && px.X <= box.Right && px.Y >= box.Top && px.Y <= box.Bottom)
                    throw new InvalidOperationException($"{fileStem}: the legend box ({box.Left:0}-{box.Right:0}, {box.Top:0}-{box.Bottom:0} px) covers a plotted point at ({px.X:0}, {px.Y:0}) px");
    }

    /// <summary>Throws when a single marker (a circled point) whose centre the last render drew inside the data area is cut by the area's frame.</summary>
    public static void MarkersInsideFrame(Plot plot, string fileStem)
    {
        var d = plot.RenderManager.LastRender.DataRect;
        foreach (var m in plot.GetPlottables().OfType<ScottPlot.Plottables.Marker>().Where(m => m.IsVisible))
        {
            var px = plot.GetPixel(m.Location);
            if (px.X < d.Left || px.X > d.Right || px.Y < d.Top || px.Y > d.Bottom) continue;
            var r = m.MarkerStyle.Size / 2 + m.MarkerStyle.LineWidth / 2;
            if (px.X - r < d.Left || px.X + r > d.Right || px.Y - r < d.Top || px.Y + r > d.Bottom)
                throw new InvalidOperationException($"{fileStem}: a marker at ({px.X:0}, {px.Y:0}) px, radius {r:0.#} px, is cut by the data area's frame ({d.Left:0}-{d.Right:0}, {d.Top:0}-{d.Bottom:0} px)");
        }
    }
}
