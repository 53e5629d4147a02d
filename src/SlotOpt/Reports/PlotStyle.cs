using ScottPlot;

namespace SlotOpt.Reports;

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

    public static Figure Render(Plot plot, string fileStem, string title, string caption, int widthPx = WidthPx, int heightPx = HeightPx) =>
        new(fileStem, title, caption, plot.GetImageBytes(widthPx, heightPx, ImageFormat.Png), SvgIds.Renumber(plot.GetSvgXml(widthPx, heightPx)));
}
