using System.Text.Json;

namespace SlotOpt.Tests.Cli;

/// <summary>Issue 17: command-line mistakes answered with what to type instead; the listing commands. Contract checks of our own CLI (no outside source applies).</summary>
public class HelpfulErrorTests
{
    [Fact]
    public void A_mistyped_command_gets_the_nearest_command()
    {
        var run = SlotOptInProcess.Run("chek", "x.toml");
        Assert.Equal(2, run.ExitCode);
        Assert.Contains("\"chek\" is not a command; did you mean check?", run.Stderr);
    }

    [Fact]
    public void A_quantity_with_a_space_gets_a_hint_to_quote_it()
    {
        var run = SlotOptInProcess.Run("core-loss", "--grade", "M270-35A", "--peak-flux-density", "1.5T", "--frequency", "50", "Hz");
        Assert.Equal(2, run.ExitCode);
        Assert.Contains("--frequency: a quantity with a space must be quoted: --frequency \"50 Hz\"", run.Stderr);
    }

    [Fact]
    public void Check_lists_its_mistakes_in_line_order()
    {
        var dir = Directory.CreateTempSubdirectory("slotopt-order-").FullName;
        try
        {
            var path = Path.Combine(dir, "p.toml");
            // mistakes on lines 3, 8 and 10; the reader finds the limits (line 3) after the parts
            File.WriteAllText(path, "[problem]\nname = \"order\"\n[limits]\nbudgit = 1\n\n[[parts]]\nname = \"core\"\nkind = \"core\"\ngrades = [\"M999\"]\nlamination_area = \"0.01 m2\"\nstack_height = \"50 furlongs\"\npeak_flux_density = \"1.2 T\"\nfrequency = \"50 Hz\"\n");
            var run = SlotOptInProcess.Run("check", path);
            Assert.Equal(2, run.ExitCode);
            var lines = run.Stderr.Split('\n').Where(l => l.StartsWith("error: ", StringComparison.Ordinal))
                .Select(l => int.Parse(l[(("error: " + path + ":").Length)..].Split(':')[0], System.Globalization.CultureInfo.InvariantCulture)).ToList();
            Assert.True(lines.Count >= 3, run.Stderr);
            Assert.Equal(lines.Order().ToList(), lines);
        }
        finally { Directory.Delete(dir, true); }
    }

    [Fact]
    public void Check_list_names_each_parts_choices()
    {
        var run = SlotOptInProcess.Run("check", Path.Combine(AppContext.BaseDirectory, "problems", "actuator-product.toml"), "--list", "--json");
        Assert.Equal(0, run.ExitCode);
        using var doc = JsonDocument.Parse(run.Stdout);
        var stator = doc.RootElement.GetProperty("parts")[0];
        var grades = stator.GetProperty("choices").GetProperty("grades").GetArrayLength();
        var processes = stator.GetProperty("choices").GetProperty("processes").GetArrayLength();
        Assert.Equal(stator.GetProperty("options").GetInt64(), grades * processes);   // a core's options are grades x processes
    }

    [Fact]
    public void Processes_lists_every_cutting_process_with_its_source()
    {
        var run = SlotOptInProcess.Run("processes", "--json");
        Assert.Equal(0, run.ExitCode);
        using var doc = JsonDocument.Parse(run.Stdout);
        var names = doc.RootElement.GetProperty("processes").EnumerateArray().Select(p => p.GetProperty("name").GetString()!).ToList();
        Assert.Equal(SlotOpt.Design.CuttingProcessLibrary.BuiltIn.Keys.Order(StringComparer.Ordinal).ToList(), names);
        Assert.All(doc.RootElement.GetProperty("processes").EnumerateArray(), p => Assert.False(string.IsNullOrWhiteSpace(p.GetProperty("source").GetString())));
    }
}
