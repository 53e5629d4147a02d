using System.Text.RegularExpressions;
using SlotOpt.Design;
using SlotOpt.Design.Cores;
using SlotOpt.Input;
using SlotOpt.Reports;
using SlotOpt.Runs;
using SlotOpt.Selection;
using SlotOpt.Tests.Selection;

namespace SlotOpt.Tests.Reports;

/// <summary>The report writer in-process: reproducible to the byte with a fixed clock, self-contained HTML, and frequency curves that pass through the engine's own numbers.</summary>
public sealed class ReportContentTests : IDisposable
{
    private static readonly DateTimeOffset FixedClock = new(2026, 1, 2, 3, 4, 5, TimeSpan.Zero);
    private readonly string parent = Path.Combine(Path.GetTempPath(), "slotopt-content-tests-" + Guid.NewGuid().ToString("N")[..8]);

    public ReportContentTests() => Directory.CreateDirectory(parent);

    public void Dispose() => Directory.Delete(parent, recursive: true);

    private static RunResult Run(string problem) => DesignRun.Execute(ProblemReader.ReadFile(ReportRuns.ProblemPath(problem)));

    private static RunResult MotorCore() => Run("motor-core-400hz");

    private string Write(RunResult r, string name)
    {
        var target = Path.Combine(parent, name);
        using var folder = ReportFolder.Begin(target, overwrite: false);
        ReportWriter.Write(r, FixedClock, folder);
        return target;
    }

    [Fact]
    public void With_a_fixed_clock_two_reports_of_one_run_are_identical_to_the_byte()
    {
        var r = Run(ReportRuns.Actuator);   // cores and a plate: every kind of plot but drag, heatmap included
        var a = Write(r, "a");
        var b = Write(r, "b");
        var names = Directory.GetFiles(a).Select(Path.GetFileName).Order(StringComparer.Ordinal).ToList();
        Assert.Equal(names, Directory.GetFiles(b).Select(Path.GetFileName).Order(StringComparer.Ordinal).ToList());
        foreach (var name in names)
            Assert.True(File.ReadAllBytes(Path.Combine(a, name!)).AsSpan().SequenceEqual(File.ReadAllBytes(Path.Combine(b, name!))), $"{name} differs");
        Assert.Contains("Generated 2026-01-02 03:04:05 UTC", File.ReadAllText(Path.Combine(a, ReportWriter.HtmlFile)));
    }

    [Fact]
    public void The_html_fetches_nothing_and_links_only_files_beside_it()
    {
        var dir = Write(MotorCore(), "r");
        var html = File.ReadAllText(Path.Combine(dir, ReportWriter.HtmlFile));
        var sources = Regex.Matches(html, "src=\"([^\"]*)\"").Select(m => m.Groups[1].Value).ToList();
        Assert.Equal(Directory.GetFiles(dir, "*.png").Length, sources.Count);
        Assert.All(sources, s => Assert.StartsWith("data:image/png;base64,", s));
        var links = Regex.Matches(html, "href=\"([^\"]*)\"").Select(m => m.Groups[1].Value).ToList();
        Assert.NotEmpty(links);
        Assert.All(links, l => Assert.True(File.Exists(Path.Combine(dir, l)), $"link to {l}, not a file of the report"));
        Assert.DoesNotContain("http://", html.Replace("http-equiv", ""));
        Assert.DoesNotContain("https://", html);
        Assert.DoesNotContain("<script", html);
    }

    [Fact]
    public void Loss_against_frequency_passes_through_each_option_at_the_operating_frequency()
    {
        var r = MotorCore();
        var evaluation = r.Parts.Single();
        var core = (CorePart)evaluation.Part;
        var curves = r.Figures.LossFrequencyOf(core.Name);
        var k = Array.IndexOf(curves.FrequenciesHz.ToArray(), curves.FrequenciesHz.MinBy(f => Math.Abs(f - core.Flux.FundamentalHz)));
        Assert.Equal(core.Flux.FundamentalHz, curves.FrequenciesHz[k], 1e-9 * core.Flux.FundamentalHz);
        Assert.Equal(core.Grades.Count, curves.Curves.Count);
        foreach (var curve in curves.Curves)
        {
            var option = evaluation.Options.First(o => o.Choice is CoreChoice c && c.Grade == curve.Grade);
            Assert.Equal(option.Loss.TotalW, curve.LossW[k], 1e-9 * option.Loss.TotalW);
        }
        // a crossing is where the two curves meet: both grades lose the same there (within the sampling's interpolation)
        foreach (var crossing in curves.Crossings)
        {
            var moved = core with { Flux = WaveformAtFrequency.Of(core.Flux, crossing.FrequencyHz) };
            double Loss(string grade) =>
                CoreOptions.EvaluateOne(moved, r.Problem.Library.GetSteel(grade, core.Name), r.Problem.Shop.Processes[core.Processes[0]], r.Problem.Shop).Loss.TotalW;
            Assert.Equal(1, Loss(crossing.BetterAbove) / Loss(crossing.BetterBelow), 0.01);
        }
    }

    [Fact]
    public void An_infeasible_run_still_reports_the_inputs_the_diagnosis_and_the_cautions()
    {
        var file = Path.Combine(parent, "rail-1N.toml");
        File.WriteAllText(file, File.ReadAllText(ReportRuns.ProblemPath(ReportRuns.Conveyor)).Replace("max_drag = \"60 N\"", "max_drag = \"1 N\""));
        var r = DesignRun.Execute(ProblemReader.ReadFile(file));
        Assert.Equal(SelectionStatus.Infeasible, r.Outcome.Status);
        var dir = Write(r, "infeasible");
        var summary = File.ReadAllText(Path.Combine(dir, ReportWriter.MarkdownFile));
        foreach (var line in r.Outcome.Diagnosis!.Explain()) Assert.Contains("- " + line, summary);
        Assert.Contains("exceeds the part's limit of 1 N", summary);   // the baselines' breaks
        Assert.Contains("certified safety analysis", summary);
        Assert.Equal(451, File.ReadAllLines(Path.Combine(dir, ReportWriter.CandidatesFile)).Length);   // header + every option
    }
}
