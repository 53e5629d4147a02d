using System.CommandLine;
using System.Globalization;
using SlotOpt.Design.Limits;
using SlotOpt.Input;
using SlotOpt.Lamination;
using SlotOpt.Reports;
using SlotOpt.Tables;

namespace SlotOpt.Cli;

/// <summary>`slotopt fit FILE`: hysteresis and excess coefficients from measured sine losses.</summary>
public static class FitCommand
{
    public static Command Build()
    {
        var file = new Argument<string>("file") { Description = "CSV with columns b_t, f_hz, w_per_kg (sine excitation)" };
        var thickness = QuantityOption.Create("--thickness", "Sheet thickness, e.g. 0.35mm", required: true);
        var resistivity = QuantityOption.Create("--resistivity", "Resistivity, e.g. \"0.52 uOhm m\"", required: true);
        var density = QuantityOption.Create("--density", "Density, e.g. \"7650 kg/m3\"", required: true);
        var permeability = new Option<double?>("--permeability") { Description = "Relative permeability for the skin correction of the classical term (default: no correction)" };
        var json = new Option<bool>("--json") { Description = "Print one JSON object" };
        var command = new Command("fit", "Fit hysteresis (kh, alpha) and excess (ke) coefficients to measured losses; classical term from theory");
        command.Arguments.Add(file);
        foreach (var o in new Option[] { thickness, resistivity, density, permeability, json }) command.Options.Add(o);
        var limitOptions = new RunLimitOptions();
        limitOptions.AddTo(command, parallel: false, search: false);

        command.SetAction(parseResult => CommandRunner.Run(parseResult, (output, error) =>
        {
            var limits = limitOptions.Start(parseResult);
            using var deadline = limits.Deadline!;
            limits.CheckMemory("the command", MemoryModel.Margin * MemoryModel.RuntimeBytes, "the process alone needs more; there is nothing to make smaller");
            var d = QuantityOption.ReadPositive(parseResult, thickness, QuantityKind.Length)!.Value;
            var rho = QuantityOption.ReadPositive(parseResult, resistivity, QuantityKind.Resistivity)!.Value;
            var rhoM = QuantityOption.ReadPositive(parseResult, density, QuantityKind.Density)!.Value;
            var mu = parseResult.GetValue(permeability);
            if (mu is { } m && !(m >= 1)) throw new InputException($"--permeability: must be 1 or more, got {m}");
            var path = parseResult.GetValue(file)!;
            var data = deadline.Run("reading the measurements", () => LossMeasurementCsv.Read(path));
            var fit = deadline.Run("the fit", () => LossCoefficientFit.Fit(data, d, rho, rhoM, mu));
            foreach (var warning in fit.Warnings) error.WriteLine($"warning: {warning}");
            if (parseResult.GetValue(json))
            {
                output.Write(new FitJson(
                    fit.HysteresisCoefficient, fit.HysteresisExponent, fit.ExcessCoefficient,
                    fit.HysteresisCoefficientError, fit.HysteresisExponentError, fit.ExcessCoefficientError,
                    fit.ClassicalCoefficient, fit.RSquared, fit.WorstRelativeError, data.Count, fit.Warnings).Serialize());
                return ExitCodes.Success;
            }
            var o = output;
            o.WriteLine($"Fit of P = kh f B^alpha + kc f^2 B^2 + ke (f B)^1.5 to {data.Count} points of {path}");
            o.WriteLine($"  kh    = {Numbers.Sig(fit.HysteresisCoefficient)} +/- {Numbers.Sig(fit.HysteresisCoefficientError)} W/(kg Hz T^alpha)");
            o.WriteLine($"  alpha = {Numbers.Sig(fit.HysteresisExponent)} +/- {Numbers.Sig(fit.HysteresisExponentError)}");
            o.WriteLine($"  ke    = {Numbers.Sig(fit.ExcessCoefficient)} +/- {Numbers.Sig(fit.ExcessCoefficientError)} W/(kg (T/s)^1.5)");
            o.WriteLine($"  kc    = {Numbers.Sig(fit.ClassicalCoefficient)} W/(kg Hz^2 T^2) (from theory, fixed{(mu is null ? "" : $", skin corrected at mu_r {Numbers.Sig(mu.Value)}")})");
            o.WriteLine($"  R^2 = {Numbers.Sig(fit.RSquared)}, worst relative error {Numbers.Sig(fit.WorstRelativeError * 100)} %");
            if (fit.Warnings.Count > 0) o.WriteLine($"  {fit.Warnings.Count} warning(s), printed above: read them before using these coefficients");
            return ExitCodes.Success;
        }));
        return command;
    }
}
