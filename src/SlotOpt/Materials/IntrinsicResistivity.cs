using System.Globalization;
using SlotOpt.Tables;

namespace SlotOpt.Materials;

/// <summary>
/// The intrinsic (phonon) resistivity of a pure metal against temperature, from a published table,
/// interpolated linearly in log(rho) against log(T) (locally a power law, as the phonon term is).
/// </summary>
public sealed class IntrinsicResistivity
{
    private readonly double[] temperaturesK;
    private readonly double[] resistivitiesOhmM;

    public string Metal { get; }

    public IntrinsicResistivity(string metal, IReadOnlyList<(double TemperatureK, double ResistivityOhmM)> table)
    {
        if (table.Count < 2) throw new ArgumentException("a resistivity table needs at least two rows", nameof(table));
        Metal = metal;
        var sorted = table.OrderBy(r => r.TemperatureK).ToArray();
        temperaturesK = sorted.Select(r => r.TemperatureK).ToArray();
        resistivitiesOhmM = sorted.Select(r => r.ResistivityOhmM).ToArray();
    }

    public double MinTemperatureK => temperaturesK[0];
    public double MaxTemperatureK => temperaturesK[^1];

    /// <summary>Intrinsic resistivity (ohm m) at a temperature within the table.</summary>
    public double At(double temperatureK)
    {
        if (!(temperatureK >= MinTemperatureK && temperatureK <= MaxTemperatureK))
            throw new InputException(string.Create(CultureInfo.InvariantCulture,
                $"temperature {Numbers.Of(temperatureK, "K")} is outside the {Metal} resistivity table ({Numbers.Of(MinTemperatureK, "K")} to {Numbers.Of(MaxTemperatureK, "K")})"));
        var i = Array.BinarySearch(temperaturesK, temperatureK);
        if (i >= 0) return resistivitiesOhmM[i];
        var upper = ~i;
        var lower = upper - 1;
        // log-log interpolation: rho = rho_a (T/T_a)^n, n = ln(rho_b/rho_a)/ln(T_b/T_a)
        var n = Math.Log(resistivitiesOhmM[upper] / resistivitiesOhmM[lower]) / Math.Log(temperaturesK[upper] / temperaturesK[lower]);
        return resistivitiesOhmM[lower] * Math.Pow(temperatureK / temperaturesK[lower], n);
    }

    public static IntrinsicResistivity Copper => BuiltInTables.Value["Cu"];
    public static IntrinsicResistivity Aluminium => BuiltInTables.Value["Al"];
    public static IntrinsicResistivity Iron => BuiltInTables.Value["Fe"];

    private static readonly Lazy<Dictionary<string, IntrinsicResistivity>> BuiltInTables = new(LoadBuiltIn);

    private static Dictionary<string, IntrinsicResistivity> LoadBuiltIn()
    {
        var table = EmbeddedData.ReadCsv("Materials", "intrinsic-resistivity.csv");
        return table.Rows
            .GroupBy(r => r.Text("metal"))
            .ToDictionary(
                g => g.Key,
                g => new IntrinsicResistivity(g.Key, g.Select(r => (r.Number("temperature_k"), r.Number("intrinsic_resistivity_uohm_cm") * 1e-8)).ToList()));
    }
}
