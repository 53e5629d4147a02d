namespace SlotOpt.Reports.Plots;

/// <summary>
/// One rendered plot: its file stem ("trade-off" -> trade-off.png, trade-off.svg), a title and a caption for the text,
/// both images, and optionally the points the HTML page names when pointed at (<see cref="Tips"/>).
/// </summary>
public sealed record Figure(string FileStem, string Title, string Caption, byte[] Png, string Svg)
{
    public string PngFileName => FileStem + ".png";
    public string SvgFileName => FileStem + ".svg";

    /// <summary>Plotted points with the text to show when the pointer rests on them, in the image's pixels; null for a still picture.</summary>
    public PointTips? Tips { get; init; }
}

/// <summary>Points of a plot image (pixels from its top left corner, the image <see cref="WidthPx"/> x <see cref="HeightPx"/>) and what each one is.</summary>
public sealed record PointTips(int WidthPx, int HeightPx, IReadOnlyList<(double XPx, double YPx, string Text)> Points);
