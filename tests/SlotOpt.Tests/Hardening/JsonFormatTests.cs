using System.Text.Json.Nodes;
using SlotOpt.Cli;
using SlotOpt.Design;
using SlotOpt.Reports;
using SlotOpt.Reports.Json;

namespace SlotOpt.Tests.Hardening;

/// <summary>A NaN or an infinity never reaches the JSON a command prints: it is a numerical failure (exit 4) naming the key.</summary>
public class JsonFormatTests
{
    private sealed record Part(string Name, double LossW, double? DragN, float Ratio);

    [Fact]
    public void A_non_finite_number_in_an_object_is_refused_with_its_key()
    {
        var result = new { problem = "p", parts = new[] { new Part("a", 1.5, null, 1), new Part("b", double.PositiveInfinity, 2, 1) } };
        var e = Assert.Throws<NumericalFailureException>(() => JsonFormat.Serialize(result));
        Assert.Equal("the result's parts[1].loss_w is Infinity, not a finite number; nothing was printed", e.Message);
    }

    [Theory]
    [InlineData(double.NaN, "NaN")]
    [InlineData(double.NegativeInfinity, "-Infinity")]
    public void Nullable_doubles_floats_and_lists_are_checked_too(double bad, string word)
    {
        Assert.Contains($"parts[0].drag_n is {word}", Assert.Throws<NumericalFailureException>(() => JsonFormat.Serialize(new { parts = new[] { new Part("a", 1, bad, 1) } })).Message);
        Assert.Contains($"parts[0].ratio is {word}", Assert.Throws<NumericalFailureException>(() => JsonFormat.Serialize(new { parts = new[] { new Part("a", 1, 1, (float)bad) } })).Message);
        Assert.Contains($"values[2] is {word}", Assert.Throws<NumericalFailureException>(() => JsonFormat.Serialize(new { values = new List<double> { 1, 2, bad } })).Message);
    }

    [Fact]
    public void A_non_finite_number_in_a_hand_built_node_is_refused_with_its_key()
    {
        var node = new JsonObject { ["loss_w"] = 2.0, ["per_position"] = new JsonArray(1.0, double.PositiveInfinity) };
        var e = Assert.Throws<NumericalFailureException>(() => JsonFormat.Serialize(node));
        Assert.Equal("the result's per_position[1] is Infinity, not a finite number; nothing was printed", e.Message);
    }

    // Finite values print as before: round-trip shortest form of each double, as System.Text.Json writes them.
    [Fact]
    public void Finite_numbers_print_unchanged()
    {
        Assert.Equal("{\n  \"loss_w\": 0.1,\n  \"ratio\": 0.1,\n  \"big\": 1.7976931348623157E+308\n}\n".Replace("\n", Environment.NewLine),
            JsonFormat.Serialize(new { loss_w = 0.1, ratio = 0.1f, big = double.MaxValue }));
    }

    [Fact]
    public void The_command_runner_turns_it_into_exit_code_4()
    {
        Assert.Equal(ExitCodes.NumericalFailure, CommandRunner.Run(SlotOptCommand.Build().Parse(["materials"]), (_, _) => { JsonFormat.Serialize(new { x = double.NaN }); return ExitCodes.Success; }));
    }
}
