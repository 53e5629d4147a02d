using SlotOpt.Tables;

namespace SlotOpt.Materials;

/// <summary>
/// Thermal conductivity of each built-in conductor near room temperature (W/(m K)), with its source,
/// from the embedded Materials/Data/thermal-conductivity.csv. Taken as constant over the plate's
/// working range (the temperature dependence of k is neglected; common practice, no source). Published
/// k(T) tables exist (e.g. C. Y. Ho, T. K. Chu, "Electrical resistivity and thermal conductivity of nine
/// selected AISI stainless steels", CINDAS Report 45, 1977) but their values could not be read, so none is
/// used. k moves only the spreading in the plane: with insulated edges the mean rise does not depend on it.
/// </summary>
public static class ThermalConductivityTable
{
    private static readonly Lazy<Dictionary<string, (double ValueWPerMK, string Source)>> Rows = new(() =>
        EmbeddedData.ReadCsv("Materials", "thermal-conductivity.csv").Rows.ToDictionary(
            r => r.Text("conductor"),
            r => (r.Number("thermal_conductivity_w_per_m_k"), r.Text("source")),
            StringComparer.OrdinalIgnoreCase));

    public static IReadOnlyCollection<string> Conductors => Rows.Value.Keys;

    public static bool TryGet(string conductor, out double valueWPerMK, out string source)
    {
        var found = Rows.Value.TryGetValue(conductor, out var row);
        (valueWPerMK, source) = found ? row : (0, "");
        return found;
    }

    /// <summary>k of the conductor, or an <see cref="InputException"/> naming the nearest one listed.</summary>
    public static double Of(string conductor, string where) =>
        TryGet(conductor, out var k, out _)
            ? k
            : throw new InputException($"{where}: no thermal conductivity listed for \"{conductor}\"{NameSuggestion.DidYouMean(conductor, Conductors)}; give thermal_conductivity instead");
}
