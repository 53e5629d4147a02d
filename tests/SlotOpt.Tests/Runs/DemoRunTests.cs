using SlotOpt.Design;
using SlotOpt.Optimization;
using SlotOpt.Problems;

namespace SlotOpt.Tests.Runs;

public class DemoRunTests
{
    private static RunResult Run(string demo) =>
        DesignRun.Execute(ProblemReader.ReadFile(Path.Combine(AppContext.BaseDirectory, "problems", demo)));

    // Issue 5: on the conveyor demo the chosen rail meets the drag limit and every manufacturing rule, and
    // costs less to own than the solid rail.
    [Fact]
    public void Conveyor_rail_meets_its_drag_limit_and_beats_the_solid_rail()
    {
        var result = Run("conveyor-rail.toml");
        Assert.Equal(SelectionStatus.Optimal, result.Outcome.Status);
        var rail = Assert.Single(result.Chosen!);
        var part = Assert.IsType<PlatePart>(result.Problem.Parts[0]);
        Assert.True(rail.IsFeasible);
        Assert.True(rail.DragN <= part.MaxDragN, $"drag {rail.DragN} N");
        var solid = result.Parts[0].Options.Where(o => o.Choice is PlateChoice { Slots: null }).ToList();
        var vpw = result.Problem.Economics.ValuePerWatt;
        Assert.All(solid, s => Assert.True(rail.BuildCost + vpw * rail.Loss.TotalW < s.BuildCost + vpw * s.Loss.TotalW));
    }

    // Issue 5: at 400 Hz a thinner gauge than the 50 Hz habit (M400-50A, 0.50 mm) wins on owning cost
    // (REFERENCES §9 rule of thumb: 400 Hz - 1 kHz wants 0.10-0.20 mm).
    [Fact]
    public void Motor_core_at_400_Hz_takes_a_thinner_gauge_than_the_50_Hz_habit()
    {
        var result = Run("motor-core-400hz.toml");
        var chosen = Assert.IsType<CoreChoice>(Assert.Single(result.Chosen!).Choice);
        var steel = result.Problem.Library.GetSteel(chosen.Grade, "test");
        Assert.True(steel.ThicknessM < 0.50e-3, chosen.Grade);
        Assert.True(result.OwningCost < result.Reference.OwningCost(result.Problem.Economics.ValuePerWatt));
    }

    // The shared coil: stator and mover of the actuator demo take the same grade and gauge.
    [Fact]
    public void Actuator_parts_of_one_coil_share_grade_and_gauge()
    {
        var result = Run("actuator-product.toml");
        var stator = Assert.IsType<CoreChoice>(result.Chosen![0].Choice);
        var mover = Assert.IsType<CoreChoice>(result.Chosen![1].Choice);
        Assert.Equal(stator.Grade, mover.Grade);
        Assert.True(result.TotalBuildCost <= result.Problem.Limits.Budget);
        Assert.NotNull(result.Outcome.Front);
        Assert.Contains(result.Outcome.Front!.Points, p => Math.Abs(p.BuildCost - result.TotalBuildCost) < 0.005 && Math.Abs(p.LossW - result.TotalLossW) < 0.0005);
    }

    // An impossible budget: the run says the budget binds and names the least budget that would do.
    [Fact]
    public void An_impossible_budget_is_named_as_the_binding_limit()
    {
        var path = Path.Combine(AppContext.BaseDirectory, "problems", "actuator-product.toml");
        var text = File.ReadAllText(path).Replace("budget = 30 ", "budget = 5 ");
        var result = DesignRun.Execute(ProblemReader.Read(text, path));
        Assert.Equal(SelectionStatus.Infeasible, result.Outcome.Status);
        Assert.Null(result.Chosen);
        var binding = Assert.Single(result.Outcome.Diagnosis!.BindingLimits);
        Assert.Equal(SharedLimitKind.Budget, binding.Kind);
        Assert.Contains(result.Outcome.Diagnosis.Explain(), line => line.StartsWith("the budget", StringComparison.Ordinal));
    }
}
