using SlotOpt.Reports.Plots;
using SlotOpt.Tables;
using SlotOpt.Cli;
using SlotOpt.Input;
using SlotOpt.Reports;
using SlotOpt.Runs;
using SlotOpt.Tests.Reports;

namespace SlotOpt.Tests.Cli;

/// <summary>Issue 17: the console says what the report says about the current design's own validity, and in the same numbers.</summary>
public class RunTextTests
{
    [Fact]
    [Trait("Category", "Slow")]
    public void The_current_designs_validity_flags_are_printed_as_the_report_states_them()
    {
        // the tie-plate demo's current design (a solid 10 mm plate, 150 mm wide) is past the resistance-limited model's Reynolds limit:
        // issue 12 ranks it with its own field, so its number is that model's and no flag says the screen overstates it
        var r = DesignRun.Execute(ProblemReader.ReadFile(ReportRuns.ProblemPath("tie-plate-50hz")));
        var part = Assert.Single(r.Parts);
        Assert.NotEqual(r.Chosen![0].Id, part.Reference.Id);
        Assert.Equal("own-field", part.Reference.Model!.Name);
        var flags = part.Reference.Flags;
        Assert.DoesNotContain(flags, f => f.Contains("overstated", StringComparison.Ordinal));
        var console = new StringWriter();
        RunText.Write(r, console);
        var summary = MarkdownRenderer.Render(ReportContent.Build(r, ReportFigures.Of(r), "stamp"));
        // the console names the model behind the current design's number, as candidates.csv and result.json do
        Assert.Contains($"loss {Numbers.Watts(part.Reference.Loss.TotalW)} (own-field model)", console.ToString());
        foreach (var flag in flags)
        {
            Assert.Contains($"warning (current design): {flag}", console.ToString());
            Assert.Contains($"{part.Part.Name} (current design): {flag}", summary);
        }
        // one number rule on both sides: the chosen loss as the console and the report's table print it
        var loss = Numbers.Watts(r.TotalLossW);
        Assert.Contains($"total:     loss {loss}", console.ToString());
        Assert.Contains($"| chosen design | {Numbers.Sig(r.TotalLossW)} |", summary);
    }
}
