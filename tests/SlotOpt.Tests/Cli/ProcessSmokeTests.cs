using System.Text.Json;

namespace SlotOpt.Tests.Cli;

/// <summary>
/// The built command as a real process, as a shell sees it: the exit codes documented in the README reach the
/// process (0 success, 2 bad input, 3 infeasible), results go to standard output and messages to standard error.
/// Everything else about the commands is tested in-process.
/// </summary>
public class ProcessSmokeTests
{
    [Fact]
    public void A_successful_command_exits_0_and_prints_its_json_on_standard_output()
    {
        var run = SlotOptProcess.Run("core-loss", "--grade", "M270-35A", "--peak-flux-density", "1.5T", "--frequency", "50Hz", "--json");
        Assert.Equal(0, run.ExitCode);
        Assert.Equal("", run.Stderr);
        using var doc = JsonDocument.Parse(run.Stdout);
        Assert.Equal("M270-35A", doc.RootElement.GetProperty("grade").GetString());
    }

    [Theory]
    [InlineData("core-loss", "--grade", "M270-35A", "--peak-flux-density", "1.5T", "--frequency", "50Hz", "--no-such-flag")]   // a parse error
    [InlineData("core-loss", "--grade", "M999-35Z", "--peak-flux-density", "1.5T", "--frequency", "50Hz")]                    // an engine InputException
    public void Bad_input_exits_2_with_the_message_on_standard_error(params string[] args)
    {
        var run = SlotOptProcess.Run(args);
        Assert.Equal(2, run.ExitCode);
        Assert.StartsWith("error:", run.Stderr);
        Assert.Equal("", run.Stdout);
    }

    [Fact]
    public void An_infeasible_run_exits_3()
    {
        var dir = Directory.CreateTempSubdirectory("slotopt-smoke-").FullName;
        try
        {
            var file = Path.Combine(dir, "tight.toml");
            File.WriteAllText(file, File.ReadAllText(Path.Combine(AppContext.BaseDirectory, "problems", "actuator-product.toml")).Replace("budget = 30 ", "budget = 5 "));
            var run = SlotOptProcess.Run("run", file);
            Assert.Equal(3, run.ExitCode);
            Assert.Contains("No design meets every limit.", run.Stdout);
        }
        finally { Directory.Delete(dir, true); }
    }
}
