using SlotOpt.Design;
using SlotOpt.Design.Cores;
using SlotOpt.Materials;
using SlotOpt.Waveforms;

namespace SlotOpt.Tests.Design;

public class CutEdgeDamageTests
{
    // Band model of the degraded cut edge, P(w)/P0 = 1 + 2 (delta_c / w)(K_c - 1), for a strip of width w with two cut
    // edges (two-zone model; depths and loss ratios per process reviewed by M. Bali and A. Muetze, IEEE Trans. Ind. Appl.
    // 55(1):366-375, 2019, who report +10 to +50 % for 5-10 mm teeth of 0.35-0.5 mm NO steel at 1.0-1.5 T). The check
    // values are the model's closed form at the built-in parameters (punching 0.5 mm at 2.0, laser 1.0 mm at 1.8, wire
    // EDM 0.1 mm at 1.5; from memory within the review's ranges), taken through a strip 1 m long: area w x 1 m, cut
    // length 2 m. Tolerance 5e-5: the values are quoted to four decimals.
    [Theory]
    [InlineData("punching", 3, 1.3333)]
    [InlineData("punching", 5, 1.2000)]
    [InlineData("punching", 10, 1.1000)]
    [InlineData("punching", 30, 1.0333)]
    [InlineData("laser", 3, 1.5333)]
    [InlineData("laser", 5, 1.3200)]
    [InlineData("laser", 10, 1.1600)]
    [InlineData("wire-edm", 5, 1.0200)]
    [InlineData("wire-edm", 30, 1.0033)]
    public void Strip_loss_follows_the_band_model(string process, double widthMm, double expected)
    {
        var p = CuttingProcessLibrary.BuiltIn[process];
        Assert.Equal(expected, CutEdgeDamage.LossFactor(2.0, widthMm * 1e-3 * 1.0, p), 5e-5);
    }

    // A strip narrower than two bands is degraded through: the factor stops at K_c (the model's own limit).
    [Fact]
    public void Narrow_strip_is_degraded_through()
    {
        var punching = CuttingProcessLibrary.BuiltIn["punching"];
        Assert.Equal(2.0, CutEdgeDamage.LossFactor(2.0, 0.5e-3, punching), 1e-12);
    }

    // The process choice changes the loss, not only the cost: the same stator lamination loses most when laser cut,
    // then punched, least by wire EDM, each by exactly its band factor (the rest of the option is the same).
    [Fact]
    public void Process_choice_changes_the_core_loss()
    {
        var shop = ManufacturingSettings.Default;
        var part = new CorePart("stator", 1, Conductor.RoomTemperatureK, null, ["M270-35A"], ["punching", "laser", "wire-edm"],
            0.0105, 0.08, 2.6, new SineWaveform(1.3, 400), 4.5e-3, null);
        var steel = MaterialLibrary.BuiltIn.GetSteel("M270-35A", "test");
        double Loss(string process) => CoreOptions.EvaluateOne(part, steel, shop.Processes[process], shop).Loss.TotalW;
        var edm = Loss("wire-edm");
        Assert.True(Loss("laser") > Loss("punching") && Loss("punching") > edm);
        var undamaged = edm / CutEdgeDamage.LossFactor(2.6, 0.0105, shop.Processes["wire-edm"]);
        Assert.Equal(undamaged * (1 + 2.6 * 0.5e-3 / 0.0105), Loss("punching"), undamaged * 1e-9);
    }
}
