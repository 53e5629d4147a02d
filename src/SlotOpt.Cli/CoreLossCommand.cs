using System.CommandLine;
using System.Globalization;
using SlotOpt.Tables;
using SlotOpt.Design.Limits;
using SlotOpt.Input;
using SlotOpt.Lamination;
using SlotOpt.Materials;
using SlotOpt.Reports;
using SlotOpt.Waveforms;

namespace SlotOpt.Cli;

/// <summary>`slotopt core-loss`: specific loss of one grade under one flux waveform, with its breakdown.</summary>
public static class CoreLossCommand
{
    public static Command Build()
    {
        var grade = new Option<string>("--grade") { HelpName = "GRADE", Description = "Lamination grade, e.g. M270-35A (see `slotopt materials`)", Required = true };
        var peak = QuantityOption.Create("--peak-flux-density", "Peak flux density in the steel, e.g. 1.5T (with --waveform: scales the file's shape to this peak)", placeholder: "<B>", oldName: "--peak");
        var frequency = QuantityOption.Create("--frequency", "Fundamental frequency, e.g. 50Hz", required: true);
        var width = QuantityOption.Create("--tooth-or-limb-width", "Width of the tooth or limb the flux runs along, e.g. 3mm", placeholder: "<LENGTH>", oldName: "--width");
        var temperature = QuantityOption.Create("--temperature", "Steel temperature, e.g. 80degC (default 20degC)");
        var waveform = new Option<string>("--waveform") { HelpName = "FILE.csv", Description = "CSV of one period of B: columns phase,b_t or t_s,b_t (straight lines between samples)" };
        var json = new Option<bool>("--json") { Description = "Print one JSON object" };
        var command = new Command("core-loss", "Specific loss of a lamination grade: hysteresis, classical eddy (skin and width corrected) and excess");
        foreach (var o in new Option[] { grade, peak, frequency, width, temperature, waveform, json }) command.Options.Add(o);
        var limitOptions = new RunLimitOptions();
        limitOptions.AddTo(command, parallel: false, search: false);

        command.SetAction(parseResult => CommandRunner.Run(parseResult, (output, error) =>
        {
            var limits = limitOptions.Start(parseResult);
            using var deadline = limits.Deadline!;
            limits.CheckMemory("the command", MemoryModel.Margin * MemoryModel.RuntimeBytes, "the process alone needs more; there is nothing to make smaller");
            QuantityOption.WarnIfOldName(parseResult, peak, error);
            QuantityOption.WarnIfOldName(parseResult, width, error);
            var steel = MaterialLibrary.BuiltIn.GetSteel(parseResult.GetValue(grade)!, "--grade");
            var f = QuantityOption.ReadPositive(parseResult, frequency, QuantityKind.Frequency)!.Value;
            var bp = QuantityOption.Read(parseResult, peak, QuantityKind.FluxDensity);
            if (bp is { } b && !(b >= 0)) throw new InputException($"--peak-flux-density: must be zero or positive, got {parseResult.GetValue(peak)}");
            var conditions = new LaminationConditions
            {
                TemperatureK = QuantityOption.Read(parseResult, temperature, QuantityKind.Temperature) ?? Conductor.RoomTemperatureK,
                FeatureWidthM = QuantityOption.ReadPositive(parseResult, width, QuantityKind.Length) ?? double.PositiveInfinity,
            };
            if (!(conditions.TemperatureK > 0)) throw new InputException($"--temperature: below absolute zero ({parseResult.GetValue(temperature)})");

            IFluxWaveform flux;
            var file = parseResult.GetValue(waveform);
            if (file is null)
            {
                flux = new SineWaveform(bp ?? throw new InputException("--peak-flux-density: required unless --waveform gives the flux values"), f);
            }
            else
            {
                var shape = deadline.Run("reading the waveform", () => WaveformCsv.Read(file, f));
                flux = bp is { } target
                    ? (shape.PeakT > 0 ? shape.Scaled(target / shape.PeakT) : throw new InputException($"{file}: the waveform is zero everywhere; it cannot be scaled to --peak-flux-density"))
                    : shape;
            }

            var loss = deadline.Run("the loss of the waveform", () => LaminationLossModel.Evaluate(steel, flux, conditions));
            if (parseResult.GetValue(json))
            {
                output.Write(new CoreLossJson(
                    steel.Grade, steel.ThicknessM * 1e3, flux.PeakT, f, conditions.TemperatureK, file ?? "sine",
                    loss.TotalWPerKg, loss.HysteresisWPerKg, loss.ClassicalWPerKg, loss.ExcessWPerKg, loss.TotalWPerM3,
                    loss.SkinFactor, loss.WidthFactor, loss.SkinDepthM * 1e3, loss.ThicknessOverSkinDepth, loss.ResistivityOhmM * 1e6,
                    loss.Flags.Select(x => $"{x.Code}: {x.Message}").ToList()).Serialize());
                return ExitCodes.Success;
            }
            var o = output;
            var ci = CultureInfo.InvariantCulture;
            o.WriteLine(string.Create(ci, $"{steel.Grade} ({Numbers.Sig(steel.ThicknessM * 1e3)} mm) at {Numbers.Sig(flux.PeakT)} T peak, {Numbers.Sig(f)} Hz, {(file is null ? "sine" : "waveform " + file)}, {Numbers.Celsius(conditions.TemperatureK, "degC")}"));
            o.WriteLine($"  hysteresis   {Numbers.Sig(loss.HysteresisWPerKg),10} W/kg");
            o.WriteLine($"  classical    {Numbers.Sig(loss.ClassicalWPerKg),10} W/kg   (skin factor {Numbers.Sig(loss.SkinFactor)}, width factor {Numbers.Sig(loss.WidthFactor)})");
            o.WriteLine($"  excess       {Numbers.Sig(loss.ExcessWPerKg),10} W/kg");
            o.WriteLine($"  total        {Numbers.Sig(loss.TotalWPerKg),10} W/kg   ({Numbers.Sig(loss.TotalWPerM3 / 1e3)} kW/m^3)");
            o.WriteLine($"  skin depth   {Numbers.Sig(loss.SkinDepthM * 1e3),10} mm    (thickness / skin depth {Numbers.Sig(loss.ThicknessOverSkinDepth)})");
            o.WriteLine($"  standard limit of {steel.Grade}: {Numbers.Sig(steel.SpecMaxLossWPerKg)} W/kg at {Numbers.Sig(steel.SpecPeakT)} T {Numbers.Sig(steel.SpecFrequencyHz)} Hz");
            foreach (var flag in loss.Flags) o.WriteLine($"  warning [{flag.Code}]: {flag.Message}");
            return ExitCodes.Success;
        }));
        return command;
    }
}
