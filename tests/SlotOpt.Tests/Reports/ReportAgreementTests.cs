using System.Globalization;
using System.Text.Json.Nodes;
using SlotOpt.Tables;
using SlotOpt.Reports;

namespace SlotOpt.Tests.Reports;

/// <summary>The report's files say what the console says: result.json is `run --json` (timings aside), candidates.csv holds every option and the chosen ones with the printed numbers, and two runs give the same files.</summary>
[Collection(ReportRunsCollection.Name)]
public sealed class ReportAgreementTests(ReportRuns runs)
{
    public static TheoryData<string> Problems => new() { ReportRuns.Conveyor, ReportRuns.Actuator };

    [Theory]
    [MemberData(nameof(Problems))]
    public void Runs_succeed_and_write_every_file(string problem)
    {
        var run = runs.Runs[problem];
        Assert.True(run.Text.ExitCode == 0, run.Text.Stderr);
        Assert.True(run.Json.ExitCode == 0, run.Json.Stderr);
        foreach (var file in new[] { ReportWriter.HtmlFile, ReportWriter.MarkdownFile, ReportWriter.CandidatesFile, ReportWriter.JsonFile, "trade-off.png", "trade-off.svg", "loss-breakdown.png", "loss-breakdown.svg" })
            Assert.True(File.Exists(Path.Combine(run.TextDir, file)), $"{problem}: {file} missing");
        Assert.DoesNotContain(Directory.GetDirectories(runs.Root), d => Path.GetFileName(d).StartsWith('.'));   // no temporary folder left beside the reports
    }

    [Theory]
    [MemberData(nameof(Problems))]
    public void Result_json_is_the_printed_json(string problem)
    {
        var run = runs.Runs[problem];
        var printed = JsonNode.Parse(run.Json.Stdout)!.AsObject();
        var written = JsonNode.Parse(File.ReadAllText(Path.Combine(run.TextDir, ReportWriter.JsonFile)))!;
        Assert.True(JsonNode.DeepEquals(printed, written), "result.json differs from run --json");
    }

    [Theory]
    [MemberData(nameof(Problems))]
    public void Candidates_csv_has_every_option_and_the_chosen_ones_with_the_printed_numbers(string problem)
    {
        var run = runs.Runs[problem];
        var json = JsonNode.Parse(run.Json.Stdout)!;
        var rows = ReadCsv(Path.Combine(run.TextDir, ReportWriter.CandidatesFile));
        var header = rows[0];
        var body = rows.Skip(1).Select(r => header.Zip(r).ToDictionary(p => p.First, p => p.Second)).ToList();

        // "450 options evaluated (210 within the rules)" on the console
        var counts = System.Text.RegularExpressions.Regex.Match(run.Text.Stdout, @"(\d+) options evaluated \((\d+) within the rules\)");
        Assert.True(counts.Success, run.Text.Stdout);
        Assert.Equal(int.Parse(counts.Groups[1].Value, CultureInfo.InvariantCulture), body.Count);
        Assert.Equal(int.Parse(counts.Groups[2].Value, CultureInfo.InvariantCulture), body.Count(r => r["feasible"] == "yes"));
        Assert.All(body.Where(r => r["feasible"] == "no"), r => Assert.NotEqual("", r["rejection"]));

        var parts = json["parts"]!.AsArray();
        var chosen = body.Where(r => r["chosen"] == "yes").ToList();
        Assert.Equal(parts.Count, chosen.Count);
        var vpw = json["value_per_watt"]!.GetValue<double>();
        foreach (var part in parts)
        {
            var row = Assert.Single(chosen, r => r["id"] == part!["id"]!.GetValue<string>());
            double Num(string column) => double.Parse(row[column], CultureInfo.InvariantCulture);
            Assert.Equal(part!["loss_w"]!.GetValue<double>(), Num("loss_w"));
            Assert.Equal(part["build_cost"]!.GetValue<double>(), Num("build_cost"));
            Assert.Equal(Num("build_cost") + vpw * Num("loss_w"), Num("owning_cost"), 9);
            // the console's line for the part, by the one number rule: "loss 11.13 W, drag 7.421 N, build cost 29.6 EUR"
            Assert.Contains($"loss {Numbers.Sig(Num("loss_w"))} W", run.Text.Stdout);
            Assert.Contains($"build cost {Numbers.Sig(Num("build_cost"))} ", run.Text.Stdout);
        }
        Assert.Equal(json["total_loss_w"]!.GetValue<double>(), chosen.Sum(r => double.Parse(r["loss_w"], CultureInfo.InvariantCulture)), 9);
    }

    [Theory]
    [MemberData(nameof(Problems))]
    public void Summary_states_the_printed_totals_and_the_cautions(string problem)
    {
        var run = runs.Runs[problem];
        var summary = File.ReadAllText(Path.Combine(run.TextDir, ReportWriter.MarkdownFile));
        var total = System.Text.RegularExpressions.Regex.Match(run.Text.Stdout, @"total:\s+loss ([\d.]+) W, build cost ([\d.]+) \w+, owning cost ([\d.]+)");
        Assert.True(total.Success, run.Text.Stdout);
        var chosenRow = summary.Split('\n').Single(l => l.StartsWith("| chosen design |", StringComparison.Ordinal));
        Assert.Equal($"| chosen design | {total.Groups[1].Value} | {total.Groups[2].Value} | {total.Groups[3].Value} | meets every limit |", chosenRow);
        var saves = System.Text.RegularExpressions.Regex.Match(run.Text.Stdout, @"saves ([\d.]+) W");
        Assert.Contains($"saves {saves.Groups[1].Value} W", summary);
        Assert.Contains("confirm them by test", summary);
        Assert.Contains("certified safety analysis", summary);
        Assert.Contains("local codes and licensed engineering practice", summary);
    }

    [Theory]
    [MemberData(nameof(Problems))]
    public void Two_runs_give_identical_files_apart_from_the_stamp_line(string problem)
    {
        var run = runs.Runs[problem];
        var names = Directory.GetFiles(run.TextDir).Select(Path.GetFileName).Order(StringComparer.Ordinal).ToList();
        Assert.Equal(names, Directory.GetFiles(run.JsonDir).Select(Path.GetFileName).Order(StringComparer.Ordinal).ToList());
        foreach (var name in names)
        {
            var a = File.ReadAllBytes(Path.Combine(run.TextDir, name!));
            var b = File.ReadAllBytes(Path.Combine(run.JsonDir, name!));
            if (name is ReportWriter.HtmlFile or ReportWriter.MarkdownFile)
            {
                var linesA = File.ReadAllLines(Path.Combine(run.TextDir, name));
                var linesB = File.ReadAllLines(Path.Combine(run.JsonDir, name));
                Assert.Equal(linesA.Length, linesB.Length);
                var differing = Enumerable.Range(0, linesA.Length).Where(i => linesA[i] != linesB[i]).ToList();
                Assert.True(differing.Count <= 1, $"{name}: {differing.Count} lines differ");
                Assert.All(differing, i => Assert.Contains("Generated ", linesA[i]));
            }
            else Assert.True(a.AsSpan().SequenceEqual(b), $"{problem}/{name} differs between two runs");
        }
    }

    /// <summary>RFC 4180: quoted cells may hold commas, doubled quotes and line breaks.</summary>
    public static List<List<string>> ReadCsv(string path)
    {
        var text = File.ReadAllText(path);
        var rows = new List<List<string>>();
        var row = new List<string>();
        var cell = new System.Text.StringBuilder();
        var quoted = false;
        for (var i = 0; i < text.Length; i++)
        {
            var c = text[i];
            if (quoted)
            {
                if (c == '"' && i + 1 < text.Length && text[i + 1] == '"') { cell.Append('"'); i++; }
                else if (c == '"') quoted = false;
                else cell.Append(c);
            }
            else if (c == '"') quoted = true;
            else if (c == ',') { row.Add(cell.ToString()); cell.Clear(); }
            else if (c == '\r') { }
            else if (c == '\n') { row.Add(cell.ToString()); cell.Clear(); rows.Add(row); row = new List<string>(); }
            else cell.Append(c);
        }
        Assert.Empty(row);
        Assert.All(rows, r => Assert.Equal(rows[0].Count, r.Count));
        return rows;
    }
}
