using SlotOpt.Design;
using SlotOpt.Selection;
using SlotOpt.Selection.Search;

namespace SlotOpt.Tests.Selection;

public class IntegerScaleTests
{
    // Half away from zero on the decimal reading of the double (hand arithmetic): 1.005 -> 100.5 -> 101 cents
    // (the binary double is 1.00499999999999989..., which naive x*100 would round to 100); 2.675 -> 268;
    // 0.125 -> 12.5 -> 13; -0.125 -> -13 (away from zero, not to even).
    [Theory]
    [InlineData(1.005, 101)]
    [InlineData(2.675, 268)]
    [InlineData(0.125, 13)]
    [InlineData(-0.125, -13)]
    [InlineData(0.0049, 0)]
    [InlineData(1234.56, 123456)]
    public void Money_becomes_cents_half_away_from_zero(double money, long cents) =>
        Assert.Equal(cents, IntegerScale.ToCents(money));

    // 0.0125 W = 12.5 mW -> 13; 0.0004 W = 0.4 mW -> 0; 4.5 W -> 4500 mW (hand arithmetic).
    [Theory]
    [InlineData(0.0125, 13)]
    [InlineData(0.0004, 0)]
    [InlineData(4.5, 4500)]
    public void Loss_becomes_milliwatts_half_away_from_zero(double watts, long milliwatts) =>
        Assert.Equal(milliwatts, IntegerScale.ToMilliwatts(watts));

    // 5 currency/W = 500 cents/W = 500000 cents/kW; 0.123456 currency/W = 12345.6 cents/kW -> 12346.
    [Theory]
    [InlineData(5.0, 500_000)]
    [InlineData(0.123456, 12_346)]
    public void Capitalisation_rate_becomes_whole_cents_per_kilowatt(double valuePerWatt, long centsPerKilowatt) =>
        Assert.Equal(centsPerKilowatt, IntegerScale.ToCentsPerKilowatt(valuePerWatt));

    // 150.00 + 5/W * 7 W = 185.00: 1e6 * 15000 + 500000 * 7000 = 15e9 + 3.5e9 microcents (hand arithmetic).
    [Fact]
    public void Owning_cost_is_exact_in_microcents()
    {
        Assert.Equal(18_500_000_000L, IntegerScale.OwningMicrocents(15_000, 7_000, 500_000));
        Assert.Equal(185.0, IntegerScale.MicrocentsToMoney(18_500_000_000L));
    }

    [Fact]
    public void Values_beyond_exact_scaling_are_refused()
    {
        Assert.Throws<InputException>(() => IntegerScale.ToCents(double.NaN));
        Assert.Throws<InputException>(() => IntegerScale.ToMilliwatts(double.PositiveInfinity));
        Assert.Throws<InputException>(() => IntegerScale.ToCents(1e13));
    }

    // 1e11 currency is 1e13 cents, 1e19 microcents: past the long range (9.2e18), so the problem is refused
    // as a user mistake rather than overflowing.
    [Fact]
    public void A_problem_whose_owning_cost_overflows_is_refused()
    {
        var problem = new SelectionProblem([Options.Part("hull", Options.Option("H", 1e11, 1))], new SharedLimits(), Objective.LowestOwningCost, ValuePerWatt: 1);
        var error = Assert.Throws<InputException>(() => new CpSatSelector().Select(problem));
        Assert.Contains("too large to rank exactly in integers", error.Message);
    }
}
