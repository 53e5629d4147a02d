using System.Globalization;
using System.Text;

namespace SlotOpt.Tables;

/// <summary>
/// A comma-separated table with a header row, read with RFC 4180 quoting. Every value keeps its
/// source name and line, so a bad cell is reported as "file:line column".
/// </summary>
public sealed class CsvTable
{
    public string SourceName { get; }
    public IReadOnlyList<string> Columns { get; }
    public IReadOnlyList<CsvRow> Rows { get; }

    private CsvTable(string sourceName, IReadOnlyList<string> columns, IReadOnlyList<CsvRow> rows)
    {
        SourceName = sourceName;
        Columns = columns;
        Rows = rows;
    }

    /// <summary>Parses CSV text; lines that are blank or start with '#' are skipped.</summary>
    /// <param name="maxRows">The most data rows accepted; one more is an error naming the line, found before the rest is read.</param>
    /// <exception cref="InputException">No header, a row with the wrong number of cells, or more than maxRows rows.</exception>
    public static CsvTable Parse(string text, string sourceName, int maxRows = int.MaxValue)
    {
        List<string>? header = null;
        var rows = new List<CsvRow>();
        var errors = new List<string>();
        var errorCount = 0;
        void Error(string message)
        {
            if (++errorCount <= MaxErrorsListed) errors.Add(message);
        }
        var lineNumber = 0;
        using var reader = new StringReader(text);
        while (reader.ReadLine() is { } line)
        {
            lineNumber++;
            if (string.IsNullOrWhiteSpace(line) || line.TrimStart().StartsWith('#')) continue;
            if (!TrySplit(line, out var cells))
            {
                Error($"{sourceName}:{lineNumber}: unbalanced quotes");
                continue;
            }
            if (header is null)
            {
                header = cells.Select(c => c.Trim()).ToList();
                continue;
            }
            if (cells.Count != header.Count)
            {
                Error($"{sourceName}:{lineNumber}: expected {header.Count} values ({string.Join(", ", header)}), found {cells.Count}");
                continue;
            }
            if (rows.Count == maxRows)
            {
                Error($"{sourceName}:{lineNumber}: more than {maxRows:N0} data rows, the most this table may hold");
                break;
            }
            rows.Add(new CsvRow(sourceName, lineNumber, header, cells));
        }
        if (header is null) Error($"{sourceName}: no header row");
        if (errorCount > MaxErrorsListed) errors.Add($"{sourceName}:{lineNumber}: ... and {errorCount - MaxErrorsListed:N0} more errors");
        if (errorCount > 0) throw new InputException(errors);
        return new CsvTable(sourceName, header!, rows);
    }

    /// <summary>Errors listed at most for one table (a wrong file would otherwise print one per line).</summary>
    private const int MaxErrorsListed = 20;

    /// <summary>Throws unless every named column is present.</summary>
    public void RequireColumns(params string[] names)
    {
        var missing = names.Where(n => !Columns.Contains(n)).ToList();
        if (missing.Count > 0)
            throw new InputException($"{SourceName}:1: missing column(s) {string.Join(", ", missing)}; the header must name {string.Join(", ", names)}");
    }

    private static bool TrySplit(string line, out List<string> cells)
    {
        cells = new List<string>();
        var cell = new StringBuilder();
        var quoted = false;
        for (var i = 0; i < line.Length; i++)
        {
            var c = line[i];
            if (quoted)
            {
                if (c == '"' && i + 1 < line.Length && line[i + 1] == '"') { cell.Append('"'); i++; }
                else if (c == '"') quoted = false;
                else cell.Append(c);
            }
            else if (c == '"') quoted = true;
            else if (c == ',') { cells.Add(cell.ToString()); cell.Clear(); }
            else cell.Append(c);
        }
        cells.Add(cell.ToString());
        return !quoted;
    }
}

/// <summary>One data row of a <see cref="CsvTable"/>.</summary>
public sealed class CsvRow
{
    private readonly IReadOnlyList<string> header;
    private readonly IReadOnlyList<string> cells;

    public string SourceName { get; }
    public int LineNumber { get; }

    internal CsvRow(string sourceName, int lineNumber, IReadOnlyList<string> header, IReadOnlyList<string> cells)
    {
        SourceName = sourceName;
        LineNumber = lineNumber;
        this.header = header;
        this.cells = cells;
    }

    public bool Has(string column) => header.Contains(column);

    public string Text(string column)
    {
        var index = IndexOf(column);
        return cells[index].Trim();
    }

    /// <summary>A finite number in the named column.</summary>
    public double Number(string column)
    {
        var text = Text(column);
        if (!double.TryParse(text, NumberStyles.Float, CultureInfo.InvariantCulture, out var value) || !double.IsFinite(value))
            throw new InputException($"{SourceName}:{LineNumber}: column {column}: \"{text}\" is not a finite number");
        return value;
    }

    public bool Boolean(string column)
    {
        var text = Text(column).ToLowerInvariant();
        return text switch
        {
            "true" or "yes" or "1" => true,
            "false" or "no" or "0" => false,
            _ => throw new InputException($"{SourceName}:{LineNumber}: column {column}: \"{text}\" is not true or false"),
        };
    }

    private int IndexOf(string column)
    {
        for (var i = 0; i < header.Count; i++)
            if (header[i] == column) return i;
        throw new InputException($"{SourceName}:{LineNumber}: missing column {column}");
    }
}
