using MathNet.Numerics;
using SlotOpt.Input;
using SlotOpt.Plates;
using SlotOpt.Plates.Conductors;
using SlotOpt.Plates.Geometry;
using SlotOpt.Plates.Grid;
using SlotOpt.Plates.Sources.Magnets;
using SlotOpt.Runs;

namespace SlotOpt.Tests.Plates;

/// <summary>[source] kind = "magnets" in a plate file: the same numbers as the engine's API, and errors naming file:line:key.</summary>
public class SourcesMagnetFileTests
{
    // A 20 x 20 x 10 mm NdFeB block (1.2 T) 2 mm over a copper sheet 1 mm thick, 160 mm square, moving at 0.05 m/s
    // (mu0 sigma t v = 3.6e-3: the resistance-limited regime).
    private const string Valid = """
        [plate]
        width = "160 mm"
        height = "160 mm"
        thickness = "1 mm"
        conductivity = 5.8e7

        [grid]
        cell = "1 mm"

        [source]
        kind = "magnets"
        shape = "cuboid"
        length = "20 mm"
        width = "20 mm"
        height = "10 mm"
        remanence = "1.2 T"
        gap = "2 mm"
        speed = "0.05 m/s"
        positions = 1
        """;

    private const double Side = 0.02, Height = 0.01, Gap = 0.002, Br = 1.2, Speed = 0.05, Sigma = 5.8e7, Thickness = 1e-3;

    // The file and the API build the same magnets and solve the same model: the drag agrees to rounding (1e-9 relative).
    [Fact]
    public void Magnet_file_gives_the_same_drag_as_the_api()
    {
        var plate = PlateFileReader.Parse(Valid, "magnets.toml");
        var fromFile = PlateFileEvaluation.Evaluate(plate);

        var magnets = new MagnetArray([new MagnetPlacement(new CuboidMagnet(Side, Side, Height, Br), new Vec2(0.08, 0.08), 1)], Gap);
        var source = new SlidingMagnets(magnets, Speed);
        var model = SheetModel.Build(PlateGeometry.Rectangle(0.16, 0.16), new GridOptions { CellSizeM = 0.001, SourceFeatures = source.GridFeatures });
        var api = PlateModels.SolveMoving(model, source, new ConductingSheet(Sigma, Thickness), [0.0], source.LoopLengthXM);

        Assert.Equal(SheetModelKind.ResistanceLimited, fromFile.Choice.Kind);
        Assert.InRange(fromFile.MeanDragN!.Value / api.MeanDragN!.Value - 1, -1e-9, 1e-9);
    }

    // Against the outside world: the exact infinite-sheet drag (1/2) sigma t v integral Bz^2 dA for a square magnet (derived from
    // Faraday's law in Fourier space in MagnetSheetDragTests; for a uniform disc it is D. W. Heald, "Magnetic braking: improved theory",
    // Am. J. Phys. 56(6) (1988) 521-522). The plate 8 magnet sides wide and 1 mm cells cost 0.18 % (measured in MagnetSheetDragTests); tolerance 0.5 %.
    [Fact]
    public void Magnet_file_drag_matches_the_infinite_sheet_drag()
    {
        var drag = PlateFileEvaluation.Evaluate(PlateFileReader.Parse(Valid, "magnets.toml")).MeanDragN!.Value;
        var magnet = new CuboidMagnet(Side, Side, Height, Br);
        double a = Side / 2, z = -(Gap + Height / 2);
        double Line(Func<double, double> f) =>
            Integrate.GaussLegendre(f, 0, a, 64) + Integrate.GaussLegendre(f, a, 2 * a, 64) + Integrate.GaussLegendre(f, 2 * a, 8 * a, 64)
            + Integrate.GaussLegendre(s => f(8 * a / s) * 8 * a / (s * s), 1e-300, 1, 32);
        double squared = 4 * Line(y => Line(x => { double b = magnet.FluxDensityAt(x, y, z).Z; return b * b; }));
        double exact = 0.5 * Sigma * Thickness * Speed * squared;
        Assert.InRange(drag / exact - 1, -0.005, 0.005);
    }

    // A row read from the file: count, pitch, polarity and the default position (the row centred on the plate). Exact arithmetic.
    [Fact]
    public void Magnet_row_is_read_with_polarity_and_centred_position()
    {
        var text = Valid.Replace("positions = 1", "positions = 1\ncount = 3\npitch = \"40 mm\"\npolarity = \"alternating\"")
            .Replace("shape = \"cuboid\"\nlength = \"20 mm\"\nwidth = \"20 mm\"", "shape = \"cylinder\"\ndiameter = \"16 mm\"");
        var source = Assert.IsType<SlidingMagnets>(PlateFileReader.Parse(text, "row.toml").MovingSource);
        var m = source.Magnets.Magnets;
        Assert.Equal(3, m.Count);
        Assert.Equal(0.04, m[0].Centre.X, 1e-15);      // centred: 80 mm - 40 mm
        Assert.Equal(0.12, m[2].Centre.X, 1e-15);
        Assert.Equal([1, -1, 1], m.Select(p => p.Polarity));
        Assert.IsType<CylinderMagnet>(m[0].Magnet);
        Assert.Equal(0.002, source.Magnets.GapM, 1e-15);
    }

    // Every error names file:line and the key.
    [Theory]
    [InlineData("shape = \"cuboid\"", "shape = \"sphere\"", "bad.toml:12: source.shape: ")]
    [InlineData("gap = \"2 mm\"", "", "bad.toml:10: source.gap: missing")]
    [InlineData("gap = \"2 mm\"", "gap = \"-2 mm\"", "bad.toml:17: source.gap: ")]
    [InlineData("remanence = \"1.2 T\"", "remanence = \"12 T\"", "bad.toml:16: source.remanence: 12 T is beyond any permanent-magnet material")]
    [InlineData("width = \"20 mm\"", "width = \"20 mm\"\ndiameter = \"20 mm\"", "bad.toml:15: source.diameter: unknown key")]
    [InlineData("positions = 1", "positions = 1\ncount = 2\npitch = \"10 mm\"", "bad.toml:21: source.pitch: is smaller than the magnet")]
    [InlineData("positions = 1", "positions = 1\npolarity = \"north\"", "bad.toml:20: source.polarity: ")]
    [InlineData("positions = 1", "positions = 1\ny = \"300 mm\"", "bad.toml:20: source.y: puts the magnets' path entirely off the plate")]
    public void Magnet_errors_name_file_line_and_key(string find, string replace, string expected)
    {
        var e = Assert.Throws<InputException>(() => PlateFileReader.Parse(Valid.Replace(find, replace), "bad.toml"));
        Assert.Contains(expected, e.Message);
    }

    // A problem file's part slides: a turning disc or an approach is refused where it is written.
    [Fact]
    public void Problem_file_magnets_refuse_rotation_with_file_line_and_key()
    {
        const string problem = """
            [problem]
            name = "p"
            objective = "lowest-owning-cost"
            [economics]
            value_per_watt = 1
            [[parts]]
            name = "plate"
            kind = "plate"
            width = "100 mm"
            height = "100 mm"
            thicknesses = ["1 mm"]
            materials = ["Cu-ETP"]
            [parts.source]
            kind = "magnets"
            motion = "rotation"
            shape = "cylinder"
            diameter = "10 mm"
            height = "5 mm"
            remanence = "1.2 T"
            gap = "2 mm"
            speed = "1 m/s"
            """;
        var e = Assert.Throws<InputException>(() => ProblemReader.Read(problem, "p.toml"));
        // a problem file's part turns only as a disc (shape = "disc"); this one is a rectangle
        Assert.Contains("p.toml:15: parts[1].source.motion: a turning disc needs a disc part: shape = \"disc\"", e.Message);
    }
}
