using System.Globalization;
using SlotOpt.Tables;

namespace SlotOpt.Input.Toml;

/// <summary>
/// Reads one table of a problem file: typed values by key, each mistake recorded in
/// <see cref="InputErrors"/> with file, line and the key's full path; keys never asked for are
/// reported as unknown (with the nearest known key) by <see cref="RejectUnknownKeys"/>.
/// </summary>
public sealed class TomlSection
{
    private readonly TomlTable table;
    private readonly HashSet<string> known = new(StringComparer.Ordinal);

    public TomlSection(TomlTable table, string path, string fileName, InputErrors errors)
    {
        this.table = table;
        Path = path;
        FileName = fileName;
        Errors = errors;
    }

    public string Path { get; }
    public string FileName { get; }
    public InputErrors Errors { get; }
    public int Line => table.Line;

    public string KeyPath(string key) => Path.Length == 0 ? key : $"{Path}.{key}";

    public bool Has(string key)
    {
        known.Add(key);
        return table.Entries.ContainsKey(key);
    }

    /// <summary>
    /// Reads a key written under its old name as its new name, with a warning that the old spelling is
    /// deprecated (accepted for one release); both written is an error. Call before reading the new key.
    /// </summary>
    public void AcceptOldName(string oldKey, string newKey)
    {
        known.Add(oldKey);
        if (!table.Entries.Remove(oldKey, out var node)) return;
        if (table.Entries.ContainsKey(newKey))
        {
            Errors.Add(FileName, node.Line, KeyPath(oldKey), $"give {newKey} only (the old name {oldKey} says the same thing)");
            return;
        }
        Errors.Warn(FileName, node.Line, KeyPath(oldKey), $"deprecated name, read as {newKey}; write {newKey} (the old name is accepted until the next release)");
        table.Entries[newKey] = node;
    }

    public int LineOf(string key) => table.Entries.TryGetValue(key, out var node) ? node.Line : table.Line;

    /// <summary>Records an error against a key of this table (its line, or the table's when absent).</summary>
    public void Error(string key, string message) => Errors.Add(FileName, LineOf(key), KeyPath(key), message);

    public void Warn(string key, string message) => Errors.Warn(FileName, LineOf(key), KeyPath(key), message);

    public string? OptionalString(string key)
    {
        var node = Get(key);
        if (node is null) return null;
        if (node is TomlScalar { Value: string s })
        {
            if (s.Trim().Length == 0) { Error(key, "is empty"); return null; }
            return s;
        }
        Error(key, $"expected a string, found {node.Describe()}");
        return null;
    }

    public string? RequiredString(string key) => Require(key) ? OptionalString(key) : null;

    /// <summary>One of the allowed words; anything else is an error naming the nearest.</summary>
    public string? OptionalChoice(string key, IReadOnlyCollection<string> allowed)
    {
        var text = OptionalString(key);
        if (text is null) return null;
        if (allowed.Contains(text)) return text;
        Error(key, $"\"{text}\" is not one of {string.Join(", ", allowed)}{NameSuggestion.DidYouMean(text, allowed)}");
        return null;
    }

    public double? OptionalQuantity(string key, QuantityKind kind) => ReadQuantity(Get(key), key, kind);

    public double? RequiredQuantity(string key, QuantityKind kind) => Require(key) ? OptionalQuantity(key, kind) : null;

    /// <summary>A quantity that must be strictly positive.</summary>
    public double? PositiveQuantity(string key, QuantityKind kind, bool required)
    {
        var value = required ? RequiredQuantity(key, kind) : OptionalQuantity(key, kind);
        if (value is { } v && !(v > 0)) { Error(key, $"must be positive, got {Raw(key)}"); return null; }
        return value;
    }

    /// <summary>One quantity or an array of them.</summary>
    public IReadOnlyList<double>? QuantityList(string key, QuantityKind kind, bool required)
    {
        if (required && !Require(key)) return null;
        var node = Get(key);
        if (node is null) return null;
        if (node is not TomlArray array) return ReadQuantity(node, key, kind) is { } single ? [single] : null;
        if (array.Items.Count == 0) { Error(key, "is an empty list"); return null; }
        var values = new List<double>();
        var ok = true;
        for (var i = 0; i < array.Items.Count; i++)
        {
            var v = ReadQuantity(array.Items[i], $"{key}[{i + 1}]", kind);
            if (v is null) ok = false; else values.Add(v.Value);
        }
        return ok ? values : null;
    }

    /// <summary>One string or an array of them.</summary>
    public IReadOnlyList<string>? StringList(string key, bool required)
    {
        if (required && !Require(key)) return null;
        var node = Get(key);
        if (node is null) return null;
        if (node is TomlScalar { Value: string one }) return [one];
        if (node is not TomlArray array || array.Items.Count == 0) { Error(key, $"expected a string or a list of strings, found {node.Describe()}"); return null; }
        var list = new List<string>();
        foreach (var item in array.Items)
        {
            if (item is TomlScalar { Value: string s } && s.Trim().Length > 0) list.Add(s);
            else { Errors.Add(FileName, item.Line, KeyPath(key), $"expected a string, found {item.Describe()}"); return null; }
        }
        return list;
    }

    /// <summary>A list of lists of strings, e.g. coil_groups = [["stator", "rotor"]].</summary>
    public IReadOnlyList<IReadOnlyList<string>> GroupList(string key)
    {
        var node = Get(key);
        if (node is null) return [];
        if (node is not TomlArray outer) { Error(key, $"expected a list of lists of part names, found {node.Describe()}"); return []; }
        var groups = new List<IReadOnlyList<string>>();
        foreach (var item in outer.Items)
        {
            if (item is TomlArray inner && inner.Items.All(i => i is TomlScalar { Value: string }))
                groups.Add(inner.Items.Select(i => (string)((TomlScalar)i).Value).ToList());
            else Errors.Add(FileName, item.Line, KeyPath(key), $"expected a list of part names such as [\"a\", \"b\"], found {item.Describe()}");
        }
        return groups;
    }

    /// <summary>A list of [x, y] points, each coordinate a length ("120 mm" or metres).</summary>
    public IReadOnlyList<(double X, double Y)>? PointList(string key)
    {
        var node = Get(key);
        if (node is null) return null;
        if (node is not TomlArray outer || outer.Items.Count < 3) { Error(key, "expected at least three [x, y] points"); return null; }
        var points = new List<(double, double)>();
        foreach (var item in outer.Items)
        {
            if (item is TomlArray { Items.Count: 2 } pair
                && ReadQuantity(pair.Items[0], key, QuantityKind.Length) is { } x
                && ReadQuantity(pair.Items[1], key, QuantityKind.Length) is { } y)
                points.Add((x, y));
            else { Errors.Add(FileName, item.Line, KeyPath(key), "each point must be [x, y] with lengths such as [\"0 mm\", \"120 mm\"]"); return null; }
        }
        return points;
    }

    /// <summary>One required [x, y] point of lengths.</summary>
    public (double X, double Y)? Point(string key)
    {
        var node = Get(key);
        if (node is null) { Errors.Add(FileName, table.Line, KeyPath(key), "missing (required): an [x, y] point"); return null; }
        if (node is TomlArray { Items.Count: 2 } pair
            && ReadQuantity(pair.Items[0], key, QuantityKind.Length) is { } x
            && ReadQuantity(pair.Items[1], key, QuantityKind.Length) is { } y)
            return (x, y);
        Error(key, "expected a point [x, y] with lengths such as [\"0 mm\", \"120 mm\"]");
        return null;
    }

    /// <summary>One whole number or an array of them, each between min and max.</summary>
    public IReadOnlyList<long>? IntegerList(string key, long min, long max, bool required)
    {
        if (required && !Require(key)) return null;
        var node = Get(key);
        if (node is null) return null;
        if (node is not TomlArray array) return OptionalInteger(key, min, max) is { } single ? [single] : null;
        if (array.Items.Count == 0) { Error(key, "is an empty list"); return null; }
        var values = new List<long>();
        foreach (var item in array.Items)
        {
            if (item is not TomlScalar { Value: long n }) { Error(key, $"expected whole numbers, found {item.Describe()}"); return null; }
            if (n < min || n > max) { Error(key, $"must lie between {min} and {max}, got {n}"); return null; }
            values.Add(n);
        }
        return values;
    }

    public long? OptionalInteger(string key, long min, long max)
    {
        var node = Get(key);
        if (node is null) return null;
        if (node is TomlScalar { Value: long n })
        {
            if (n < min || n > max) { Error(key, $"must lie between {min} and {max}, got {n}"); return null; }
            return n;
        }
        Error(key, $"expected a whole number, found {node.Describe()}");
        return null;
    }

    public double? OptionalNumber(string key)
    {
        var node = Get(key);
        switch (node)
        {
            case null: return null;
            case TomlScalar { Value: long n }: return n;
            case TomlScalar { Value: double d } when double.IsFinite(d): return d;
            default: Error(key, $"expected a finite number, found {node.Describe()}"); return null;
        }
    }

    public bool? OptionalBoolean(string key)
    {
        var node = Get(key);
        if (node is null) return null;
        if (node is TomlScalar { Value: bool b }) return b;
        Error(key, $"expected true or false, found {node.Describe()}");
        return null;
    }

    public TomlSection? OptionalTable(string key)
    {
        var node = Get(key);
        if (node is null) return null;
        if (node is TomlTable t) return new TomlSection(t, KeyPath(key), FileName, Errors);
        Error(key, $"expected a table, found {node.Describe()}");
        return null;
    }

    public TomlSection? RequiredTable(string key) => Require(key) ? OptionalTable(key) : null;

    /// <summary>An array of tables ([[key]] headers or an array of inline tables).</summary>
    public IReadOnlyList<TomlSection> TableArray(string key, bool required)
    {
        if (required && !Require(key)) return [];
        var node = Get(key);
        if (node is null) return [];
        if (node is not TomlArray array) { Error(key, $"expected [[{KeyPath(key)}]] tables, found {node.Describe()}"); return []; }
        var sections = new List<TomlSection>();
        for (var i = 0; i < array.Items.Count; i++)
        {
            if (array.Items[i] is TomlTable t) sections.Add(new TomlSection(t, $"{KeyPath(key)}[{i + 1}]", FileName, Errors));
            else Errors.Add(FileName, array.Items[i].Line, $"{KeyPath(key)}[{i + 1}]", $"expected a table, found {array.Items[i].Describe()}");
        }
        return sections;
    }

    /// <summary>Builds an engine object from values already read; an <see cref="InputException"/> it throws is recorded against the key.</summary>
    public T? Guard<T>(string key, Func<T> build) where T : class
    {
        try { return build(); }
        catch (InputException e)
        {
            foreach (var line in e.Message.Split(Environment.NewLine)) Error(key, line);
            return null;
        }
    }

    /// <summary>The keys written in this table, in order (all counted as known).</summary>
    public IReadOnlyList<string> KeysWritten()
    {
        foreach (var key in table.Entries.Keys) known.Add(key);
        return table.Entries.Keys.ToList();
    }

    /// <summary>Every key written in this table but never asked for is an error, with the nearest known key.</summary>
    public void RejectUnknownKeys()
    {
        foreach (var (key, node) in table.Entries)
            if (!known.Contains(key))
                Errors.Add(FileName, node.Line, KeyPath(key), $"unknown key{NameSuggestion.DidYouMean(key, known)}; allowed here: {string.Join(", ", known.Order(StringComparer.Ordinal))}");
    }

    private TomlNode? Get(string key)
    {
        known.Add(key);
        return table.Entries.TryGetValue(key, out var node) ? node : null;
    }

    private bool Require(string key)
    {
        if (Has(key)) return true;
        Errors.Add(FileName, table.Line, KeyPath(key), "missing (required)");
        return false;
    }

    private string Raw(string key) => table.Entries.TryGetValue(key, out var node) && node is TomlScalar s
        ? Convert.ToString(s.Value, CultureInfo.InvariantCulture) ?? ""
        : "";

    private double? ReadQuantity(TomlNode? node, string key, QuantityKind kind)
    {
        var value = ReadUncheckedQuantity(node, key, kind);
        if (value is { } v && PhysicalRange.Violation(v, kind) is { } beyond)
        {
            Errors.Add(FileName, node!.Line, KeyPath(key), beyond);
            return null;
        }
        return value;
    }

    private double? ReadUncheckedQuantity(TomlNode? node, string key, QuantityKind kind)
    {
        switch (node)
        {
            case null: return null;
            case TomlScalar { Value: string text }:
                if (QuantityParser.TryParse(text, kind, out var si, out var error)) return si;
                Errors.Add(FileName, node.Line, KeyPath(key), error);
                return null;
            case TomlScalar { Value: long n }: return n;
            case TomlScalar { Value: double d } when double.IsFinite(d): return d;
            default:
                Errors.Add(FileName, node.Line, KeyPath(key), $"expected a {QuantityParser.Describe(kind)} such as {QuantityParser.Example(kind)}, found {node.Describe()}");
                return null;
        }
    }
}
