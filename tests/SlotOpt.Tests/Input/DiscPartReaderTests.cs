using SlotOpt.Design.SolidParts;
using SlotOpt.Input;

namespace SlotOpt.Tests.Input;

/// <summary>Disc parts of problem files: read with the plate file's keys (DiscReader, MagnetSourceReader.Rotation); each mistake named by file, line and key.</summary>
public class DiscPartReaderTests
{
    // Line numbers below count from "[problem]" as line 1.
    private const string Valid = """
        [problem]
        name = "disc"
        objective = "lowest-owning-cost"
        [[parts]]
        name = "cover"
        kind = "plate"
        shape = "disc"
        diameter = "160 mm"
        bore = "20 mm"
        thicknesses = ["1.5 mm", "2 mm"]
        materials = ["SS-304"]
        max_torque = "0.03 N m"
        [parts.source]
        kind = "magnets"
        motion = "rotation"
        shape = "cylinder"
        diameter = "20 mm"
        height = "8 mm"
        remanence = "1.2 T"
        gap = "4 mm"
        radius = "55 mm"
        count = 8
        rotation_speed = 2900
        [[parts.slots]]
        pattern = "radial"
        count = [16, 32]
        width = "2 mm"
        from = ["35 mm", "45 mm"]
        [parts.current]
        thickness = "2 mm"
        material = "SS-304"
        [parts.current.slots]
        pattern = "radial"
        count = 24
        width = "1.5 mm"
        from = "35 mm"
        to = "75 mm"
        """;

    [Fact]
    public void A_disc_part_reads_its_shape_source_slot_family_and_current_design()
    {
        var part = (PlatePart)ProblemReader.Read(Valid, "disc.toml").Parts[0];
        Assert.Equal(0.08, part.Disc!.RadiusM, 12);
        Assert.Equal(0.01, part.Disc.BoreRadiusM, 12);
        var turning = Assert.IsType<PlateExcitation.Turning>(part.Excitation);
        Assert.Equal(2900, turning.Rpm, 9);
        Assert.Null(turning.Positions);
        Assert.Equal(0.03, part.MaxTorqueNm);
        Assert.Equal(4, part.SlotFamilies.Single().Rings!.Count);                       // count x from
        Assert.Equal(2 * 1 * (1 + 4), part.OptionCount);                               // thicknesses x material x (solid + 4 layouts), one process
        Assert.Equal(new RadialSlots(24, 0.035, 0.075), part.Current!.Slots!.Radial);
        Assert.Equal(8, turning.Angles(part.Current.Slots.Radial).Count);              // a slotted disc: eight angles over one slot pitch, as plate files
        Assert.Single(turning.Angles(null));                                           // a solid disc: one
    }

    [Theory]
    [InlineData("max_torque = \"0.03 N m\"", "max_drag = \"1 N\"", 12, "parts[1].max_drag", "max_torque")]
    [InlineData("max_torque = \"0.03 N m\"", "min_torque_speed = 1000", 12, "parts[1].min_torque_speed", "give min_torque as well")]
    [InlineData("max_torque = \"0.03 N m\"", "max_torque = \"0.03 N\"", 12, "parts[1].max_torque", "")]
    [InlineData("max_torque = \"0.03 N m\"", "max_torque = \"0.03 N m\"\nmin_torque = \"0.05 N m\"", 13, "parts[1].min_torque", "above max_torque")]
    [InlineData("from = [\"35 mm\", \"45 mm\"]", "from = [\"35 mm\", \"81 mm\"]", 28, "parts[1].slots[1].from", "beyond the disc's rim")]
    [InlineData("from = [\"35 mm\", \"45 mm\"]", "from = [\"5 mm\", \"45 mm\"]", 27, "parts[1].slots[1].width", "do not fit round the inner radius")]
    [InlineData("count = [16, 32]", "count = [16, 0]", 26, "parts[1].slots[1].count", "must lie between 1 and 720")]
    [InlineData("pattern = \"radial\"\ncount = [16, 32]", "pattern = \"comb\"\ncount = [16, 32]", 25, "parts[1].slots[1].pattern", "a disc takes radial slots")]
    [InlineData("motion = \"rotation\"", "motion = \"linear\"", 15, "parts[1].source.motion", "turn with it")]
    [InlineData("radius = \"55 mm\"", "radius = \"95 mm\"", 21, "parts[1].source.radius", "beyond the disc's rim")]
    [InlineData("bore = \"20 mm\"", "bore = \"200 mm\"", 9, "parts[1].bore", "smaller than the diameter")]
    public void Each_mistake_names_its_line_and_key(string from, string to, int line, string key, string says)
    {
        Assert.Contains(from, Valid);
        var message = Assert.Throws<InputException>(() => ProblemReader.Read(Valid.Replace(from, to), "bad.toml")).Message;
        Assert.Contains($"bad.toml:{line}: {key}: ", message);
        Assert.Contains(says, message);
    }

    [Fact]
    public void Radial_slots_need_a_disc_and_torque_limits_a_turning_one()
    {
        var rectangle = Valid.Replace("shape = \"disc\"\ndiameter = \"160 mm\"\nbore = \"20 mm\"", "width = \"160 mm\"\nheight = \"160 mm\"");
        Assert.NotEqual(Valid, rectangle);
        var message = Assert.Throws<InputException>(() => ProblemReader.Read(rectangle, "bad.toml")).Message;
        Assert.Contains("parts[1].slots[1].pattern: \"radial\" slots need a disc: the part's shape = \"disc\"", message);
        Assert.Contains("parts[1].source.motion: a turning disc needs a disc part", message);
    }
}
