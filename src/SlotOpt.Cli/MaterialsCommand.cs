using System.CommandLine;
using System.Globalization;
using SlotOpt.Materials;
using SlotOpt.Reports;

namespace SlotOpt.Cli;

/// <summary>`slotopt materials [--json]`: the built-in grades and conductors.</summary>
public static class MaterialsCommand
{
    public static Command Build()
    {
        var json = new Option<bool>("--json") { Description = "Print one JSON object" };
        var command = new Command("materials", "List the built-in lamination grades and plate conductors with their data and sources");
        command.Options.Add(json);
        command.SetAction(parseResult => CommandRunner.Run(parseResult, (output, error) =>
        {
            var library = MaterialLibrary.BuiltIn;
            var steels = library.Steels.OrderBy(s => s.Family).ThenBy(s => s.ThicknessM).ThenBy(s => s.SpecMaxLossWPerKg).ToList();
            var conductors = library.Conductors.OrderBy(c => c.Name, StringComparer.Ordinal).ToList();
            if (parseResult.GetValue(json))
            {
                output.Write(JsonFormat.Serialize(new
                {
                    grades = steels.Select(s => new
                    {
                        grade = s.Grade, family = s.Family, thickness_mm = s.ThicknessM * 1e3, density_kg_m3 = s.DensityKgPerM3,
                        resistivity_uohm_m = s.Resistivity20COhmM * 1e6, spec_max_loss_w_per_kg = s.SpecMaxLossWPerKg,
                        spec_peak_t = s.SpecPeakT, spec_frequency_hz = s.SpecFrequencyHz, stacking_factor = s.StackingFactor,
                        relative_permeability = s.RelativePermeability, knee_flux_t = s.KneeFluxT, max_flux_t = s.MaxFluxT,
                        kh = s.HysteresisCoefficient, alpha = s.HysteresisExponent, ke = s.ExcessCoefficient,
                        coefficients_frequency_hz = s.CoefficientsFrequencyHz, price_per_kg = s.PricePerKg, source = s.Source,
                    }),
                    conductors = conductors.Select(c => new
                    {
                        name = c.Name, resistivity_20c_uohm_m = c.Resistivity20COhmM * 1e6, alpha_20_per_k = c.Alpha20PerK,
                        density_kg_m3 = c.DensityKgPerM3, relative_permeability = c.RelativePermeability, magnetic = c.IsMagnetic,
                        temperature_model = c.TemperatureModel, price_per_kg = c.PricePerKg, source = c.Source,
                    }),
                }));
                return ExitCodes.Success;
            }
            var o = output;
            var ci = CultureInfo.InvariantCulture;
            o.WriteLine("Lamination grades (limit = the standard's maximum specific loss at its specification point)");
            o.WriteLine($"{"grade",-10} {"family",-16} {"t mm",5} {"rho uOhm m",10} {"limit W/kg",10} {"at",12} {"SF",5} {"kh",8} {"alpha",6} {"ke",9} {"price/kg",8}");
            foreach (var s in steels)
                o.WriteLine(string.Create(ci, $"{s.Grade,-10} {s.Family,-16} {s.ThicknessM * 1e3,5:0.00} {s.Resistivity20COhmM * 1e6,10:0.00} {s.SpecMaxLossWPerKg,10:0.00} {$"{s.SpecPeakT:0.0} T {s.SpecFrequencyHz:0} Hz",12} {s.StackingFactor,5:0.00} {s.HysteresisCoefficient,8:0.00000} {s.HysteresisExponent,6:0.000} {s.ExcessCoefficient,9:0.000000} {s.PricePerKg,8:0.00}"));
            o.WriteLine();
            o.WriteLine("Plate conductors (resistivity at 20 degC)");
            o.WriteLine($"{"name",-13} {"rho uOhm m",10} {"alpha 1/K",9} {"kg/m3",6} {"magnetic",8} {"temperature model",-22} {"price/kg",8}");
            foreach (var c in conductors)
                o.WriteLine(string.Create(ci, $"{c.Name,-13} {c.Resistivity20COhmM * 1e6,10:0.000000} {c.Alpha20PerK,9:0.00000} {c.DensityKgPerM3,6:0} {(c.IsMagnetic ? "yes" : "no"),8} {c.TemperatureModel,-22} {c.PricePerKg,8:0.00}"));
            o.WriteLine();
            o.WriteLine("Prices are invented demo prices. Coefficients are derived from the standards' limits (see Materials/Data/README.md); fit your own with `slotopt fit`.");
            return ExitCodes.Success;
        }));
        return command;
    }
}
