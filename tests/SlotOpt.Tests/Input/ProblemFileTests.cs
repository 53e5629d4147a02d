using SlotOpt.Design.SolidParts;
using SlotOpt.Design;
using SlotOpt.Design.Cores;
using SlotOpt.Input;
using SlotOpt.Plates.Geometry;
using SlotOpt.Runs;

namespace SlotOpt.Tests.Input;

public class ProblemFileTests
{
    public static string ProblemsFolder => Path.Combine(AppContext.BaseDirectory, "problems");

    public static TheoryData<string> DemoProblems() =>
        new(Directory.GetFiles(Path.Combine(AppContext.BaseDirectory, "problems"), "*.toml").Select(Path.GetFileName).OfType<string>().Order(StringComparer.Ordinal));

    // Every demo problem loads and its current (or baseline) design evaluates to finite, non-negative
    // loss and cost: the demos are what a new user runs first.
    [Theory]
    [MemberData(nameof(DemoProblems))]
    public void Every_demo_problem_loads_and_evaluates(string fileName)
    {
        var problem = ProblemReader.ReadFile(Path.Combine(ProblemsFolder, fileName));
        Assert.NotEmpty(problem.Parts);
        foreach (var part in problem.Parts)
        {
            var option = ReferenceDesigns.CurrentOrBaseline(part, problem);
            Assert.True(double.IsFinite(option.Loss.TotalW) && option.Loss.TotalW >= 0, option.Description);
            Assert.True(double.IsFinite(option.BuildCost) && option.BuildCost > 0, option.Description);
            Assert.True(ChoiceSpace.OptionCount(part) > 1);
        }
    }

    [Fact]
    public void Four_demos_cover_the_scenarios()
    {
        var problems = Directory.GetFiles(ProblemsFolder, "*.toml").Select(ProblemReader.ReadFile).ToList();
        Assert.True(problems.Count >= 4);
        Assert.Contains(problems, p => p.Parts.Count >= 3 && p.Limits.Budget is not null && p.Limits.CoilGroups.Count > 0);
        Assert.Contains(problems, p => p.Parts.OfType<PlatePart>().Any(x => x.Excitation.IsMoving && x.MaxDragN is not null));
        Assert.Contains(problems, p => p.Parts.OfType<CorePart>().Any(x => !x.Flux.IsSinusoidal && x.Flux.FundamentalHz == 400));
        Assert.Contains(problems, p => p.Parts.OfType<PlatePart>().Any(x => x.Excitation is PlateExcitation.AcField { FrequencyHz: 50 }));
    }

    private static InputException ReadFails(string text) =>
        Assert.Throws<InputException>(() => ProblemReader.Read(text, "bad.toml"));

    private const string ValidCore = """
        [problem]
        name = "t"

        [[parts]]
        name = "core"
        kind = "core"
        grades = ["M270-35A"]
        lamination_area = "0.01 m2"
        stack_height = "50 mm"
        peak_flux_density = "1.2 T"
        frequency = "50 Hz"
        """;

    [Fact]
    public void A_valid_minimal_core_problem_reads()
    {
        var problem = ProblemReader.Read(ValidCore, "ok.toml");
        var core = Assert.IsType<CorePart>(Assert.Single(problem.Parts));
        Assert.Equal(0.05, core.StackHeightM, 1e-15);
        Assert.Equal(["punching"], core.Processes);
    }

    // `slotopt check` on a file with three mistakes reports all three with line numbers (issue 4).
    [Fact]
    public void Three_mistakes_are_reported_at_once_with_lines_and_keys()
    {
        var text = ValidCore.Replace("name = \"t\"", "nmae = \"t\"").Replace("\"M270-35A\"", "\"M270-35B\"").Replace("\"50 mm\"", "\"50 furlongs\"");
        var lines = ReadFails(text).Message.Split(Environment.NewLine);
        Assert.Equal(4, lines.Length); // the misspelt key is unknown, and [problem] then lacks its name
        Assert.Contains(lines, l => l.StartsWith("bad.toml:2: problem.nmae: unknown key (did you mean name?)"));
        Assert.Contains(lines, l => l.StartsWith("bad.toml:1: problem.name: missing"));
        Assert.Contains(lines, l => l.StartsWith("bad.toml:7: parts[1].grades: unknown grade \"M270-35B\" (did you mean M270-35A?)"));
        Assert.Contains(lines, l => l.StartsWith("bad.toml:9: parts[1].stack_height:"));
    }

    [Theory]
    [InlineData("peak_flux_density = \"1.2 T\"", "peak_flux_density = \"2.1 T\"", 10, "parts[1].peak_flux_density", "beyond what M270-35A carries")]          // above saturation
    [InlineData("stack_height = \"50 mm\"", "stack_height = \"-50 mm\"", 9, "parts[1].stack_height", "must be positive")] // negative size
    [InlineData("kind = \"core\"", "kind = \"coer\"", 6, "parts[1].kind", "did you mean core?")]
    [InlineData("frequency = \"50 Hz\"", "frequency = \"50 Hz\"\nfrobnicate = 3", 12, "parts[1].frobnicate", "unknown key")]
    [InlineData("frequency = \"50 Hz\"", "frequency = true", 11, "parts[1].frequency", "expected a frequency")]
    public void Each_kind_of_mistake_names_its_line_and_key(string from, string to, int line, string key, string says)
    {
        var message = ReadFails(ValidCore.Replace(from, to)).Message;
        Assert.Contains($"bad.toml:{line}: {key}: ", message);
        Assert.Contains(says, message);
    }

    private const string ValidPlate = """
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
        peak_flux_density = "10 mT"
        frequency = "50 Hz"

        [[parts.slots]]
        pattern = "comb"
        pitch = ["20 mm"]
        depth = ["40 mm"]
        width = ["2 mm"]
        """;

    [Theory]
    [InlineData("pitch = [\"20 mm\"]", "pitch = [\"1.5 mm\"]", 21, "parts[1].slots[1].width", "not narrower than the smallest pitch")]   // pitch below width
    [InlineData("depth = [\"40 mm\"]", "depth = [\"70 mm\"]", 20, "parts[1].slots[1].depth", "cuts right through")]
    [InlineData("materials = [\"Al-6061-T6\"]", "materials = [\"Al-6016-T6\"]", 10, "parts[1].materials", "did you mean Al-6061-T6?")]
    [InlineData("kind = \"uniform_ac\"", "kind = \"uniform\"", 13, "parts[1].source.kind", "is not one of")]
    public void Plate_mistakes_name_their_line_and_key(string from, string to, int line, string key, string says)
    {
        var message = ReadFails(ValidPlate.Replace(from, to)).Message;
        Assert.Contains($"bad.toml:{line}: {key}: ", message);
        Assert.Contains(says, message);
    }

    [Fact]
    public void A_pole_wider_than_its_path_is_an_error()
    {
        var moving = ValidPlate.Replace("""
            kind = "uniform_ac"
            peak_flux_density = "10 mT"
            frequency = "50 Hz"
            """, """
            kind = "moving_poles"
            pole = "rectangle"
            pole_width = "20 mm"
            pole_height = "80 mm"
            flux_density = "0.3 T"
            speed = "1 m/s"
            """);
        Assert.Contains("parts[1].source.pole_height: the pole (80 mm across the travel) is wider than the plate it moves over (60 mm)", ReadFails(moving).Message);
    }

    [Fact]
    public void A_pole_path_off_the_plate_is_an_error()
    {
        var moving = ValidPlate.Replace("""
            kind = "uniform_ac"
            peak_flux_density = "10 mT"
            frequency = "50 Hz"
            """, """
            kind = "moving_poles"
            pole = "circle"
            radius = "10 mm"
            flux_density = "0.3 T"
            speed = "1 m/s"
            y = "200 mm"
            """);
        Assert.Contains("parts[1].source.y: puts the poles' path entirely off the plate", ReadFails(moving).Message);
    }

    // Round trip: a fixed design written as a [parts.current] table and read back is the same choice and
    // evaluates to the same numbers (exact: same inputs, same code path).
    [Fact]
    public void A_fixed_design_round_trips_through_the_file()
    {
        var problem = ProblemReader.ReadFile(Path.Combine(ProblemsFolder, "conveyor-rail.toml"));
        var rail = Assert.IsType<PlatePart>(problem.Parts[0]);
        var slotted = new PlateChoice(0.008, "Al-6061-T6", "laser", new SlotChoice(SlotPatternKind.Comb, PlateEdge.Bottom, 0.015, 0.055, 0.002, null));
        var direct = PlateOptions.EvaluateOne(rail, slotted, problem.Library, problem.Shop);

        var text = File.ReadAllText(Path.Combine(ProblemsFolder, "conveyor-rail.toml"));
        var start = text.IndexOf("[parts.current]", StringComparison.Ordinal);
        const string current = """
            [parts.current]
            thickness = "8 mm"
            material = "Al-6061-T6"
            process = "laser"
            slots = { pattern = "comb", edge = "bottom", pitch = "15 mm", depth = "55 mm", width = "2 mm" }

            """;
        var rewritten = text[..start] + current;
        var reread = ProblemReader.Read(rewritten, Path.Combine(ProblemsFolder, "conveyor-rail.toml"));
        var rereadRail = Assert.IsType<PlatePart>(reread.Parts[0]);
        Assert.Equal(slotted, rereadRail.Current);
        var viaFile = ReferenceDesigns.CurrentOrBaseline(rereadRail, reread);
        Assert.Equal(direct.Loss.TotalW, viaFile.Loss.TotalW);
        Assert.Equal(direct.BuildCost, viaFile.BuildCost);
    }

    // Issue 4: on the conveyor demo a hand-slotted rail has less drag than the solid one. The physics
    // reason: slots across the rail cut the eddy-current loops under each pole (the Saint-Venant torsion
    // series for rectangles, S. P. Timoshenko and J. N. Goodier, Theory of Elasticity, 3rd ed., 1970, ch. 10, applied to n strips: loss falls roughly as 1/n^2 when a strip is cut into n).
    [Fact]
    public void Hand_slotted_rail_has_less_drag_than_the_solid_rail()
    {
        var problem = ProblemReader.ReadFile(Path.Combine(ProblemsFolder, "conveyor-rail.toml"));
        var rail = Assert.IsType<PlatePart>(problem.Parts[0]);
        var solid = PlateOptions.EvaluateOne(rail, new PlateChoice(0.008, "Al-6061-T6", "laser", null), problem.Library, problem.Shop);
        var slotted = PlateOptions.EvaluateOne(rail, new PlateChoice(0.008, "Al-6061-T6", "laser",
            new SlotChoice(SlotPatternKind.Comb, PlateEdge.Bottom, 0.015, 0.055, 0.002, null)), problem.Library, problem.Shop);
        Assert.True(slotted.DragN < 0.5 * solid.DragN, $"solid {solid.DragN} N, slotted {slotted.DragN} N");
    }
}
