namespace SlotOpt.Selection;

/// <summary>
/// The exact integer units the selection works in (CP-SAT takes long coefficients only).
/// </summary>
/// <remarks>
/// Money is whole cents and loss whole milliwatts, each rounded half away from zero after reading the
/// double as a decimal (15 significant digits, so 1.005 means 1.005 and becomes 101 cents).
/// The capitalisation rate is whole cents per kW (ValuePerWatt to 1e-5 currency per W). Owning cost is
/// then exact in microcents: 1e6 * cents + rate[cents/kW] * loss[mW], since 1 mW at 1 cent/kW is 1e-6 cent.
/// Two designs tie when their cents, milliwatts or microcents are equal; each objective breaks such ties
/// by its second criterion and then by candidate order (see <see cref="Objective"/>).
/// </remarks>
public static class IntegerScale
{
    public const long MicrocentsPerCent = 1_000_000;

    /// <summary>Largest magnitude of money, loss or rate accepted: far inside the long range once scaled.</summary>
    public const double LargestScalable = 1e12;

    /// <summary>Whole cents, half away from zero.</summary>
    public static long ToCents(double money) => RoundScaled(money, 100m, "money");

    /// <summary>Whole milliwatts, half away from zero.</summary>
    public static long ToMilliwatts(double watts) => RoundScaled(watts, 1000m, "loss");

    /// <summary>Capitalisation rate in whole cents per kW, half away from zero.</summary>
    public static long ToCentsPerKilowatt(double valuePerWatt) => RoundScaled(valuePerWatt, 100_000m, "value per watt");

    /// <summary>Owning cost in microcents: exact for whole cents, whole milliwatts and a whole cents-per-kW rate.</summary>
    public static long OwningMicrocents(long cents, long milliwatts, long centsPerKilowatt)
    {
        var microcents = (Int128)MicrocentsPerCent * cents + (Int128)centsPerKilowatt * milliwatts;
        if (microcents > long.MaxValue || microcents < long.MinValue)
            throw new InputException(FormattableString.Invariant(
                $"an owning cost of {(double)microcents / (100.0 * MicrocentsPerCent):0.###e0} is too large to rank exactly in integers"));
        return (long)microcents;
    }

    public static double CentsToMoney(long cents) => cents / 100.0;

    public static double MilliwattsToWatts(long milliwatts) => milliwatts / 1000.0;

    public static double MicrocentsToMoney(long microcents) => (double)(microcents / (decimal)(100 * MicrocentsPerCent));

    private static long RoundScaled(double value, decimal factor, string what)
    {
        if (!double.IsFinite(value) || Math.Abs(value) > LargestScalable)
            throw new InputException($"{what} {value} cannot be scaled to an exact integer (finite, at most {LargestScalable:0e0} in size expected)");
        return (long)Math.Round((decimal)value * factor, MidpointRounding.AwayFromZero);
    }
}
