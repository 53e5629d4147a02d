using SlotOpt.Design.SolidParts;
using System.Globalization;
using SlotOpt.Design;
using SlotOpt.Input;
using SlotOpt.Plates.Thermal;
using SlotOpt.Reports;
using SlotOpt.Runs;
using SlotOpt.Reports.Json;

namespace SlotOpt.Tests.Runs;

/// <summary>
/// [parts.thermal] in the main job: the temperature limit drops options (counted by its own rule kind), the bracket's
/// decisions agree with a coupled solve of every option, the run's coupled temperature of the chosen plate equals the
/// plate command's on the same plate, the heat balance closes, and the JSON carries the keys of issue 14.
/// </summary>
public class PlateTemperatureRunTests
{
    // An invented shield in a 20 mT, 50 Hz field with a fixed h of 10 W/m2K per face (demo data, not a reference): the
    // aluminium options run tens of kelvin hot, the stainless ones a few, so a 20 K limit drops some and keeps others.
    private const string Problem = """
        [problem]
        name = "hot plate test"
        objective = "lowest-owning-cost"
        [economics]
        value_per_watt = 2
        [[parts]]
        name = "shield"
        kind = "plate"
        width = "300 mm"
        height = "120 mm"
        thicknesses = ["4 mm", "8 mm"]
        materials = ["SS-304", "Al-6061-T6"]
        processes = ["laser"]
        temperature = "40 degC"
        min_ligament = "20 mm"
        [parts.grid]
        cell = "5 mm"
        [parts.source]
        kind = "uniform_ac"
        peak = "20 mT"
        frequency = "50 Hz"
        [[parts.slots]]
        pattern = "comb"
        edge = "bottom"
        pitch = ["30 mm", "60 mm"]
        depth = ["80 mm"]
        width = ["3 mm"]
        [parts.thermal]
        cooling = "fixed"
        h = 10
        ambient = "40 degC"
        max_temperature_rise = 20
        """;

    private const double H = 10, LimitK = 20;

    private static readonly Lazy<RunResult> Run = new(() => DesignRun.Execute(ProblemReader.Read(Problem, "hot.toml")));

    [Fact]
    public void Part_thermal_is_read_in_SI()
    {
        var part = (PlatePart)ProblemReader.Read(Problem, "hot.toml").Parts[0];
        var thermal = Assert.IsType<PartThermal>(part.Thermal);
        Assert.Equal(CoolingMedium.Fixed, thermal.Cooling.Medium);
        Assert.Equal(10, thermal.Cooling.FixedCoefficientWPerM2K);
        Assert.Equal(313.15, thermal.Cooling.AmbientK, 1e-9);
        Assert.Equal(20, thermal.Limit.MaxRiseK);
    }

    [Theory]
    [InlineData("material = \"SS-304\"\n", "bad.toml:33: parts[1].thermal.material")]           // the candidates' materials give k; a material key is unknown here
    [InlineData("emissivity = 2\n", "bad.toml:33: parts[1].thermal.emissivity")]
    public void Part_thermal_mistakes_name_the_file_line_and_key(string extra, string key)
    {
        var e = Assert.Throws<InputException>(() => ProblemReader.Read(Problem + "\n" + extra, "bad.toml"));
        Assert.Contains("bad.toml:", e.Message);
        Assert.Contains(key, e.Message);
    }

    // The rule's count against an independent coupled solve of every option (PlateHeating: resistivity at the local
    // temperature): the options over the limit are exactly those the run dropped by the new kind. Decisions taken on a bound
    // must hold against the coupled answer: the upper bound (loss at the ambient resistivity) is never below it, the lower
    // bound never above it (Rayleigh's monotonicity of the dissipation in an EMF-driven network; common practice, no source).
    // Tolerance 1e-6 K: the coupling stops at a conductivity mismatch of 1e-5, about 1e-3 K here, so the bounds are checked
    // with that margin, and the count must match exactly.
    [Fact]
    public void Temperature_limit_drops_exactly_the_options_a_coupled_solve_finds_too_hot()
    {
        var r = Run.Value;
        var part = (PlatePart)r.Problem.Parts[0];
        var options = r.Parts[0].Options;
        int tooHot = 0;
        foreach (var o in options)
        {
            var c = (PlateChoice)o.Choice;
            var coupled = PlateOptions.SolveHeated(part, c.Slots, c.ThicknessM, r.Problem.Library.GetConductor(c.Material, part.Name), EvaluationLimits.Default);
            var rise = coupled.Temperature.MaxRiseK;
            if (rise > LimitK) tooHot++;
            var t = Assert.IsType<OptionTemperature>(o.Temperature);
            switch (t.Method)
            {
                case TemperatureMethod.UpperBound: Assert.True(t.MaxRiseK >= rise - 2e-3, $"{o.Id}: upper bound {t.MaxRiseK} K below the coupled {rise} K"); break;
                case TemperatureMethod.LowerBound: Assert.True(t.MaxRiseK <= rise + 2e-3, $"{o.Id}: lower bound {t.MaxRiseK} K above the coupled {rise} K"); break;
                default: Assert.Equal(rise, t.MaxRiseK, 1e-6); break;
            }
            Assert.Equal(rise > LimitK, o.Rejection?.Kind == RuleKind.HotterThanLimit);
        }
        Assert.True(tooHot > 0 && tooHot < options.Count, $"the limit should drop some options and keep others (dropped {tooHot} of {options.Count})");
        Assert.Equal(tooHot, r.Parts[0].RejectionCounts["hotter than the part's limit"]);
        Assert.Contains(options, o => o.Temperature!.Method == TemperatureMethod.Coupled);     // the case exercises all three ways
        Assert.Contains(options, o => o.Temperature!.Method == TemperatureMethod.LowerBound);
        Assert.True(r.HeatOf("shield", DesignRole.Chosen)!.Heating!.Temperature.MaxRiseK <= LimitK);
    }

    // The two paths agree: the chosen plate written as a plate file (same outline, slots, grid, thickness, conductivity at the
    // part's temperature, [thermal] with the same cooling and SS-304's law from that temperature) gives the same temperature
    // through `slotopt plate`'s evaluation. Same equations on the same grid: agreement to 1e-9 relative (rounding only).
    [Fact]
    public void Run_temperature_of_the_chosen_plate_equals_the_plate_command_on_the_same_plate()
    {
        var r = Run.Value;
        var heat = r.HeatOf("shield", DesignRole.Chosen)!;
        var choice = (PlateChoice)heat.Option.Choice;
        var part = (PlatePart)r.Problem.Parts[0];
        var material = r.Problem.Library.GetConductor(choice.Material, part.Name);
        var ci = CultureInfo.InvariantCulture;
        var slots = choice.Slots is { } s
            ? string.Create(ci, $"[[slots]]\npattern = \"comb\"\nedge = \"bottom\"\npitch = {s.PitchM:R}\ndepth = {s.DepthM:R}\nwidth = {s.WidthM:R}\n")
            : "";
        var plateFile = string.Create(ci, $"""
            [plate]
            width = 0.3
            height = 0.12
            thickness = {choice.ThicknessM:R}
            conductivity = {material.ConductivityAt(part.TemperatureK):R}
            [grid]
            cell = 0.005
            [source]
            kind = "uniform_ac"
            peak = 0.02
            frequency = 50
            [thermal]
            cooling = "fixed"
            h = 10
            ambient = "40 degC"
            material = "{choice.Material}"
            resistivity_temperature = "40 degC"
            max_temperature_rise = 20

            """) + slots;
        var plate = PlateFileEvaluation.Evaluate(PlateFileReader.Parse(plateFile, "same.toml"));
        var viaPlate = plate.Heating!.Temperature;
        var viaRun = heat.Heating!.Temperature;
        Assert.Equal(viaPlate.HottestK, viaRun.HottestK, viaRun.HottestK * 1e-9);
        Assert.Equal(viaPlate.MeanRiseK, viaRun.MeanRiseK, viaRun.MeanRiseK * 1e-9);
        Assert.Equal(viaPlate.HottestXM, viaRun.HottestXM, 1e-12);
        Assert.Equal(viaPlate.HottestYM, viaRun.HottestYM, 1e-12);
        Assert.Equal(plate.LossW, heat.Heating.LossW, heat.Heating.LossW * 1e-9);
    }

    // Energy balance with a fixed h and no radiation: all the loss leaves by convection from both faces, P = 2 h A mean rise
    // (Newton's law of cooling, F. P. Incropera et al., Fundamentals of Heat and Mass Transfer, 6th ed., 2007, eq. 1.3a). The
    // reference plate is solid (A = 0.3 m x 0.12 m exactly). Tolerance 2e-4: the solver's heat balance is held to 1e-4.
    [Fact]
    public void Reference_plate_mean_rise_closes_the_heat_balance()
    {
        var heated = Run.Value.HeatOf("shield", DesignRole.Reference)!.Heating!;
        var expected = heated.LossW / (2 * H * 0.3 * 0.12);
        Assert.Equal(expected, heated.Temperature.MeanRiseK, expected * 2e-4);
    }

    [Fact]
    public void Result_json_carries_the_rises_of_the_chosen_and_the_reference_plate()
    {
        var r = Run.Value;
        using var doc = System.Text.Json.JsonDocument.Parse(ResultJson.From(r).Serialize());
        var part = doc.RootElement.GetProperty("parts")[0];
        var chosen = part.GetProperty("temperature");
        var reference = part.GetProperty("reference").GetProperty("temperature");
        Assert.Equal(r.HeatOf("shield", DesignRole.Chosen)!.Heating!.Temperature.MaxRiseK, chosen.GetProperty("temperature_rise_max_k").GetDouble(), 1e-9);
        Assert.Equal(r.HeatOf("shield", DesignRole.Reference)!.Heating!.Temperature.MeanRiseK, reference.GetProperty("temperature_rise_mean_k").GetDouble(), 1e-9);
        Assert.Equal(RuleBreak.ShortNameOf(RuleKind.HotterThanLimit), part.GetProperty("rejected").EnumerateObject().Single().Name);
    }
}
