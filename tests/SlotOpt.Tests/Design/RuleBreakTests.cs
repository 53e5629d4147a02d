using SlotOpt.Design.SolidParts;
using SlotOpt.Design;
using SlotOpt.Materials;
using SlotOpt.Plates.Geometry;

namespace SlotOpt.Tests.Design;

public class RuleBreakTests
{
    // The report counts rejections by the short name of their kind: two kinds sharing a name would merge
    // their counts, and a kind without one would not be counted. Exact.
    [Fact]
    public void Every_kind_has_its_own_short_name()
    {
        var names = Enum.GetValues<RuleKind>().Select(RuleBreak.ShortNameOf).ToList();
        Assert.Equal(Enum.GetValues<RuleKind>().Length, names.Distinct(StringComparer.Ordinal).Count());
        Assert.All(names, n => Assert.False(string.IsNullOrWhiteSpace(n)));
    }

    // A comb of pitch 10 mm and slot width 2 mm leaves strips of 10 - 2 = 8 mm (geometry, exact to rounding,
    // tolerance 1e-12 m). The laser row of the built-in process table asks for strips of at least 1.0 x the
    // thickness (common practice, no source): a 10 mm plate breaks it (8 < 10), a 5 mm plate does not, and
    // with 20 mm of uncut ligament (>= 2 x 5 mm) and 20 slots (<= 400) no other rule breaks.
    [Fact]
    public void A_strip_narrower_than_the_process_allows_breaks_as_its_kind()
    {
        var outline = Polygon.Rectangle(0, 0, 0.200, 0.060);
        var slots = new SlotChoice(SlotPatternKind.Comb, PlateEdge.Bottom, 0.010, 0.040, 0.002, null);
        var pattern = SlotPatternCatalog.Cut(outline, slots);
        Assert.Equal(0.008, pattern.StripWidthM, 1e-12);
        var aluminium = MaterialLibrary.BuiltIn.GetConductor("Al-6061-T6", "test");
        var laser = CuttingProcessLibrary.BuiltIn["laser"];

        var thick = PlateRules.FirstBroken(slots, pattern, 0.010, aluminium, laser, 0, null);
        Assert.NotNull(thick);
        Assert.Equal(RuleKind.StripTooNarrow, thick.Kind);
        Assert.Equal("strip between slots too narrow", thick.ShortName);
        Assert.Null(PlateRules.FirstBroken(slots, pattern, 0.005, aluminium, laser, 0, null));
    }
}
