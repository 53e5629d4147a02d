namespace SlotOpt.Reports;

/// <summary>
/// A report folder written atomically: every file goes into a hidden temporary sibling of the target,
/// which is moved into place by <see cref="Commit"/> (a rename on the same file system). Until then the
/// target does not exist (or, with overwrite, still holds the previous report). The temporary folder is
/// made by the first write, so a caller can hook <see cref="Abandon"/> to its signal handlers between
/// <see cref="Begin"/> and that write; disposing without a commit, or Abandon, deletes it. Only a run
/// killed outright (SIGKILL, power loss) can leave one behind; the next report to the same target removes
/// such leftovers once they are <see cref="StaleAfter"/> old (a live run writes its files within seconds).
/// </summary>
public sealed class ReportFolder : IDisposable
{
    private readonly object gate = new();
    private readonly bool overwrite;
    private bool finished;

    private ReportFolder(string targetPath, string temporaryPath, bool overwrite)
    {
        TargetPath = targetPath;
        TemporaryPath = temporaryPath;
        this.overwrite = overwrite;
    }

    /// <summary>Age after which a temporary sibling counts as left by a killed run.</summary>
    public static readonly TimeSpan StaleAfter = TimeSpan.FromMinutes(10);

    public string TargetPath { get; }
    public string TemporaryPath { get; }

    /// <summary>Prefix of the temporary sibling of a target folder ("DIR" -> ".DIR.partial-").</summary>
    public static string TemporaryPrefix(string targetPath) => $".{Path.GetFileName(Path.TrimEndingDirectorySeparator(Path.GetFullPath(targetPath)))}.partial-";

    /// <exception cref="InputException">The target exists and overwrite is false, or a file stands where a parent folder should be.</exception>
    public static void CheckTarget(string targetPath, bool overwrite)
    {
        var full = Path.TrimEndingDirectorySeparator(Path.GetFullPath(targetPath));
        if (File.Exists(full)) throw new InputException($"--out {targetPath}: a file of that name exists; give a folder name");
        if (Directory.Exists(full) && !overwrite) throw new InputException($"--out {targetPath}: the folder exists; pass --force to replace it");
        // a missing parent folder is made when the report is written (as `mkdir -p` would); a file in its way is a mistake
        for (var parent = Path.GetDirectoryName(full); parent is not null && !Directory.Exists(parent); parent = Path.GetDirectoryName(parent))
            if (File.Exists(parent)) throw new InputException($"--out {targetPath}: {parent} is a file, not a folder");
    }

    public static ReportFolder Begin(string targetPath, bool overwrite)
    {
        CheckTarget(targetPath, overwrite);
        var full = Path.TrimEndingDirectorySeparator(Path.GetFullPath(targetPath));
        var parent = Path.GetDirectoryName(full)!;
        Directory.CreateDirectory(parent);
        foreach (var leftover in Directory.EnumerateDirectories(parent).Where(d => Path.GetFileName(d).StartsWith(TemporaryPrefix(full), StringComparison.Ordinal)))
            if (DateTime.UtcNow - Directory.GetLastWriteTimeUtc(leftover) > StaleAfter) Directory.Delete(leftover, recursive: true);
        var temporary = Path.Combine(parent, TemporaryPrefix(full) + Guid.NewGuid().ToString("N")[..12]);
        return new ReportFolder(full, temporary, overwrite);
    }

    public void WriteBytes(string fileName, byte[] bytes) => Write(fileName, path => File.WriteAllBytes(path, bytes));

    public void WriteText(string fileName, string text) => Write(fileName, path => File.WriteAllText(path, text));

    /// <summary>Moves the finished folder into place; an existing target (overwrite) is moved aside first and then deleted.</summary>
    public void Commit()
    {
        lock (gate)
        {
            EnsureOpen();
            Directory.CreateDirectory(TemporaryPath);
            CheckTarget(TargetPath, overwrite);
            string? previous = null;
            if (Directory.Exists(TargetPath))
            {
                previous = TemporaryPath + ".previous";
                Directory.Move(TargetPath, previous);
            }
            Directory.Move(TemporaryPath, TargetPath);
            finished = true;
            if (previous is not null) Directory.Delete(previous, recursive: true);
        }
    }

    /// <summary>Deletes the temporary folder and refuses any later write; safe to call from another thread (a signal handler).</summary>
    public void Abandon()
    {
        lock (gate)
        {
            if (finished) return;
            finished = true;
            if (Directory.Exists(TemporaryPath)) Directory.Delete(TemporaryPath, recursive: true);
        }
    }

    public void Dispose() => Abandon();

    private void Write(string fileName, Action<string> write)
    {
        if (fileName != Path.GetFileName(fileName)) throw new ArgumentException($"'{fileName}' is not a plain file name", nameof(fileName));
        lock (gate)
        {
            EnsureOpen();
            Directory.CreateDirectory(TemporaryPath);
            write(Path.Combine(TemporaryPath, fileName));
        }
    }

    private void EnsureOpen()
    {
        if (finished) throw new InvalidOperationException("the report folder was already committed or abandoned");
    }
}
