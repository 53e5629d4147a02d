using System.Text.Json;
using SlotOpt.Cli;
using SlotOpt.Input;
using SlotOpt.Plates.Thermal;
using SlotOpt.Runs;

namespace SlotOpt.Tests.Plates.Thermal;

/// <summary>[thermal] in plate files: reading, mistakes with file:line and key, and the plate command's output.</summary>
[Collection("Console")]
public class ThermalPlateFileTests
{
    // An invented stainless tie plate in oil (demo data, not a reference).
    private const string Plate = """
        [plate]
        width = "300 mm"
        height = "120 mm"
        thickness = "10 mm"
        resistivity = "0.72 uOhm m"

        [grid]
        cell = "5 mm"

        [source]
        kind = "uniform_ac"
        peak = "60 mT"
        frequency = "50 Hz"

        """;

    private const string Thermal = """
        [thermal]
        cooling = "air"
        ambient = "40 degC"
        emissivity = 0.5
        material = "SS-304"
        max_temperature_rise = 30
        """;

    [Fact]
    public void Thermal_section_is_read_in_SI()
    {
        var file = PlateFileReader.Parse(Plate + Thermal, "plate.toml");
        var t = Assert.IsType<PlateThermalInput>(file.Thermal);
        Assert.Equal(CoolingMedium.Air, t.Cooling.Medium);
        Assert.Equal(313.15, t.Cooling.AmbientK, 1e-9);
        Assert.Equal(0.12, t.Cooling.VerticalLengthM, 1e-12);       // y extent: the default vertical axis
        Assert.Equal(14.9, t.Material.ThermalConductivityWPerMK);    // SS-304 row of the built-in table
        Assert.Equal(30, t.Limit.MaxRiseK);
        // resistivity law of SS-304 (linear, alpha 0.001/K from 20 degC): sigma(120 degC) / sigma(20 degC) = 1 / 1.1
        Assert.Equal(1 / 1.1, t.Material.ConductivityFactorAtK(393.15), 1e-12);
    }

    [Theory]
    [InlineData("cooling = \"oill\"\nmaterial = \"SS-304\"\n", "thermal.cooling", "oil")]
    [InlineData("cooling = \"fixed\"\nmaterial = \"SS-304\"\n", "thermal.h", "missing")]
    [InlineData("cooling = \"air\"\nh = 10\nmaterial = \"SS-304\"\n", "thermal.h", "fixed")]
    [InlineData("cooling = \"air\"\nmaterial = \"SS-30\"\n", "thermal.material", "SS-304")]
    [InlineData("cooling = \"air\"\nmaterial = \"SS-304\"\nemissivity = 1.5\n", "thermal.emissivity", "between 0 and 1")]
    [InlineData("cooling = \"air\"\nmaterial = \"SS-304\"\nedge = \"ambient\"\n", "thermal.edge", "edges")]
    [InlineData("cooling = \"air\"\nthermal_conductivity = 15\n", "thermal.temperature_coefficient", "missing")]
    public void Mistakes_name_the_file_line_and_key(string section, string key, string hint)
    {
        var e = Assert.Throws<InputException>(() => PlateFileReader.Parse(Plate + "[thermal]\n" + section, "bad.toml"));
        Assert.Contains("bad.toml:", e.Message);
        Assert.Contains(key, e.Message);
        Assert.Contains(hint, e.Message);
    }

    private static (int Code, string Out, string Err) Run(params string[] args)
    {
        var oldOut = Console.Out; var oldErr = Console.Error;
        var o = new StringWriter(); var e = new StringWriter();
        Console.SetOut(o); Console.SetError(e);
        try { return (SlotOptCommand.Build().Parse(args).Invoke(), o.ToString(), e.ToString()); }
        finally { Console.SetOut(oldOut); Console.SetError(oldErr); }
    }

    // Through the command: the JSON keys of the issue, and the heat balance (convected + radiated = loss within
    // 0.5 %, the tolerance) as the user sees it.
    [Fact]
    public void Plate_command_prints_the_temperature()
    {
        var dir = Path.Combine(Path.GetTempPath(), "slotopt-thermal-" + Guid.NewGuid().ToString("N"));
        Directory.CreateDirectory(dir);
        try
        {
            var path = Path.Combine(dir, "plate.toml");
            File.WriteAllText(path, Plate + Thermal);
            var (code, json, err) = Run("plate", path, "--json");
            Assert.True(code == 0, err);
            var o = JsonDocument.Parse(json).RootElement;
            double max = o.GetProperty("temperature_rise_max_k").GetDouble(), mean = o.GetProperty("temperature_rise_mean_k").GetDouble();
            Assert.True(max >= mean && mean > 1, $"max {max} K, mean {mean} K");
            double loss = o.GetProperty("loss_w").GetDouble();
            Assert.Equal(loss, o.GetProperty("heat_convected_w").GetDouble() + o.GetProperty("heat_radiated_w").GetDouble(), loss * 0.005);
            var (code2, text, _) = Run("plate", path);
            Assert.Equal(0, code2);
            Assert.Contains("hottest point", text);
            Assert.Contains("mean rise", text);
            Assert.Contains("resistivity at", text);
            Assert.Contains("temperature limit", text);
        }
        finally { Directory.Delete(dir, true); }
    }
}
