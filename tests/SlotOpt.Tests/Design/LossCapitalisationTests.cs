using SlotOpt.Design;

namespace SlotOpt.Tests.Design;

public class LossCapitalisationTests
{
    // Worked example computed on the construction of IEEE Std C57.120-1991, IEEE Loss Evaluation Guide for
    // Power Transformers and Reactors (A = C_energy x 8760 h x PVF, PVF = ((1+i)^n - 1)/(i (1+i)^n)): 0.10 $/kWh,
    // 8760 h, 8 %, 30 years: PVF = 11.258 and A = 9.86 $/W; 0.08 $/kWh, 5 %, 25 years: A = 9.88 $/W.
    // Tolerances: half a unit of the last printed digit.
    [Fact]
    public void Matches_the_worked_examples()
    {
        Assert.Equal(11.258, LossCapitalisation.PresentWorthFactor(0.08, 30), 5e-4);
        Assert.Equal(9.86, LossCapitalisation.ValuePerWatt(0.10, 8760, 0.08, 30), 5e-3);
        Assert.Equal(9.88, LossCapitalisation.ValuePerWatt(0.08, 8760, 0.05, 25), 5e-3);
    }

    // Zero discount rate: the plain sum of n years (limit of the annuity formula). Exact.
    [Fact]
    public void Zero_rate_is_the_plain_sum()
    {
        Assert.Equal(25, LossCapitalisation.PresentWorthFactor(0, 25));
    }
}
