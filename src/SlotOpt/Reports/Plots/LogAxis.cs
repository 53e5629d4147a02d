using System.Globalization;
using ScottPlot;
using ScottPlot.TickGenerators;

namespace SlotOpt.Reports.Plots;

/// <summary>
/// ScottPlot 5 has no logarithmic axis: the data are plotted as log10(value), and the axis gets ticks
/// placed at log10 of 1..9 x 10^k. Decades are labelled; over three decades or fewer 2 x and 5 x 10^k too,
/// so a short span still carries several numbers. The rest are minor ticks.
/// </summary>
public static class LogAxis
{
    public static double[] Log10(IEnumerable<double> values) => values.Select(Math.Log10).ToArray();

    public static void Apply(IAxis axis, IEnumerable<double> values)
    {
        var positive = values.Where(v => v > 0 && double.IsFinite(v)).ToList();
        var lo = (int)Math.Floor(Math.Log10(positive.Min()));
        var hi = (int)Math.Ceiling(Math.Log10(positive.Max()));
        int[] labelled = hi - lo <= 3 ? [1, 2, 5] : [1];
        var ticks = new NumericManual();
        for (var k = lo; k <= hi; k++)
            for (var m = 1; m <= 9; m++)
            {
                var value = m * Math.Pow(10, k);
                if (labelled.Contains(m)) ticks.AddMajor(Math.Log10(value), Label(value));
                else ticks.AddMinor(Math.Log10(value));
            }
        axis.TickGenerator = ticks;
    }

    /// <summary>A tick label: plain digits from 0.001 to 10^5, else "2e6".</summary>
    public static string Label(double value) =>
        value is >= 1e-3 and < 1e5 ? value.ToString("0.###", CultureInfo.InvariantCulture) : value.ToString("0e0", CultureInfo.InvariantCulture);

    /// <summary>True when positive values span more than a decade: then a log axis reads better than a linear one.</summary>
    public static bool SpansMoreThanADecade(IEnumerable<double> values)
    {
        var positive = values.Where(v => v > 0 && double.IsFinite(v)).ToList();
        return positive.Count > 1 && positive.Max() / positive.Min() > 10;
    }
}
