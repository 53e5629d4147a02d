using System.Globalization;
using CsCheck;
using SlotOpt.Input;

namespace SlotOpt.Tests.Input;

/// <summary>
/// Properties of the unit parser over generated inputs (CsCheck; a failure prints the seed that reproduces
/// it). Single thread, so the suite stays gentle on a loaded machine.
/// </summary>
public class QuantityParserPropertyTests
{
    private static readonly QuantityKind[] Kinds = Enum.GetValues<QuantityKind>();

    /// <summary>Each kind with each of its spellings that has no offset (the kelvin scales; degC and degF are checked in the unit table).</summary>
    private static readonly (QuantityKind Kind, string Unit, double Scale)[] ScaledUnits = Kinds
        .SelectMany(kind => QuantityParser.UnitSpellings(kind).Select(unit => (kind, unit)))
        .Where(x => Parse($"0 {x.unit}", x.kind) == 0)
        .Select(x => (x.kind, x.unit, Parse($"1 {x.unit}", x.kind)))
        .ToArray();

    private static double Parse(string text, QuantityKind kind) =>
        QuantityParser.TryParse(text, kind, out var si, out var error) ? si : throw new InvalidOperationException(error);

    // value -> "{value} {unit}" -> SI -> divided by the unit's scale gives the value back: two roundings (the
    // product and the quotient), so within 2 ulp, i.e. 2 x 2^-52 relative. Values stay within 1e-200..1e200
    // so that no product leaves the normal range of doubles (the unit scales lie within 1e-72..1e48).
    [Fact]
    public void A_value_written_with_any_unit_reads_back_within_two_ulp()
    {
        Gen.Select(Gen.Int[0, ScaledUnits.Length - 1], Gen.Double[-200, 200], Gen.Double[1, 10], Gen.Int[0, 1])
            .Sample((index, exponent, mantissa, sign) =>
            {
                var (kind, unit, scale) = ScaledUnits[index];
                var value = (sign == 0 ? 1 : -1) * mantissa * Math.Pow(10, exponent);
                var text = $"{value.ToString("R", CultureInfo.InvariantCulture)} {unit}";
                Assert.True(QuantityParser.TryParse(text, kind, out var si, out var error), $"{text}: {error}");
                var back = si / scale;
                Assert.True(Math.Abs(back - value) <= 2 * Math.Pow(2, -52) * Math.Abs(value), $"{text} as {kind}: read back {back:R}");
            }, iter: 20_000, threads: 1);
    }

    // Any double (NaN, infinities, subnormals, the extremes) with any unit, or no unit: a finite result or a
    // refusal with a reason, never an exception, never a non-finite number.
    [Fact]
    public void Any_number_with_any_unit_gives_a_finite_value_or_a_reason()
    {
        Gen.Select(Gen.Enum<QuantityKind>(), Gen.Double.Special, Gen.Int[-1, ScaledUnits.Length - 1])
            .Sample((kind, value, index) =>
            {
                var text = value.ToString("R", CultureInfo.InvariantCulture) + (index < 0 ? "" : " " + ScaledUnits[index].Unit);
                CheckTotal(text, kind);
            }, iter: 20_000, threads: 1);
    }

    // Arbitrary text made of the characters units and numbers are written with (and some that are not).
    [Fact]
    public void Any_text_gives_a_finite_value_or_a_reason()
    {
        var chars = Gen.Char["0123456789.+-eE mkMGTunµμΩohmOHzsSBiK°C/^23²³*·degFtlbrPainf N\t\"'"];
        Gen.Select(Gen.Enum<QuantityKind>(), chars.Array[0, 24])
            .Sample((kind, text) => CheckTotal(new string(text), kind), iter: 50_000, threads: 1);
        Gen.Select(Gen.Enum<QuantityKind>(), Gen.String)
            .Sample((kind, text) => CheckTotal(text, kind), iter: 20_000, threads: 1);
    }

    private static void CheckTotal(string text, QuantityKind kind)
    {
        bool ok;
        double si;
        string error;
        try { ok = QuantityParser.TryParse(text, kind, out si, out error); }
        catch (Exception e) { throw new Xunit.Sdk.XunitException($"\"{text}\" as {kind} threw {e}"); }
        if (ok) Assert.True(double.IsFinite(si), $"\"{text}\" as {kind} gave {si}");
        else
        {
            Assert.True(double.IsNaN(si));
            Assert.False(string.IsNullOrWhiteSpace(error), $"\"{text}\" as {kind}: refused without a reason");
        }
    }
}
