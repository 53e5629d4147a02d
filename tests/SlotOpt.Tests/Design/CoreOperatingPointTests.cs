using SlotOpt.Design;
using SlotOpt.Design.Cores;
using SlotOpt.Materials;
using SlotOpt.Waveforms;

namespace SlotOpt.Tests.Design;

public class CoreOperatingPointTests
{
    private static CorePart Core(IFluxWaveform flux, params string[] grades) => new(
        "core", 1, Conductor.RoomTemperatureK, null, grades, ["laser"], 0.01, 0.05, 0.4, flux, double.PositiveInfinity, null);

    // The stacking factor is the steel's share of the gross stack volume (IEC 60404-13; ASTM A719), so for a flux
    // given over the gross section B_steel = B / SF and the steel mass is proportional to SF. With P = kh f B^alpha +
    // classical (B^2) + excess (B^1.5) per kg, each term of the part's loss scales as SF^(1 - exponent):
    // loss(0.88) / loss(0.97) = sum_t L_t(0.97) (0.97/0.88)^(exponent_t - 1) > 1 (derived from that definition).
    // Tolerance 1e-9 relative: the skin factor does not depend on the amplitude (linear permeability).
    [Fact]
    public void Lower_stacking_factor_loses_more_for_the_same_gross_flux()
    {
        var m270 = MaterialLibrary.BuiltIn.GetSteel("M270-35A", "test");
        var dense = m270 with { Grade = "dense", StackingFactor = 0.97 };
        var loose = m270 with { Grade = "loose", StackingFactor = 0.88 };
        var part = Core(new SineWaveform(1.2, 50), "dense", "loose");
        var shop = ManufacturingSettings.Default;
        var a = CoreOptions.EvaluateOne(part, dense, shop.Processes["laser"], shop).Loss;
        var b = CoreOptions.EvaluateOne(part, loose, shop.Processes["laser"], shop).Loss;
        var ratio = 0.97 / 0.88;
        var expected = a.HysteresisW * Math.Pow(ratio, m270.HysteresisExponent - 1) + a.ClassicalW * ratio + a.ExcessW * Math.Pow(ratio, 0.5);
        Assert.Equal(expected, b.TotalW, expected * 1e-9);
        Assert.True(b.TotalW > a.TotalW * 1.05, $"0.88 stacking factor: {b.TotalW} W against {a.TotalW} W at 0.97");
    }

    // The report shows the flux in the steel: 1.2 T / 0.96 = 1.25 T for M270-35A (stacking factor 0.96 in the
    // grade table). Tolerance: the attribute is printed to 3 decimals.
    [Fact]
    public void Option_reports_the_steel_flux_density()
    {
        var shop = ManufacturingSettings.Default;
        var m270 = MaterialLibrary.BuiltIn.GetSteel("M270-35A", "test");
        var option = CoreOptions.EvaluateOne(Core(new SineWaveform(1.2, 50), "M270-35A"), m270, shop.Processes["laser"], shop);
        Assert.Equal(1.2 / m270.StackingFactor, double.Parse(option.Attributes["steel_flux_t"], System.Globalization.CultureInfo.InvariantCulture), 5e-4);
    }
}
