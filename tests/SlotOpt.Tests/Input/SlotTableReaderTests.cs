using SlotOpt.Design.SolidParts;
using SlotOpt.Design;
using SlotOpt.Input;
using SlotOpt.Plates.Geometry;

namespace SlotOpt.Tests.Input;

/// <summary>One slot reader for both file kinds: the same keys and defaults in plate files and problem files.</summary>
public class SlotTableReaderTests
{
    private const string PlateFile = """
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
        kind = "uniform_ac"
        peak = "10 mT"
        frequency = "50 Hz"
        """;

    private const string ProblemFile = """
        [problem]
        name = "p"

        [[parts]]
        name = "plate"
        kind = "plate"
        width = "200 mm"
        height = "60 mm"
        thicknesses = ["5 mm"]
        materials = ["Al-6061-T6"]

        [parts.source]
        kind = "uniform_ac"
        peak = "10 mT"
        frequency = "50 Hz"

        [[parts.slots]]
        pattern = "comb"
        pitch = ["20 mm"]
        depth = ["40 mm"]
        width = ["2 mm"]

        [parts.current]
        thickness = "5 mm"
        material = "Al-6061-T6"
        slots = { pattern = "comb", pitch = "20 mm", depth = "40 mm", width = "2 mm" }
        """;

    // A plate file without edge cuts the same slots as one that says "bottom": same code path, so the
    // corners agree exactly.
    [Fact]
    public void Edge_defaults_to_bottom_in_plate_files()
    {
        var said = PlateFileReader.Parse(PlateFile, "said.toml").Geometry.Slots;
        var unsaid = PlateFileReader.Parse(PlateFile.Replace("edge = \"bottom\"\n", ""), "unsaid.toml").Geometry.Slots;
        Assert.Equal(8, unsaid.Count);   // 400 mm / 50 mm pitch, centred (the pattern rule of SlotPatterns)
        Assert.Equal(said.Select(s => (s.Start, s.End, s.WidthM)), unsaid.Select(s => (s.Start, s.End, s.WidthM)));
    }

    [Fact]
    public void Edge_defaults_to_bottom_in_problem_files_for_families_and_the_current_design()
    {
        var plate = Assert.IsType<PlatePart>(ProblemReader.Read(ProblemFile, "ok.toml").Parts[0]);
        Assert.Equal(PlateEdge.Bottom, plate.SlotFamilies[0].Edge);
        Assert.Equal(new SlotChoice(SlotPatternKind.Comb, PlateEdge.Bottom, 0.020, 0.040, 0.002, null), plate.Current!.Slots);
    }

    // The same mistakes are the same errors in both file kinds: grooves need remaining_thickness, and the
    // pattern is required (the current design no longer falls back to a comb or to half the thickness).
    [Theory]
    [InlineData("slots = { pattern = \"comb\", pitch", "slots = { pitch", "parts[1].current.slots.pattern: missing")]
    [InlineData("slots = { pattern = \"comb\"", "slots = { pattern = \"grooves\"", "parts[1].current.slots.remaining_thickness_fraction: grooves need remaining_thickness_fraction")]
    [InlineData("pattern = \"comb\"\npitch", "pattern = \"grooves\"\npitch", "parts[1].slots[1].remaining_thickness_fraction: grooves need remaining_thickness_fraction")]
    public void Problem_file_slot_mistakes_are_input_errors(string from, string to, string says)
    {
        var text = ProblemFile.Replace(from, to);
        Assert.NotEqual(ProblemFile, text);
        var e = Assert.Throws<InputException>(() => ProblemReader.Read(text, "bad.toml"));
        Assert.Contains(says, e.Message);
    }

    [Theory]
    [InlineData("pattern = \"comb\"\n", "", "slots[1].pattern: missing")]
    [InlineData("pattern = \"comb\"", "pattern = \"grooves\"", "slots[1].remaining_thickness_fraction: grooves need remaining_thickness_fraction")]
    [InlineData("pattern = \"comb\"", "pattern = \"comb\"\nremaining_thickness = 0.5", "slots[1].remaining_thickness_fraction: only grooves take remaining_thickness_fraction")]
    public void Plate_file_slot_mistakes_are_the_same_errors(string from, string to, string says)
    {
        var text = PlateFile.Replace(from, to);
        Assert.NotEqual(PlateFile, text);
        var e = Assert.Throws<InputException>(() => PlateFileReader.Parse(text, "bad.toml"));
        Assert.Contains(says, e.Message);
    }
}
