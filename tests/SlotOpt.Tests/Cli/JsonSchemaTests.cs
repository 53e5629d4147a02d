using System.Text.Json;

namespace SlotOpt.Tests.Cli;

/// <summary>
/// Issue 17: every command's --json output, success and error, is one JSON document whose first key is
/// schema_version; an error comes out on standard output as {"errors": [{file, line, key, message}]} with the
/// exit code the command returns without --json. These are contract checks of our own format (no outside
/// source applies); each asserts exact keys and exit codes.
/// </summary>
public class JsonSchemaTests
{
    private static string Demo(string name) => Path.Combine(AppContext.BaseDirectory, "problems", name);

    private static JsonElement ParseVersioned(SlotOptProcess.Outcome run)
    {
        using var doc = JsonDocument.Parse(run.Stdout);
        var root = doc.RootElement.Clone();
        var first = root.EnumerateObject().First();
        Assert.Equal("schema_version", first.Name);
        Assert.Equal(3, first.Value.GetInt32());   // 3 since result.json named the selection search's effort in plain words
        Assert.DoesNotContain("null", run.Stdout);
        return root;
    }

    public static TheoryData<string[]> SuccessfulCommands() => new()
    {
        new[] { "materials", "--json" },
        new[] { "core-loss", "--grade", "M270-35A", "--peak-flux-density", "1.5T", "--frequency", "50Hz", "--json" },
        new[] { "check", "{problems}/actuator-product.toml", "--json" },
        new[] { "evaluate", "{problems}/actuator-product.toml", "--json" },
        new[] { "plate", "{plate}", "--json" },
    };

    [Theory]
    [MemberData(nameof(SuccessfulCommands))]
    public void Every_successful_command_prints_versioned_json_without_nulls(string[] args)
    {
        var run = SlotOptInProcess.Run(Resolve(args));
        Assert.True(run.ExitCode == 0, run.Stderr);
        ParseVersioned(run);
    }

    [Fact]
    public void Fit_json_is_versioned()
    {
        var dir = Directory.CreateTempSubdirectory("slotopt-fit-json-").FullName;
        try
        {
            // measured-like points generated from P = kh f B^2 + ke (f B)^1.5 (invented demo coefficients; the fit itself is checked in LaminationCommandTests)
            var lines = new List<string> { "b_t,f_hz,w_per_kg" };
            foreach (var b in new[] { 0.5, 1.0, 1.5 })
                foreach (var f in new[] { 50.0, 100.0 })
                    lines.Add(FormattableString.Invariant($"{b},{f},{0.02 * f * b * b + 3e-10 * f * f * b * b + 5e-4 * Math.Pow(f * b, 1.5)}"));
            File.WriteAllLines(Path.Combine(dir, "m.csv"), lines);
            var run = SlotOptInProcess.Run("fit", Path.Combine(dir, "m.csv"), "--thickness", "0.5mm", "--resistivity", "0.42 uOhm m", "--density", "7700 kg/m3", "--json");
            Assert.True(run.ExitCode == 0, run.Stderr);
            ParseVersioned(run);
        }
        finally { Directory.Delete(dir, true); }
    }

    [Fact]
    public void Run_json_is_versioned_and_uses_the_same_keys_as_evaluate()
    {
        var run = SlotOptInProcess.Run("run", Demo("actuator-product.toml"), "--json");
        Assert.True(run.ExitCode == 0, run.Stderr);
        var result = ParseVersioned(run);
        var evaluate = ParseVersioned(SlotOptInProcess.Run("evaluate", Demo("actuator-product.toml"), "--json"));
        // the reference of a chosen part and a part of evaluate carry their kind (current or baseline) under the same key
        var reference = result.GetProperty("parts")[0].GetProperty("reference");
        Assert.Contains(reference.GetProperty("kind").GetString(), new[] { "current", "baseline" });
        Assert.Contains(evaluate.GetProperty("parts")[0].GetProperty("kind").GetString(), new[] { "current", "baseline" });
        Assert.False(evaluate.GetProperty("parts")[0].TryGetProperty("breaks_rule", out _));
    }

    public static TheoryData<string[], string?, string?> FailingCommands() => new()
    {
        // a flag with a value that is not a quantity: the flag is the key
        { new[] { "core-loss", "--grade", "M270-35A", "--peak-flux-density", "1.5 furlongs", "--frequency", "50Hz", "--json" }, null, "--peak-flux-density" },
        // an unknown grade
        { new[] { "core-loss", "--grade", "M999-99Z", "--peak-flux-density", "1.5T", "--frequency", "50Hz", "--json" }, null, "--grade" },
        // a file that does not exist
        { new[] { "check", "/nonexistent/p.toml", "--json" }, "/nonexistent/p.toml", null },
        { new[] { "evaluate", "/nonexistent/p.toml", "--json" }, "/nonexistent/p.toml", null },
        { new[] { "run", "/nonexistent/p.toml", "--json" }, "/nonexistent/p.toml", null },
        { new[] { "fit", "/nonexistent/m.csv", "--thickness", "0.5mm", "--resistivity", "0.42 uOhm m", "--density", "7700 kg/m3", "--json" }, "/nonexistent/m.csv", null },
        { new[] { "plate", "/nonexistent/p.toml", "--json" }, "/nonexistent/p.toml", null },
        // a flag the command does not know (caught by the parser, before the command runs)
        { new[] { "materials", "--jsn", "--json" }, null, null },
    };

    [Theory]
    [MemberData(nameof(FailingCommands))]
    public void Every_failing_command_prints_its_errors_as_versioned_json_with_exit_2(string[] args, string? file, string? key)
    {
        var run = SlotOptInProcess.Run(args);
        Assert.Equal(2, run.ExitCode);
        var root = ParseVersioned(run);
        Assert.Equal(2, root.GetProperty("exit_code").GetInt32());
        var first = root.GetProperty("errors")[0];
        Assert.False(string.IsNullOrWhiteSpace(first.GetProperty("message").GetString()));
        if (file is not null) Assert.Equal(file, first.GetProperty("file").GetString());
        if (key is not null) Assert.Equal(key, first.GetProperty("key").GetString());
    }

    [Fact]
    public void A_problem_file_with_mistakes_gives_each_error_with_file_line_and_key()
    {
        var dir = Directory.CreateTempSubdirectory("slotopt-json-errors-").FullName;
        try
        {
            var path = Path.Combine(dir, "bad.toml");
            File.WriteAllText(path, "[problem]\nname = \"two mistakes\"\nobjectve = \"lowest-owning-cost\"\n");
            var run = SlotOptInProcess.Run("check", path, "--json");
            Assert.Equal(2, run.ExitCode);
            var errors = ParseVersioned(run).GetProperty("errors");
            var misspelt = errors.EnumerateArray().Single(e => e.TryGetProperty("key", out var k) && k.GetString() == "problem.objectve");
            Assert.Equal(path, misspelt.GetProperty("file").GetString());
            Assert.Equal(3, misspelt.GetProperty("line").GetInt32());
            Assert.Contains("problem.objectve", run.Stderr);   // and the usual line for a person
        }
        finally { Directory.Delete(dir, true); }
    }

    private static string[] Resolve(string[] args) => args.Select(a => a
        .Replace("{problems}", Path.Combine(AppContext.BaseDirectory, "problems"))
        .Replace("{plate}", ExamplePlate())).ToArray();

    private static string ExamplePlate()
    {
        var copied = Path.Combine(AppContext.BaseDirectory, "Plates", "Data", "example-plate.toml");
        if (File.Exists(copied)) return copied;
        for (var d = new DirectoryInfo(AppContext.BaseDirectory); d is not null; d = d.Parent)
        {
            var source = Path.Combine(d.FullName, "tests", "SlotOpt.Tests", "Plates", "Data", "example-plate.toml");
            if (File.Exists(source)) return source;
        }
        throw new FileNotFoundException("example-plate.toml not found in the output folder or above it");
    }
}
