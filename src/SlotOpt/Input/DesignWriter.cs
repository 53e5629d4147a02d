using System.Globalization;
using System.Text;
using SlotOpt.Design;

namespace SlotOpt.Input;

/// <summary>
/// Writes a fixed design as the [parts.current] table of a problem file, so that a chosen design can be
/// pasted back and evaluated as "the design we have" (ProblemReader reads it back to the same choice).
/// </summary>
public static class DesignWriter
{
    public static string CurrentTable(DesignChoice choice)
    {
        var ci = CultureInfo.InvariantCulture;
        var text = new StringBuilder("[parts.current]\n");
        switch (choice)
        {
            case CoreChoice core:
                text.Append(ci, $"grade = \"{core.Grade}\"\nprocess = \"{core.Process}\"\n");
                break;
            case PlateChoice plate:
                text.Append(ci, $"thickness = \"{Millimetres(plate.ThicknessM)}\"\nmaterial = \"{plate.Material}\"\nprocess = \"{plate.Process}\"\n");
                if (plate.Slots is { } s)
                {
                    text.Append(ci, $"slots = {{ pattern = \"{SlotWords.Word(s.Pattern)}\", edge = \"{SlotWords.Word(s.Edge)}\", pitch = \"{Millimetres(s.PitchM)}\", {SlotWords.ExtentKey(SlotWords.Word(s.Pattern))} = \"{Millimetres(s.DepthM)}\", width = \"{Millimetres(s.WidthM)}\"");
                    if (s.RemainingThicknessFraction is { } r) text.Append(ci, $", remaining_thickness = {r:R}");
                    text.Append(" }\n");
                }
                break;
            default:
                throw new ArgumentOutOfRangeException(nameof(choice), choice.GetType().Name, "unknown design choice");
        }
        return text.ToString();
    }

    /// <summary>Metres as "12.5 mm" with every significant digit kept (round-trip exact to 1e-12 m).</summary>
    private static string Millimetres(double metres) => (metres * 1e3).ToString("0.############", CultureInfo.InvariantCulture) + " mm";
}
