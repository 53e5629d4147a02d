using SlotOpt.Design;
using SlotOpt.Design.SolidParts;

namespace SlotOpt.Tests.Design;

/// <summary>
/// One wanted braking quantity for both kinds of part: a sliding part's drag in N at m/s (min_drag) and a turning disc's torque in N m at rpm
/// (min_torque). The screen scales the number at the source's speed linearly to the named speed: with the resistance-limited loss P ~ v^2,
/// F = P / v and T = P / omega grow as v (power balance of a steady motion, common practice, no source).
/// </summary>
public class BrakingMinimumTests
{
    [Fact]
    public void A_drag_below_its_minimum_at_the_named_speed_breaks_the_drag_rule_in_newtons()
    {
        var wanted = BrakingMinimum.Drag(10, 0.6);
        // 4 N at 0.3 m/s is 8 N at 0.6 m/s (exact in binary floating point): short of 10 N
        Assert.Equal(8, wanted.ScreenValue(4, 0.3), 12);
        var broken = wanted.Check(4, 0.3)!;
        Assert.Equal(RuleKind.DragBelowMinimum, broken.Kind);
        Assert.Equal("drag 8 N at 0.6 m/s is below the part's minimum of 10 N", broken.Message);
        Assert.Null(wanted.Check(5, 0.3));   // 10 N at 0.6 m/s reaches it: the minimum is inclusive
    }

    [Fact]
    public void A_torque_below_its_minimum_at_the_named_speed_breaks_the_torque_rule_in_newton_metres()
    {
        var wanted = BrakingMinimum.Torque(0.02, 1500);
        Assert.Equal(0.015, wanted.ScreenValue(0.01, 1000), 12);
        var broken = wanted.Check(0.01, 1000)!;
        Assert.Equal(RuleKind.TorqueBelowMinimum, broken.Kind);
        Assert.Equal("torque 0.015 N m at 1500 rpm is below the part's minimum of 0.02 N m", broken.Message);
        Assert.Null(wanted.Check(0.02, 1000));
    }

    [Theory]
    [InlineData(0, 1, "a minimum drag must be positive")]
    [InlineData(1, double.NaN, "the speed of a minimum drag must be positive")]
    public void A_minimum_that_is_not_positive_is_refused(double value, double speed, string expected)
    {
        var e = Assert.Throws<InputException>(() => BrakingMinimum.Drag(value, speed));
        Assert.StartsWith(expected, e.Message);
        Assert.Throws<InputException>(() => BrakingMinimum.Torque(value, speed));
    }
}
