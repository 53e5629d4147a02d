using SlotOpt.Design;
using SlotOpt.Design.SolidParts;
using SlotOpt.Input;
using SlotOpt.Reports;

namespace SlotOpt.Tests.Reports;

/// <summary>
/// The words a workshop orders a plate option by name its shape: a disc part's options are discs, solid or slotted, and a rectangular
/// part's are plates (wording of our own; common practice, no source). The parts come from small problem files of invented test data;
/// the options are built directly, as the words read only the choice, its attributes and the part's shape.
/// </summary>
public class WorkshopWordsTests
{
    private const string Disc = """
        [problem]
        name = "disc words test"
        [economics]
        value_per_watt = 0
        [[parts]]
        name = "cover disc"
        kind = "plate"
        shape = "disc"
        diameter = "80 mm"
        thicknesses = ["2 mm"]
        materials = ["Cu-ETP"]
        processes = ["waterjet"]
        [parts.source]
        kind = "magnets"
        motion = "rotation"
        shape = "cylinder"
        diameter = "12 mm"
        height = "6 mm"
        remanence = "1.2 T"
        gap = "2 mm"
        radius = "25 mm"
        count = 4
        rotation_speed = 1000
        """;

    private const string Rectangle = """
        [problem]
        name = "plate words test"
        [economics]
        value_per_watt = 0
        [[parts]]
        name = "tie plate"
        kind = "plate"
        width = "200 mm"
        height = "100 mm"
        thicknesses = ["2 mm"]
        materials = ["Cu-ETP"]
        processes = ["waterjet"]
        [parts.source]
        kind = "uniform_ac"
        peak_flux_density = "0.1 T"
        frequency = "50 Hz"
        """;

    private static EvaluatedOption Solid(Part part) => new(part.Name, "solid", new PlateChoice(0.002, "Cu-ETP", "waterjet", null), "solid",
        new Dictionary<string, string>(), 0, LossBreakdown.Zero, null, [], null);

    [Fact]
    public void A_solid_disc_is_named_a_disc()
    {
        var part = ProblemReader.Read(Disc, "disc.toml").Parts[0];
        Assert.Equal("Cu-ETP disc 2 mm thick, solid (no slots), cut by waterjet", WorkshopWords.Of(Solid(part), part));
    }

    [Fact]
    public void A_solid_rectangular_plate_is_still_named_a_plate()
    {
        var part = ProblemReader.Read(Rectangle, "plate.toml").Parts[0];
        Assert.Equal("Cu-ETP plate 2 mm thick, solid (no slots), cut by waterjet", WorkshopWords.Of(Solid(part), part));
    }
}
