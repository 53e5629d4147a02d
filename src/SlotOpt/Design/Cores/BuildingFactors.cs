using SlotOpt.Materials;
using SlotOpt.Tables;

namespace SlotOpt.Design.Cores;

/// <summary>
/// Building factor BF = P_core / (P_specific(B, f) x m_core): what joints, non-uniform and rotating flux add to the
/// loss the steel shows in an Epstein or single-sheet test (S. Zurek, "Building factor", Encyclopedia Magnetica).
/// Defaults per construction and steel family in Design/Data/building-factors.csv, each row with its source.
/// </summary>
public static class BuildingFactors
{
    public sealed record Entry(double Factor, string Source);

    /// <summary>The default building factor, or null where the table has none (grain-oriented steel across its rolling direction).</summary>
    public static Entry? Default(CoreConstruction construction, SteelFamily family)
    {
        var key = (CoreConstructionWords.Word(construction), family == SteelFamily.GrainOriented ? "GO" : "NO");
        return Table.Value.TryGetValue(key, out var entry) ? entry : null;
    }

    private static readonly Lazy<IReadOnlyDictionary<(string, string), Entry>> Table = new(Load);

    private static IReadOnlyDictionary<(string, string), Entry> Load() =>
        EmbeddedData.ReadCsv("Design", "building-factors.csv").Rows
            .ToDictionary(r => (r.Text("construction"), r.Text("family")), r => new Entry(r.Number("building_factor"), r.Text("source")));
}
