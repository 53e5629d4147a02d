using SlotOpt.Design;
using SlotOpt.Input;
using SlotOpt.Runs;

namespace SlotOpt.Tests.Design;

public class LoadLossCapitalisationTests
{
    private static string Problem(string economics) => $"""
        [problem]
        name = "two cores"
        currency = "USD"

        [economics]
        {economics}

        [[parts]]
        name = "core"
        kind = "core"
        grades = ["M270-35A"]
        lamination_area = "0.01 m2"
        stack_height = "50 mm"
        flux = "1.2 T"
        frequency = "50 Hz"

        [[parts]]
        name = "stray"
        kind = "core"
        loss_kind = "load"
        grades = ["M400-50A"]
        lamination_area = "0.01 m2"
        stack_height = "50 mm"
        flux = "1.0 T"
        frequency = "50 Hz"
        """;

    // Owning cost with separate no-load (A) and load (B) values (IEEE Std C57.120-1991: TOC = cost + A x no-load
    // loss + B x load loss), checked by hand from the options' own build costs and losses. Tolerance 1e-9 relative.
    [Fact]
    public void Owning_cost_values_no_load_and_load_loss_apart()
    {
        var problem = ProblemReader.Read(Problem("no_load_value_per_watt = 12.0\nload_value_per_watt = 3.0"), "two-cores.toml");
        Assert.Equal(LossKind.NoLoad, problem.Parts[0].LossKind);
        Assert.Equal(LossKind.Load, problem.Parts[1].LossKind);
        var core = ReferenceDesigns.CurrentOrBaseline(problem.Parts[0], problem);
        var stray = ReferenceDesigns.CurrentOrBaseline(problem.Parts[1], problem);
        var byHand = core.BuildCost + stray.BuildCost + 12.0 * core.Loss.TotalW + 3.0 * stray.Loss.TotalW;
        Assert.Equal(byHand, problem.OwningCost([core, stray]), byHand * 1e-9);

        // value_per_watt still means both the same
        var same = ProblemReader.Read(Problem("value_per_watt = 12.0"), "two-cores.toml");
        Assert.False(same.Economics.SeparatesLoadLoss);
        var sameByHand = core.BuildCost + stray.BuildCost + 12.0 * (core.Loss.TotalW + stray.Loss.TotalW);
        Assert.Equal(sameByHand, same.OwningCost([core, stray]), sameByHand * 1e-9);
    }

    // A and B derived from the energy price (IEEE Std C57.120-1991 form): 0.10 /kWh, 8760 h, 6 %, 30 years give
    // PVF = (1.06^30 - 1) / (0.06 x 1.06^30) = 13.7648 and A = 0.876 x 13.7648 = 12.0580 /W; load factor 0.6 gives the
    // loss factor 0.3 x 0.6 + 0.7 x 0.36 = 0.432 (F. H. Buller, C. A. Woodrow, Electrical World 92(2), 1928), and a
    // per-unit peak load of 0.8 makes B = A x 0.64 x 0.432 = 3.3338 /W. Tolerance: half a unit of the 4th decimal (5e-5).
    [Fact]
    public void Load_loss_value_follows_load_factor_and_per_unit_load()
    {
        var problem = ProblemReader.Read(Problem("energy_price_per_kwh = 0.10\nhours_per_year = 8760\nyears = 30\ndiscount_rate = 0.06\nload_factor = 0.6\nper_unit_load = 0.8"), "two-cores.toml");
        Assert.Equal(12.0580, problem.Economics.ValuePerWatt, 5e-5);
        Assert.Equal(0.27648, problem.Economics.LoadEnergyShare!.Value, 1e-12);
        Assert.Equal(3.3338, problem.Economics.ValuePerWattFor(LossKind.Load), 5e-5);
        Assert.Equal(0.876 * 0.27648, problem.Economics.YearlyCostPerWattFor(LossKind.Load)!.Value, 1e-12);
    }

    [Fact]
    public void Conflicting_economics_keys_are_refused()
    {
        var e = Assert.Throws<InputException>(() => ProblemReader.Read(Problem("value_per_watt = 5\nno_load_value_per_watt = 12.0\nload_value_per_watt = 3.0"), "two-cores.toml"));
        Assert.Contains("give one of", e.Message);
        Assert.Throws<InputException>(() => ProblemReader.Read(Problem("value_per_watt = 5\nload_factor = 0.5"), "two-cores.toml"));
    }
}
