using SlotOpt.Design;
using SlotOpt.Design.Limits;
using SlotOpt.Design.SolidParts;
using SlotOpt.Input;
using SlotOpt.Plates;
using SlotOpt.Plates.Conductors;
using SlotOpt.Plates.Geometry;
using SlotOpt.Plates.Grid;
using SlotOpt.Plates.Sources;
using SlotOpt.Runs;
using Xunit.Abstractions;

namespace SlotOpt.Tests.Plates;

/// <summary>
/// Every plate result carries its grid-error estimate (three grids with their observed order and the grid convergence index, or two
/// grids where the coarsest cannot resolve the plate): the procedure against its published worked example, and the estimate against
/// the actual error of plates with closed forms.
/// </summary>
public class DiscretisationErrorTests(ITestOutputHelper output)
{
    // G = 1e7 S/m x 0.1 mm = 1000 S: Rm = mu0 G omega L / 2 = 0.0197 at 50 Hz over 0.1 m, resistance-limited.
    private static readonly ConductingSheet Thin = new(1e7, 1e-4);
    private static readonly UniformAcField Field = new(0.01, 50);

    // I. B. Celik et al., "Procedure for estimation and reporting of uncertainty due to discretization in CFD applications",
    // J. Fluids Eng. 130:078001, 2008, Table 1, first column (from memory): N = 18000, 8000, 4500 cells in 2-D (h ~ N^-1/2, so
    // r21 = 1.5, r32 = 1.333), phi = 6.063, 5.972, 5.863; p = 1.53, e_a21 = 1.5 %, GCI_fine21 = 2.2 %. Unequal ratios exercise the
    // fixed-point iteration of Eq. 3. Tolerance: the table's rounding (p to 0.005, the GCI to 0.05 %).
    [Fact]
    public void Celik_worked_example_gives_its_order_and_index()
    {
        var e = DiscretisationError.FromThreeGrids(6.063, 5.972, 5.863, 1 / Math.Sqrt(18000), 1 / Math.Sqrt(8000), 1 / Math.Sqrt(4500));
        Assert.Equal(GridErrorMethod.ThreeGrid, e.Method);
        Assert.Equal(1.53, e.ObservedOrder!.Value, 0.005);
        Assert.Equal(0.022, e.Relative, 0.0005);
        Assert.Equal(1.25, e.SafetyFactor);
        Assert.Equal("three-grid", e.MethodName);
    }

    // A sequence of known order, P(h) = P0 + C h^p (Richardson 1927's error model itself): the observed order is p to rounding
    // (1e-9) for equal and unequal refinement ratios, and the GCI is Fs = 1.25 times the actual error of the fine value, to 1e-9.
    [Theory]
    [InlineData(2.0, 1.0, 2.0, 4.0)]
    [InlineData(1.3, 1.0, 2.0, 4.0)]
    [InlineData(1.7, 1.0, 1.5, 2.6)]
    public void A_sequence_of_known_order_gives_that_order(double p, double h1, double h2, double h3)
    {
        double P(double h) => 10.0 + 0.3 * Math.Pow(h, p);
        var e = DiscretisationError.FromThreeGrids(P(h1), P(h2), P(h3), h1, h2, h3);
        Assert.Equal(p, e.ObservedOrder!.Value, 1e-9);
        double actual = Math.Abs(P(h1) - 10.0) / P(h1);
        Assert.Equal(1.25 * actual, e.Relative, 1e-9);
    }

    // The fall-backs Roache (1997) gives for an order the grids do not confirm: differences of opposite sign (oscillatory convergence)
    // or an observed order under 0.5 take order 1 with Fs = 3, i.e. three times the change between the fine grids (r = 2); an observed
    // order above 2 is taken as 2. Exact algebra: 1e-12.
    [Fact]
    public void Oscillating_or_slow_sequences_take_order_1_with_factor_3_and_fast_ones_order_2()
    {
        var oscillating = DiscretisationError.FromThreeGrids(1.00, 1.02, 1.01, 1, 2, 4);
        Assert.Equal(GridErrorMethod.ThreeGridOrderUnconfirmed, oscillating.Method);
        Assert.Null(oscillating.ObservedOrder);
        Assert.Equal(3 * 0.02, oscillating.Relative, 1e-12);
        Assert.Contains("change sign", oscillating.Description);

        var slow = DiscretisationError.FromThreeGrids(1.00, 1.02, 1.045, 1, 2, 4);   // differences 0.02 then 0.025: p = log2(1.25) = 0.32
        Assert.Equal(GridErrorMethod.ThreeGridOrderUnconfirmed, slow.Method);
        Assert.Equal(Math.Log2(1.25), slow.ObservedOrder!.Value, 1e-12);
        Assert.Equal(3 * 0.02, slow.Relative, 1e-12);

        var fast = DiscretisationError.FromThreeGrids(1.00, 1.02, 1.20, 1, 2, 4);    // differences 0.02 then 0.18: p = log2(9) = 3.17
        Assert.Equal(GridErrorMethod.ThreeGrid, fast.Method);
        Assert.Equal(2, fast.Order);
        Assert.Equal(1.25 * 0.02 / 3, fast.Relative, 1e-12);
    }

    private (double Actual, DiscretisationError Estimate) Case(PlateGeometry plate, double cellM, double exactW)
    {
        var model = SheetModel.Build(plate, new GridOptions { CellSizeM = cellM });
        var solution = PlateModels.SolveAc(model, Field, Thin);
        solution = PlateModels.WithGridError(solution, model, m => PlateModels.SolveAc(m, Field, Thin, forcedKind: solution.Choice.Kind));
        Assert.Equal(SheetModelKind.ResistanceLimited, solution.Choice.Kind);
        double actual = Math.Abs(solution.MeanLossW / exactW - 1);
        output.WriteLine($"cell {cellM * 1e3} mm: actual {actual:E3}, estimate {solution.GridError!.Relative:E3} ({solution.GridError.Description})");
        return (actual, solution.GridError!);
    }

    // Grid-aligned 200 x 100 mm rectangle (second order): P = G omega^2 Bp^2 J / 8 with J from the Timoshenko & Goodier series (Theory
    // of Elasticity, 3rd ed., 1970, ch. 10). The three-grid estimate must cover the actual error (the GCI's promise) and, with its
    // factor 1.25 over an order near 2, stay within 2 times it (measured 1.64 at 10 and 1.31 at 20 cells across: observed order 1.69 and
    // 1.94, the coarsest grid 2.7 and 5 cells across). The two-grid order-1 estimate it replaces was 2.9 to 3 times the actual error.
    [Theory]
    [InlineData(0.01)]    // 10 cells across the short side
    [InlineData(0.005)]   // 20
    public void Estimate_covers_the_error_of_a_rectangle_within_twice(double cellM)
    {
        double exact = TorsionReference.AcLossW(Thin.SheetConductanceS, Field.PeakT, Field.FrequencyHz, TorsionReference.Rectangle(0.1, 0.2));
        var (actual, estimate) = Case(PlateGeometry.Rectangle(0.2, 0.1), cellM, exact);
        Assert.Equal(GridErrorMethod.ThreeGrid, estimate.Method);
        Assert.InRange(estimate.Relative / actual, 1, 2);
    }

    // Disc of radius 50 mm (cut cells on the circle: first order, irregular): J = pi r^4 / 2 (Timoshenko & Goodier 1970, ch. 10). At
    // 16 cells per radius the grids show order 0.82; the estimate must cover the actual error and stay within 2 times it (measured 1.64:
    // 5.6 % estimated, 3.4 % actual).
    [Fact]
    public void Estimate_covers_the_error_of_a_disc_within_twice()
    {
        const double r = 0.05;
        double exact = TorsionReference.AcLossW(Thin.SheetConductanceS, Field.PeakT, Field.FrequencyHz, Math.PI * Math.Pow(r, 4) / 2);
        var (actual, estimate) = Case(new PlateGeometry(Polygon.Circle(new Vec2(r, r), r)), r / 16, exact);
        Assert.Equal(GridErrorMethod.ThreeGrid, estimate.Method);
        Assert.InRange(estimate.Relative / actual, 1, 2);
    }

    // The warning: on 4 cells across the 100 mm side there is no grid of 4 times the cell (1 cell across), so the estimate is the
    // two-grid one; it exceeds 1 % and says so, naming the method, both cells and why there is no third grid.
    [Fact]
    public void A_large_estimate_is_a_warning_that_names_its_method()
    {
        double exact = TorsionReference.AcLossW(Thin.SheetConductanceS, Field.PeakT, Field.FrequencyHz, TorsionReference.Rectangle(0.1, 0.2));
        var (_, estimate) = Case(PlateGeometry.Rectangle(0.2, 0.1), 0.025, exact);
        Assert.True(estimate.IsLarge);
        Assert.Equal(GridErrorMethod.TwoGrid, estimate.Method);
        Assert.Equal("two-grid", estimate.MethodName);
        Assert.Contains("25 mm against 50 mm cells, order 1 assumed", estimate.Warning);
        Assert.Contains("100 mm cells cannot be built", estimate.Warning);
    }

    // The finer-grid estimate on a sequence of known order, P(h) = P0 + C h^p (Richardson 1927's error model): the extrapolation from the
    // pair h, h/2 at order 1 (I. B. Celik et al., J. Fluids Eng. 130:078001, 2008, Eq. 4a, from memory) is exact for p = 1, so the estimate of
    // the h value's error is Fs = 1.25 times its actual error (the coarse-grid GCI, Fs r^p |eps| / (r^p - 1): P. J. Roache, J. Fluids Eng.
    // 116:405-413, 1994, from memory; Fs from Roache, Annu. Rev. Fluid Mech. 29:123-160, 1997); for p = 2 the order-1 assumption
    // overstates by r (1 - r^-p) / (r - 1), 2 x (3/4) = 1.5 at r = 2, so 1.875 times. For r = 2 and r = 1.5. Exact algebra: 1e-12.
    [Theory]
    [InlineData(1.0, 2.0, 1.0, 1.25)]
    [InlineData(1.0, 3.0, 2.0, 1.25)]
    [InlineData(2.0, 2.0, 1.0, 1.875)]
    public void Finer_grid_estimate_of_a_sequence_of_known_order(double p, double h, double hFine, double timesActual)
    {
        double P(double cell) => 10.0 + 0.3 * Math.Pow(cell, p);
        var e = DiscretisationError.FromFinerGrid(P(h), P(hFine), h, hFine, "why");
        double actual = Math.Abs(P(h) - 10.0) / P(h);
        double r = h / hFine, expected = p == 1 ? 1.25 : 1.25 * r / (r - 1) * (1 - Math.Pow(hFine / h, p));
        Assert.Equal(expected, e.Relative / actual, 1e-12);
        if (h / hFine == 2) Assert.Equal(timesActual, e.Relative / actual, 1e-12);
        Assert.Equal(GridErrorMethod.FinerGrid, e.Method);
        Assert.Equal("finer-grid", e.MethodName);
        Assert.Equal([P(h), P(hFine)], e.Values);
    }

    // Where the 2h grid does not resolve the plate, Estimate solves h/2 (the finer grid's value in the words), and where that grid is refused
    // (memory) or its solve fails it falls back to the two-grid estimate naming why, never a number from the refused grid. The plate: the
    // conveyor section below on 2 mm cells (3 mm slots: 0.75 cells on 4 mm). Values are an invented P(h) = 10 W + 100 W/m x h (first order),
    // so no solve runs: the routing is checked, and the finer-grid number follows from FromFinerGrid exactly (1e-12).
    [Fact]
    public void Estimate_refines_where_the_coarser_grid_does_not_resolve_and_falls_back_with_the_reason()
    {
        var (geometry, _, _, _) = ConveyorSection();
        var model = SheetModel.Build(geometry, new GridOptions { CellSizeM = 0.002 });
        double ValueOn(SheetModel m) => 10 + 100 * Math.Sqrt(m.Lattice.Hx * m.Lattice.Hy);
        double reported = ValueOn(model);

        var finer = DiscretisationError.Estimate(model, reported, ValueOn)!;
        Assert.Equal(GridErrorMethod.FinerGrid, finer.Method);
        Assert.Equal(0.001, finer.CellsM[1], 1e-12);
        Assert.Equal(1.25 * 2 * Math.Abs(reported - ValueOn(SheetModel.Build(geometry, new GridOptions { CellSizeM = 0.001 }))) / reported, finer.Relative, 1e-12);
        Assert.Contains("on 1 mm cells: 10.1 W", finer.Description);
        Assert.Contains("4 mm cells put 0.75 across slot 1 (3 mm)", finer.Description);

        var refused = DiscretisationError.Estimate(model, reported, ValueOn, cell => cell < 0.002 ? "too large for the test's limit" : null)!;
        Assert.Equal(GridErrorMethod.TwoGrid, refused.Method);
        Assert.Equal(0.004, refused.CellsM[1], 1e-12);
        Assert.Contains("no finer grid: too large for the test's limit", refused.Description);

        var failed = DiscretisationError.Estimate(model, reported, m => m.Lattice.Hx < 0.0015 ? throw new NumericalFailureException("no convergence in 3 steps") : ValueOn(m))!;
        Assert.Equal(GridErrorMethod.TwoGrid, failed.Method);
        Assert.Contains("the solve on 1 mm cells failed (no convergence in 3 steps)", failed.Description);
    }

    // The memory guard of the finer grid, end to end through `slotopt plate`'s evaluation: a slotted plate (3 mm slots on 2 mm cells, so the
    // 4 mm grid does not resolve it) under a memory limit that holds its own solve (MemoryModel.OwnField of its 51 x 21 nodes) but not the
    // finer grid beside it (EvaluationLimits.RefusesGrid: the 1 mm grid's own-field estimate plus the held one, the runtime once). The estimate
    // must fall back to the two-grid one and say why, never solve the refused grid; with the default limit the same plate takes the finer grid.
    // The limit is set halfway between the two estimates, so the check does not rest on rounding (common practice, no source).
    [Fact]
    public void A_finer_grid_over_the_memory_limit_falls_back_to_two_grids_with_the_reason()
    {
        const string file = """
            [plate]
            width = "100 mm"
            height = "40 mm"
            thickness = "2 mm"
            conductivity = "1.4e6"
            [grid]
            cell = "2 mm"
            [[slots]]
            pattern = "comb"
            edge = "bottom"
            pitch = "20 mm"
            depth = "25 mm"
            width = "3 mm"
            [source]
            kind = "uniform_ac"
            peak = "25 mT"
            frequency = "50 Hz"
            """;
        var plate = PlateFileReader.Parse(file, "slotted.toml");
        double held = MemoryModel.OwnField(51, 21), finerAndHeld = MemoryModel.OwnField(101, 41) + held - MemoryModel.WithMargin(0);
        var limits = new EvaluationLimits { MaxMemoryBytes = (long)((held + finerAndHeld) / 2) };

        var refused = PlateFileEvaluation.Evaluate(plate, limits: limits).GridError!;
        Assert.Equal(GridErrorMethod.TwoGrid, refused.Method);
        Assert.Contains("no finer grid: a 1 mm grid", refused.Description);
        Assert.Contains("the memory limit is", refused.Description);

        Assert.Equal(GridErrorMethod.FinerGrid, PlateFileEvaluation.Evaluate(plate).GridError!.Method);
    }

    // The conveyor demo's chosen rail (problems/conveyor-rail.toml: Al-6061-T6 6 mm, comb from the bottom, pitch 10 mm, depth 65 mm,
    // width 3 mm), reduced to a 300 mm section under the same four poles to keep the test fast.
    private static (PlateGeometry Geometry, ConductingSheet Sheet, ITravellingSource Source, IReadOnlyList<double> Offsets) ConveyorSection()
    {
        var problem = ProblemReader.ReadFile(Path.Combine(AppContext.BaseDirectory, "problems", "conveyor-rail.toml"));
        var part = Assert.IsType<PlatePart>(problem.Parts[0]);
        part = part with { Outline = Polygon.Rectangle(0.15, 0, 0.45, 0.08) };      // the middle 300 mm of the 600 mm rail, under the poles
        var slots = new SlotChoice(SlotPatternKind.Comb, PlateEdge.Bottom, 0.010, 0.065, 0.003, null);
        var (geometry, _) = PlateGeometryFactory.Build(part, slots);
        var material = problem.Library.GetConductor("Al-6061-T6", part.Name);
        var sheet = new ConductingSheet(material.ConductivityAt(part.TemperatureK), 0.006, material.RelativePermeability);
        var source = Assert.IsType<PlateExcitation.Moving>(part.Excitation).Source;
        return (geometry, sheet, source, PlateOptions.TravelOffsets(part, slots));
    }

    // The conveyor section on the demo's 2 mm cells, own-field model. Its 3 mm slots get 0.75 cells on the 4 mm grid: a coarser grid bridges
    // them and solves a different plate, so the estimate comes from the finer grid (1 mm, 3 cells across). The actual error is against the
    // same section on 0.5 mm cells, whose grid lines hold the slot edges (on the full 600 mm rail the 0.5 mm solve is within 0.19 % of a
    // 0.25 mm one, measured: 10.211 and 10.192 W, against 11.110 W at 2 mm). Measured here: 11.110 W at 2 mm, 10.64 W at 1 mm, 10.211 W at
    // 0.5 mm: actual 8.8 %, estimate 10.5 % (the two-grid coarsening it replaces said 17 %). The estimate must not fall below the actual error
    // and must stay within 3 times it (the brief's bound: a bar three times too wide is no longer a designer's estimate); the 0.5 mm
    // reference's own error (under 0.2 % of 8.8 %) moves the ratio by about 2 %, inside both ends.
    [Fact]
    [Trait("Category", "Slow")]
    public void Conveyor_rail_finer_grid_estimate_is_neither_below_nor_three_times_above_the_error_against_a_fine_solve()
    {
        var (geometry, sheet, source, offsets) = ConveyorSection();
        PlateSolution Solve(SheetModel m, SheetModelKind? kind = null) => PlateModels.SolveMoving(m, source, sheet, offsets, source.LoopLengthXM, forcedKind: kind);

        var model = SheetModel.Build(geometry, new GridOptions { CellSizeM = 0.002 });
        var demo = Solve(model);
        Assert.Equal(SheetModelKind.ThinSheetReaction, demo.Choice.Kind);
        demo = PlateModels.WithGridError(demo, model, m => Solve(m, demo.Choice.Kind));
        var fine = Solve(SheetModel.Build(geometry, new GridOptions { CellSizeM = 0.0005 }), demo.Choice.Kind);
        double actual = Math.Abs(demo.MeanLossW / fine.MeanLossW - 1);
        var estimate = demo.GridError!;
        output.WriteLine($"2 mm {demo.MeanLossW} W, 0.5 mm {fine.MeanLossW} W: actual {actual:P2}, estimate {estimate.Relative:P2} ({estimate.Description})");
        Assert.Equal(GridErrorMethod.FinerGrid, estimate.Method);
        Assert.Contains("on 1 mm cells: ", estimate.Description);
        Assert.InRange(estimate.Relative / actual, 1, 3);
    }

    // The cryogenic demo's warm damper plate (problems/cryogenic-damper.toml: Al-1350 5 mm, solid, 2 mm cells, four magnets sliding at
    // 0.3 m/s, resistance-limited). Its 2, 4 and 8 mm grids show order 2.99, which the estimate takes as 2: at the observed order the
    // index would be 0.048 %, half the actual error. Actual error against the same plate on 0.5 mm cells (measured: 3.5707 W at 2 mm,
    // 3.5733 W at 1 mm, 3.5740 W at 0.5 mm, differences falling fourfold, so the 0.5 mm value is within 0.02 % of the limit): 0.093 %,
    // estimate 0.112 %. Tolerance [1, 2] times the actual error: the GCI's promise, and a bar at most twice too wide.
    [Fact]
    [Trait("Category", "Slow")]
    public void Damper_plate_estimate_covers_the_error_against_a_fine_solve_with_the_order_capped_at_2()
    {
        var problem = ProblemReader.ReadFile(Path.Combine(AppContext.BaseDirectory, "problems", "cryogenic-damper.toml"));
        var part = Assert.IsType<PlatePart>(problem.Parts[0]);
        var (geometry, _) = PlateGeometryFactory.Build(part, null);
        var material = problem.Library.GetConductor("Al-1350", part.Name);
        var sheet = new ConductingSheet(material.ConductivityAt(part.TemperatureK), 0.005, material.RelativePermeability);
        var source = Assert.IsType<PlateExcitation.Moving>(part.Excitation).Source;
        var offsets = PlateOptions.TravelOffsets(part, null);
        PlateSolution Solve(SheetModel m) => PlateModels.SolveMoving(m, source, sheet, offsets, source.LoopLengthXM, forcedKind: SheetModelKind.ResistanceLimited);

        var model = SheetModel.Build(geometry, new GridOptions { CellSizeM = 0.002 });
        var demo = PlateModels.WithGridError(Solve(model), model, Solve);
        var fine = Solve(SheetModel.Build(geometry, new GridOptions { CellSizeM = 0.0005 }));
        double actual = Math.Abs(demo.MeanLossW / fine.MeanLossW - 1);
        var estimate = demo.GridError!;
        output.WriteLine($"2 mm {demo.MeanLossW} W, 0.5 mm {fine.MeanLossW} W: actual {actual:P3}, estimate {estimate.Relative:P3} ({estimate.Description})");
        Assert.Equal(GridErrorMethod.ThreeGrid, estimate.Method);
        Assert.True(estimate.ObservedOrder > DiscretisationError.HighestOrder, $"observed order {estimate.ObservedOrder}");
        Assert.Equal(DiscretisationError.HighestOrder, estimate.Order);
        Assert.InRange(estimate.Relative / actual, 1, 2);
    }
}
