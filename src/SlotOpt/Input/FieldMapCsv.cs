using System.Numerics;
using SlotOpt.Plates.Sources;
using SlotOpt.Tables;

namespace SlotOpt.Input;

/// <summary>
/// Reads a normal AC field map from CSV: header x_m,y_m,peak_flux_density_t,phase_deg, one row per point of a
/// rectangular grid (every x with every y, any order). Errors name file:line.
/// </summary>
public static class FieldMapCsv
{
    /// <summary>Most grid points read (1000 x 1000; the plate solver interpolates the map onto its own grid).</summary>
    public const int MaxPoints = 1_000_000;

    public static FieldMap Read(string path, double frequencyHz)
    {
        var text = InputFile.ReadAllText(path, "field map", InputFile.MaxCsvBytes);
        var table = CsvTable.Parse(text, path, MaxPoints);
        // amplitude_t is the deprecated name of peak_flux_density_t, accepted until the next release
        var peakColumn = table.Columns.Contains("amplitude_t") && !table.Columns.Contains("peak_flux_density_t") ? "amplitude_t" : "peak_flux_density_t";
        table.RequireColumns("x_m", "y_m", peakColumn, "phase_deg");
        var values = new Dictionary<(double X, double Y), Complex>();
        foreach (var row in table.Rows)
        {
            var point = (row.Number("x_m"), row.Number("y_m"));
            var amplitude = row.Number(peakColumn);
            if (amplitude < 0) throw new InputException($"{path}:{row.LineNumber}: {peakColumn} must be zero or positive (put the sign in phase_deg)");
            if (!values.TryAdd(point, Complex.FromPolarCoordinates(amplitude, row.Number("phase_deg") * Math.PI / 180)))
                throw new InputException($"{path}:{row.LineNumber}: the point ({point.Item1}, {point.Item2}) is given twice");
        }
        var xs = values.Keys.Select(p => p.X).Distinct().Order().ToArray();
        var ys = values.Keys.Select(p => p.Y).Distinct().Order().ToArray();
        if (xs.Length < 2 || ys.Length < 2) throw new InputException($"{path}: a field map needs at least 2 distinct x and 2 distinct y values");
        if (values.Count != xs.Length * ys.Length)
            throw new InputException($"{path}: the points do not form a full grid ({xs.Length} x values by {ys.Length} y values need {xs.Length * ys.Length} rows, found {values.Count})");
        var b = new Complex[xs.Length * ys.Length];
        for (var j = 0; j < ys.Length; j++)
            for (var i = 0; i < xs.Length; i++)
                b[j * xs.Length + i] = values[(xs[i], ys[j])];
        return new FieldMap(xs, ys, b, frequencyHz);
    }
}
