using SlotOpt.Tests.Cli;

namespace SlotOpt.Tests.Hardening;

/// <summary>
/// `check` finds every mistake `run` and `evaluate` would: each class of mistake is refused by all three with exit 2 and the same
/// message naming file, line and key (the validation is the readers', shared by the commands). The problem is the tie-plate demo.
/// The physical bounds are common practice, no source (see PhysicalRange).
/// </summary>
public sealed class CheckAgreementTests : IDisposable
{
    private readonly string folder = Directory.CreateTempSubdirectory("slotopt-agree-").FullName;

    public void Dispose() => Directory.Delete(folder, recursive: true);

    private const string OverrideTable = "\n[[materials.conductor]]\nname = \"SS-304\"\nbased_on = \"SS-304\"\nalpha_20 = -0.004\n";

    [Theory]
    [InlineData("materials = [\"SS-304\", \"SS-316\"]", "materials = [\"SS-304\", \"SS-304\"]", "materials: \"SS-304\" is listed 2 times")]
    [InlineData("processes = [\"laser\", \"waterjet\"]", "processes = [\"laser\", \"laser\"]", "processes: \"laser\" is listed 2 times")]
    [InlineData("frequency = \"50 Hz\"", "frequency = \"1 GHz\"", "frequency: 1E+09 Hz is beyond any sensible")]
    [InlineData("peak_flux_density = \"25 mT\"", "peak_flux_density = \"1e9 T\"", "peak_flux_density: 1E+09 T is beyond any sensible")]
    [InlineData("pitch = [\"30 mm\", \"50 mm\", \"75 mm\", \"110 mm\"]", "pitch = [\"30 mm\", \"1e308 m\"]", "is beyond any sensible")]
    [InlineData("cell = \"2.5 mm\"", "cell = \"0.02 mm\"", "cell: a 0.02 mm cell needs 337,500,000 cells")]
    [InlineData("[manufacturing]", OverrideTable + "\n[manufacturing]", "alpha_20: must be between 0 and 0.1 per K")]
    public void Check_evaluate_and_run_refuse_the_same_mistake_at_the_same_place(string original, string mistake, string expected)
    {
        var text = File.ReadAllText(Path.Combine(AppContext.BaseDirectory, "problems", "tie-plate-50hz.toml"));
        Assert.Contains(original, text);
        var path = Path.Combine(folder, "problem.toml");
        File.WriteAllText(path, text.Replace(original, mistake));
        var outcomes = new[] { "check", "evaluate", "run" }.Select(c => (Command: c, Outcome: SlotOptInProcess.Run(c, path))).ToList();
        foreach (var (command, outcome) in outcomes)
        {
            Assert.True(outcome.ExitCode == 2, $"{command}: exit {outcome.ExitCode}: {outcome.Stderr}");
            Assert.Contains(expected, outcome.Stderr);
            Assert.Matches(@"error: [^:\n]*problem\.toml:\d+: ", outcome.Stderr);
            Assert.DoesNotContain("   at ", outcome.Stderr);
        }
        Assert.Single(outcomes.Select(o => o.Outcome.Stderr.Split('\n').First(l => l.StartsWith("error:", StringComparison.Ordinal))).Distinct());
    }

    // The single-plate command shares the readers: a plate that conducts 1e300 times better than copper is refused where it is written.
    [Fact]
    public void Plate_refuses_an_absurd_resistivity_at_its_line()
    {
        var path = Path.Combine(folder, "plate.toml");
        File.WriteAllText(path, File.ReadAllText(Path.Combine(AppContext.BaseDirectory, "Plates", "Data", "example-plate.toml"))
            .Replace("resistivity = \"0.0401 uOhm m\"", "resistivity = \"1e-300 ohm m\""));
        var run = SlotOptInProcess.Run("plate", path);
        Assert.True(run.ExitCode == 2, $"exit {run.ExitCode}: {run.Stderr}");
        Assert.Matches(@"plate\.toml:\d+: plate\.resistivity: 1E-300 ohm m is below any real resistivity", run.Stderr);
    }
}
