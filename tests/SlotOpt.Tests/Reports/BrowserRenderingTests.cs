using SlotOpt.Reports.Plots;
using System.Text.Json.Nodes;
using System.Text.RegularExpressions;
using System.Xml.Linq;
using SlotOpt.Reports;
using SlotOpt.Tests.Cli;

namespace SlotOpt.Tests.Reports;

/// <summary>
/// index.html opened in headless Chromium: every plot image decodes, the page asks for nothing beyond its own file, the
/// verdict and the chosen design are on the first screen, the trade-off points name their designs; and every plot file
/// has axis labels with units.
/// </summary>
[Collection(ReportRunsCollection.Name)]
public sealed class BrowserRenderingTests(ReportRuns runs)
{
    /// <summary>The first screen of a laptop browser window: what a reader sees before scrolling.</summary>
    private static readonly (int Width, int Height) FirstScreen = (1280, 800);

    [Fact]
    public async Task Every_plot_loads_and_no_request_leaves_the_machine()
    {
        var run = runs.Runs[ReportRuns.Conveyor];
        Assert.True(run.Text.ExitCode == 0, run.Text.Stderr);
        var index = Path.Combine(run.TextDir, ReportWriter.HtmlFile);
        var pageUrl = new Uri(index).AbsoluteUri;
        var plots = Directory.GetFiles(run.TextDir, "*.png").Length;

        await using var browser = await HeadlessChromium.StartAsync(SlotOptProcess.HangGuard);
        await browser.OpenTabAsync(1280, 3000);
        await browser.NavigateAsync(pageUrl, SlotOptProcess.HangGuard);
        var images = (await browser.EvaluateAsync("Array.from(document.images).map(i => ({ alt: i.alt, complete: i.complete, width: i.naturalWidth, height: i.naturalHeight }))"))!.AsArray();
        var screenshot = await browser.ScreenshotAsync();

        // the page itself is the only request that is not a data: URI (embedded plots)
        var foreign = browser.RequestedUrls.Where(u => u != pageUrl && !u.StartsWith("data:", StringComparison.Ordinal)).ToList();
        Assert.True(foreign.Count == 0, "the page requested: " + string.Join(", ", foreign));
        Assert.Contains(pageUrl, browser.RequestedUrls);
        Assert.Equal(plots, images.Count);
        foreach (var image in images)
        {
            var alt = image!["alt"]!.GetValue<string>();
            Assert.True(image["complete"]!.GetValue<bool>(), $"{alt} did not finish loading");
            Assert.True(image["width"]!.GetValue<int>() > 0 && image["height"]!.GetValue<int>() > 0, $"{alt} has no natural size: it did not decode");
        }

        // issue 17: the verdict and the chosen design's table are on the first screen (1280 x 800, not scrolled)
        var verdict = (await browser.EvaluateAsync("(() => { const r = document.getElementById('verdict').getBoundingClientRect(); return { top: r.top, bottom: r.bottom, right: r.right, text: document.getElementById('verdict').textContent }; })()"))!;
        Assert.StartsWith("Verdict: ", verdict["text"]!.GetValue<string>());
        Assert.True(verdict["top"]!.GetValue<double>() >= 0 && verdict["bottom"]!.GetValue<double>() <= FirstScreen.Height && verdict["right"]!.GetValue<double>() <= FirstScreen.Width,
            $"the verdict lies at {verdict["top"]}-{verdict["bottom"]} px, not within the first {FirstScreen.Width} x {FirstScreen.Height} px");
        var chosenTableTop = (await browser.EvaluateAsync("document.querySelector('table').getBoundingClientRect().top"))!.GetValue<double>();
        Assert.True(chosenTableTop < FirstScreen.Height, $"the chosen design's table starts at {chosenTableTop} px, below the first screen");
        Assert.Contains("chosen", (await browser.EvaluateAsync("document.querySelector('table').textContent"))!.GetValue<string>());

        // issue 17: each point of the trade-off curve names its design when pointed at (an SVG title, no script)
        var front = JsonNode.Parse(File.ReadAllText(Path.Combine(run.TextDir, ReportWriter.JsonFile)))!["front"]!.AsArray();
        var tips = (await browser.EvaluateAsync("Array.from(document.querySelectorAll('svg.tips circle title')).map(t => t.textContent)"))!.AsArray();
        Assert.Equal(front.Count, tips.Count);
        Assert.All(tips, t => Assert.Matches(@"^(chosen design: )?build cost [0-9.]+ EUR, loss [0-9.]+ W, owning cost [0-9.]+ EUR\n\S", t!.GetValue<string>()));
        Assert.Equal(0, (await browser.EvaluateAsync("document.scripts.length"))!.GetValue<int>());

        Assert.Equal([0x89, (byte)'P', (byte)'N', (byte)'G'], screenshot.Take(4));
        var heightPx = (screenshot[20] << 24) | (screenshot[21] << 16) | (screenshot[22] << 8) | screenshot[23];   // IHDR height
        Assert.True(heightPx > 3000, $"the screenshot is only {heightPx} px tall: the page did not lay out its plots");
        File.WriteAllBytes(Path.Combine(runs.Root, "index-screenshot.png"), screenshot);
    }

    /// <summary>
    /// Issue 17: every plot file carries its axis labels with units, read from the SVG's text (the plot code refuses to
    /// render without them: <see cref="PlotChecks"/>). The loss breakdown's x axis names designs, not a quantity.
    /// </summary>
    [Theory]
    [InlineData(ReportRuns.Conveyor)]
    [InlineData(ReportRuns.Actuator)]
    public void Every_plot_has_axis_labels_with_units(string problem)
    {
        var run = runs.Runs[problem];
        Assert.True(run.Text.ExitCode == 0, run.Text.Stderr);
        var units = new Regex(@"\((W|N|mm|m/s|Hz|A/mm²|°C|EUR)\b[^()]*\)$");
        var svgs = Directory.GetFiles(run.TextDir, "*.svg");
        Assert.NotEmpty(svgs);
        foreach (var svg in svgs)
        {
            var texts = XDocument.Load(svg).Descendants().Where(e => e.Name.LocalName == "text").Select(e => e.Value.Trim()).ToList();
            var labelled = texts.Where(t => units.IsMatch(t)).Distinct().ToList();
            var needed = Path.GetFileName(svg).StartsWith(LossBreakdownPlot.FileStem, StringComparison.Ordinal) ? 1 : 2;
            Assert.True(labelled.Count >= needed, $"{Path.GetFileName(svg)}: {labelled.Count} texts with a unit ({string.Join("; ", labelled)}), {needed} needed");
            Assert.Contains(texts, t => t is "x (mm)" or "speed (m/s)" or "frequency (Hz, log scale)" or "design and part" || t.StartsWith("build cost (", StringComparison.Ordinal));
        }
    }
}
