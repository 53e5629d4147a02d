using System.Globalization;
using SlotOpt.Materials;
using SlotOpt.Plates.Geometry;

namespace SlotOpt.Design.SolidParts;

/// <summary>
/// Checks a slot pattern against a cutting process and the part's limits: smallest slot, strip and
/// ligament, most slots, and (in an AC field) the stiffness of the fingers between slots.
/// Returns the first broken rule, or null.
/// </summary>
public static class PlateRules
{
    public static RuleBreak? FirstBroken(SlotChoice slots, SlotPattern pattern, double thicknessM, Conductor material,
        CuttingProcess process, double partMinLigamentM, double? acFrequencyHz)
    {
        var ci = CultureInfo.InvariantCulture;
        if (slots.Pattern != SlotPatternKind.Grooves && slots.WidthM < process.MinSlotWidthM)
            return new(RuleKind.SlotNarrowerThanProcess, string.Create(ci, $"slot width {slots.WidthM * 1e3:0.##} mm is below the {process.MinSlotWidthM * 1e3:0.##} mm that {process.Name} cuts"));
        var minStrip = process.MinStripOverThickness * thicknessM;
        if (pattern.StripWidthM < minStrip)
            return new(RuleKind.StripTooNarrow, string.Create(ci, $"strip {pattern.StripWidthM * 1e3:0.##} mm between slots is below {process.MinStripOverThickness:0.##} x thickness ({minStrip * 1e3:0.##} mm) for {process.Name}"));
        var minLigament = Math.Max(partMinLigamentM, process.MinLigamentOverThickness * thicknessM);
        if (pattern.LigamentM < minLigament)
            return new(RuleKind.LigamentTooSmall, string.Create(ci, $"uncut ligament {pattern.LigamentM * 1e3:0.##} mm is below the {minLigament * 1e3:0.##} mm minimum"));
        var count = pattern.Slots.Count + pattern.Grooves.Count;
        if (count > process.MaxSlots)
            return new(RuleKind.TooManySlots, $"{count} slots exceed the {process.MaxSlots} that {process.Name} allows");
        if (acFrequencyHz is { } f && slots.Pattern is SlotPatternKind.Comb or SlotPatternKind.Alternating && material.YoungsModulusPa > 0)
        {
            var longest = FingerStiffness.LongestFingerM(pattern.StripWidthM, f, material.YoungsModulusPa, material.DensityKgPerM3);
            if (slots.DepthM > longest)
                return new(RuleKind.FingerResonance, string.Create(ci, $"fingers {slots.DepthM * 1e3:0.#} mm long and {pattern.StripWidthM * 1e3:0.#} mm wide resonate near {2 * f:0} Hz: at most {longest * 1e3:0.#} mm keeps the first mode {FingerStiffness.FrequencyMargin:0.#} x above 2f"));
        }
        return null;
    }
}
