using System.Globalization;

namespace SlotOpt.Tables;

/// <summary>
/// The one rule for the numbers slotopt prints (report, tables, plots and the console alike): four significant
/// figures, never rounding away a digit before the decimal point (12 345.6 prints as 12346), trailing zeros
/// dropped (29.60 prints as 29.6), so a loss of 11.131 W and one of 168.035 W read 11.13 and 168. Temperatures
/// are the exception: a Celsius value has an arbitrary zero, so significant figures mean nothing there; they print
/// to 0.1 K. Estimates whose own accuracy is a factor, not a digit (grid errors, payback times), print to
/// <see cref="EstimateFigures"/> significant figures. Current density prints in A/mm².
/// </summary>
public static class Numbers
{
    public const int SignificantFigures = 4;
    public const int EstimateFigures = 2;

    private static readonly CultureInfo Ci = CultureInfo.InvariantCulture;

    /// <summary>The value to <see cref="SignificantFigures"/> significant figures (all its integer digits kept), invariant culture.</summary>
    public static string Sig(double value) => Significant(value, SignificantFigures);

    /// <summary>An estimate to <see cref="EstimateFigures"/> significant figures: a grid error of 0.08358 % prints as 0.084.</summary>
    public static string Estimate(double value) => Significant(value, EstimateFigures);

    /// <summary>An estimated fraction as a percentage to <see cref="EstimateFigures"/> significant figures: 0.1711 as "17 %".</summary>
    public static string EstimatePercent(double fraction) => Estimate(fraction * 100) + " %";

    private static string Significant(double value, int figures)
    {
        if (double.IsNaN(value) || double.IsInfinity(value)) return value.ToString(Ci);
        if (value == 0) return "0";
        var magnitude = (int)Math.Floor(Math.Log10(Math.Abs(value)));
        if (magnitude < -6) return value.ToString("0.###e0", Ci);   // below a millionth: 1.235e-7
        var decimals = Math.Max(0, figures - 1 - magnitude);
        var rounded = Math.Round(value, decimals, MidpointRounding.AwayFromZero);
        return rounded == 0 ? "0" : rounded.ToString("0." + new string('#', Math.Max(decimals, 1)), Ci);
    }

    /// <summary>A quantity with its unit: "11.13 W".</summary>
    public static string Of(double value, string unit) => Sig(value) + " " + unit;

    /// <summary>A fraction printed as a percentage: 0.0123 as "1.23 %".</summary>
    public static string Percent(double fraction) => Of(fraction * 100, "%");

    public static string Watts(double w) => Of(w, "W");

    public static string Newtons(double n) => Of(n, "N");

    public static string Money(double amount, string currency) => Of(amount, currency);

    /// <summary>Current density given in A/m², printed in A/mm² (the trade's unit for conductors).</summary>
    public static string CurrentDensity(double aPerM2) => Of(aPerM2 / 1e6, "A/mm²");

    /// <summary>A temperature given in kelvin, printed in °C to 0.1 K (<paramref name="unit"/> "degC" for plain-ASCII consoles).</summary>
    public static string Celsius(double kelvin, string unit = "°C") => (kelvin - 273.15).ToString("0.0", Ci) + " " + unit;

    /// <summary>A temperature difference (a rise) in K, to 0.1 K.</summary>
    public static string Kelvin(double differenceK) => differenceK.ToString("0.0", Ci) + " K";
}
