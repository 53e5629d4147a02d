using SlotOpt.Reports.Plots;
using ScottPlot;
using SlotOpt.Reports;
using PlotStyle = SlotOpt.Reports.Plots.PlotStyle;

namespace SlotOpt.Tests.Reports;

/// <summary>
/// Issue 17: no legend box over a plotted point, and every axis labelled with its unit, checked by the plot code
/// itself (<see cref="PlotChecks"/>) as each report plot renders. Geometry of boxes and points: common practice, no source.
/// </summary>
public class PlotChecksTests
{
    /// <summary>A line across the whole data area, corner to corner, and one marker in each corner.</summary>
    private static Plot CornersPlot()
    {
        var plot = PlotStyle.NewPlot("corners", "x (m)", "y (W)");
        var line = plot.Add.ScatterLine(new double[] { 0, 10 }, new double[] { 0, 10 });
        line.LegendText = "a line";
        foreach (var (x, y) in new[] { (0.0, 0.0), (0.0, 10.0), (10.0, 0.0), (10.0, 10.0) }) plot.Add.Marker(x, y);
        plot.Axes.SetLimits(-0.2, 10.2, -0.2, 10.2);
        return plot;
    }

    [Fact]
    public void A_legend_inside_the_data_area_over_a_point_is_refused()
    {
        var plot = CornersPlot();
        plot.Add.Marker(0.6, 9.6);   // about 20 px in from the upper left corner of the data area, where the legend goes
        plot.Legend.Alignment = Alignment.UpperLeft;
        plot.ShowLegend();
        plot.GetImageBytes(400, 300, ImageFormat.Png);
        var box = Assert.Single(PlotChecks.LegendBoxes(plot));
        var corner = plot.GetPixel(new Coordinates(0.6, 9.6));
        // the box found is where the legend is drawn: its corner a margin away from the data area's, holding the marker
        Assert.True(box.Left <= corner.X && corner.X <= box.Right && box.Top <= corner.Y && corner.Y <= box.Bottom, $"box {box} does not hold {corner}");
        var error = Assert.Throws<InvalidOperationException>(() => PlotChecks.LegendClearOfData(plot, "corners"));
        Assert.Contains("covers a plotted point", error.Message);
    }

    [Fact]
    public void A_legend_below_the_data_area_covers_no_point()
    {
        var plot = CornersPlot();
        var legendPx = PlotStyle.LegendBelow(plot);
        plot.GetImageBytes(400, 300 + legendPx, ImageFormat.Png);
        var data = plot.RenderManager.LastRender.DataRect;
        var box = Assert.Single(PlotChecks.LegendBoxes(plot));
        Assert.True(box.Top >= data.Bottom, $"the legend ({box}) reaches into the data area ({data})");
        Assert.Equal(6, PlotChecks.PlottedPoints(plot).Count);   // two line vertices and four markers, all drawn
        PlotChecks.LegendClearOfData(plot, "corners");
    }

    [Theory]
    [InlineData("loss (W)", true)]
    [InlineData("speed (m/s)", true)]
    [InlineData("frequency (Hz, log scale)", true)]
    [InlineData("|J| (A/mm²)", true)]
    [InlineData("build cost (EUR per unit)", true)]
    [InlineData("y (mm), each panel from its own plate's edge", false)]
    [InlineData("loss", false)]
    [InlineData("loss (log scale)", false)]
    [InlineData("", false)]
    public void An_axis_label_names_its_unit_in_parentheses(string label, bool hasUnit) =>
        Assert.Equal(hasUnit, PlotChecks.HasUnit(label));

    [Fact]
    public void A_plot_without_units_on_its_axes_is_not_rendered()
    {
        var plot = PlotStyle.NewPlot("no units", "speed", "drag (N)");
        plot.Add.ScatterLine(new double[] { 0, 1 }, new double[] { 0, 1 });
        var error = Assert.Throws<InvalidOperationException>(() => PlotStyle.Render(plot, "no-units", "t", "c"));
        Assert.Contains("x axis label \"speed\" names no unit", error.Message);
    }

    [Fact]
    public void A_circled_point_cut_by_the_frame_is_refused_and_one_inside_passes()
    {
        var plot = PlotStyle.NewPlot("circled", "x (mm)", "y (mm)");
        plot.Axes.SetLimits(0, 100, 0, 100);
        var circle = plot.Add.Marker(50, 100, MarkerShape.OpenCircle, 12);   // centre on the top edge: half the circle outside
        plot.GetImageBytes(400, 300, ImageFormat.Png);
        var error = Assert.Throws<InvalidOperationException>(() => PlotChecks.MarkersInsideFrame(plot, "circled"));
        Assert.Contains("cut by the data area's frame", error.Message);
        circle.Location = new Coordinates(50, 90);   // about 20 px below the top edge of a ~200 px data area
        plot.GetImageBytes(400, 300, ImageFormat.Png);
        PlotChecks.MarkersInsideFrame(plot, "circled");
    }
}
