using SlotOpt.Design.SolidParts;
using SlotOpt.Design.Cores;

namespace SlotOpt.Design;

/// <summary>How many design options each part has before the manufacturing rules filter them.</summary>
public static class ChoiceSpace
{
    public static long OptionCount(Part part) => part switch
    {
        CorePart core => (long)core.Grades.Count * core.Processes.Count,
        PlatePart plate => plate.OptionCount,
        _ => throw new ArgumentOutOfRangeException(nameof(part), part.GetType().Name, "unknown part kind"),
    };

    /// <summary>Product of the option counts, saturating at long.MaxValue.</summary>
    public static long Combinations(IEnumerable<Part> parts)
    {
        long total = 1;
        foreach (var p in parts)
        {
            var n = OptionCount(p);
            total = n != 0 && total > long.MaxValue / n ? long.MaxValue : total * n;
        }
        return total;
    }
}
