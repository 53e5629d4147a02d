using System.Globalization;
using Tomlyn.Syntax;

namespace SlotOpt.Problems;

/// <summary>
/// Typed, position-aware access to the keys of one table of a plate file. Every read marks its key
/// as known; <see cref="ReportUnknownKeys"/> turns the rest into errors. Errors go to a shared list
/// as "file:line: key 'table.key': message" so the reader can report them all at once.
/// </summary>
internal sealed class PlateFileTable
{
    private readonly Dictionary<string, KeyValueSyntax> _items = new(StringComparer.Ordinal);
    private readonly HashSet<string> _read = new(StringComparer.Ordinal);
    private readonly string _file;
    private readonly List<string> _errors;

    public PlateFileTable(string file, string name, int line, IEnumerable<KeyValueSyntax> items, List<string> errors)
    {
        _file = file;
        Name = name;
        Line = line;
        _errors = errors;
        foreach (var kv in items)
        {
            string key = kv.Key?.ToString().Trim() ?? "";
            if (_items.ContainsKey(key)) Error(kv, key, "is given twice");
            else _items[key] = kv;
        }
    }

    public string Name { get; }
    /// <summary>Line (1-based) of the table header.</summary>
    public int Line { get; }

    public bool Has(string key) => _items.ContainsKey(key);

    public string Where(string key) => _items.TryGetValue(key, out var kv) ? $"{_file}:{kv.Span.Start.Line + 1}: key '{Name}.{key}'" : $"{_file}:{Line}: table [{Name}]";

    public void ErrorAt(string key, string message) => _errors.Add($"{Where(key)}: {message}");

    public void Missing(string key, string what) => _errors.Add($"{_file}:{Line}: table [{Name}]: missing key '{key}' ({what})");

    public string? String(string key, bool required, string what)
    {
        if (!Take(key, required, what, out var kv)) return null;
        if (kv.Value is StringValueSyntax s) return s.Value;
        Error(kv, key, $"expected a string ({what})");
        return null;
    }

    /// <summary>A quantity written as a string with units ("6 mm") or a plain SI number.</summary>
    public double? Quantity(string key, QuantityKind kind, bool required)
    {
        if (!Take(key, required, $"a {QuantityParser.Describe(kind)} such as {QuantityParser.Example(kind)}", out var kv)) return null;
        return QuantityOf(kv.Value, kind, kv, key);
    }

    public double? Number(string key, bool required, string what)
    {
        if (!Take(key, required, what, out var kv)) return null;
        switch (kv.Value)
        {
            case IntegerValueSyntax i: return i.Value;
            case FloatValueSyntax f when double.IsFinite(f.Value): return f.Value;
            case StringValueSyntax s when double.TryParse(s.Value, NumberStyles.Float, CultureInfo.InvariantCulture, out var d) && double.IsFinite(d): return d;
        }
        Error(kv, key, $"expected a finite number ({what})");
        return null;
    }

    public int? Integer(string key, bool required, string what)
    {
        if (!Take(key, required, what, out var kv)) return null;
        if (kv.Value is IntegerValueSyntax i && i.Value is >= int.MinValue and <= int.MaxValue) return (int)i.Value;
        Error(kv, key, $"expected a whole number ({what})");
        return null;
    }

    /// <summary>A point [x, y], each a length.</summary>
    public (double X, double Y)? Point(string key, bool required)
    {
        if (!Take(key, required, "a point [x, y] such as [\"10 mm\", \"20 mm\"]", out var kv)) return null;
        return PointOf(kv.Value, kv, key);
    }

    /// <summary>A list of points [[x, y], ...].</summary>
    public List<(double X, double Y)>? Points(string key, bool required)
    {
        if (!Take(key, required, "a list of points [[x, y], ...]", out var kv)) return null;
        if (kv.Value is not ArraySyntax array) { Error(kv, key, "expected a list of points [[x, y], ...]"); return null; }
        var points = new List<(double, double)>();
        foreach (var item in array.Items)
        {
            var p = PointOf(item.Value, kv, key);
            if (p is null) return null;
            points.Add(p.Value);
        }
        return points;
    }

    public void ReportUnknownKeys(IReadOnlyCollection<string> allowed)
    {
        foreach (var (key, kv) in _items)
            if (!_read.Contains(key) && !allowed.Contains(key))
                Error(kv, key, $"unknown key; expected one of: {string.Join(", ", allowed.Order())}");
    }

    private bool Take(string key, bool required, string what, out KeyValueSyntax kv)
    {
        _read.Add(key);
        if (_items.TryGetValue(key, out kv!)) return true;
        if (required) Missing(key, what);
        return false;
    }

    private (double, double)? PointOf(ValueSyntax? value, KeyValueSyntax kv, string key)
    {
        if (value is not ArraySyntax pair || pair.Items.ChildrenCount != 2) { Error(kv, key, "expected a point [x, y] such as [\"10 mm\", \"20 mm\"]"); return null; }
        var x = QuantityOf(pair.Items.GetChild(0)!.Value, QuantityKind.Length, kv, key);
        var y = QuantityOf(pair.Items.GetChild(1)!.Value, QuantityKind.Length, kv, key);
        return x is null || y is null ? null : (x.Value, y.Value);
    }

    private double? QuantityOf(ValueSyntax? value, QuantityKind kind, KeyValueSyntax kv, string key)
    {
        string? text = value switch
        {
            StringValueSyntax s => s.Value,
            IntegerValueSyntax i => i.Value.ToString(CultureInfo.InvariantCulture),
            FloatValueSyntax f => f.Value.ToString("R", CultureInfo.InvariantCulture),
            _ => null,
        };
        if (text is null) { Error(kv, key, $"expected a {QuantityParser.Describe(kind)} such as {QuantityParser.Example(kind)}"); return null; }
        if (QuantityParser.TryParse(text, kind, out var si, out var error)) return si;
        Error(kv, key, error);
        return null;
    }

    private void Error(KeyValueSyntax kv, string key, string message) => _errors.Add($"{_file}:{kv.Span.Start.Line + 1}: key '{Name}.{key}': {message}");
}
