using SlotOpt.Design.SolidParts;
using SlotOpt.Design;
using SlotOpt.Design.Cores;
using SlotOpt.Input;
using SlotOpt.Plates;
using SlotOpt.Runs;
using SlotOpt.Selection;
using SlotOpt.Tests.Selection;

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
    // (400 Hz - 1 kHz wants 0.10-0.20 mm: common practice, no source; IEC 60404-8-8 specifies its thin grades at 400 Hz and above).
    [Fact]
    public void Motor_core_at_400_Hz_takes_a_thinner_gauge_than_the_50_Hz_habit()
    {
        var result = Run("motor-core-400hz.toml");
        var chosen = Assert.IsType<CoreChoice>(Assert.Single(result.Chosen!).Choice);
        var steel = result.Problem.Library.GetSteel(chosen.Grade, "test");
        Assert.True(steel.ThicknessM < 0.50e-3, chosen.Grade);
        Assert.True(result.OwningCost < result.Reference.OwningCost(result.Problem));
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

public class PlateConfirmationTests
{
    // Issue 8, item 3: the chosen rail is confirmed with the model its validity figures call for. At Rm = 0.14
    // the thin-sheet reaction model runs (ReactionModelChoice: Rm > sqrt(0.01)), and by Reitz 1970 / Saslow 1992
    // (Reitz, J. Appl. Phys. 41:2067, 1970, and Saslow, Am. J. Phys. 60(8):693-711, 1992, re-derived for a thin sheet:
    // drag/drag_low = 1/(1 + Rm^2) for a line source, (2/Rm)(1 - 1/sqrt(1+Rm^2)) axisymmetric) the
    // drag falls by 1-2 %: confirmed drag within 5 % below the screen, and lift = drag Rm > 0. Issue 12: the rail was ranked with
    // that model already, so the chosen option's own loss and drag are the confirmed ones (the same converged solve: 1e-6 relative
    // allows for the reduced basis stopping at 1e-8 in the ranking and again in the confirmation).
    [Fact]
    public void Conveyor_rail_is_confirmed_with_its_own_field()
    {
        var result = DesignRun.Execute(ProblemReader.ReadFile(Path.Combine(AppContext.BaseDirectory, "problems", "conveyor-rail.toml")));
        var rail = result.Chosen![0];
        var confirmed = result.Confirmation(rail.PartName)!;
        Assert.Equal(SheetModelKind.ThinSheetReaction, confirmed.Model);
        Assert.Equal("own-field", rail.Model!.Name);
        Assert.InRange(confirmed.LossW / confirmed.ResistanceLimitedLossW, 0.95, 1.0);
        Assert.True(confirmed.LiftN > 0);
        Assert.Equal(rail.Loss.TotalW, confirmed.LossW, rail.Loss.TotalW * 1e-6);
        Assert.Equal(rail.DragN!.Value, confirmed.DragN!.Value, rail.DragN.Value * 1e-6);
    }

    // A solid aluminium carrier plate at 200 Hz has Rm = mu0 sigma t omega L / 2 ~ 5: the plate screens the field, so the
    // confirmed loss is well below the resistance-limited screen (the thin-disc check of the reaction solver,
    // tests/Plates/OwnField, shows the ratio falling to 0.68 at beta = 2).
    [Fact]
    public void An_aluminium_plate_at_200_Hz_loses_less_than_the_screen_says()
    {
        var path = Path.Combine(AppContext.BaseDirectory, "problems", "actuator-product.toml");
        var text = File.ReadAllText(path).Replace("materials = [\"SS-304\", \"SS-316\"]", "materials = [\"Al-6061-T6\"]").Replace("thicknesses = [\"2 mm\", \"3 mm\"]", "thicknesses = [\"3 mm\"]");
        text = text[..text.IndexOf("[[parts.slots]]", StringComparison.Ordinal)];   // a solid plate: its widest loop is the plate's 90 mm

        var result = DesignRun.Execute(ProblemReader.Read(text, path));
        var confirmed = Assert.Single(result.Confirmations);
        Assert.NotEqual(SheetModelKind.ResistanceLimited, confirmed.Model);
        Assert.True(confirmed.LossW < 0.9 * confirmed.ResistanceLimitedLossW, $"{confirmed.LossW} W vs screen {confirmed.ResistanceLimitedLossW} W");
    }
}
