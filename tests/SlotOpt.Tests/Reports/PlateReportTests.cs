using System.Globalization;
using System.Text.Json;
using System.Xml.Linq;
using SlotOpt.Cli;
using SlotOpt.Input;
using SlotOpt.Reports;
using SlotOpt.Reports.Plots;
using SlotOpt.Runs;
using SlotOpt.Tables;
using SlotOpt.Tests.Cli;

namespace SlotOpt.Tests.Reports;

/// <summary>
/// `slotopt plate FILE --out DIR [--force]`: the report folder (written atomically, the marker, refused over a folder that is
/// not a report, the exit codes), its numbers against the plate command's --json, each plot's checks, and the page in a browser.
/// Small plates on coarse grids: these check the report, not the physics (SourcesMotionFileTests and PlateCommandTests do).
/// </summary>
public sealed class PlateReportTests : IDisposable
{
    private readonly string dir = Path.Combine(Path.GetTempPath(), "slotopt-plate-report-" + Guid.NewGuid().ToString("N")[..8]);

    public PlateReportTests() => Directory.CreateDirectory(dir);

    public void Dispose() => Directory.Delete(dir, recursive: true);

    /// <summary>A copper plate under a magnet approaching it (two gaps), on a 2 mm grid: a second's solve.</summary>
    private const string ApproachFile = """
        [plate]
        width = "80 mm"
        height = "80 mm"
        thickness = "2 mm"
        conductivity = 5.8e7

        [grid]
        cell = "2 mm"

        [source]
        kind = "magnets"
        motion = "approach"
        shape = "cuboid"
        length = "20 mm"
        width = "20 mm"
        height = "10 mm"
        remanence = "1.2 T"
        gaps = ["3 mm", "6 mm", "12 mm"]
        speed = "0.2 m/s"
        """;

    /// <summary>A small disc with eight radial slots under four magnets turning at 300 rpm, on a 2 mm grid.</summary>
    private const string DiscFile = """
        [plate]
        shape = "disc"
        diameter = "120 mm"
        bore = "20 mm"
        thickness = "2 mm"
        conductivity = 5.8e7

        [grid]
        cell = "2 mm"

        [[slots]]
        pattern = "radial"
        count = 8
        width = "4 mm"
        from = "25 mm"

        [source]
        kind = "magnets"
        motion = "rotation"
        shape = "cylinder"
        diameter = "16 mm"
        height = "8 mm"
        remanence = "1.2 T"
        gap = "3 mm"
        radius = "40 mm"
        count = 4
        rotation_speed = 300
        """;

    /// <summary>A slotted aluminium strip under a row of magnets sliding along it at 2 m/s (drag over one slot pitch).</summary>
    private const string SlidingFile = """
        [plate]
        width = "160 mm"
        height = "60 mm"
        thickness = "2 mm"
        conductivity = 3.5e7

        [grid]
        cell = "2 mm"

        [[slots]]
        pattern = "comb"
        pitch = "20 mm"
        depth = "40 mm"
        width = "3 mm"

        [source]
        kind = "magnets"
        shape = "cuboid"
        length = "20 mm"
        width = "20 mm"
        height = "10 mm"
        remanence = "1.2 T"
        gap = "3 mm"
        x = "80 mm"
        y = "30 mm"
        speed = "2 m/s"
        """;

    private string Write(string name, string text)
    {
        var path = Path.Combine(dir, name);
        File.WriteAllText(path, text);
        return path;
    }

    private static string[] Files(string folder) => Directory.GetFiles(folder).Select(Path.GetFileName).Order(StringComparer.Ordinal).ToArray()!;

    [Fact]
    public void The_report_folder_holds_the_marker_the_pages_the_json_and_every_plot_and_nothing_else_is_left()
    {
        var plate = Write("damper.toml", ApproachFile);
        var target = Path.Combine(dir, "out", "damper-report");   // a missing parent is made, as mkdir -p
        var run = SlotOptInProcess.Run("plate", plate, "--out", target);
        Assert.True(run.ExitCode == ExitCodes.Success, run.Stderr);
        Assert.Contains("report: " + Path.Combine(target, ReportWriter.HtmlFile), run.Stderr);
        Assert.Equal(new[] { ReportFolder.MarkerFile, ApproachForcePlot.FileStem + ".png", ApproachForcePlot.FileStem + ".svg",
            PlateReportFigures.CurrentDensityStem + ".png", PlateReportFigures.CurrentDensityStem + ".svg", ReportWriter.HtmlFile, ReportWriter.JsonFile, ReportWriter.MarkdownFile }.Order(StringComparer.Ordinal),
            Files(target));
        // the atomic write leaves no hidden temporary sibling beside the report
        Assert.Equal(["damper-report"], Directory.EnumerateFileSystemEntries(Path.GetDirectoryName(target)!).Select(Path.GetFileName));
        // the text still goes to the console as without --out
        Assert.Contains("damping force", run.Stdout);
    }

    [Fact]
    public void Out_is_checked_before_any_work_and_force_replaces_only_a_report()
    {
        var plate = Write("damper.toml", ApproachFile);
        var foreign = Path.Combine(dir, "photos");
        Directory.CreateDirectory(foreign);
        File.WriteAllText(Path.Combine(foreign, "holiday.jpg"), "not a report");

        // a folder that is not a report: refused even with --force, untouched, exit 2, the message names --out
        var refused = SlotOptInProcess.Run("plate", plate, "--out", foreign, "--force");
        Assert.Equal(ExitCodes.InvalidInput, refused.ExitCode);
        Assert.Contains($"--out {foreign}", refused.Stderr);
        Assert.Contains(ReportFolder.MarkerFile, refused.Stderr);
        Assert.DoesNotContain("at SlotOpt", refused.Stderr);   // no stack trace
        Assert.Equal(["holiday.jpg"], Files(foreign));
        Assert.Equal("", refused.Stdout);   // refused before the solve: nothing printed

        // checked before the plate file is even read: a missing file is not what it reports
        var beforeWork = SlotOptInProcess.Run("plate", Path.Combine(dir, "missing.toml"), "--out", foreign);
        Assert.Equal(ExitCodes.InvalidInput, beforeWork.ExitCode);
        Assert.Contains("--out", beforeWork.Stderr);
        Assert.DoesNotContain("missing.toml", beforeWork.Stderr);

        // --force alone, and an --out holding the plate file itself
        var forceAlone = SlotOptInProcess.Run("plate", plate, "--force");
        Assert.Equal(ExitCodes.InvalidInput, forceAlone.ExitCode);
        Assert.Contains("--force only applies with --out", forceAlone.Stderr);
        var overInput = SlotOptInProcess.Run("plate", plate, "--out", dir, "--force");
        Assert.Equal(ExitCodes.InvalidInput, overInput.ExitCode);
        Assert.Contains("holds the input", overInput.Stderr);

        // a report of ours: refused without --force, replaced whole with it
        var report = Path.Combine(dir, "report");
        Assert.Equal(ExitCodes.Success, SlotOptInProcess.Run("plate", plate, "--out", report).ExitCode);
        File.WriteAllText(Path.Combine(report, "left-by-hand.txt"), "x");
        var again = SlotOptInProcess.Run("plate", plate, "--out", report);
        Assert.Equal(ExitCodes.InvalidInput, again.ExitCode);
        Assert.Contains("pass --force", again.Stderr);
        Assert.True(File.Exists(Path.Combine(report, "left-by-hand.txt")));
        var replaced = SlotOptInProcess.Run("plate", plate, "--out", report, "--force");
        Assert.True(replaced.ExitCode == ExitCodes.Success, replaced.Stderr);
        Assert.False(File.Exists(Path.Combine(report, "left-by-hand.txt")));
        Assert.True(File.Exists(Path.Combine(report, ReportFolder.MarkerFile)));
    }

    [Fact]
    public void A_bad_plate_file_writes_no_report_and_exits_with_the_input_code()
    {
        var plate = Write("bad.toml", ApproachFile.Replace("speed = \"0.2 m/s\"", "speed = \"-1 m/s\""));
        var target = Path.Combine(dir, "never");
        var run = SlotOptInProcess.Run("plate", plate, "--out", target);
        Assert.Equal(ExitCodes.InvalidInput, run.ExitCode);
        Assert.Contains("bad.toml:", run.Stderr);
        Assert.False(Directory.Exists(target));
        Assert.Equal([Path.GetFileName(plate)], Directory.EnumerateFileSystemEntries(dir).Select(Path.GetFileName));
    }

    /// <summary>
    /// result.json is the document --json prints, byte for byte; every figure of it that the report shows reads there as the
    /// house's four significant figures (<see cref="Numbers"/>) of that same value: exact agreement, no tolerance.
    /// </summary>
    [Theory]
    [InlineData("damper.toml", ApproachFile)]
    [InlineData("disc.toml", DiscFile)]
    [InlineData("strip.toml", SlidingFile)]
    public void The_numbers_in_the_report_are_the_json_numbers(string name, string text)
    {
        var plate = Write(name, text);
        var target = Path.Combine(dir, "report");
        var run = SlotOptInProcess.Run("plate", plate, "--json", "--out", target);
        Assert.True(run.ExitCode == ExitCodes.Success, run.Stderr);
        var json = File.ReadAllText(Path.Combine(target, ReportWriter.JsonFile));
        Assert.Equal(run.Stdout, json);
        using var doc = JsonDocument.Parse(json);
        var root = doc.RootElement;
        Assert.True(root.TryGetProperty("schema_version", out _));
        var markdown = File.ReadAllText(Path.Combine(target, ReportWriter.MarkdownFile));
        var html = File.ReadAllText(Path.Combine(target, ReportWriter.HtmlFile));
        void Shown(string text)
        {
            Assert.Contains(text, markdown);
            Assert.Contains(System.Net.WebUtility.HtmlEncode(text), html);
        }
        Shown(Numbers.Watts(root.GetProperty("loss_w").GetDouble()));
        Shown(root.GetProperty("model").GetString()!);
        Shown(Numbers.CurrentDensity(root.GetProperty("peak_current_density_a_per_m2").GetDouble()));
        Shown(Numbers.Sig(root.GetProperty("reynolds_number").GetDouble()));
        Shown(Numbers.EstimatePercent(root.GetProperty("discretisation_error").GetDouble()));
        if (root.TryGetProperty("approach_force_n", out var forces))
        {
            var gaps = root.GetProperty("approach_gaps_m").EnumerateArray().Select(g => g.GetDouble()).ToList();
            foreach (var (force, gap) in forces.EnumerateArray().Select(f => f.GetDouble()).Zip(gaps))
                Assert.Contains($"| {Numbers.Sig(gap * 1e3)} | {Numbers.Sig(force)} |", markdown);
        }
        else if (root.TryGetProperty("torque_n_m", out var torque))
        {
            Shown(Numbers.Of(torque.GetDouble(), "N m"));
            Shown(Numbers.Newtons(root.GetProperty("drag_n").GetDouble()));
            Shown(Numbers.Of(root.GetProperty("rotation_speed_rpm").GetDouble(), "rpm"));
        }
        else
        {
            Shown(Numbers.Newtons(root.GetProperty("drag_n").GetDouble()));
            var drags = root.GetProperty("drag_per_position_n").EnumerateArray().Select(d => d.GetDouble()).ToList();
            Shown($"min {Numbers.Newtons(drags.Min())}, max {Numbers.Newtons(drags.Max())}");
        }
    }

    /// <summary>
    /// The torque against disc angle is the evaluation's force along the magnets' path times their radius: its mean is the
    /// reported torque (the plate command averages the same angles), to rounding (1e-12 relative).
    /// </summary>
    [Fact]
    public void The_disc_curve_is_the_torque_at_each_angle_and_its_mean_is_the_reported_torque()
    {
        var e = PlateFileEvaluation.Evaluate(PlateFileReader.Parse(DiscFile, "disc.toml"));
        var f = PlateFigures.Of(e);
        Assert.Null(f.Travel);
        Assert.Null(f.Approach);
        var disc = f.DiscAngle!;
        Assert.Equal(e.Case.Rotation!.AnglesRad, disc.AnglesRad);
        Assert.Equal(e.TorqueNm!.Value, disc.TorqueNm.Average(), e.TorqueNm.Value * 1e-12);
        Assert.Equal(300, disc.SpeedRpm, 1e-9);
    }

    /// <summary>
    /// Every plot of the three motions renders through PlotChecks (which throws on a legend over a point or an axis without its
    /// unit) and carries both axis labels with units in its SVG text.
    /// </summary>
    [Theory]
    [InlineData(ApproachFile, "gap, magnet face to plate (mm)", "damping force (N)")]
    [InlineData(DiscFile, "disc angle (degrees)", "torque (N m)")]
    [InlineData(SlidingFile, "travel position of the source (mm)", "drag (N)")]
    public void Each_motion_plot_passes_the_plot_checks_and_names_its_units(string text, string xLabel, string yLabel)
    {
        var e = PlateFileEvaluation.Evaluate(PlateFileReader.Parse(text, "case.toml"));
        var figures = PlateReportFigures.Of(PlateFigures.Of(e), "case", e.Case.MovingSource is not null);
        var motion = figures.Motion!;
        var texts = SvgTexts(motion.Svg);
        Assert.Contains(xLabel, texts);
        Assert.Contains(yLabel, texts);
        Assert.Contains("x (mm)", SvgTexts(figures.CurrentDensity.Svg));
        Assert.Contains("|J| (A/mm²)", SvgTexts(figures.CurrentDensity.Svg));
        Assert.True(PlotChecks.HasUnit(xLabel) && PlotChecks.HasUnit(yLabel));
    }

    /// <summary>A solid disc is solved at one angle: a curve over angles would be one point on a zero-width axis, so there is no motion plot.</summary>
    [Fact]
    public void A_disc_solved_at_one_angle_has_no_torque_angle_plot()
    {
        var solid = DiscFile.Replace("""
            [[slots]]
            pattern = "radial"
            count = 8
            width = "4 mm"
            from = "25 mm"
            """, "");
        Assert.DoesNotContain("radial", solid);
        var e = PlateFileEvaluation.Evaluate(PlateFileReader.Parse(solid, "solid.toml"));
        Assert.Single(e.Case.Rotation!.AnglesRad);
        var figures = PlateReportFigures.Of(PlateFigures.Of(e), "solid", sourceMoves: true);
        Assert.Null(figures.Motion);
    }

    /// <summary>
    /// The neutral curve against speed: points marked one colour a model, the peak ringed and named in the legend. The series is
    /// the shape of the thin-sheet drag against speed, F(v) proportional to v w / (v^2 + w^2), which peaks at v = w (Reitz,
    /// J. Appl. Phys. 41 (1970) 2067, from memory); here w = 30 m/s, two models along the sweep as an own-field sweep would mix them.
    /// </summary>
    [Fact]
    public void The_speed_curve_marks_its_peak_and_its_models_and_passes_the_plot_checks()
    {
        const double w = 30;
        var points = Enumerable.Range(1, 12).Select(k => 6.0 * k)
            .Select(v => new SpeedCurvePoint(v, 10 * v * w / (v * v + w * w), v < 20 ? "resistance-limited" : "own-field")).ToList();
        var peak = points.MaxBy(p => p.Value)!;
        var figure = SpeedCurvePlot.Build(new SpeedCurve("speed", "m/s", "drag", "N", points, peak));
        var texts = SvgTexts(figure.Svg);
        Assert.Contains("speed (m/s)", texts);
        Assert.Contains("drag (N)", texts);
        Assert.Contains($"peak {Numbers.Of(peak.Value, "N")} at {Numbers.Of(peak.Speed, "m/s")}", texts);
        Assert.Contains("evaluated: resistance-limited", texts);
        Assert.Contains("evaluated: own-field", texts);
        Assert.Equal(30, peak.Speed);
        Assert.Contains("peaks at 5 N near 30 m/s", figure.Caption);
    }

    private static List<string> SvgTexts(string svg) =>
        XDocument.Parse(svg).Descendants().Where(x => x.Name.LocalName == "text").Select(x => x.Value.Trim()).ToList();

    /// <summary>
    /// The page in headless Chromium: every plot decodes, nothing is requested beyond the page itself, and the result line (with
    /// its model and grid error) is on the first screen of a laptop window (1280 x 800).
    /// </summary>
    [Fact]
    public async Task The_page_renders_in_a_browser_with_the_result_on_the_first_screen()
    {
        var plate = Write("disc.toml", DiscFile);
        var target = Path.Combine(dir, "report");
        var run = SlotOptInProcess.Run("plate", plate, "--out", target);
        Assert.True(run.ExitCode == ExitCodes.Success, run.Stderr);
        var pageUrl = new Uri(Path.Combine(target, ReportWriter.HtmlFile)).AbsoluteUri;

        await using var browser = await HeadlessChromium.StartAsync(SlotOptProcess.HangGuard);
        await browser.OpenTabAsync(1280, 800);
        await browser.NavigateAsync(pageUrl, SlotOptProcess.HangGuard);
        var images = (await browser.EvaluateAsync("Array.from(document.images).map(i => ({ alt: i.alt, complete: i.complete, width: i.naturalWidth }))"))!.AsArray();
        Assert.Equal(Directory.GetFiles(target, "*.png").Length, images.Count);
        Assert.Equal(2, images.Count);   // torque against angle, and the map
        foreach (var image in images)
            Assert.True(image!["complete"]!.GetValue<bool>() && image["width"]!.GetValue<int>() > 0, $"{image["alt"]} did not decode");
        var foreign = browser.RequestedUrls.Where(u => u != pageUrl && !u.StartsWith("data:", StringComparison.Ordinal)).ToList();
        Assert.True(foreign.Count == 0, "the page requested: " + string.Join(", ", foreign));

        var result = (await browser.EvaluateAsync("(() => { const e = document.getElementById('verdict'); const r = e.getBoundingClientRect(); return { bottom: r.bottom, right: r.right, text: e.textContent }; })()"))!;
        var line = result["text"]!.GetValue<string>();
        Assert.StartsWith("Result: braking torque ", line);
        Assert.Contains("resistance-limited model, grid error ", line);
        Assert.True(result["bottom"]!.GetValue<double>() <= 800 && result["right"]!.GetValue<double>() <= 1280, $"the result line ends at {result["bottom"]} px: below the first screen");
        Assert.Equal(0, (await browser.EvaluateAsync("document.scripts.length"))!.GetValue<int>());
    }
}
