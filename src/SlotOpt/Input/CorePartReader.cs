using System.Globalization;
using SlotOpt.Design;
using SlotOpt.Design.Cores;
using SlotOpt.Input.Toml;
using SlotOpt.Materials;
using SlotOpt.Tables;
using SlotOpt.Waveforms;

namespace SlotOpt.Input;

/// <summary>Reads a [[parts]] table of kind "core".</summary>
public static class CorePartReader
{
    /// <summary>Processes that cut laminations (milling does not).</summary>
    public static readonly IReadOnlyList<string> LaminationProcesses = ["punching", "laser", "waterjet", "guillotine", "wire-edm"];

    public static CorePart? Read(TomlSection s, MaterialLibrary library, ManufacturingSettings shop, string baseDirectory)
    {
        var name = s.RequiredString("name");
        s.OptionalString("kind");
        var grades = s.StringList("grades", required: true) ?? [];
        PlatePartReader.RejectDuplicates(s, "grades", grades);
        var validGrades = new List<string>();
        foreach (var g in grades)
        {
            if (library.TryGetSteel(g, out var steel)) validGrades.Add(steel.Grade);
            else s.Error("grades", $"unknown grade \"{g}\"{NameSuggestion.DidYouMean(g, library.Steels.Select(x => x.Grade))}; `slotopt materials` lists them");
        }
        var processes = ReadProcesses(s, shop);
        var area = s.PositiveQuantity("lamination_area", QuantityKind.Area, required: true);
        var height = s.PositiveQuantity("stack_height", QuantityKind.Length, required: true);
        var cutLength = s.PositiveQuantity("cut_length_per_sheet", QuantityKind.Length, required: false);
        s.AcceptOldName("flux", "peak_flux_density");
        s.AcceptOldName("feature_width", "tooth_or_limb_width");
        var flux = s.PositiveQuantity("peak_flux_density", QuantityKind.FluxDensity, required: !s.Has("waveform"));
        var frequency = s.PositiveQuantity("frequency", QuantityKind.Frequency, required: true);
        var waveformFile = s.OptionalString("waveform");
        var width = s.PositiveQuantity("tooth_or_limb_width", QuantityKind.Length, required: false);
        var temperature = s.OptionalQuantity("temperature", QuantityKind.Temperature) ?? Conductor.RoomTemperatureK;
        if (!(temperature > 0)) s.Error("temperature", "is below absolute zero");
        var maxLoss = s.PositiveQuantity("max_loss", QuantityKind.Power, required: false);
        var constructionWord = s.OptionalString("construction");
        CoreConstruction? construction = null;
        if (constructionWord is not null)
        {
            if (CoreConstructionWords.TryParse(constructionWord, out var c)) construction = c;
            else s.Error("construction", $"\"{constructionWord}\" is not a construction{NameSuggestion.DidYouMean(constructionWord, CoreConstructionWords.All)}; use {string.Join(", ", CoreConstructionWords.All)}");
        }
        var lossKind = LossKindWords.Read(s);
        var buildingFactor = s.OptionalNumber("building_factor");
        if (buildingFactor is { } bf && !(bf >= 1 && bf <= 3)) s.Error("building_factor", "must be between 1 and 3 (core loss over the loss of the steel's own test)");
        var current = ReadCurrent(s.OptionalTable("current"), library, shop);
        s.RejectUnknownKeys();

        IFluxWaveform? wave = null;
        if (frequency is { } f)
        {
            if (waveformFile is not null)
            {
                try
                {
                    var shape = WaveformCsv.Read(Path.Combine(baseDirectory, waveformFile), f);
                    wave = flux is { } peak && shape.PeakT > 0 ? shape.Scaled(peak / shape.PeakT) : shape;
                }
                catch (InputException e) { s.Error("waveform", e.Message); }
            }
            else if (flux is { } peak) wave = s.Guard("peak_flux_density", () => new SineWaveform(peak, f));
            if (f > 20e3) s.Warn("frequency", "above 20 kHz: laminated steel is rarely used there; check the coefficients' range");
        }
        if (wave is not null)
            foreach (var g in validGrades)
            {
                var steel = library.GetSteel(g, s.KeyPath("grades"));
                var inSteel = wave.PeakT / steel.StackingFactor; // flux is over the gross section
                if (inSteel > steel.MaxFluxT)
                    s.Error("peak_flux_density", string.Create(CultureInfo.InvariantCulture, $"{wave.PeakT:0.###} T over the gross section is {inSteel:0.###} T in the steel (stacking factor {steel.StackingFactor:0.###}), beyond what {g} carries ({steel.MaxFluxT:0.##} T at 10 kA/m): the steel saturates; lower the flux or drop the grade"));
                else if (inSteel > steel.KneeFluxT)
                    s.Warn("peak_flux_density", string.Create(CultureInfo.InvariantCulture, $"{wave.PeakT:0.###} T over the gross section is {inSteel:0.###} T in {g}, above its knee ({steel.KneeFluxT:0.##} T): magnetising current rises steeply"));
            }
        if (temperature > 473.15) s.Warn("temperature", "above 200 degC: insulation coatings and the resistivity data may not hold");
        if (current is not null && !validGrades.Contains(current.Grade))
            s.Error("current", $"the current grade {current.Grade} is not among this part's grades; add it to grades");
        if (current is not null && !processes.Contains(current.Process))
            s.Error("current", $"the current process {current.Process} is not among this part's processes");

        if (name is null || area is null || height is null || wave is null || validGrades.Count == 0 || processes.Count == 0) return null;
        return new CorePart(name, s.Line, temperature, maxLoss, validGrades, processes, area.Value, height.Value,
            cutLength ?? 4 * Math.Sqrt(area.Value), wave, width ?? double.PositiveInfinity, current)
        {
            Construction = construction,
            BuildingFactorOverride = buildingFactor,
            DeclaredLossKind = lossKind,
        };
    }

    private static List<string> ReadProcesses(TomlSection s, ManufacturingSettings shop)
    {
        var names = s.StringList("processes", required: false) ?? ["punching"];
        PlatePartReader.RejectDuplicates(s, "processes", names);
        var valid = new List<string>();
        foreach (var p in names)
        {
            if (!shop.Processes.ContainsKey(p)) s.Error("processes", $"unknown process \"{p}\"{NameSuggestion.DidYouMean(p, shop.Processes.Keys)}");
            else if (!LaminationProcesses.Contains(p) && !shop.Processes[p].Origin.Contains("problem file")) s.Error("processes", $"{p} does not cut laminations; use {string.Join(", ", LaminationProcesses)}");
            else valid.Add(p);
        }
        return valid;
    }

    private static CoreChoice? ReadCurrent(TomlSection? section, MaterialLibrary library, ManufacturingSettings shop)
    {
        if (section is null) return null;
        var grade = section.RequiredString("grade");
        var process = section.OptionalString("process") ?? "punching";
        section.RejectUnknownKeys();
        if (grade is null) return null;
        return new CoreChoice(library.TryGetSteel(grade, out var steel) ? steel.Grade : grade, process);
    }
}
