using System.Text.Json;
using SlotOpt.Cli;
using SlotOpt.Input;
using SlotOpt.Plates;
using SlotOpt.Plates.Geometry;
using SlotOpt.Plates.Sources.Magnets;
using SlotOpt.Plates.Thick;
using SlotOpt.Runs;

namespace SlotOpt.Tests.Plates;

/// <summary>
/// Magnets sliding over a wide block in a plate file: the model thick-slab (<see cref="PlateThickSlab"/>), its choice, its refusals and
/// its output. The slab's physics is checked against the outside world in <see cref="ThickSlabTests"/>; here the file must give the
/// engine's numbers.
/// </summary>
[Collection("Console")]
public class ThickSlabFileTests
{
    // A 20 x 20 x 10 mm NdFeB block (1.2 T) 2 mm over a copper block 20 mm thick, 200 x 160 mm, at 2 m/s (an invented demo scenario).
    private static string Block(string thickness = "20 mm", string extra = "") => $"""
        [plate]
        width = "200 mm"
        height = "160 mm"
        thickness = "{thickness}"
        conductivity = 5.8e7

        [grid]
        cell = "4 mm"

        [source]
        kind = "magnets"
        shape = "cuboid"
        length = "20 mm"
        width = "20 mm"
        height = "10 mm"
        remanence = "1.2 T"
        gap = "2 mm"
        speed = "2 m/s"
        positions = 1
        {extra}
        """;

    // The file picks the slab by itself (the block is ten gaps thick) and reports the engine's drag, lift and loss at every speed of the
    // curve: the same computation, so 1e-12 relative.
    [Fact]
    public void Block_file_is_solved_as_the_slab_with_the_engines_numbers()
    {
        var e = PlateFileEvaluation.Evaluate(PlateFileReader.Parse(Block(), "block.toml"));
        Assert.Equal(SheetModelKind.ThickSlab, e.Choice.Kind);
        var magnets = new MagnetArray([new MagnetPlacement(new CuboidMagnet(0.02, 0.02, 0.01, 1.2), new Vec2(0.1, 0.08), 1)], 0.002);
        var speeds = PlateThickSlab.SpeedFactors.Select(f => 2 * f).ToArray();
        var api = new SlabUnderMovingMagnets(5.8e7, 0.02).Solve(SurfaceFieldSpectrum.Of(magnets), speeds);
        Assert.Equal(speeds, e.SlabSpeedCurve!.Select(f => f.SpeedMPerS));
        for (int s = 0; s < speeds.Length; s++)
        {
            Assert.InRange(e.SlabSpeedCurve![s].DragN / api[s].DragN - 1, -1e-12, 1e-12);
            Assert.InRange(e.SlabSpeedCurve[s].LiftN / api[s].LiftN - 1, -1e-12, 1e-12);
        }
        Assert.Equal(api[3].DragN, e.MeanDragN!.Value, 12);
        Assert.Equal(api[3].LossW, e.LossW, 12);
    }

    // A thin plate at low speed stays with the thin-sheet models (the slab is not forced on cases the sheet describes).
    [Fact]
    public void Thin_plate_at_low_speed_keeps_the_sheet_model()
    {
        var e = PlateFileEvaluation.Evaluate(PlateFileReader.Parse(Block("1 mm").Replace("speed = \"2 m/s\"", "speed = \"0.05 m/s\""), "thin.toml"));
        Assert.Equal(SheetModelKind.ResistanceLimited, e.Choice.Kind);
        Assert.Null(e.SlabSpeedCurve);
    }

    // --model thick-slab where the slab cannot describe the plate is refused with the file and the reason: slots; a plate whose edge is
    // nearer the magnets than three far-face heights.
    [Theory]
    [InlineData("", "[[slots]]\npattern = \"comb\"\nedge = \"bottom\"\npitch = \"50 mm\"\ndepth = \"40 mm\"\nwidth = \"4 mm\"", "slots, cut-outs")]
    [InlineData("x = \"20 mm\"", "", "not wide against the magnets")]
    public void Thick_slab_is_refused_where_it_does_not_apply(string sourceLine, string appended, string reason)
    {
        var plate = PlateFileReader.Parse(Block(extra: sourceLine) + "\n" + appended + "\n", "bad.toml");
        var error = Assert.Throws<InputException>(() => PlateFileEvaluation.Evaluate(plate, forcedKind: SheetModelKind.ThickSlab));
        Assert.Contains("bad.toml", error.Message);
        Assert.Contains(reason, error.Message);
    }

    // The command line: --model thick-slab is accepted, and the JSON carries the model's name and the drag and lift against speed.
    [Fact]
    public void Plate_command_prints_drag_and_lift_against_speed()
    {
        string file = Path.Combine(Path.GetTempPath(), $"slotopt-block-{Guid.NewGuid():N}.toml");
        File.WriteAllText(file, Block());
        try
        {
            var oldOut = Console.Out;
            var o = new StringWriter();
            Console.SetOut(o);
            int code;
            try { code = SlotOptCommand.Build().Parse(["plate", file, "--json", "--model", "thick-slab"]).Invoke(); }
            finally { Console.SetOut(oldOut); }
            Assert.Equal(0, code);
            using var json = JsonDocument.Parse(o.ToString());
            Assert.Equal("thick-slab", json.RootElement.GetProperty("model").GetString());
            Assert.Equal(PlateThickSlab.SpeedFactors.Length, json.RootElement.GetProperty("slab_drag_n").GetArrayLength());
            Assert.Equal(PlateThickSlab.SpeedFactors.Length, json.RootElement.GetProperty("slab_lift_n").GetArrayLength());
        }
        finally { File.Delete(file); }
    }
}
