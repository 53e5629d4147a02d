using MathNet.Numerics;
using SlotOpt.Input;
using SlotOpt.Plates.Geometry;
using SlotOpt.Plates.Grid;
using SlotOpt.Plates.Sources.Magnets;
using SlotOpt.Plates.Sources.Rotation;
using SlotOpt.Runs;
using SlotOpt.Tests.Cli;
using System.Text.Json;

namespace SlotOpt.Tests.Plates;

/// <summary>Plate files with magnets over a turning disc (motion = "rotation") and magnets approaching a plate (motion = "approach").</summary>
public class SourcesMotionFileTests
{
    private const string DiscFile = """
        [plate]
        shape = "disc"
        diameter = "200 mm"
        bore = "20 mm"
        thickness = "3 mm"
        conductivity = 5.8e7

        [grid]
        cell = "2 mm"

        [source]
        kind = "magnets"
        motion = "rotation"
        shape = "cylinder"
        diameter = "20 mm"
        height = "10 mm"
        remanence = "1.2 T"
        gap = "2 mm"
        radius = "70 mm"
        count = 4
        rotation_speed = 100
        """;

    private const string ApproachFile = """
        [plate]
        width = "160 mm"
        height = "160 mm"
        thickness = "1 mm"
        conductivity = 5.8e7

        [grid]
        cell = "1 mm"

        [source]
        kind = "magnets"
        motion = "approach"
        shape = "cuboid"
        length = "20 mm"
        width = "20 mm"
        height = "10 mm"
        remanence = "1.2 T"
        gaps = ["2 mm", "6 mm"]
        speed = "0.1 m/s"
        """;

    // The file and the API build the same ring over the same disc (bore cut out) and solve the same equation: torque to rounding (1e-9 relative);
    // drag_n is the torque over the magnets' radius (exact arithmetic).
    [Fact]
    public void Disc_file_gives_the_same_torque_as_the_api()
    {
        var plate = PlateFileReader.Parse(DiscFile, "disc.toml");
        var e = PlateFileEvaluation.Evaluate(plate);
        var centre = new Vec2(0.1, 0.1);
        var geometry = new PlateGeometry(Polygon.Circle(centre, 0.1)).AddCutout(Polygon.Circle(centre, 0.01));
        var ring = new RotatingMagnets(new CylinderMagnet(0.02, 0.01, 1.2), 0.07, 4, Math.PI / 2, MagnetPolarity.Alternating, 0.002, centre, 100 * 2 * Math.PI / 60);
        var model = SheetModel.Build(geometry, new GridOptions { CellSizeM = 0.002, SourceFeatures = ring.GridFeatures });
        var api = DiscTorque.Solve(model, ring, [0.0]).MeanTorqueNm(5.8e7 * 0.003);
        Assert.InRange(e.TorqueNm!.Value / api - 1, -1e-9, 1e-9);
        Assert.Equal(e.TorqueNm.Value / 0.07, e.MeanDragN!.Value, 1e-12);
    }

    // Radial slots are read round the disc: 24 slots 2 mm wide from 40 mm through the rim, the angles spread over one slot pitch (15 deg).
    // Exact counts and arithmetic.
    [Fact]
    public void Radial_slots_are_cut_round_the_disc_and_the_angles_span_one_slot_pitch()
    {
        var text = DiscFile.Replace("[source]", "[[slots]]\npattern = \"radial\"\ncount = 24\nwidth = \"2 mm\"\nfrom = \"40 mm\"\n\n[source]");
        var plate = PlateFileReader.Parse(text, "slotted.toml");
        Assert.Equal(24, plate.Geometry.Slots.Count);
        Assert.Equal(0.04, (plate.Geometry.Slots[6].Start - new Vec2(0.1, 0.1)).Length, 1e-12);
        Assert.Equal(8, plate.Rotation!.AnglesRad.Count);
        Assert.Equal(2 * Math.PI / 24 * 7 / 8, plate.Rotation.AnglesRad[^1], 1e-12);
    }

    // The approach file against the API at each gap (1e-9 relative: the same solve), and the first gap against the exact infinite-sheet
    // damping F = sigma t v integral Bz^2 dA (derived from Faraday's law in Fourier space in MagnetSheetDragTests; the sliding counterpart is
    // D. W. Heald, Am. J. Phys. 56(6) (1988) 521-522). Measured 0.9993 there on this plate and grid; tolerance 0.5 %.
    [Fact]
    public void Approach_file_gives_the_api_force_at_each_gap_and_the_infinite_sheet_damping()
    {
        var e = PlateFileEvaluation.Evaluate(PlateFileReader.Parse(ApproachFile, "approach.toml"));
        var magnet = new CuboidMagnet(0.02, 0.02, 0.01, 1.2);
        double g = 5.8e7 * 1e-3;
        var model = SheetModel.Build(PlateGeometry.Rectangle(0.16, 0.16), new GridOptions { CellSizeM = 0.001 });
        Assert.Equal(2, e.ApproachCurve!.Count);
        foreach (var (gap, point) in new[] { 0.002, 0.006 }.Zip(e.ApproachCurve))
        {
            var array = new MagnetArray([new MagnetPlacement(magnet, new Vec2(0.08, 0.08), 1)], gap);
            Assert.InRange(point.ForceN / ApproachDamping.Solve(model, array, 0.1).DampingForceN(g) - 1, -1e-9, 1e-9);
        }
        double a = 0.01, z = -(0.002 + 0.005);
        double Line(Func<double, double> f) =>
            Integrate.GaussLegendre(f, 0, a, 64) + Integrate.GaussLegendre(f, a, 2 * a, 64) + Integrate.GaussLegendre(f, 2 * a, 8 * a, 64)
            + Integrate.GaussLegendre(s => f(8 * a / s) * 8 * a / (s * s), 1e-300, 1, 32);
        double squared = 4 * Line(y => Line(x => { double b = magnet.FluxDensityAt(x, y, z).Z; return b * b; }));
        Assert.InRange(e.MeanDragN!.Value / (g * 0.1 * squared) - 1, -0.005, 0.005);
        Assert.True(e.ApproachCurve[1].ForceN < e.ApproachCurve[0].ForceN);
    }

    // Every mistake names file:line and the key.
    [Theory]
    [InlineData("radius = \"70 mm\"", "radius = \"120 mm\"", "disc.toml:19: source.radius: puts the magnets' centres")]
    [InlineData("rotation_speed = 100", "rotation_speed = -5", "disc.toml:21: source.rotation_speed: must be a positive number")]
    [InlineData("rotation_speed = 100", "", "disc.toml:11: source.rotation_speed: missing")]
    [InlineData("bore = \"20 mm\"", "bore = \"300 mm\"", "disc.toml:4: plate.bore: must be smaller than the diameter")]
    [InlineData("motion = \"rotation\"", "motion = \"spin\"", "disc.toml:13: source.motion: ")]
    [InlineData("count = 4", "count = 4\nspeed = \"2 m/s\"", "disc.toml:21: source.speed: unknown key")]
    public void Disc_mistakes_name_file_line_and_key(string find, string replace, string expected)
    {
        var e = Assert.Throws<InputException>(() => PlateFileReader.Parse(DiscFile.Replace(find, replace), "disc.toml"));
        Assert.Contains(expected, e.Message);
    }

    [Fact]
    public void Rotation_needs_a_disc_and_radial_slots_need_one_too()
    {
        var rectangle = DiscFile.Replace("shape = \"disc\"\ndiameter = \"200 mm\"\nbore = \"20 mm\"", "width = \"200 mm\"\nheight = \"200 mm\"");
        var e = Assert.Throws<InputException>(() => PlateFileReader.Parse(rectangle, "rect.toml"));
        Assert.Contains("rect.toml:", e.Message);
        Assert.Contains("source.motion: \"rotation\" needs a disc", e.Message);
        var slots = ApproachFile.Replace("[source]", "[[slots]]\npattern = \"radial\"\ncount = 8\nwidth = \"2 mm\"\nfrom = \"40 mm\"\n\n[source]");
        var s = Assert.Throws<InputException>(() => PlateFileReader.Parse(slots, "rect.toml"));
        Assert.Contains("slots[1].pattern: \"radial\" slots need a disc", s.Message);
    }

    [Fact]
    public void Approach_gap_and_gaps_together_is_an_error()
    {
        var e = Assert.Throws<InputException>(() => PlateFileReader.Parse(ApproachFile.Replace("speed = \"0.1 m/s\"", "speed = \"0.1 m/s\"\ngap = \"2 mm\""), "a.toml"));
        Assert.Contains("a.toml:18: source.gaps: give either gap or gaps, not both", e.Message);
    }

    // `slotopt plate --json` carries torque_n_m (the evaluation's, to the 17 significant digits the JSON writes) and rotation_speed_rpm; exit 0.
    [Fact]
    public void Plate_command_json_carries_the_torque()
    {
        var path = Path.Combine(Path.GetTempPath(), "slotopt-disc-" + Guid.NewGuid().ToString("N") + ".toml");
        File.WriteAllText(path, DiscFile);
        try
        {
            var run = SlotOptInProcess.Run("plate", path, "--json");
            Assert.Equal(0, run.ExitCode);
            using var json = JsonDocument.Parse(run.Stdout);
            var expected = PlateFileEvaluation.Evaluate(PlateFileReader.Read(path)).TorqueNm!.Value;
            Assert.Equal(expected, json.RootElement.GetProperty("torque_n_m").GetDouble(), expected * 1e-12);
            Assert.Equal(100, json.RootElement.GetProperty("rotation_speed_rpm").GetDouble(), 1e-9);
        }
        finally { File.Delete(path); }
    }
}
