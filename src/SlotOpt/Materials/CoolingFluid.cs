using System.Globalization;
using SlotOpt.Tables;

namespace SlotOpt.Materials;

/// <summary>
/// A cooling fluid's property table against temperature (embedded Materials/Data/cooling-fluids.csv,
/// source per row), interpolated linearly between rows. Outside the table the properties are unknown:
/// <see cref="At"/> throws <see cref="NumericalFailureException"/>, as a temperature that leaves the
/// fluid's table is a result (a plate far too hot), not a user mistake.
/// </summary>
public sealed class CoolingFluid
{
    private readonly double[] temperaturesK;
    private readonly FluidProperties[] properties;

    private CoolingFluid(string name, double[] temperaturesK, FluidProperties[] properties, string source)
    {
        Name = name;
        this.temperaturesK = temperaturesK;
        this.properties = properties;
        Source = source;
    }

    public string Name { get; }
    public string Source { get; }
    public double MinTemperatureK => temperaturesK[0];
    public double MaxTemperatureK => temperaturesK[^1];

    public static CoolingFluid Air => Fluids.Value["air"];
    public static CoolingFluid MineralOil => Fluids.Value["oil"];

    public FluidProperties At(double temperatureK)
    {
        if (!(temperatureK >= MinTemperatureK && temperatureK <= MaxTemperatureK))
            throw new NumericalFailureException(string.Create(CultureInfo.InvariantCulture,
                $"film temperature {temperatureK:0.#} K lies outside the {Name} property table ({MinTemperatureK:0} K to {MaxTemperatureK:0} K)"));
        int i = Array.BinarySearch(temperaturesK, temperatureK);
        if (i >= 0) return properties[i];
        int hi = ~i, lo = hi - 1;
        double t = (temperatureK - temperaturesK[lo]) / (temperaturesK[hi] - temperaturesK[lo]);
        var a = properties[lo];
        var b = properties[hi];
        double Mix(double x, double y) => x + t * (y - x);
        return new FluidProperties(
            Mix(a.KinematicViscosityM2PerS, b.KinematicViscosityM2PerS),
            Mix(a.ThermalConductivityWPerMK, b.ThermalConductivityWPerMK),
            Mix(a.PrandtlNumber, b.PrandtlNumber),
            Mix(a.ExpansionPerK, b.ExpansionPerK));
    }

    private static readonly Lazy<Dictionary<string, CoolingFluid>> Fluids = new(() =>
        EmbeddedData.ReadCsv("Materials", "cooling-fluids.csv").Rows
            .GroupBy(r => r.Text("fluid"))
            .ToDictionary(g => g.Key, g =>
            {
                var rows = g.OrderBy(r => r.Number("temperature_k")).ToList();
                return new CoolingFluid(g.Key,
                    rows.Select(r => r.Number("temperature_k")).ToArray(),
                    rows.Select(r => new FluidProperties(
                        r.Number("kinematic_viscosity_mm2_per_s") * 1e-6,
                        r.Number("thermal_conductivity_w_per_m_k"),
                        r.Number("prandtl"),
                        r.Number("expansion_per_k"))).ToArray(),
                    rows[0].Text("source"));
            }));
}
