using System.Text.Json;

namespace SlotOpt.Tests.Cli;

public class ProblemCommandTests
{
    private static string Demo(string name) => Path.Combine(AppContext.BaseDirectory, "problems", name);

    [Fact]
    public void Check_summarises_the_design_space()
    {
        var run = SlotOptInProcess.Run("check", Demo("actuator-product.toml"), "--json");
        Assert.Equal(0, run.ExitCode);
        using var doc = JsonDocument.Parse(run.Stdout);
        var parts = doc.RootElement.GetProperty("parts");
        Assert.Equal(3, parts.GetArrayLength());
        var product = parts.EnumerateArray().Aggregate(1L, (p, x) => p * x.GetProperty("options").GetInt64());
        Assert.Equal(product, doc.RootElement.GetProperty("combinations").GetInt64());
    }

    [Fact]
    public void Check_of_a_file_with_three_mistakes_lists_them_and_exits_2()
    {
        var dir = Directory.CreateTempSubdirectory("slotopt-check-").FullName;
        try
        {
            File.WriteAllText(Path.Combine(dir, "bad.toml"), """
                [problem]
                name = "three mistakes"
                objectve = "lowest-owning-cost"

                [[parts]]
                name = "core"
                kind = "core"
                grades = ["M270-35A", "M400-50B"]
                lamination_area = "0.01 m2"
                stack_height = "50 furlongs"
                flux = "1.2 T"
                frequency = "50 Hz"
                """);
            var file = Path.Combine(dir, "bad.toml");
            var run = SlotOptInProcess.Run("check", file);
            Assert.Equal(2, run.ExitCode);
            var lines = run.Stderr.Split('\n', StringSplitOptions.RemoveEmptyEntries);
            Assert.Equal(3, lines.Length);
            Assert.StartsWith($"error: {file}:3: problem.objectve", lines[0]);
            Assert.StartsWith($"error: {file}:8: parts[1].grades", lines[1]);
            Assert.StartsWith($"error: {file}:10: parts[1].stack_height", lines[2]);
            Assert.Equal("", run.Stdout);
        }
        finally { Directory.Delete(dir, true); }
    }

    [Fact]
    public void Evaluate_prints_totals_that_add_up()
    {
        var run = SlotOptInProcess.Run("evaluate", Demo("actuator-product.toml"), "--json");
        Assert.Equal(0, run.ExitCode);
        using var doc = JsonDocument.Parse(run.Stdout);
        var root = doc.RootElement;
        var loss = root.GetProperty("parts").EnumerateArray().Sum(p => p.GetProperty("loss_w").GetDouble());
        var cost = root.GetProperty("parts").EnumerateArray().Sum(p => p.GetProperty("build_cost").GetDouble());
        Assert.Equal(loss, root.GetProperty("total_loss_w").GetDouble(), 1e-9);
        Assert.Equal(cost, root.GetProperty("total_cost").GetDouble(), 1e-9);
        Assert.Equal(cost + root.GetProperty("value_per_watt").GetDouble() * loss, root.GetProperty("owning_cost").GetDouble(), 1e-9);
    }

    [Fact]
    public void Missing_problem_file_is_a_clear_error()
    {
        var run = SlotOptInProcess.Run("evaluate", "no-such-problem.toml");
        Assert.Equal(2, run.ExitCode);
        Assert.StartsWith("error: no-such-problem.toml: cannot read", run.Stderr);
    }
}
