using System.Globalization;
using System.Numerics;
using SlotOpt.Sheets;

namespace SlotOpt.Problems;

/// <summary>
/// Reads a field-map CSV for a plate file: header x_m,y_m,amplitude_t,phase_deg, then one row per
/// point of a rectangular grid (every x with every y, any order). Errors name file:line.
/// </summary>
public static class PlateFileFieldMap
{
    private static readonly string[] Header = { "x_m", "y_m", "amplitude_t", "phase_deg" };

    public static FieldMap Read(string path, double frequencyHz)
    {
        if (!File.Exists(path)) throw new InputException($"{path}: field-map file not found");
        var lines = File.ReadAllLines(path);
        if (lines.Length == 0 || !lines[0].Split(',').Select(h => h.Trim()).SequenceEqual(Header))
            throw new InputException($"{path}:1: the header must be {string.Join(",", Header)}");
        var values = new Dictionary<(double, double), Complex>();
        for (int k = 1; k < lines.Length; k++)
        {
            if (string.IsNullOrWhiteSpace(lines[k])) continue;
            var cells = lines[k].Split(',');
            var numbers = new double[4];
            if (cells.Length != 4 || !Enumerable.Range(0, 4).All(c => double.TryParse(cells[c].Trim(), NumberStyles.Float, CultureInfo.InvariantCulture, out numbers[c]) && double.IsFinite(numbers[c])))
                throw new InputException($"{path}:{k + 1}: expected four finite numbers x_m,y_m,amplitude_t,phase_deg");
            if (!values.TryAdd((numbers[0], numbers[1]), Complex.FromPolarCoordinates(numbers[2], numbers[3] * Math.PI / 180)))
                throw new InputException($"{path}:{k + 1}: the point ({numbers[0]}, {numbers[1]}) is given twice");
        }
        var xs = values.Keys.Select(p => p.Item1).Distinct().Order().ToArray();
        var ys = values.Keys.Select(p => p.Item2).Distinct().Order().ToArray();
        if (xs.Length < 2 || ys.Length < 2) throw new InputException($"{path}: a field map needs at least 2 distinct x and 2 distinct y values");
        if (values.Count != xs.Length * ys.Length)
            throw new InputException($"{path}: the points do not form a full grid ({xs.Length} x values by {ys.Length} y values need {xs.Length * ys.Length} rows, found {values.Count})");
        var b = new Complex[xs.Length * ys.Length];
        for (int j = 0; j < ys.Length; j++)
            for (int i = 0; i < xs.Length; i++)
                b[j * xs.Length + i] = values[(xs[i], ys[j])];
        return new FieldMap(xs, ys, b, frequencyHz);
    }
}
