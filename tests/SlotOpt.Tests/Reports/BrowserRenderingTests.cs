using System.Text.Json.Nodes;
using SlotOpt.Reports;
using SlotOpt.Tests.Cli;

namespace SlotOpt.Tests.Reports;

/// <summary>index.html opened in headless Chromium: every plot image decodes, and the page asks for nothing beyond its own file.</summary>
[Collection(ReportRunsCollection.Name)]
public sealed class BrowserRenderingTests(ReportRuns runs)
{
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

        Assert.Equal([0x89, (byte)'P', (byte)'N', (byte)'G'], screenshot.Take(4));
        var heightPx = (screenshot[20] << 24) | (screenshot[21] << 16) | (screenshot[22] << 8) | screenshot[23];   // IHDR height
        Assert.True(heightPx > 3000, $"the screenshot is only {heightPx} px tall: the page did not lay out its plots");
        File.WriteAllBytes(Path.Combine(runs.Root, "index-screenshot.png"), screenshot);
    }
}
