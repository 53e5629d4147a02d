using ScottPlot;
using SlotOpt.Plates.Geometry;
using SlotOpt.Runs;

namespace SlotOpt.Reports.Plots;

/// <summary>A plate's outline, slots (white, cut through) and grooves (grey, partial depth) drawn over a map in millimetres: the one drawing every plate map shares.</summary>
internal static class PlateOutlineLayer
{
    public static void Draw(Plot plot, PlateDrawing drawing)
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
