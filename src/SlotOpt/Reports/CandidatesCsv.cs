using SlotOpt.Design.SolidParts;
using System.Globalization;
using System.Text;
using SlotOpt.Design;
using SlotOpt.Plates.Thermal;
using SlotOpt.Runs;

namespace SlotOpt.Reports;

/// <summary>
/// candidates.csv: every evaluated option of every part, one row each (RFC 4180 quoting), with its
/// attributes (the union over all parts; empty where an option has none), its loss by origin, drag,
/// build cost, owning cost (build cost + value per watt x loss), whether it passed the rules, the
/// rule it broke, whether the run chose it, its validity flags, and (plates) the model that gave its loss (`plate --model`'s names; empty for cores); with [parts.thermal] its temperature and how it was found.
/// </summary>
public static class CandidatesCsv
{
    public static readonly IReadOnlyList<string> LeadingColumns = ["part", "id", "description"];

    public static readonly IReadOnlyList<string> TrailingColumns =
        ["loss_w", "hysteresis_w", "classical_w", "excess_w", "plate_eddy_w", "drag_power_w", "drag_n", "build_cost", "owning_cost", "feasible", "rejection", "chosen", "flags", "model"];

    /// <summary>Added after the trailing columns when a part has [parts.thermal]: the option's temperature as the screen found it.</summary>
    public static readonly IReadOnlyList<string> TemperatureColumns = ["temperature_rise_max_k", "temperature_rise_mean_k", "hottest_c", "temperature_method"];

    public static string Write(RunResult r)
    {
        var ci = CultureInfo.InvariantCulture;
        var options = r.Parts.SelectMany(p => p.Options).ToList();
        var attributeColumns = options.SelectMany(o => o.Attributes.Keys).Distinct(StringComparer.Ordinal).ToList();
        var chosenIds = r.Chosen?.Select(o => o.Id).ToHashSet(StringComparer.Ordinal) ?? [];
        var s = new StringBuilder();
        var hot = r.Problem.Parts.OfType<PlatePart>().Any(p => p.Thermal is not null);
        Row(s, LeadingColumns.Concat(attributeColumns).Concat(TrailingColumns).Concat(hot ? TemperatureColumns : []));
        foreach (var o in options)
        {
            string N(double v) => v.ToString("R", ci);
            Row(s, new[] { o.PartName, o.Id, o.Description }
                .Concat(attributeColumns.Select(c => o.Attributes.TryGetValue(c, out var v) ? v : ""))
                .Concat([
                    N(o.Loss.TotalW), N(o.Loss.HysteresisW), N(o.Loss.ClassicalW), N(o.Loss.ExcessW), N(o.Loss.PlateEddyW), N(o.Loss.DragPowerW),
                    o.DragN is { } d ? N(d) : "", N(o.BuildCost), N(o.BuildCost + r.Problem.ValuePerWattOf(o.PartName) * o.Loss.TotalW),
                    o.IsFeasible ? "yes" : "no", o.Rejection?.Message ?? "", chosenIds.Contains(o.Id) ? "yes" : "no", string.Join("; ", o.Flags), o.Model?.Name ?? "",
                ]).Concat(!hot ? [] : o.Temperature is { } t
                    ? [N(t.MaxRiseK), N(t.MeanRiseK), N(t.HottestK - 273.15), t.Method switch { TemperatureMethod.UpperBound => "upper_bound", TemperatureMethod.LowerBound => "lower_bound", _ => "coupled" }]
                    : ["", "", "", ""]));
        }
        return s.ToString();
    }

    private static void Row(StringBuilder s, IEnumerable<string> cells)
    {
        s.Append(string.Join(',', cells.Select(Quote))).Append("\r\n");
    }

    private static string Quote(string cell) =>
        cell.IndexOfAny([',', '"', '\r', '\n']) >= 0 ? "\"" + cell.Replace("\"", "\"\"") + "\"" : cell;
}
