using SlotOpt.Input;
using SlotOpt.Tests.Cli;

namespace SlotOpt.Tests.Hardening;

/// <summary>
/// Each class of hostile input from the hardening issue, through the command as a user runs it: the exit
/// code it must end with (2: input error), one "error:" line per mistake and no stack trace, nothing on
/// stdout, and nothing half-written: the folder the command ran in holds exactly what it held before, and
/// no report folder or temporary sibling appears.
/// </summary>
public sealed class HostileInputTests : IDisposable
{
    private readonly string folder = Directory.CreateTempSubdirectory("slotopt-hostile-").FullName;

    public void Dispose() => Directory.Delete(folder, recursive: true);

    private static string Demo(string name) => Path.Combine(AppContext.BaseDirectory, "problems", name + ".toml");

    /// <summary>The hostile file of a class, made in the test folder; "{F}" in a command stands for it.</summary>
    private string Make(string hostile, bool csv)
    {
        var path = Path.Combine(folder, csv ? "input.csv" : "input.toml");
        switch (hostile)
        {
            case "fifo": InputFileTests.MakeFifo(path); break;
            case "device": File.CreateSymbolicLink(path, "/dev/zero"); break;
            case "folder": Directory.CreateDirectory(path); break;
            case "oversize": InputFileTests.MakeSparse(path, (csv ? InputFile.MaxCsvBytes : InputFile.MaxTomlBytes) + 1); break;
            case "too-many-rows":
                File.WriteAllText(path, "b_t,f_hz,w_per_kg\n" + string.Concat(Enumerable.Range(0, WaveformCsv.MaxSamples + 2).Select(i => $"{i * 1e-5:R},50,1\n")));
                break;
            case "deep-nesting":
                File.WriteAllText(path, File.ReadAllText(Demo("tie-plate-50hz")) + "\nextra = " + new string('[', 5000) + new string(']', 5000) + "\n");
                break;
            case "non-finite":
                File.WriteAllText(path, File.ReadAllText(Demo("tie-plate-50hz")).Replace("cell = \"2.5 mm\"", "cell = nan"));
                break;
            case "overflowing-unit":
                File.WriteAllText(path, File.ReadAllText(Demo("tie-plate-50hz")).Replace("cell = \"2.5 mm\"", "cell = \"1e308 km\""));
                break;
            case "prefix-case":
                File.WriteAllText(path, File.ReadAllText(Demo("tie-plate-50hz")).Replace("cell = \"2.5 mm\"", "cell = \"2.5 MM\""));
                break;
            default: throw new ArgumentOutOfRangeException(nameof(hostile));
        }
        return path;
    }

    public static TheoryData<string, string> Cases()
    {
        var data = new TheoryData<string, string>();
        foreach (var hostile in new[] { "fifo", "device", "folder", "oversize", "deep-nesting", "non-finite", "overflowing-unit", "prefix-case" })
            foreach (var command in new[] { "check {F}", "evaluate {F}", "run {F} --out report" })
                data.Add(command, hostile);
        foreach (var hostile in new[] { "fifo", "device", "folder", "oversize", "deep-nesting" })
            data.Add("plate {F} --json", hostile);
        foreach (var hostile in new[] { "fifo", "device", "folder", "oversize", "too-many-rows" })
        {
            data.Add("core-loss --grade M270-35A --peak-flux-density 1.5T --frequency 50Hz --waveform {F} --json", hostile);
            data.Add("fit {F} --thickness 0.35mm --resistivity 0.52e-6 --density 7650 --json", hostile);
        }
        return data;
    }

    [Theory]
    [MemberData(nameof(Cases))]
    public void A_hostile_input_ends_with_exit_2_a_clear_line_and_nothing_written(string command, string hostile)
    {
        var csv = command.StartsWith("core-loss", StringComparison.Ordinal) || command.StartsWith("fit", StringComparison.Ordinal);
        var path = Make(hostile, csv);
        var before = Listing();
        var run = SlotOptInProcess.Run(command.Split(' ').Select(a => a == "{F}" ? path : a).ToArray());
        AssertCleanRefusal(run, 2, $"{command} on {hostile}");
        Assert.Contains(path, run.Stderr);   // the message names the file
        Assert.Equal(before, Listing());
    }

    [Theory]
    [InlineData("")]
    [InlineData(".")]
    [InlineData("./")]
    [InlineData("mine")]
    [InlineData("file.txt")]
    [InlineData("file.txt/report")]
    [InlineData("/proc/slotopt-report")]
    public void A_bad_out_target_is_refused_before_any_work_and_nothing_is_deleted(string target)
    {
        var problem = Path.Combine(folder, "p.toml");
        File.Copy(Demo("tie-plate-50hz"), problem);
        Directory.CreateDirectory(Path.Combine(folder, "mine"));
        File.WriteAllText(Path.Combine(folder, "mine", "keep.txt"), "precious");
        File.WriteAllText(Path.Combine(folder, "file.txt"), "a file");
        var before = Listing();
        var run = SlotOptProcess.RunIn(folder, "run", "p.toml", "--out", target, "--force");
        AssertCleanRefusal(run, 2, $"--out '{target}' --force");
        Assert.Contains("--out", run.Stderr);
        Assert.Equal(before, Listing());
        Assert.Equal(File.ReadAllText(Demo("tie-plate-50hz")), File.ReadAllText(problem));
    }

    [Theory]
    [InlineData("core-loss --grade M270-35A --peak-flux-density 1.5t --frequency 50Hz", "did you mean T?")]
    [InlineData("core-loss --grade M270-35A --peak-flux-density 1.5T --frequency 50HZ", "did you mean Hz?")]
    [InlineData("core-loss --grade M270-35A --peak-flux-density 1.5T --frequency 1e308kHz", "not a finite frequency")]
    [InlineData("core-loss --grade M270-35A --peak-flux-density 1.5T --frequency 50Hz --temperature 1e308MK", "not a finite temperature")]
    public void A_flag_with_a_wrong_unit_or_an_overflow_names_the_flag(string command, string expected)
    {
        var run = SlotOptInProcess.Run(command.Split(' '));
        AssertCleanRefusal(run, 2, command);
        Assert.Contains(expected, run.Stderr);
    }

    // A plate that conducts 1e300 times better than copper: its results overflow. Either the input is refused
    // as absurd (exit 2) or the non-finite result is a numerical failure naming its key (exit 4): never a
    // stack trace, never "Infinity" printed as a number.
    [Fact]
    public void A_result_that_overflows_never_reaches_the_output()
    {
        var plate = Path.Combine(folder, "plate.toml");
        File.WriteAllText(plate, File.ReadAllText(Path.Combine(AppContext.BaseDirectory, "Plates", "Data", "example-plate.toml"))
            .Replace("resistivity = \"0.0401 uOhm m\"", "resistivity = \"1e-300 ohm m\"").Replace("cell = \"2 mm\"", "cell = \"10 mm\""));
        var run = SlotOptInProcess.Run("plate", plate, "--json");
        Assert.True(run.ExitCode is 2 or 4, $"exit {run.ExitCode}: {run.Stderr}");
        Assert.DoesNotContain("   at ", run.Stderr);
        AssertNothingButErrorsOnOutput(run, run.ExitCode);
        // exit 4 either from the solver the model choice picks (a thick plate at this conductivity does not converge)
        // or from the JSON guard naming the key; both start with the failure's kind
        if (run.ExitCode == 4) Assert.StartsWith("numerical failure: ", run.Stderr);
    }

    private static void AssertCleanRefusal(SlotOptProcess.Outcome run, int exitCode, string what)
    {
        Assert.True(run.ExitCode == exitCode, $"{what}: exit {run.ExitCode}, expected {exitCode}\n{run.Stderr}");
        Assert.StartsWith("error: ", run.Stderr);
        Assert.DoesNotContain("   at ", run.Stderr);   // no stack trace
        Assert.DoesNotContain("internal error", run.Stderr);
        AssertNothingButErrorsOnOutput(run, exitCode);
    }

    /// <summary>Standard output is empty, or with --json the errors document (issue 17) and nothing else.</summary>
    private static void AssertNothingButErrorsOnOutput(SlotOptProcess.Outcome run, int exitCode)
    {
        if (run.Stdout.Length == 0) return;
        using var doc = System.Text.Json.JsonDocument.Parse(run.Stdout);
        Assert.Equal(exitCode, doc.RootElement.GetProperty("exit_code").GetInt32());
        Assert.True(doc.RootElement.GetProperty("errors").GetArrayLength() > 0);
    }

    /// <summary>Every entry under the test folder with its size: a half-written report or temporary sibling would show.</summary>
    private List<string> Listing() =>
        Directory.EnumerateFileSystemEntries(folder, "*", new EnumerationOptions { RecurseSubdirectories = true, AttributesToSkip = 0 })
            .Select(p => Path.GetRelativePath(folder, p) + (File.Exists(p) ? $" {new FileInfo(p).Length}" : ""))
            .Order(StringComparer.Ordinal).ToList();
}
