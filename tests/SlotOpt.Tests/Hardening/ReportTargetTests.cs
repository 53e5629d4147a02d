using SlotOpt.Reports;

namespace SlotOpt.Tests.Hardening;

/// <summary>
/// --out is checked before any work, and --force replaces only a previous report of ours (one holding the
/// marker file the report writes): never the input's folder, never a folder of the user's.
/// </summary>
public sealed class ReportTargetTests : IDisposable
{
    private readonly string folder = Directory.CreateTempSubdirectory("slotopt-out-").FullName;
    private readonly string problem;

    public ReportTargetTests()
    {
        problem = Path.Combine(folder, "inputs", "p.toml");
        Directory.CreateDirectory(Path.GetDirectoryName(problem)!);
        File.WriteAllText(problem, "# a problem file\n");
    }

    public void Dispose() => Directory.Delete(folder, recursive: true);

    private static string Refusal(string? target, bool force, params string[] inputs) =>
        Assert.Throws<InputException>(() => ReportFolder.CheckTarget(target, force, inputs)).Message;

    [Theory]
    [InlineData("")]
    [InlineData("   ")]
    [InlineData(null)]
    public void An_empty_name_is_refused(string? target) =>
        Assert.Equal("--out: the folder name is empty; give one, e.g. --out report", Refusal(target, force: false));

    [Fact]
    public void The_inputs_folder_or_one_above_it_is_refused_even_with_force()
    {
        var inputs = Path.GetDirectoryName(problem)!;
        File.WriteAllText(Path.Combine(inputs, ReportFolder.MarkerFile), "");   // even one that looks like a report
        foreach (var target in new[] { inputs, inputs + "/", folder, inputs + "/../inputs" })
            Assert.StartsWith($"--out {target}: the folder holds the input {problem}", Refusal(target, force: true, problem));
        Assert.True(File.Exists(problem));
    }

    [Fact]
    public void A_folder_that_is_not_a_report_of_ours_is_never_replaced()
    {
        var mine = Path.Combine(folder, "my-notes");
        Directory.CreateDirectory(mine);
        File.WriteAllText(Path.Combine(mine, "keep.txt"), "precious");
        Assert.Contains("pass --force", Refusal(mine, force: false, problem));
        Assert.Contains($"is not a report written by slotopt (it holds no {ReportFolder.MarkerFile})", Refusal(mine, force: true, problem));
        Assert.Equal("precious", File.ReadAllText(Path.Combine(mine, "keep.txt")));
    }

    [Fact]
    public void A_file_or_a_file_in_the_path_is_refused()
    {
        var file = Path.Combine(folder, "file");
        File.WriteAllText(file, "x");
        Assert.Contains("a file of that name exists", Refusal(file, force: true, problem));
        Assert.Contains($"{file} is a file, not a folder", Refusal(Path.Combine(file, "report"), force: false, problem));
    }

    [Theory]
    [InlineData("/proc/slotopt-report")]      // a file system nothing can be made in
    [InlineData("/proc/self/slotopt/report")]
    public void A_place_that_cannot_be_written_is_refused_before_any_work(string target) =>
        Assert.StartsWith($"--out {target}: cannot write in /proc", Refusal(target, force: false, problem));

    [Fact]
    public void A_new_folder_under_missing_parents_is_accepted_and_nothing_is_made_by_the_check()
    {
        var target = Path.Combine(folder, "a", "b", "report");
        ReportFolder.CheckTarget(target, overwrite: false, problem);
        Assert.False(Directory.Exists(Path.Combine(folder, "a")));
        Assert.Equal(["inputs"], Directory.EnumerateFileSystemEntries(folder).Select(Path.GetFileName));
    }

    [Fact]
    public void A_written_report_carries_the_marker_and_force_replaces_it_whole()
    {
        var target = Path.Combine(folder, "report");
        using (var first = ReportFolder.Begin(target, overwrite: false))
        {
            first.WriteText("index.html", "first");
            first.Commit();
        }
        Assert.True(File.Exists(Path.Combine(target, ReportFolder.MarkerFile)));
        ReportFolder.CheckTarget(target, overwrite: true, problem);
        using (var second = ReportFolder.Begin(target, overwrite: true))
        {
            second.WriteText("summary.md", "second");
            second.Commit();
        }
        Assert.Equal([ReportFolder.MarkerFile, "summary.md"], Directory.GetFiles(target).Select(Path.GetFileName).Order(StringComparer.Ordinal));
        Assert.Equal(["inputs", "report"], Directory.EnumerateFileSystemEntries(folder).Select(Path.GetFileName).Order(StringComparer.Ordinal));
    }
}
