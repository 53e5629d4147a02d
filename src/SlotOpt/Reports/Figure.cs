namespace SlotOpt.Reports;

/// <summary>One rendered plot: its file stem ("trade-off" -> trade-off.png, trade-off.svg), a title and a caption for the text, and both images.</summary>
public sealed record Figure(string FileStem, string Title, string Caption, byte[] Png, string Svg)
{
    public string PngFileName => FileStem + ".png";
    public string SvgFileName => FileStem + ".svg";
}
