using System.Runtime.InteropServices;
using System.Text;

namespace SlotOpt.Input;

/// <summary>
/// Reads a user's input file. Only a regular file is read (a folder, a FIFO or a device such as /dev/zero
/// is refused before it is opened, so nothing blocks or grows without bound), and never more than a cap:
/// <see cref="MaxTomlBytes"/> for problem and plate files, <see cref="MaxCsvBytes"/> for CSV tables.
/// Every refusal is an <see cref="InputException"/> naming the file.
/// </summary>
public static class InputFile
{
    /// <summary>Cap on a TOML problem or plate file (the demo problems are 2-5 KiB).</summary>
    public const long MaxTomlBytes = 4L << 20;

    /// <summary>Cap on a CSV table (waveform, field map, measurements).</summary>
    public const long MaxCsvBytes = 64L << 20;

    /// <param name="what">The file's role in words, e.g. "problem file", "waveform file".</param>
    /// <param name="maxBytes">The largest file accepted.</param>
    public static string ReadAllText(string path, string what, long maxBytes = MaxTomlBytes)
    {
        if (string.IsNullOrWhiteSpace(path)) throw new InputException($"the {what} has an empty name");
        var kind = KindOf(path);
        if (kind == FileKind.Missing) throw new InputException($"{path}: cannot read the {what} (no such file)");
        if (kind != FileKind.Regular)
            throw new InputException($"{path}: the {what} must be a regular file, not {Describe(kind)}");
        try
        {
            using var stream = new FileStream(path, FileMode.Open, FileAccess.Read, FileShare.Read, 1 << 16);
            if (stream.Length > maxBytes) throw TooBig(path, what, maxBytes);
            var bytes = new byte[stream.Length];
            var read = 0;
            while (read < bytes.Length && stream.Read(bytes, read, bytes.Length - read) is var n and > 0) read += n;
            if (stream.ReadByte() >= 0) throw TooBig(path, what, maxBytes);   // grew while it was read
            using var reader = new StreamReader(new MemoryStream(bytes, 0, read), Encoding.UTF8, detectEncodingFromByteOrderMarks: true);
            return reader.ReadToEnd();
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException or ArgumentException or NotSupportedException)
        {
            throw new InputException($"{path}: cannot read the {what} ({e.Message})");
        }
    }

    private static InputException TooBig(string path, string what, long maxBytes) =>
        new($"{path}: the {what} is larger than {maxBytes >> 20} MiB, the most slotopt reads");

    private enum FileKind { Missing, Regular, Directory, Fifo, CharacterDevice, BlockDevice, Socket, Other }

    private static string Describe(FileKind kind) => kind switch
    {
        FileKind.Directory => "a folder",
        FileKind.Fifo => "a FIFO (named pipe)",
        FileKind.CharacterDevice => "a character device",
        FileKind.BlockDevice => "a block device",
        FileKind.Socket => "a socket",
        _ => "a special file",
    };

    /// <summary>What the path names, following symbolic links: statx(2) on Linux; elsewhere (or without statx) only file or folder.</summary>
    private static FileKind KindOf(string path)
    {
        if (OperatingSystem.IsLinux() && LinuxKindOf(path) is { } kind) return kind;
        if (Directory.Exists(path)) return FileKind.Directory;
        return File.Exists(path) ? FileKind.Regular : FileKind.Missing;
    }

    /// <summary>The file type from statx(2); null where the C library has no statx (glibc before 2.28).</summary>
    private static FileKind? LinuxKindOf(string path)
    {
        // struct statx (Linux uapi <linux/stat.h>): stx_mode is the 16-bit field at byte offset 28; the file type is mode & S_IFMT
        var buffer = new byte[256];
        int result;
        try { result = Statx(AtFdCwd, path, 0, StatxType, buffer); }
        catch (Exception e) when (e is EntryPointNotFoundException or DllNotFoundException) { return null; }
        if (result != 0) return Marshal.GetLastPInvokeError() == ENoEnt ? FileKind.Missing : FileKind.Regular;   // let the open report other failures in its own words
        return (BitConverter.ToUInt16(buffer, 28) & 0xF000) switch
        {
            0x8000 => FileKind.Regular,
            0x4000 => FileKind.Directory,
            0x1000 => FileKind.Fifo,
            0x2000 => FileKind.CharacterDevice,
            0x6000 => FileKind.BlockDevice,
            0xC000 => FileKind.Socket,
            _ => FileKind.Other,
        };
    }

    private const int AtFdCwd = -100, ENoEnt = 2;
    private const uint StatxType = 0x1;

    [DllImport("libc", EntryPoint = "statx", SetLastError = true)]
    private static extern int Statx(int dirFd, [MarshalAs(UnmanagedType.LPUTF8Str)] string path, int flags, uint mask, [Out] byte[] buffer);
}
