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

    /// <summary>The file every report folder holds; only a folder holding it is ever replaced (--force).</summary>
    public const string MarkerFile = ".slotopt-report";

    private const string MarkerText = "This folder is a report written by slotopt; `slotopt run FILE --out THIS --force` (or `slotopt plate FILE ...`) may replace it whole.\n";

    /// <summary>
    /// Checks a report target before any work, so that a run never ends by failing to write: the name is not
    /// empty; it names no file; it is not a folder holding one of the inputs (the input's own folder, or
    /// above it); an existing folder is replaced only with overwrite and only when it holds <see cref="MarkerFile"/>
    /// (a previous report of ours); the nearest existing parent is a folder that can be written in.
    /// </summary>
    /// <param name="inputFiles">The files the run reads; the report may not replace a folder holding one.</param>
    /// <exception cref="InputException">Any of these fails; the message names --out and what to do.</exception>
    public static void CheckTarget(string? targetPath, bool overwrite, params IReadOnlyList<string> inputFiles)
    {
        if (string.IsNullOrWhiteSpace(targetPath)) throw new InputException("--out: the folder name is empty; give one, e.g. --out report");
        var flag = $"--out {targetPath}";
        string full;
        try { full = Path.TrimEndingDirectorySeparator(Path.GetFullPath(targetPath)); }
        catch (Exception e) when (e is ArgumentException or NotSupportedException or PathTooLongException)
        {
            throw new InputException($"{flag}: not a usable folder name ({e.Message})");
        }
        var parent = Path.GetDirectoryName(full) ?? throw new InputException($"{flag}: is the root of the file system; give a folder of its own");
        foreach (var input in inputFiles)
            if (IsInside(Path.GetFullPath(input), full))
                throw new InputException($"{flag}: the folder holds the input {input}; write the report to a folder of its own, e.g. --out {Path.GetFileNameWithoutExtension(input)}-report");
        if (File.Exists(full)) throw new InputException($"{flag}: a file of that name exists; give a folder name");
        if (Directory.Exists(full))
        {
            if (!overwrite) throw new InputException($"{flag}: the folder exists; pass --force to replace it");
            if (!File.Exists(Path.Combine(full, MarkerFile)))
                throw new InputException($"{flag}: the folder exists and is not a report written by slotopt (it holds no {MarkerFile}); --force replaces only a previous report: choose another folder or empty this one yourself");
        }
        // a missing parent folder is made when the report is written (as `mkdir -p` would); a file in its way is a mistake
        var existing = parent;
        while (!Directory.Exists(existing))
        {
            if (File.Exists(existing)) throw new InputException($"{flag}: {existing} is a file, not a folder");
            existing = Path.GetDirectoryName(existing) ?? throw new InputException($"{flag}: no part of the path exists");
        }
        if (!CanWriteIn(existing)) throw new InputException($"{flag}: cannot write in {existing}");
    }

    /// <summary>True when path lies inside folder (at any depth).</summary>
    private static bool IsInside(string path, string folder) =>
        path.StartsWith(Path.EndsInDirectorySeparator(folder) ? folder : folder + Path.DirectorySeparatorChar, StringComparison.Ordinal);

    /// <summary>Makes and removes an empty hidden folder: the one sure test that a folder can be written in (permissions, read-only mounts, /proc).</summary>
    private static bool CanWriteIn(string folder)
    {
        var probe = Path.Combine(folder, $".slotopt-probe-{Guid.NewGuid():N}");
        try
        {
            Directory.CreateDirectory(probe);
            Directory.Delete(probe);
            return true;
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException) { return false; }
    }

    public static ReportFolder Begin(string targetPath, bool overwrite)
    {
        CheckTarget(targetPath, overwrite);
        var full = Path.TrimEndingDirectorySeparator(Path.GetFullPath(targetPath));
        var parent = Path.GetDirectoryName(full)!;
        Directory.CreateDirectory(parent);
        foreach (var leftover in Directory.EnumerateDirectories(parent).Where(d => Path.GetFileName(d).StartsWith(TemporaryPrefix(full), StringComparison.Ordinal)))
            if (DateTime.UtcNow - Directory.GetLastWriteTimeUtc(leftover) > StaleAfter) DeleteIfPossible(leftover);
        var temporary = Path.Combine(parent, TemporaryPrefix(full) + Guid.NewGuid().ToString("N")[..12]);
        return new ReportFolder(full, temporary, overwrite);
    }

    public void WriteBytes(string fileName, byte[] bytes) => Write(fileName, path => File.WriteAllBytes(path, bytes));

    public void WriteText(string fileName, string text) => Write(fileName, path => File.WriteAllText(path, text));

    /// <summary>
    /// Writes <see cref="MarkerFile"/> and moves the finished folder into place; an existing target (overwrite)
    /// is moved aside first and then deleted.
    /// </summary>
    /// <exception cref="InputException">The previous report could not be deleted completely (the new one is in place; the message says where the rest is).</exception>
    public void Commit()
    {
        lock (gate)
        {
            EnsureOpen();
            Directory.CreateDirectory(TemporaryPath);
            File.WriteAllText(Path.Combine(TemporaryPath, MarkerFile), MarkerText);
            CheckTarget(TargetPath, overwrite);
            string? previous = null;
            if (Directory.Exists(TargetPath))
            {
                previous = TemporaryPath + ".previous";
                Directory.Move(TargetPath, previous);
            }
            Directory.Move(TemporaryPath, TargetPath);
            finished = true;
            if (previous is not null && !DeleteIfPossible(previous))
                throw new InputException($"--out {TargetPath}: the new report is in place, but the previous one could not be deleted completely; what is left of it is in {previous}");
        }
    }

    /// <summary>Deletes a folder of ours; false when some entry cannot be deleted (a permission, an immutable file).</summary>
    private static bool DeleteIfPossible(string folder)
    {
        try
        {
            Directory.Delete(folder, recursive: true);
            return true;
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException) { return false; }
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
