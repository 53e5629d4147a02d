using System.Reflection;
using System.Text;
using System.Text.RegularExpressions;
using SlotOpt.Plates.Conductors;
using SlotOpt.Runs;

namespace SlotOpt.Tests.Architecture;

/// <summary>
/// The rules of the house (DEVELOPERS.md, issue 16) checked on the engine's source, src/SlotOpt/**/*.cs: no
/// namespace cycle; the physics rooms, Design and Selection import nothing from the edge (Input, Reports, Runs,
/// Cli); Reports name no type that computes (found by reflection) and call no computing entry of Runs; no
/// folder under src holds more than 25 source files directly. Imports are read from the `using` lines and the
/// file's namespace, in code with comments and literal text removed. Common practice, no source: the rules are the project's own.
/// </summary>
public sealed partial class HouseRulesTests
{
    private const int MaxFilesPerFolder = 25;

    private static readonly string[] PhysicsRooms = ["SlotOpt.Numerics", "SlotOpt.Materials", "SlotOpt.Waveforms", "SlotOpt.Lamination", "SlotOpt.Plates"];
    private static readonly string[] LowerRooms = [.. PhysicsRooms, "SlotOpt.Design", "SlotOpt.Selection"];
    private static readonly string[] EdgeRooms = ["SlotOpt.Input", "SlotOpt.Reports", "SlotOpt.Runs", "SlotOpt.Cli"];

    private static readonly Lazy<IReadOnlyList<SourceFile>> Files = new(ReadEngineSource);

    [Fact]
    public void No_namespace_imports_another_that_imports_it_back()
    {
        var edges = ImportGraph().SelectMany(kv => kv.Value.Select(to => (From: kv.Key, To: to))).ToList();
        var cycles = StronglyConnected(edges).Where(c => c.Count > 1).Select(c => string.Join(" <-> ", c.Order(StringComparer.Ordinal))).ToList();
        Assert.True(cycles.Count == 0, "namespace cycles: " + string.Join("; ", cycles));
    }

    [Fact]
    public void Physics_Design_and_Selection_import_nothing_from_the_edge()
    {
        var breaches = Files.Value.Where(f => InRoom(f.Namespace, LowerRooms))
            .SelectMany(f => f.Imports.Where(i => InRoom(i, EdgeRooms)).Select(i => $"{f.Path} imports {i}")
                .Concat(QualifiedEdgeName().Matches(f.Code).Select(m => $"{f.Path} names {m.Value}")))
            .ToList();
        Assert.True(breaches.Count == 0, string.Join("\n", breaches));
    }

    [Fact]
    public void Reports_name_no_type_that_computes()
    {
        var forbidden = ComputingTypes();
        // the reflection finds the solvers themselves (a guard against a criterion that lets everything through)
        Assert.Contains(forbidden, t => t.Namespace == "SlotOpt.Lamination" && t.Name == "LaminationLossModel");
        Assert.Contains(forbidden, t => t.Namespace!.StartsWith("SlotOpt.Plates", StringComparison.Ordinal) && t.Name.EndsWith("Solver", StringComparison.Ordinal));
        var names = forbidden.Select(t => t.Name).ToHashSet(StringComparer.Ordinal);
        var breaches = ReportFiles()
            .SelectMany(f => TypeReference().Matches(f.Code).Select(m => m.Groups[1].Value).Where(names.Contains).Distinct().Select(n => $"{f.Path} names {n}"))
            .ToList();
        Assert.True(breaches.Count == 0, string.Join("\n", breaches));
    }

    [Fact]
    public void Reports_call_no_computing_entry_of_Runs()
    {
        var engine = typeof(SlotOpt.Runs.RunResult).Assembly;
        var entries = engine.GetExportedTypes().Where(t => t.Namespace == "SlotOpt.Runs")
            .SelectMany(t => t.GetMethods(BindingFlags.Public | BindingFlags.Static | BindingFlags.DeclaredOnly).Where(m => !m.IsSpecialName).Select(m => $"{t.Name}.{m.Name}"))
            .ToHashSet(StringComparer.Ordinal);
        Assert.Contains("DesignRun.Execute", entries);
        var breaches = ReportFiles()
            .SelectMany(f => StaticCall().Matches(f.Code).Select(m => m.Groups[1].Value + "." + m.Groups[2].Value).Where(entries.Contains).Distinct().Select(c => $"{f.Path} calls {c}"))
            .ToList();
        Assert.True(breaches.Count == 0, string.Join("\n", breaches));
    }

    [Fact]
    public void No_folder_under_src_holds_more_than_25_source_files()
    {
        var crowded = CrowdedFolders().Select(f => $"{f.Folder}: {f.Count} files").ToList();
        Assert.True(crowded.Count == 0, string.Join("; ", crowded));
    }

    /// <summary>The lexer keeps code and drops comments and literal text, but keeps the code in interpolation holes.</summary>
    [Fact]
    public void Code_only_drops_comments_and_text_but_keeps_interpolated_code()
    {
        const string source = "var a = \"Validity flags\"; // LaminationLossModel\n/* PlateSolver */ var b = $\"x {Validity.ReynoldsLimit:0.#} y {(c ? \"u\" : \"v\")}\"; var d = @\"\"\"q\"; var e = '\"';";
        var code = CodeOnly(source);
        Assert.DoesNotContain("flags", code);
        Assert.DoesNotContain("LaminationLossModel", code);
        Assert.DoesNotContain("PlateSolver", code);
        Assert.Contains("Validity.ReynoldsLimit", code);
        Assert.DoesNotContain("0.#", code);
        Assert.Contains("c ?", code);
        Assert.Contains("var e", code);
    }

    private sealed record SourceFile(string Path, string Namespace, IReadOnlyList<string> Imports, string Code);

    /// <summary>Public types of the physics rooms that compute: every one with a public method of its own beyond what a record generates (enums and plain data records pass).</summary>
    private static IReadOnlyList<Type> ComputingTypes()
    {
        var engine = typeof(SlotOpt.Runs.RunResult).Assembly;
        string[] generated = ["Equals", "GetHashCode", "ToString", "Deconstruct", "PrintMembers", "<Clone>$"];
        return engine.GetExportedTypes()
            .Where(t => t.Namespace is { } ns && InRoom(ns, PhysicsRooms) && !t.IsEnum)
            .Where(t => t.GetMethods(BindingFlags.Public | BindingFlags.Instance | BindingFlags.Static | BindingFlags.DeclaredOnly)
                .Any(m => !m.IsSpecialName && !generated.Contains(m.Name)))
            .ToList();
    }

    private static IEnumerable<SourceFile> ReportFiles() => Files.Value.Where(f => f.Namespace == "SlotOpt.Reports");

    private static bool InRoom(string ns, IEnumerable<string> rooms) => rooms.Any(r => ns == r || ns.StartsWith(r + ".", StringComparison.Ordinal));

    private static IReadOnlyList<(string Folder, int Count)> CrowdedFolders()
    {
        var root = RepoRoot();
        return Directory.EnumerateDirectories(Path.Combine(root, "src"), "*", SearchOption.AllDirectories)
            .Where(d => !IsBuildOutput(d))
            .Select(d => (Folder: Path.GetRelativePath(root, d).Replace('\\', '/'), Count: Directory.GetFiles(d, "*.cs").Length))
            .Where(f => f.Count > MaxFilesPerFolder)
            .ToList();
    }

    /// <summary>Namespace to the SlotOpt namespaces its files import (itself left out).</summary>
    private static Dictionary<string, HashSet<string>> ImportGraph()
    {
        var graph = new Dictionary<string, HashSet<string>>(StringComparer.Ordinal);
        foreach (var f in Files.Value)
        {
            var to = graph.TryGetValue(f.Namespace, out var set) ? set : graph[f.Namespace] = new HashSet<string>(StringComparer.Ordinal);
            foreach (var i in f.Imports.Where(i => i != f.Namespace)) to.Add(i);
        }
        return graph;
    }

    /// <summary>Tarjan's strongly connected components (Tarjan, "Depth-first search and linear graph algorithms", SIAM J. Comput. 1, 1972).</summary>
    private static List<List<string>> StronglyConnected(IReadOnlyList<(string From, string To)> edges)
    {
        var next = edges.GroupBy(e => e.From).ToDictionary(g => g.Key, g => g.Select(e => e.To).ToList());
        var nodes = edges.SelectMany(e => new[] { e.From, e.To }).Distinct().Order(StringComparer.Ordinal).ToList();
        var index = new Dictionary<string, int>();
        var low = new Dictionary<string, int>();
        var stack = new Stack<string>();
        var onStack = new HashSet<string>();
        var components = new List<List<string>>();
        void Visit(string v)
        {
            index[v] = low[v] = index.Count;
            stack.Push(v);
            onStack.Add(v);
            foreach (var w in next.GetValueOrDefault(v) ?? [])
            {
                if (!index.ContainsKey(w)) { Visit(w); low[v] = Math.Min(low[v], low[w]); }
                else if (onStack.Contains(w)) low[v] = Math.Min(low[v], index[w]);
            }
            if (low[v] != index[v]) return;
            var component = new List<string>();
            string x;
            do { x = stack.Pop(); onStack.Remove(x); component.Add(x); } while (x != v);
            components.Add(component);
        }
        foreach (var n in nodes) if (!index.ContainsKey(n)) Visit(n);
        return components;
    }

    private static IReadOnlyList<SourceFile> ReadEngineSource()
    {
        var root = RepoRoot();
        var engine = Path.Combine(root, "src", "SlotOpt");
        var parsed = Directory.EnumerateFiles(engine, "*.cs", SearchOption.AllDirectories).Where(p => !IsBuildOutput(p)).Order(StringComparer.Ordinal)
            .Select(p => (Path: Path.GetRelativePath(root, p).Replace('\\', '/'), Code: CodeOnly(File.ReadAllText(p))))
            .Select(f => (f.Path, f.Code, Namespace: FileNamespace().Match(f.Code) is { Success: true } m ? m.Groups[1].Value : "", Usings: UsingLine().Matches(f.Code).Select(u => u.Groups[1].Value).ToList()))
            .ToList();
        var namespaces = parsed.Select(f => f.Namespace).Where(n => n.Length > 0).ToHashSet(StringComparer.Ordinal);
        // a using names a namespace, or (static, alias) a type in one: keep the longest prefix that is a namespace of the engine
        string? Namespace(string name)
        {
            for (var n = name; n.Length > 0; n = n.Contains('.') ? n[..n.LastIndexOf('.')] : "")
                if (namespaces.Contains(n)) return n;
            return null;
        }
        return parsed.Select(f => new SourceFile(f.Path, f.Namespace, f.Usings.Select(Namespace).OfType<string>().Distinct().ToList(), f.Code)).ToList();
    }

    private static bool IsBuildOutput(string path) =>
        path.Replace('\\', '/').Split('/').Any(s => s is "bin" or "obj");

    private static string RepoRoot()
    {
        for (var dir = new DirectoryInfo(AppContext.BaseDirectory); dir is not null; dir = dir.Parent)
            if (File.Exists(Path.Combine(dir.FullName, "SlotOpt.sln"))) return dir.FullName;
        throw new InvalidOperationException($"no SlotOpt.sln above {AppContext.BaseDirectory}");
    }

    [GeneratedRegex(@"^\s*namespace\s+([\w.]+)", RegexOptions.Multiline)]
    private static partial Regex FileNamespace();

    [GeneratedRegex(@"^\s*(?:global\s+)?using\s+(?:static\s+)?(?:\w+\s*=\s*)?(SlotOpt[\w.]*)\s*;", RegexOptions.Multiline)]
    private static partial Regex UsingLine();

    [GeneratedRegex(@"\bSlotOpt\.(?:Input|Reports|Runs|Cli)\b")]
    private static partial Regex QualifiedEdgeName();

    /// <summary>A type name as code uses it: not a member after a dot, but possibly qualified by SlotOpt.* namespaces.</summary>
    [GeneratedRegex(@"(?<![\w.])(?:SlotOpt\.(?:\w+\.)*)?([A-Z]\w*)")]
    private static partial Regex TypeReference();

    [GeneratedRegex(@"(?<![\w.])(?:SlotOpt\.(?:\w+\.)*)?([A-Z]\w*)\s*\.\s*([A-Z]\w*)\s*[(<]")]
    private static partial Regex StaticCall();

    /// <summary>C# source without comments and without the text of string and char literals (each left as an empty literal); the code inside interpolation holes is kept.</summary>
    private static string CodeOnly(string source)
    {
        var o = new StringBuilder(source.Length);
        var i = 0;
        Code(source, ref i, o, inHole: false, holeBraces: 0);
        return o.ToString();
    }

    /// <summary>Copies code from i; in an interpolation hole, stops at the brace run that closes it or at its format (a top-level ':').</summary>
    private static void Code(string s, ref int i, StringBuilder o, bool inHole, int holeBraces)
    {
        var depth = 0;
        while (i < s.Length)
        {
            var c = s[i];
            var next = i + 1 < s.Length ? s[i + 1] : '\0';
            if (c == '/' && next == '/') { while (i < s.Length && s[i] != '\n') i++; continue; }
            if (c == '/' && next == '*') { var end = s.IndexOf("*/", i + 2, StringComparison.Ordinal); i = end < 0 ? s.Length : end + 2; o.Append(' '); continue; }
            if (c == '\'') { i++; while (i < s.Length && s[i] != '\'') i += s[i] == '\\' ? 2 : 1; i++; o.Append("' '"); continue; }
            if ((c is '"' or '$' or '@') && (i == 0 || !char.IsLetterOrDigit(s[i - 1])) && StringLiteral(s, ref i, o)) continue;
            if (inHole)
            {
                if (c is '(' or '[' or '{') depth++;
                else if (c is ')' or ']') depth--;
                else if (c == '}' && depth > 0) depth--;
                else if (c == '}') { i += holeBraces; return; }
                else if (c == ':' && depth == 0 && next != ':') { while (i < s.Length && s[i] != '}') i++; i += holeBraces; return; }
            }
            o.Append(c);
            i++;
        }
    }

    /// <summary>Skips a string literal at i (regular, verbatim, raw, any of them interpolated), keeping the code of its holes; false when i does not start one.</summary>
    private static bool StringLiteral(string s, ref int i, StringBuilder o)
    {
        var p = i;
        int dollars = 0;
        var verbatim = false;
        while (p < s.Length && (s[p] == '$' || s[p] == '@')) { if (s[p] == '$') dollars++; else verbatim = true; p++; }
        if (p >= s.Length || s[p] != '"') return false;
        var quotes = 0;
        while (p + quotes < s.Length && s[p + quotes] == '"') quotes++;
        o.Append("\"\"");
        if (!verbatim && quotes == 2) { i = p + 2; return true; }   // ""
        var raw = !verbatim && quotes >= 3;
        p += raw ? quotes : 1;
        var holeBraces = raw ? Math.Max(dollars, 1) : 1;
        while (p < s.Length)
        {
            var c = s[p];
            if (raw && c == '"' && p + quotes <= s.Length && s.AsSpan(p, quotes).IndexOfAnyExcept('"') < 0) { i = p + quotes; return true; }
            if (!raw && !verbatim && c == '\\') { p += 2; continue; }
            if (!raw && c == '"')
            {
                if (verbatim && p + 1 < s.Length && s[p + 1] == '"') { p += 2; continue; }
                i = p + 1;
                return true;
            }
            if (dollars > 0 && c == '{')
            {
                var run = 0;
                while (p + run < s.Length && s[p + run] == '{') run++;
                if (!raw && run >= 2) { p += 2; continue; }   // {{ is a brace of text
                if (run < holeBraces) { p += run; continue; }
                p += run;
                o.Append(' ');
                Code(s, ref p, o, inHole: true, holeBraces: holeBraces);
                o.Append(' ');
                continue;
            }
            p++;
        }
        i = p;
        return true;
    }
}
