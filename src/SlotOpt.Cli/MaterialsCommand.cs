using System.CommandLine;
using System.Globalization;
using SlotOpt.Materials;
using SlotOpt.Reports;
using SlotOpt.Tables;

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
                output.Write(new MaterialsJson(
                    steels.Select(s => new MaterialsJson.Steel(
                        s.Grade, IsOwnDesignation(s), s.Family, s.ThicknessM * 1e3, s.DensityKgPerM3, s.Resistivity20COhmM * 1e6, s.SpecMaxLossWPerKg,
                        s.SpecPeakT, s.SpecFrequencyHz, s.StackingFactor, s.RelativePermeability, s.KneeFluxT, s.MaxFluxT,
                        s.HysteresisCoefficient, s.HysteresisExponent, s.ExcessCoefficient, s.CoefficientsFrequencyHz, s.PricePerKg, s.Source)).ToList(),
                    conductors.Select(c => new MaterialsJson.Conductor(
                        c.Name, c.Resistivity20COhmM * 1e6, c.Alpha20PerK, c.DensityKgPerM3, c.RelativePermeability, c.IsMagnetic,
                        c.TemperatureModel, c.PricePerKg, c.Source)).ToList()).Serialize());
                return ExitCodes.Success;
            }
            var o = output;
            o.WriteLine("Lamination grades (limit = the standard's maximum specific loss at its specification point)");
            o.WriteLine($"{"grade",-10} {"family",-16} {"t mm",5} {"rho uOhm m",10} {"limit W/kg",10} {"at",12} {"SF",5} {"kh",8} {"alpha",6} {"ke",9} {"price/kg",8}");
            foreach (var s in steels)
                o.WriteLine($"{s.Grade + (IsOwnDesignation(s) ? "*" : ""),-10} {FamilyWords(s.Family),-16} {Numbers.Sig(s.ThicknessM * 1e3),5} {Numbers.Sig(s.Resistivity20COhmM * 1e6),10} {Numbers.Sig(s.SpecMaxLossWPerKg),10} {$"{Numbers.Of(s.SpecPeakT, "T")} {Numbers.Of(s.SpecFrequencyHz, "Hz")}",12} {Numbers.Sig(s.StackingFactor),5} {Numbers.Sig(s.HysteresisCoefficient),8} {Numbers.Sig(s.HysteresisExponent),6} {Numbers.Sig(s.ExcessCoefficient),9} {Numbers.Sig(s.PricePerKg),8}");
            o.WriteLine();
            o.WriteLine("Plate conductors (resistivity at 20 degC)");
            o.WriteLine($"{"name",-13} {"rho uOhm m",10} {"alpha 1/K",9} {"kg/m3",6} {"magnetic",8} {"temperature model",-22} {"price/kg",8}");
            foreach (var c in conductors)
                o.WriteLine($"{c.Name,-13} {Numbers.Sig(c.Resistivity20COhmM * 1e6),10} {Numbers.Sig(c.Alpha20PerK),9} {Numbers.Sig(c.DensityKgPerM3),6} {(c.IsMagnetic ? "yes" : "no"),8} {TemperatureModelWords(c.TemperatureModel),-22} {Numbers.Sig(c.PricePerKg),8}");
            o.WriteLine();
            o.WriteLine("* our own designation, not a standard grade name (see its source in `slotopt materials --json`).");
            o.WriteLine("Prices are invented demo prices. Coefficients are derived from the standards' limits (see Materials/Data/README.md); fit your own with `slotopt fit`.");
            return ExitCodes.Success;
        }));
        return command;
    }

    /// <summary>A grade name of our own (the data file's source says so), not a designation from a standard.</summary>
    private static bool IsOwnDesignation(ElectricalSteel s) => s.Source.StartsWith("own designation", StringComparison.Ordinal);

    private static string FamilyWords(SteelFamily family) => family switch
    {
        SteelFamily.NonOriented => "non-oriented",
        SteelFamily.GrainOriented => "grain-oriented",
        SteelFamily.ThinNonOriented => "thin non-oriented",
        _ => throw new ArgumentOutOfRangeException(nameof(family)),
    };

    private static string TemperatureModelWords(TemperatureModel model) => model switch
    {
        TemperatureModel.Linear => "linear in temperature",
        TemperatureModel.MatthiessenCopper => "Matthiessen, copper",
        TemperatureModel.MatthiessenAluminium => "Matthiessen, aluminium",
        _ => throw new ArgumentOutOfRangeException(nameof(model)),
    };
}
