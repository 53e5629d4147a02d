using System.Globalization;

namespace SlotOpt.Input;

/// <summary>
/// The widest values of each kind of quantity a problem can sensibly hold, checked on every quantity read from a file, so a
/// mistake (a wrong prefix, 1e308) is refused with its file, line and key before any result is predicted from it: a length of
/// 1e308 m would be printed as "Infinity mm", a 1 GHz source or a 1e9 T field would give losses beyond 1e12 W.
/// The bounds are generous: common practice, no source (the strongest steady laboratory fields are about 45 T; thin-sheet
/// eddy-current models are quasi-static, far below 10 MHz for parts of this size; copper's resistivity at 4 K is about 1e-11 ohm m).
/// </summary>
public static class PhysicalRange
{
    /// <summary>The largest magnitude, and the smallest positive magnitude where one applies, of each kind; null for no bound.</summary>
    private static (double Largest, double Smallest)? Of(QuantityKind kind) => kind switch
    {
        QuantityKind.Length => (1e3, 0),
        QuantityKind.FluxDensity => (100, 0),
        QuantityKind.Frequency => (1e7, 0),
        QuantityKind.Speed => (1e4, 0),
        QuantityKind.Temperature => (1e4, 0),
        QuantityKind.Resistivity => (1e6, 1e-12),
        QuantityKind.Conductivity => (1e12, 1e-6),
        QuantityKind.Density => (1e5, 0),
        QuantityKind.Mass => (1e9, 0),
        QuantityKind.Area => (1e6, 0),
        QuantityKind.Power => (1e12, 0),
        QuantityKind.Force => (1e12, 0),
        QuantityKind.Pressure => (1e13, 0),
        QuantityKind.Torque => (1e12, 0),
        _ => null,
    };

    /// <summary>Why the value is outside its kind's range; null when inside (zero is left to the key's own rule).</summary>
    public static string? Violation(double si, QuantityKind kind)
    {
        if (Of(kind) is not var (largest, smallest)) return null;
        var unit = QuantityParser.SiUnit(kind);
        var magnitude = Math.Abs(si);
        if (magnitude > largest)
            return string.Create(CultureInfo.InvariantCulture, $"{si:G4} {unit} is beyond any sensible {QuantityParser.Describe(kind)} (at most {largest:G3} {unit}): check the number and its unit");
        if (magnitude > 0 && magnitude < smallest)
            return string.Create(CultureInfo.InvariantCulture, $"{si:G4} {unit} is below any real {QuantityParser.Describe(kind)} (at least {smallest:G3} {unit}): check the number and its unit");
        return null;
    }
}
