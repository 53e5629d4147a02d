using ScottPlot;

namespace SlotOpt.Reports.Plots;

/// <summary>
/// The look every report plot shares: DejaVu Sans (ScottPlot's default resolves to a serif face here),
/// one size, a colour-blind-safe palette (Okabe and Ito, 2008), and the rendering to a <see cref="Figure"/>.
/// No plot uses dash patterns: SkiaSharp's SVG canvas cannot draw them (it prints "Unsupported path effect"
/// and strokes solid), so lines are told apart by colour, width and opacity, the same in PNG and SVG.
/// </summary>
public static class PlotStyle
{
    public const string FontName = "DejaVu Sans";
    public const int WidthPx = 900;
    public const int HeightPx = 540;

    /// <summary>Okabe-Ito colours: distinguishable with the common colour-vision deficiencies and in grey print.</summary>
    public static readonly Color Blue = Color.FromHex("#0072B2");
    public static readonly Color Orange = Color.FromHex("#E69F00");
    public static readonly Color Green = Color.FromHex("#009E73");
    public static readonly Color Vermillion = Color.FromHex("#D55E00");
    public static readonly Color Purple = Color.FromHex("#CC79A7");
    public static readonly Color Sky = Color.FromHex("#56B4E9");
    public static readonly Color Yellow = Color.FromHex("#F0E442");
    public static readonly Color Black = Color.FromHex("#000000");
    public static readonly Color Grey = Color.FromHex("#8C8C8C");

    public static readonly IReadOnlyList<Color> Series = [Blue, Vermillion, Green, Orange, Purple, Sky, Black, Yellow];

    public static Plot NewPlot(string title, string xLabel, string yLabel)
    {
        var plot = new Plot();
        plot.Title(title, size: 17);
        plot.XLabel(xLabel, size: 14);
        plot.YLabel(yLabel, size: 14);
        plot.Font.Set(FontName);
        plot.Axes.Bottom.TickLabelStyle.FontSize = 12;
        plot.Axes.Left.TickLabelStyle.FontSize = 12;
        plot.Legend.FontSize = 12;
        plot.Legend.FontName = FontName;
        return plot;
    }

    /// <summary>
    /// The legend in a panel below the data area, so it covers no data (<see cref="PlotChecks"/> verifies it after
    /// rendering); returns the pixels it takes, to be added to the figure's height.
    /// </summary>
    public static int LegendBelow(Plot plot)
    {
        plot.Legend.FontSize = 12;
        plot.Legend.FontName = FontName;
        plot.Legend.InterItemPadding = new PixelPadding(0, 0, 2, 2);
        var heightPx = plot.Legend.GetImage().Height + 30;   // the legend's own height, one item a line, and its margin
        var panel = plot.ShowLegend(Edge.Bottom);
        panel.MinimumSize = panel.MaximumSize = heightPx;   // the panel otherwise clips a long legend
        return heightPx;
    }

    /// <summary>
    /// Panels stacked top to bottom in one figure, each <paramref name="panelHeightPx"/> tall (a ScottPlot multiplot),
    /// rendered as PNG and SVG; each panel is checked as <see cref="Render"/> checks a plot.
    /// </summary>
    public static Figure RenderPanels(IReadOnlyList<Plot> panels, string fileStem, string title, string caption, int panelHeightPx)
    {
        var multiplot = new Multiplot();
        multiplot.Reset(panels[0]);   // a new multiplot holds one empty plot of its own: start from the first panel instead
        foreach (var panel in panels.Skip(1)) multiplot.AddPlot(panel);
        foreach (var panel in panels) PlotChecks.AxisLabels(panel, fileStem, categoricalX: false);
        var heightPx = panelHeightPx * panels.Count;
        var png = multiplot.Render(WidthPx, heightPx).GetImageBytes(ImageFormat.Png);
        foreach (var panel in panels) PlotChecks.LegendClearOfData(panel, fileStem);
        foreach (var panel in panels) PlotChecks.MarkersInsideFrame(panel, fileStem);
        using var svg = new MemoryStream();
        using (var canvas = SkiaSharp.SKSvgCanvas.Create(new SkiaSharp.SKRect(0, 0, WidthPx, heightPx), svg))   // SkiaSharp's SVG canvas, as Plot.GetSvgXml uses
            multiplot.Render(canvas, new PixelRect(0, WidthPx, heightPx, 0));
        return new Figure(fileStem, title, caption, png, SvgIds.Renumber(System.Text.Encoding.UTF8.GetString(svg.ToArray())));
    }

    /// <summary>
    /// Renders the plot as PNG and SVG, then checks it (<see cref="PlotChecks"/>): axis labels with units
    /// (<paramref name="categoricalX"/>: the x axis names categories) and no legend over a plotted point.
    /// </summary>
    public static Figure Render(Plot plot, string fileStem, string title, string caption, int widthPx = WidthPx, int heightPx = HeightPx, bool categoricalX = false)
    {
        PlotChecks.AxisLabels(plot, fileStem, categoricalX);
        var png = plot.GetImageBytes(widthPx, heightPx, ImageFormat.Png);
        PlotChecks.LegendClearOfData(plot, fileStem);
        PlotChecks.MarkersInsideFrame(plot, fileStem);
        return new Figure(fileStem, title, caption, png, SvgIds.Renumber(plot.GetSvgXml(widthPx, heightPx)));
    }
}
