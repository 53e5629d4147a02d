using SlotOpt.Design.SolidParts;
using SlotOpt.Design;
using SlotOpt.Design.Cores;
using SlotOpt.Tables;

namespace SlotOpt.Reports;

/// <summary>
/// A chosen option in the words a workshop orders and cuts by: sheets of a grade and gauge; a plate (or a disc, the part's shape),
/// its slots and their count.
/// </summary>
public static class WorkshopWords
{
    /// <param name="part">The option's part: its shape names a plate option "plate" or "disc".</param>
    public static string Of(EvaluatedOption option, Part part)
    {
        var a = option.Attributes;
        var shape = part is PlatePart { Disc: not null } ? "disc" : "plate";
        switch (option.Choice)
        {
            case CoreChoice c:
                return $"{a["sheets"]} sheets of {c.Grade}, {a["gauge_mm"]} mm gauge ({a["steel_mass_kg"]} kg of steel), cut by {c.Process}";
            case PlateChoice { Slots: null } p:
                return $"{p.Material} {shape} {Numbers.Sig(p.ThicknessM * 1e3)} mm thick, solid (no slots), cut by {p.Process}";
            case PlateChoice { Slots.Radial: not null } p:   // a disc: the slot words carry their count ("32 radial slots from 45 mm ...")
                return $"{p.Material} disc {Numbers.Sig(p.ThicknessM * 1e3)} mm thick, cut by {p.Process}; {PlateOptions.Describe(p.Slots!)}";
            case PlateChoice p:
                var slots = p.Slots!;
                var count = a.TryGetValue("slot_count", out var n) ? n : "?";
                return $"{p.Material} {shape} {Numbers.Sig(p.ThicknessM * 1e3)} mm thick, cut by {p.Process}; {count} {(slots.Pattern == SlotPatternKind.Grooves ? "grooves" : "slots")}: {PlateOptions.Describe(slots)}";
            default:
                throw new ArgumentOutOfRangeException(nameof(option), option.Choice.GetType().Name, "unknown design choice");
        }
    }
}
