using System.Diagnostics;
using SlotOpt.Input;
using SlotOpt.Tables;

namespace SlotOpt.Tests.Hardening;

/// <summary>
/// Input files: only regular files are opened (a FIFO would block the open, /dev/zero would never end), no
/// file beyond its cap is read, no CSV beyond its row cap is kept. Each refusal names the file.
/// </summary>
public sealed class InputFileTests : IDisposable
{
    private readonly string folder = Directory.CreateTempSubdirectory("slotopt-input-files-").FullName;

    public void Dispose() => Directory.Delete(folder, recursive: true);

    private string PathOf(string name) => Path.Combine(folder, name);

    /// <summary>A named pipe with no writer: opening it for reading would block for ever.</summary>
    internal static void MakeFifo(string path)
    {
        using var mkfifo = Process.Start("mkfifo", [path]);
        mkfifo.WaitForExit();
        Assert.Equal(0, mkfifo.ExitCode);
    }

    /// <summary>A sparse file of the given length: no disk space, read as zeros.</summary>
    internal static void MakeSparse(string path, long length)
    {
        using var stream = File.Create(path);
        stream.SetLength(length);
    }

    [Fact]
    public void A_fifo_is_refused_before_it_is_opened()
    {
        var fifo = PathOf("problem.toml");
        MakeFifo(fifo);
        var e = Assert.Throws<InputException>(() => InputFile.ReadAllText(fifo, "problem file"));
        Assert.Equal($"{fifo}: the problem file must be a regular file, not a FIFO (named pipe)", e.Message);
    }

    [Theory]
    [InlineData("/dev/zero", "a character device")]
    [InlineData("/dev/null", "a character device")]
    [InlineData("/tmp", "a folder")]
    public void A_device_or_a_folder_is_refused(string path, string what)
    {
        var e = Assert.Throws<InputException>(() => InputFile.ReadAllText(path, "waveform file", InputFile.MaxCsvBytes));
        Assert.Equal($"{path}: the waveform file must be a regular file, not {what}", e.Message);
    }

    [Fact]
    public void A_link_to_a_device_is_refused_as_the_device()
    {
        var link = PathOf("zero.csv");
        File.CreateSymbolicLink(link, "/dev/zero");
        var e = Assert.Throws<InputException>(() => InputFile.ReadAllText(link, "field map", InputFile.MaxCsvBytes));
        Assert.Contains("not a character device", e.Message);
    }

    [Fact]
    public void A_missing_file_is_named()
    {
        var e = Assert.Throws<InputException>(() => InputFile.ReadAllText(PathOf("nope.toml"), "problem file"));
        Assert.Equal($"{PathOf("nope.toml")}: cannot read the problem file (no such file)", e.Message);
    }

    [Theory]
    [InlineData(InputFile.MaxTomlBytes, "4 MiB")]
    [InlineData(InputFile.MaxCsvBytes, "64 MiB")]
    public void A_file_one_byte_over_its_cap_is_refused_and_one_at_the_cap_is_read(long cap, string capInWords)
    {
        var over = PathOf("over");
        MakeSparse(over, cap + 1);
        var e = Assert.Throws<InputException>(() => InputFile.ReadAllText(over, "input", cap));
        Assert.Equal($"{over}: the input is larger than {capInWords}, the most slotopt reads", e.Message);

        var at = PathOf("at");
        MakeSparse(at, cap);
        Assert.Equal(cap, InputFile.ReadAllText(at, "input", cap).Length);   // zeros read as NUL characters, one byte each
    }

    [Fact]
    public void A_table_past_its_row_cap_stops_at_the_first_row_too_many()
    {
        var text = "a,b\n# note\n" + string.Concat(Enumerable.Range(0, 10).Select(i => $"{i},{i}\n"));
        Assert.Equal(10, CsvTable.Parse(text, "t.csv", maxRows: 10).Rows.Count);
        var e = Assert.Throws<InputException>(() => CsvTable.Parse(text, "t.csv", maxRows: 9));
        Assert.Equal("t.csv:12: more than 9 data rows, the most this table may hold", e.Message);
    }

    [Fact]
    public void Measurements_past_their_cap_are_refused()
    {
        var path = PathOf("m.csv");
        File.WriteAllText(path, "b_t,f_hz,w_per_kg\n" + string.Concat(Enumerable.Range(1, LossMeasurementCsv.MaxRows + 1).Select(i => $"{1 + i * 1e-4},50,{1 + i * 1e-4}\n")));
        var e = Assert.Throws<InputException>(() => LossMeasurementCsv.Read(path));
        Assert.Equal($"{path}:{LossMeasurementCsv.MaxRows + 2}: more than {LossMeasurementCsv.MaxRows:N0} data rows, the most this table may hold", e.Message);
    }

    [Fact]
    public void A_waveform_past_its_cap_is_refused()
    {
        var rows = WaveformCsv.MaxSamples + 2;   // + the closing sample at phase 1 is one too many
        var text = "phase,b_t\n" + string.Concat(Enumerable.Range(0, rows).Select(i => $"{(double)i / (rows - 1):R},{Math.Sin(2 * Math.PI * i / (rows - 1)):R}\n"));
        var e = Assert.Throws<InputException>(() => WaveformCsv.Parse(text, "w.csv", 50));
        Assert.StartsWith($"w.csv:{rows + 1}: more than", e.Message);
    }

    [Fact]
    public void A_table_of_bad_rows_lists_the_first_twenty_and_counts_the_rest()
    {
        var text = "a,b\n" + string.Concat(Enumerable.Repeat("1\n", 1000));
        var lines = Assert.Throws<InputException>(() => CsvTable.Parse(text, "t.csv")).Message.Split(Environment.NewLine);
        Assert.Equal(21, lines.Length);
        Assert.Equal("t.csv:1001: ... and 980 more errors", lines[^1]);
    }
}
