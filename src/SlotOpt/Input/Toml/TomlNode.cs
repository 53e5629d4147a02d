namespace SlotOpt.Input.Toml;

/// <summary>A value of a TOML document with the (1-based) line it was written on.</summary>
public abstract class TomlNode
{
    protected TomlNode(int line) => Line = line;

    public int Line { get; }

    /// <summary>What the value is, in words for messages ("a string", "a table", ...).</summary>
    public abstract string Describe();
}

/// <summary>A string, integer (long), float (double) or boolean.</summary>
public sealed class TomlScalar : TomlNode
{
    public TomlScalar(object value, int line) : base(line) => Value = value;

    public object Value { get; }

    public override string Describe() => Value switch
    {
        string s => $"the string \"{s}\"",
        bool b => $"the boolean {(b ? "true" : "false")}",
        _ => $"the number {Convert.ToString(Value, System.Globalization.CultureInfo.InvariantCulture)}",
    };
}

/// <summary>An array of values.</summary>
public sealed class TomlArray : TomlNode
{
    public TomlArray(int line) : base(line) { }

    public List<TomlNode> Items { get; } = new();

    /// <summary>True for an array of tables written as [[name]] headers.</summary>
    public bool IsTableArray { get; init; }

    public override string Describe() => "an array";
}

/// <summary>A table: keys in the order written, each with its value.</summary>
public sealed class TomlTable : TomlNode
{
    public TomlTable(int line) : base(line) { }

    public Dictionary<string, TomlNode> Entries { get; } = new(StringComparer.Ordinal);

    /// <summary>Created only as the parent of a dotted key or header, never written itself.</summary>
    public bool IsImplicit { get; set; }

    public override string Describe() => "a table";
}
