using System.Text.Json;

namespace SlotOpt.Tests.Cli;

public class RunCommandTests
{
    private static string Demo(string name) => Path.Combine(AppContext.BaseDirectory, "problems", name);

    // Issue 5: `run --json` prints one object with parts, total_loss_w, total_cost, owning_cost and the
    // front as {cost, loss_w}; the totals are the sums of the parts and owning = cost + value x loss.
    [Fact]
    public void Run_json_has_the_promised_keys_and_consistent_totals()
    {
        var run = SlotOptInProcess.Run("run", Demo("tie-plate-50hz.toml"), "--json");
        Assert.Equal(0, run.ExitCode);
        using var doc = JsonDocument.Parse(run.Stdout);
        var root = doc.RootElement;
        var parts = root.GetProperty("parts").EnumerateArray().ToList();
        Assert.Equal(parts.Sum(p => p.GetProperty("loss_w").GetDouble()), root.GetProperty("total_loss_w").GetDouble(), 1e-9);
        Assert.Equal(parts.Sum(p => p.GetProperty("build_cost").GetDouble()), root.GetProperty("total_cost").GetDouble(), 1e-9);
        // each part's loss at its own kind's value (IEEE C57.120 A for no-load, B for load loss; the tie plate is load loss)
        var owning = parts.Sum(p => p.GetProperty("build_cost").GetDouble() + p.GetProperty("value_per_watt").GetDouble() * p.GetProperty("loss_w").GetDouble());
        Assert.Equal(root.GetProperty("load_value_per_watt").GetDouble(), parts[0].GetProperty("value_per_watt").GetDouble());
        Assert.Equal(owning, root.GetProperty("owning_cost").GetDouble(), 1e-9);
        var front = root.GetProperty("front").EnumerateArray().ToList();
        Assert.NotEmpty(front);
        for (var i = 1; i < front.Count; i++)
        {
            Assert.True(front[i].GetProperty("cost").GetDouble() > front[i - 1].GetProperty("cost").GetDouble());
            Assert.True(front[i].GetProperty("loss_w").GetDouble() < front[i - 1].GetProperty("loss_w").GetDouble());
        }
    }

    [Fact]
    public void Infeasible_run_exits_3_and_names_the_binding_limit()
    {
        var dir = Directory.CreateTempSubdirectory("slotopt-run-").FullName;
        try
        {
            var text = File.ReadAllText(Demo("actuator-product.toml")).Replace("budget = 30 ", "budget = 5 ");
            File.WriteAllText(Path.Combine(dir, "tight.toml"), text);
            var run = SlotOptInProcess.Run("run", Path.Combine(dir, "tight.toml"));
            Assert.Equal(3, run.ExitCode);
            Assert.Contains("No design meets every limit.", run.Stdout);
            Assert.Contains("the budget", run.Stdout);
        }
        finally { Directory.Delete(dir, true); }
    }
}

public class RunLimitFlagTests
{
    private static string Demo(string name) => Path.Combine(AppContext.BaseDirectory, "problems", name);

    // Issue 7: a run that would exceed its limits stops early with a clear message and its own exit code (5).
    [Theory]
    [InlineData("--max-memory", "1 MB", "--max-memory")]
    [InlineData("--time-limit", "0.001 s", "--time-limit")]
    public void Exceeding_a_resource_limit_exits_5_with_the_limit_named(string flag, string value, string named)
    {
        var run = SlotOptInProcess.Run("run", Demo("tie-plate-50hz.toml"), flag, value);
        Assert.Equal(5, run.ExitCode);
        Assert.StartsWith("resource limit:", run.Stderr);
        Assert.Contains(named, run.Stderr);
        Assert.Equal("", run.Stdout);
    }

    [Theory]
    [InlineData("--threads", "0")]
    [InlineData("--max-memory", "lots")]
    [InlineData("--time-limit", "-3 s")]
    [InlineData("--search-budget", "0")]
    public void Bad_limit_flags_are_input_errors(string flag, string value)
    {
        var run = SlotOptInProcess.Run("run", Demo("tie-plate-50hz.toml"), flag, value);
        Assert.Equal(2, run.ExitCode);
        Assert.Contains(flag, run.Stderr);
    }
}

public class RunReproducibilityTests
{
    // Issue 7: the same input gives byte-identical JSON across two runs and across 1 and 2 threads
    // (CP-SAT runs one worker with a fixed seed and a deterministic budget; plate solves are independent).
    [Fact]
    public void Same_problem_gives_byte_identical_json_across_runs_and_threads()
    {
        var demo = Path.Combine(AppContext.BaseDirectory, "problems", "conveyor-rail.toml");
        var first = SlotOptInProcess.Run("run", demo, "--json", "--threads", "1");
        var second = SlotOptInProcess.Run("run", demo, "--json", "--threads", "2");
        var third = SlotOptInProcess.Run("run", demo, "--json", "--threads", "2");
        Assert.Equal(0, first.ExitCode);
        Assert.Equal(first.Stdout, second.Stdout);
        Assert.Equal(second.Stdout, third.Stdout);
    }
}
