using System.Diagnostics;
using System.Text;
using System.Text.RegularExpressions;
using SlotOpt.Input;
using SlotOpt.Input.Toml;
using Xunit.Abstractions;

namespace SlotOpt.Tests.Hardening;

/// <summary>
/// Mutation test of the problem-file reader: thousands of damaged copies of every demo problem must each
/// end in a valid problem or a clean <see cref="InputException"/> whose every line names file:line;
/// never another exception, never a hang. The mutations cover each class of the hardening issue: lines
/// deleted, duplicated, swapped, truncated; numbers changed; units swapped, their prefixes' case flipped
/// ("mm" to "Mm" or "MM"), values that overflow once their unit is applied ("1e308 km"); wrong types; inf
/// and nan; arrays and inline tables nested beyond the reader's limit; random bytes; long and empty strings.
/// The seed is fixed so that a failure reproduces.
/// </summary>
public class ProblemFileMutationTests(ITestOutputHelper output)
{
    private const int Seed = 20261202;
    private const int MutantsPerDemo = 600;

    [Fact]
    public void Damaged_problem_files_fail_cleanly_with_a_line()
    {
        var random = new Random(Seed);
        var demos = Directory.GetFiles(Path.Combine(AppContext.BaseDirectory, "problems"), "*.toml").Order(StringComparer.Ordinal).ToList();
        int tried = 0, accepted = 0, refused = 0;
        var slowest = 0.0;
        foreach (var demo in demos)
        {
            var original = File.ReadAllText(demo);
            for (var k = 0; k < MutantsPerDemo; k++)
            {
                var (kind, text) = Mutate(original, random);
                var clock = Stopwatch.StartNew();
                try
                {
                    ProblemReader.Read(text, demo);
                    Assert.False(MustBeRefused.Contains(kind), $"mutant {tried} ({kind}) of {Path.GetFileName(demo)} was accepted\n--- file ---\n{text}");
                    accepted++;
                }
                catch (InputException e)
                {
                    refused++;
                    foreach (var line in e.Message.Split(Environment.NewLine))
                        Assert.True(LineReference.IsMatch(line), $"mutant {tried} ({kind}) of {Path.GetFileName(demo)}: message without file:line: {line}");
                }
                catch (Exception e)
                {
                    Assert.Fail($"mutant {tried} ({kind}) of {Path.GetFileName(demo)} threw {e}\n--- file ---\n{text}");
                }
                slowest = Math.Max(slowest, clock.Elapsed.TotalSeconds);
                Assert.True(clock.Elapsed.TotalSeconds < 5, $"mutant {tried} ({kind}) took {clock.Elapsed.TotalSeconds:0.0} s");
                tried++;
            }
        }
        output.WriteLine($"mutated problem files tried: {tried} (accepted {accepted}, refused cleanly {refused}); slowest {slowest:0.000} s; seed {Seed}");
        Assert.True(tried >= 2000);
        Assert.True(refused > tried / 4, "most mutations should be caught");
    }

    private static readonly Regex LineReference = new(@"^.+:\d+: ", RegexOptions.Compiled);

    private static readonly string[] Units = ["mm", "m", "T", "mT", "Hz", "kHz", "m/s", "degC", "K", "N", "W", "kg", "m2", "furlongs", ""];
    private static readonly string[] Junk = ["nan", "inf", "-inf", "1e308", "-1e308", "\"\"", "\"NaN\"", "\"Infinity mm\"", "true", "[]", "{}", "0", "-0", "\"-5 mm\"", "\"1e400 mm\"", "[[1, 2], [3]]"];

    private static (string Kind, string Text) Mutate(string text, Random random)
    {
        var lines = text.Split('\n').ToList();
        var n = lines.Count;
        switch (random.Next(14))
        {
            case 0:
                lines.RemoveAt(random.Next(n));
                return ("delete line", string.Join('\n', lines));
            case 1:
            {
                var i = random.Next(n);
                lines.Insert(i, lines[i]);
                return ("duplicate line", string.Join('\n', lines));
            }
            case 2:
            {
                int i = random.Next(n), j = random.Next(n);
                (lines[i], lines[j]) = (lines[j], lines[i]);
                return ("swap lines", string.Join('\n', lines));
            }
            case 3:
                return ("change number", Regex.Replace(text, @"\d+(\.\d+)?", m => random.Next(6) == 0 ? Scale(m.Value, random) : m.Value));
            case 4:
                return ("change unit", Regex.Replace(text, @"(?<=\d )(mm|T|mT|Hz|m/s|degC|N|W|m2|mm)(?="")", m => random.Next(4) == 0 ? Units[random.Next(Units.Length)] : m.Value));
            case 5:
            {
                var values = lines.Select((l, i) => (l, i)).Where(x => x.l.Contains(" = ")).ToList();
                if (values.Count == 0) return ("none", text);
                var (line, index) = values[random.Next(values.Count)];
                lines[index] = line[..(line.IndexOf(" = ", StringComparison.Ordinal) + 3)] + Junk[random.Next(Junk.Length)];
                return ("wrong type or value", string.Join('\n', lines));
            }
            case 6:
                return ("truncate", text[..random.Next(text.Length)]);
            case 7:
            {
                var bytes = new byte[random.Next(1, 40)];
                random.NextBytes(bytes);
                var at = random.Next(text.Length);
                return ("random bytes", text[..at] + Encoding.Latin1.GetString(bytes) + text[at..]);
            }
            case 8:
                return ("long string", Regex.Replace(text, "name = \"[^\"]*\"", _ => $"name = \"{new string('x', random.Next(1000, 100_000))}\"", RegexOptions.None, TimeSpan.FromSeconds(2)));
            case 9:
            {
                var values = lines.Select((l, i) => (l, i)).Where(x => x.l.Contains(" = \"") && char.IsDigit(x.l[x.l.IndexOf(" = \"", StringComparison.Ordinal) + 4])).ToList();
                if (values.Count == 0) return ("none", text);
                var (line, index) = values[random.Next(values.Count)];
                lines[index] = line[..(line.IndexOf(" = ", StringComparison.Ordinal) + 3)] + (random.Next(2) == 0 ? "\"1e300 mm\"" : "1e-300");
                return ("huge or tiny value", string.Join('\n', lines));
            }
            case 11:
                return ("prefix case", Regex.Replace(text, @"(?<=\d ?)(mm|mT|kHz|MS/m|uOhm|kg|GPa)(?="")", m => random.Next(3) == 0 ? FlipFirstCase(m.Value, random) : m.Value));
            case 12:
            {
                var depth = random.Next(TomlDocumentReader.MaxDepth - 2, 3 * TomlDocumentReader.MaxDepth);
                var (open, close) = random.Next(2) == 0 ? ("[", "]") : ("{ k = ", " }");
                var value = string.Concat(Enumerable.Repeat(open, depth)) + "1" + string.Concat(Enumerable.Repeat(close, depth));
                var values = lines.Select((l, i) => (l, i)).Where(x => x.l.Contains(" = ")).ToList();
                if (values.Count == 0) return ("none", text);
                var (line, index) = values[random.Next(values.Count)];
                lines[index] = line[..(line.IndexOf(" = ", StringComparison.Ordinal) + 3)] + value;
                return (depth > TomlDocumentReader.MaxDepth ? "deep nesting" : "nesting within the limit", string.Join('\n', lines));
            }
            case 13:
            {
                var quantities = Regex.Matches(text, @"(?<=^\w+ = )""\d+(\.\d+)? ?(mm|T|mT|Hz|kHz|m/s|N|W|m2)""", RegexOptions.Multiline);   // values, not comments
                if (quantities.Count == 0) return ("none", text);
                var chosen = quantities[random.Next(quantities.Count)];
                return ("overflowing unit", text[..chosen.Index] + $"\"1e308 {Overflowing[random.Next(Overflowing.Length)]}\"" + text[(chosen.Index + chosen.Length)..]);
            }
            default:
                return ("empty string", Regex.Replace(text, "\"[^\"\n]*\"", m => random.Next(5) == 0 ? "\"\"" : m.Value));
        }
    }

    /// <summary>Mutations that always make the file wrong: accepting one would be a silently wrong value.</summary>
    private static readonly HashSet<string> MustBeRefused = ["deep nesting", "overflowing unit"];

    private static readonly string[] Overflowing = ["km", "Mm", "GT", "EHz", "Ym/s", "kN", "YW", "km2", "MS/m", "YOhm m"];

    private static string FlipFirstCase(string unit, Random random) => random.Next(3) switch
    {
        0 => unit.ToUpperInvariant(),
        1 => unit.ToLowerInvariant(),
        _ => (char.IsUpper(unit[0]) ? char.ToLowerInvariant(unit[0]) : char.ToUpperInvariant(unit[0])) + unit[1..],
    };

    private static string Scale(string number, Random random) => random.Next(5) switch
    {
        0 => "-" + number,
        1 => "0",
        2 => number + "000000",
        3 => "0.000" + number.Replace(".", ""),
        _ => number + "e30",
    };
}
