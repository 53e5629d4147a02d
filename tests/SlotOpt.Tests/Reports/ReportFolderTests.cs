using SlotOpt.Reports;

namespace SlotOpt.Tests.Reports;

/// <summary>The atomic folder writer, with failures injected directly: nothing partial is ever visible at the target.</summary>
public sealed class ReportFolderTests : IDisposable
{
    private readonly string parent = Path.Combine(Path.GetTempPath(), "slotopt-folder-tests-" + Guid.NewGuid().ToString("N")[..8]);

    public ReportFolderTests() => Directory.CreateDirectory(parent);

    public void Dispose() => Directory.Delete(parent, recursive: true);

    private string Target => Path.Combine(parent, "report");

    [Fact]
    public void A_failure_while_writing_leaves_neither_the_target_nor_the_temporary_folder()
    {
        Action writeThenFail = () =>
        {
            using var folder = ReportFolder.Begin(Target, overwrite: false);
            folder.WriteText("a.txt", "first file");
            Assert.True(Directory.Exists(folder.TemporaryPath));
            Assert.False(Directory.Exists(Target));
            throw new IOException("disk full (injected)");
        };
        var failure = Assert.Throws<IOException>(writeThenFail);
        Assert.Equal("disk full (injected)", failure.Message);
        Assert.Empty(Directory.EnumerateFileSystemEntries(parent));
    }

    [Fact]
    public void A_committed_folder_holds_every_file_and_no_temporary_sibling_is_left()
    {
        using (var folder = ReportFolder.Begin(Target, overwrite: false))
        {
            folder.WriteText("a.txt", "A");
            folder.WriteBytes("b.bin", [1, 2, 3]);
            folder.Commit();
        }
        Assert.Equal(["report"], Directory.EnumerateFileSystemEntries(parent).Select(Path.GetFileName));
        Assert.Equal("A", File.ReadAllText(Path.Combine(Target, "a.txt")));
        Assert.Equal([1, 2, 3], File.ReadAllBytes(Path.Combine(Target, "b.bin")));
    }

    [Fact]
    public void An_existing_folder_is_kept_without_overwrite_and_replaced_whole_with_it()
    {
        Directory.CreateDirectory(Target);
        File.WriteAllText(Path.Combine(Target, "old.txt"), "old report");
        File.WriteAllText(Path.Combine(Target, ReportFolder.MarkerFile), "");   // a report of ours: --force may replace it
        var refused = Assert.Throws<InputException>(() => ReportFolder.Begin(Target, overwrite: false));
        Assert.Contains("--force", refused.Message);
        Assert.True(File.Exists(Path.Combine(Target, "old.txt")));

        using (var failed = ReportFolder.Begin(Target, overwrite: true))
            failed.WriteText("new.txt", "half a report");   // disposed without a commit: the old report stays
        Assert.Equal([ReportFolder.MarkerFile, "old.txt"], Directory.GetFiles(Target).Select(Path.GetFileName).Order(StringComparer.Ordinal));

        using (var folder = ReportFolder.Begin(Target, overwrite: true))
        {
            folder.WriteText("new.txt", "new report");
            folder.Commit();
        }
        Assert.Equal([ReportFolder.MarkerFile, "new.txt"], Directory.GetFiles(Target).Select(Path.GetFileName).Order(StringComparer.Ordinal));
        Assert.Equal(["report"], Directory.EnumerateFileSystemEntries(parent).Select(Path.GetFileName));
    }

    [Fact]
    public void After_abandon_no_write_lands_and_nothing_is_left()
    {
        using var folder = ReportFolder.Begin(Target, overwrite: false);
        folder.WriteText("a.txt", "A");
        folder.Abandon();
        Assert.Throws<InvalidOperationException>(() => folder.WriteText("b.txt", "B"));
        Assert.Throws<InvalidOperationException>(folder.Commit);
        Assert.Empty(Directory.EnumerateFileSystemEntries(parent));
    }

    [Fact]
    public void A_leftover_of_a_killed_run_is_removed_once_stale_and_a_fresh_one_is_kept()
    {
        var stale = Path.Combine(parent, ReportFolder.TemporaryPrefix(Target) + "killedlongago");
        var fresh = Path.Combine(parent, ReportFolder.TemporaryPrefix(Target) + "stillrunning");
        Directory.CreateDirectory(stale);
        Directory.CreateDirectory(fresh);
        Directory.SetLastWriteTimeUtc(stale, DateTime.UtcNow - ReportFolder.StaleAfter - TimeSpan.FromMinutes(1));
        using (var folder = ReportFolder.Begin(Target, overwrite: false))
        {
            folder.WriteText("a.txt", "A");
            folder.Commit();
        }
        Assert.False(Directory.Exists(stale));
        Assert.True(Directory.Exists(fresh));
        Assert.True(File.Exists(Path.Combine(Target, "a.txt")));
    }
}
