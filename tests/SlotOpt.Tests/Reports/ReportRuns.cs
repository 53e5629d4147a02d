using SlotOpt.Runs;
using SlotOpt.Tests.Cli;

namespace SlotOpt.Tests.Reports;

/// <summary>The test classes that read <see cref="ReportRuns"/> share one set of runs.</summary>
[CollectionDefinition(Name)]
public sealed class ReportRunsCollection : ICollectionFixture<ReportRuns>
{
    public const string Name = "report runs";
}

/// <summary>
/// The runs the report tests read, made once for the test run: each demo run twice with --out, once printing
/// text and once printing JSON, in-process through the command's entry point, into a fresh temporary folder
/// that is deleted afterwards.
/// </summary>
public sealed class ReportRuns : IDisposable
{
    public const string Conveyor = "conveyor-rail";
    public const string Actuator = "actuator-product";

    public sealed record Run(string Problem, string TextDir, string JsonDir, SlotOptProcess.Outcome Text, SlotOptProcess.Outcome Json);

    public ReportRuns()
    {
        Root = Path.Combine(Path.GetTempPath(), "slotopt-report-tests-" + Guid.NewGuid().ToString("N")[..8]);
        Directory.CreateDirectory(Root);
        Runs = new[] { Conveyor, Actuator }.ToDictionary(p => p, p =>
        {
            var textDir = Path.Combine(Root, p + "-text");
            var jsonDir = Path.Combine(Root, p + "-json");
            var text = SlotOptInProcess.Run("run", ProblemPath(p), "--out", textDir);
            var json = SlotOptInProcess.Run("run", ProblemPath(p), "--out", jsonDir, "--json");
            return new Run(p, textDir, jsonDir, text, json);
        });
    }

    public string Root { get; }
    public IReadOnlyDictionary<string, Run> Runs { get; }

    public static string ProblemPath(string name) => Path.Combine(AppContext.BaseDirectory, "problems", name + ".toml");

    public void Dispose() => Directory.Delete(Root, recursive: true);
}
