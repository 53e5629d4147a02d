using SlotOpt.Tables;
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
        if (slots.Pattern != SlotPatternKind.Grooves && slots.WidthM < process.MinSlotWidthM)
            return new(RuleKind.SlotNarrowerThanProcess, $"slot width {Numbers.Of(slots.WidthM * 1e3, "mm")} is below the {Numbers.Of(process.MinSlotWidthM * 1e3, "mm")} that {process.Name} cuts");
        var minStrip = process.MinStripOverThickness * thicknessM;
        if (pattern.StripWidthM < minStrip)
            return new(RuleKind.StripTooNarrow, $"strip {Numbers.Of(pattern.StripWidthM * 1e3, "mm")} between slots is below {Numbers.Sig(process.MinStripOverThickness)} x thickness ({Numbers.Of(minStrip * 1e3, "mm")}) for {process.Name}");
        var minLigament = Math.Max(partMinLigamentM, process.MinLigamentOverThickness * thicknessM);
        if (pattern.LigamentM < minLigament)
            return new(RuleKind.LigamentTooSmall, $"uncut ligament {Numbers.Of(pattern.LigamentM * 1e3, "mm")} is below the {Numbers.Of(minLigament * 1e3, "mm")} minimum");
        var count = pattern.Slots.Count + pattern.Grooves.Count;
        if (count > process.MaxSlots)
            return new(RuleKind.TooManySlots, $"{count} slots exceed the {process.MaxSlots} that {process.Name} allows");
        if (acFrequencyHz is { } f && slots.Pattern is SlotPatternKind.Comb or SlotPatternKind.Alternating && material.YoungsModulusPa > 0)
        {
            var longest = FingerStiffness.LongestFingerM(pattern.StripWidthM, f, material.YoungsModulusPa, material.DensityKgPerM3);
            if (slots.DepthM > longest)
                return new(RuleKind.FingerResonance, $"fingers {Numbers.Of(slots.DepthM * 1e3, "mm")} long and {Numbers.Of(pattern.StripWidthM * 1e3, "mm")} wide resonate near {Numbers.Of(2 * f, "Hz")}: at most {Numbers.Of(longest * 1e3, "mm")} keeps the first mode {Numbers.Sig(FingerStiffness.FrequencyMargin)} x above 2f");
        }
        return null;
    }
}
