using SlotOpt.Input;
using SlotOpt.Plates.Sources;

namespace SlotOpt.Tests.Plates;

public class PlateFileReaderTests
{
    private const string Valid = """
        [plate]
        width = "400 mm"
        height = "200 mm"
        thickness = "6 mm"
        resistivity = "0.0401 uOhm m"

        [[slots]]
        pattern = "comb"
        edge = "bottom"
        pitch = "50 mm"
        depth = "150 mm"
        width = "4 mm"

        [source]
        kind = "moving_poles"
        pole = "rectangle"
        pole_width = "30 mm"
        pole_height = "60 mm"
        flux_density = "0.3 T"
        speed = "2 m/s"
        x = "100 mm"
        y = "100 mm"
        count = 2
        pole_pitch = "60 mm"
        positions = 5
        """;

    // Units: BIPM SI Brochure, 9th ed., 2019 (prefixes); sigma = 1/rho. Tolerance 1e-12 relative: unit arithmetic only.
    [Fact]
    public void Reads_plate_slots_and_moving_poles_into_SI()
    {
        var plate = PlateFileReader.Parse(Valid, "valid.toml");
        Assert.Equal(6e-3, plate.Sheet.ThicknessM, 1e-15);
        Assert.Equal(1 / 0.0401e-6, plate.Sheet.ConductivitySPerM, 1e-12 * 1 / 0.0401e-6);
        Assert.Equal(0.05, plate.Geometry.Patterns[0].PitchM, 1e-15);
        Assert.Equal(8, plate.Geometry.Slots.Count);          // 400 mm / 50 mm pitch, centred: 8 slots (common practice, no source: the pattern rule of SlotPatterns)
        Assert.Equal(5, plate.OffsetsXM.Count);               // positions = 5 over one slot pitch (the default average with slots)
        Assert.Equal(0.04, plate.OffsetsXM[^1], 1e-15);       // 4/5 of the 50 mm pitch
        Assert.Equal(-0.3, ((MovingPoles)plate.MovingSource!).Poles[1].FluxDensityT, 1e-15);   // alternating polarity
    }

    // Every error names file:line and the key; all are reported together.
    [Theory]
    [InlineData("thickness = \"6 mm\"", "thickness = \"6 T\"", "bad.toml:4: plate.thickness: ")]          // wrong unit
    [InlineData("thickness = \"6 mm\"", "thickness = \"6 mm\"\ncolour = \"red\"", "bad.toml:5: plate.colour: unknown key")]
    [InlineData("thickness = \"6 mm\"", "", "bad.toml:1: plate.thickness: missing")]
    [InlineData("edge = \"bottom\"", "edge = \"middle\"", "bad.toml:9: slots[1].edge: ")]
    [InlineData("width = \"4 mm\"", "width = \"60 mm\"", "bad.toml:8: slots[1].pattern: slot width 0.06 m is not smaller than the pitch")]
    [InlineData("count = 2", "count = 2\nspeed_limit = 3", "source.speed_limit: unknown key")]
    public void Errors_name_file_line_and_key(string find, string replace, string expected)
    {
        var text = Valid.Replace(find, replace);
        var e = Assert.Throws<InputException>(() => PlateFileReader.Parse(text, "bad.toml"));
        Assert.Contains(expected, e.Message);
    }

    [Fact]
    public void Unknown_table_and_syntax_errors_are_input_errors()
    {
        var e = Assert.Throws<InputException>(() => PlateFileReader.Parse(Valid + "\n[magnets]\nn = 1\n", "bad.toml"));
        Assert.Contains("magnets: unknown key", e.Message);
        var s = Assert.Throws<InputException>(() => PlateFileReader.Parse("[plate]\nwidth = \n", "bad.toml"));
        Assert.StartsWith("bad.toml:2:", s.Message);
    }
}
