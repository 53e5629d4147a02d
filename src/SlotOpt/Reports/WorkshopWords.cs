using SlotOpt.Design.SolidParts;
using System.Globalization;
using SlotOpt.Design;
using SlotOpt.Design.Cores;

namespace SlotOpt.Reports;

/// <summary>A chosen option in the words a workshop orders and cuts by: sheets of a grade and gauge; a plate, its slots and their count.</summary>
public static class WorkshopWords
{
    public static string Of(EvaluatedOption option)
    {
        var ci = CultureInfo.InvariantCulture;
        var a = option.Attributes;
        switch (option.Choice)
        {
            case CoreChoice c:
                return string.Create(ci, $"{a["sheets"]} sheets of {c.Grade}, {a["gauge_mm"]} mm gauge ({a["steel_mass_kg"]} kg of steel), cut by {c.Process}");
            case PlateChoice { Slots: null } p:
                return string.Create(ci, $"{p.Material} plate {p.ThicknessM * 1e3:0.###} mm thick, solid (no slots), cut by {p.Process}");
            case PlateChoice { Slots.Radial: not null } p:   // a disc: the slot words carry their count ("32 radial slots from 45 mm ...")
                return string.Create(ci, $"{p.Material} disc {p.ThicknessM * 1e3:0.###} mm thick, cut by {p.Process}; {PlateOptions.Describe(p.Slots!)}");
            case PlateChoice p:
                var slots = p.Slots!;
                var count = a.TryGetValue("slot_count", out var n) ? n : "?";
                return string.Create(ci, $"{p.Material} plate {p.ThicknessM * 1e3:0.###} mm thick, cut by {p.Process}; {count} {(slots.Pattern == SlotPatternKind.Grooves ? "grooves" : "slots")}: {PlateOptions.Describe(slots)}");
            default:
                throw new ArgumentOutOfRangeException(nameof(option), option.Choice.GetType().Name, "unknown design choice");
        }
    }
}
