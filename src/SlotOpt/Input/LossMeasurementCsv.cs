using SlotOpt.Lamination;
using SlotOpt.Tables;

namespace SlotOpt.Input;

/// <summary>Reads measured sine losses from CSV with columns b_t, f_hz, w_per_kg.</summary>
public static class LossMeasurementCsv
{
    /// <summary>Most measurements read (an Epstein or single-sheet test series is tens to hundreds of points; common practice, no source).</summary>
    public const int MaxRows = 2_000;

    public static IReadOnlyList<LossMeasurement> Read(string path)
    {
        var text = InputFile.ReadAllText(path, "measurement file", InputFile.MaxCsvBytes);
        var table = CsvTable.Parse(text, path, MaxRows);
        table.RequireColumns("b_t", "f_hz", "w_per_kg");
        var list = new List<LossMeasurement>();
        foreach (var row in table.Rows)
        {
            var m = new LossMeasurement(row.Number("b_t"), row.Number("f_hz"), row.Number("w_per_kg"));
            if (!(m.PeakT > 0 && m.FrequencyHz > 0 && m.LossWPerKg > 0))
                throw new InputException($"{path}:{row.LineNumber}: b_t, f_hz and w_per_kg must all be positive");
            list.Add(m);
        }
        return list;
    }
}
