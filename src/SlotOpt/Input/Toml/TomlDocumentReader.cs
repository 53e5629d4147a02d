using Tomlyn.Syntax;

namespace SlotOpt.Input.Toml;

/// <summary>
/// Turns TOML text into a tree of <see cref="TomlNode"/>s that keep their line numbers, using Tomlyn's
/// syntax parser. Syntax errors, duplicate keys, values nested deeper than <see cref="MaxDepth"/>, numbers
/// that are not finite ("inf", "nan", "1e400") and any exception of the parser are collected as errors with
/// file and line, not thrown one at a time.
/// </summary>
public static class TomlDocumentReader
{
    /// <summary>Arrays and inline tables nested deeper than this are refused (a problem file needs three or four; the parser's own limit is 64).</summary>
    public const int MaxDepth = 32;

    public static TomlTable Read(string text, string fileName, InputErrors errors)
    {
        var root = new TomlTable(1);
        if (TomlNesting.FirstLineDeeperThan(text, MaxDepth) is { } deepLine)
        {
            errors.Add(fileName, deepLine, "", $"arrays or inline tables nested deeper than {MaxDepth} levels");
            return root;
        }
        DocumentSyntax document;
        try { document = Tomlyn.Parsing.SyntaxParser.Parse(text, fileName, true); }
        catch (Exception e) when (e is not OutOfMemoryException)
        {
            var line = (e as Tomlyn.TomlException)?.Span is { } span ? span.Start.Line + 1 : 1;
            errors.Add(fileName, line, "", $"cannot be read as TOML ({e.Message})");
            return root;
        }
        foreach (var diagnostic in document.Diagnostics)
            errors.Add(fileName, diagnostic.Span.Start.Line + 1, "", diagnostic.Message);
        if (document.HasErrors) return root;

        foreach (var keyValue in document.KeyValues) AddKeyValue(root, "", keyValue, fileName, errors);
        foreach (var header in document.Tables)
        {
            var path = KeyPath(header.Name);
            if (path is null) { errors.Add(fileName, header.Span.Start.Line + 1, "", "a table header needs a name"); continue; }
            var line = header.Span.Start.Line + 1;
            var table = header is TableArraySyntax
                ? AppendTableArrayItem(root, path, line, fileName, errors)
                : OpenTable(root, path, line, fileName, errors);
            if (table is null) continue;
            foreach (var keyValue in header.Items) AddKeyValue(table, string.Join('.', path), keyValue, fileName, errors);
        }
        return root;
    }

    /// <param name="tablePath">The dotted path of the table the key is written in, for messages ("" at the top).</param>
    private static void AddKeyValue(TomlTable table, string tablePath, KeyValueSyntax keyValue, string fileName, InputErrors errors)
    {
        var line = keyValue.Span.Start.Line + 1;
        var path = KeyPath(keyValue.Key);
        if (path is null || keyValue.Value is null) { errors.Add(fileName, line, "", "a key needs a name and a value"); return; }
        var parent = table;
        for (var i = 0; i < path.Count - 1; i++)
        {
            parent = ChildTable(parent, path[i], line, fileName, errors, implicitTable: true);
            if (parent is null) return;
        }
        var name = path[^1];
        if (parent.Entries.ContainsKey(name))
        {
            errors.Add(fileName, line, string.Join('.', path), $"written twice (first on line {parent.Entries[name].Line})");
            return;
        }
        var keyPath = tablePath.Length == 0 ? string.Join('.', path) : $"{tablePath}.{string.Join('.', path)}";
        var value = ReadValue(keyValue.Value, keyPath, fileName, errors);
        if (value is not null) parent.Entries[name] = value;
    }

    private static TomlNode? ReadValue(ValueSyntax value, string keyPath, string fileName, InputErrors errors)
    {
        var line = value.Span.Start.Line + 1;
        switch (value)
        {
            case StringValueSyntax s: return new TomlScalar(s.Value ?? "", line);
            case IntegerValueSyntax i: return new TomlScalar(i.Value, line);
            case FloatValueSyntax f when double.IsFinite(f.Value): return new TomlScalar(f.Value, line);
            case FloatValueSyntax f:
                errors.Add(fileName, line, keyPath, $"{f.Token?.Text ?? f.Value.ToString(System.Globalization.CultureInfo.InvariantCulture)} is not a finite number");
                return null;
            case BooleanValueSyntax b: return new TomlScalar(b.Value, line);
            case ArraySyntax a:
            {
                var array = new TomlArray(line);
                foreach (var item in a.Items)
                {
                    if (item.Value is null) continue;
                    var node = ReadValue(item.Value, $"{keyPath}[{array.Items.Count + 1}]", fileName, errors);
                    if (node is not null) array.Items.Add(node);
                }
                return array;
            }
            case InlineTableSyntax t:
            {
                var table = new TomlTable(line);
                foreach (var item in t.Items)
                    if (item.KeyValue is not null) AddKeyValue(table, keyPath, item.KeyValue, fileName, errors);
                return table;
            }
            default:
                errors.Add(fileName, line, "", "dates and times are not used in problem files");
                return null;
        }
    }

    private static TomlTable? OpenTable(TomlTable root, IReadOnlyList<string> path, int line, string fileName, InputErrors errors)
    {
        var parent = root;
        for (var i = 0; i < path.Count - 1; i++)
        {
            parent = ChildTable(parent, path[i], line, fileName, errors, implicitTable: true);
            if (parent is null) return null;
        }
        var name = path[^1];
        if (parent.Entries.TryGetValue(name, out var existing))
        {
            if (existing is TomlTable { IsImplicit: true } table) { table.IsImplicit = false; return table; }
            errors.Add(fileName, line, string.Join('.', path), $"table written twice (first on line {existing.Line})");
            return null;
        }
        var created = new TomlTable(line);
        parent.Entries[name] = created;
        return created;
    }

    private static TomlTable? AppendTableArrayItem(TomlTable root, IReadOnlyList<string> path, int line, string fileName, InputErrors errors)
    {
        var parent = root;
        for (var i = 0; i < path.Count - 1; i++)
        {
            parent = ChildTable(parent, path[i], line, fileName, errors, implicitTable: true);
            if (parent is null) return null;
        }
        var name = path[^1];
        if (!parent.Entries.TryGetValue(name, out var existing))
        {
            existing = new TomlArray(line) { IsTableArray = true };
            parent.Entries[name] = existing;
        }
        if (existing is not TomlArray { IsTableArray: true } array)
        {
            errors.Add(fileName, line, string.Join('.', path), $"already written as {existing.Describe()} on line {existing.Line}");
            return null;
        }
        var item = new TomlTable(line);
        array.Items.Add(item);
        return item;
    }

    /// <summary>The named child table; inside an array of tables, its last table (TOML's rule for [a.b] after [[a]]).</summary>
    private static TomlTable? ChildTable(TomlTable parent, string name, int line, string fileName, InputErrors errors, bool implicitTable)
    {
        if (!parent.Entries.TryGetValue(name, out var child))
        {
            var created = new TomlTable(line) { IsImplicit = implicitTable };
            parent.Entries[name] = created;
            return created;
        }
        switch (child)
        {
            case TomlTable table: return table;
            case TomlArray { IsTableArray: true } array when array.Items.Count > 0: return (TomlTable)array.Items[^1];
            default:
                errors.Add(fileName, line, name, $"already written as {child.Describe()} on line {child.Line}");
                return null;
        }
    }

    private static List<string>? KeyPath(KeySyntax? key)
    {
        if (key?.Key is null) return null;
        var path = new List<string> { KeyName(key.Key) };
        foreach (var dotted in key.DotKeys)
            if (dotted.Key is not null) path.Add(KeyName(dotted.Key));
        return path;
    }

    private static string KeyName(BareKeyOrStringValueSyntax key) => key switch
    {
        BareKeySyntax bare => bare.Key?.Text ?? "",
        StringValueSyntax quoted => quoted.Value ?? "",
        _ => key.ToString().Trim(),
    };
}
