using SlotOpt.Materials;
using SlotOpt.Plates.Geometry;
using SlotOpt.Plates.Grid;
using SlotOpt.Plates.Thermal;

namespace SlotOpt.Tests.Plates.Thermal;

/// <summary>
/// The iteration for the natural-convection coefficient and the reuse across options: the converged temperature is the
/// fixed-h solution at the correlation's h of its own mean rise (Churchill and Chu 1975 through <see cref="NaturalConvection"/>),
/// and warm starts, rescaled networks and a shared preconditioner change the iterations only, never the answer.
/// </summary>
public class ThermalIterationTests
{
    private const double AmbientK = 368.15;

    private static PlateGrid SlottedGrid()
    {
        var g = PlateGeometry.Rectangle(0.4, 0.15);
        g.AddPattern(SlotPatterns.Comb(g.Outline, PlateEdge.Bottom, 0.05, 0.09, 0.004));
        return PlateGrid.Build(g, new GridOptions { CellSizeM = 0.004 });
    }

    /// <summary>More loss near the slot tips' row and towards the left, so heat flows in the plane.</summary>
    private static double[] Loss(PlateGrid grid, double scale)
    {
        var l = grid.Lattice;
        var loss = new double[l.CellCount];
        for (int j = 0; j < l.Ny; j++)
            for (int i = 0; i < l.Nx; i++)
            {
                int c = j * l.Nx + i;
                loss[c] = grid.Conductance[c] == 0 ? 0 : scale * grid.AreaFraction[c] * l.CellAreaM2 * (200 + 600 * (1 - (double)i / l.Nx) + 800 * Math.Exp(-Math.Pow((l.CellCentreY(j) - 0.09) / 0.02, 2)));
            }
        return loss;
    }

    private static double MaxDifference(PlateTemperature a, PlateTemperature b) =>
        a.NodeTemperatureK.Zip(b.NodeTemperatureK).Where(p => !double.IsNaN(p.First)).Max(p => Math.Abs(p.First - p.Second));

    // The rise r of a face shedding q by convection solves r h(r) = q with h from the correlation (Newton's law of cooling,
    // Incropera, DeWitt, Bergman, Lavine, Fundamentals of Heat and Mass Transfer, 6th ed., 2007, eq. 1.3a). Tolerance 1e-10
    // relative: Brent's method stops at 1e-13 K.
    [Theory]
    [InlineData(50.0, 0.15)]
    [InlineData(600.0, 0.15)]
    [InlineData(3000.0, 1.0)]
    public void Rise_at_a_heat_flux_sheds_that_flux(double q, double heightM)
    {
        var (h, r) = NaturalConvection.AtHeatFlux(CoolingFluid.MineralOil, AmbientK, q, heightM);
        Assert.Equal(NaturalConvection.AverageCoefficient(CoolingFluid.MineralOil, AmbientK, r, heightM), h, h * 1e-12);
        Assert.Equal(q, r * h, q * 1e-10);
    }

    // Insulated edges, no radiation: 2 h A r_mean = Q holds for the discrete solution, so the coefficient from the heat balance
    // is the converged one and one linear solve settles it. The answer is the fixed-h solve at that h (same network, same
    // linear tolerance): tolerance 2 x PlateTemperatureSolver.RiseAccuracy of the largest rise (each solve within the accuracy
    // the solver promises of the network's exact solution; h here is exact to Brent's 1e-13 K).
    [Fact]
    public void Natural_convection_with_insulated_edges_takes_one_solve_and_equals_the_fixed_h_solve()
    {
        var grid = SlottedGrid();
        var loss = Loss(grid, 1);
        var oil = new PlateCooling(CoolingMedium.Oil, AmbientK, 0, ThermalEdge.Insulated, verticalLengthM: 0.15);
        var t = PlateTemperatureSolver.Solve(grid, loss, 16.2, 0.01, oil);
        Assert.Equal(1, t.Iterations);
        Assert.Equal(NaturalConvection.AverageCoefficient(CoolingFluid.MineralOil, AmbientK, t.MeanRiseK, 0.15), t.ConvectionCoefficientWPerM2K, t.ConvectionCoefficientWPerM2K * 1e-6);
        var atH = PlateTemperatureSolver.Solve(grid, loss, 16.2, 0.01, new PlateCooling(CoolingMedium.Fixed, AmbientK, 0, ThermalEdge.Insulated, t.ConvectionCoefficientWPerM2K));
        Assert.InRange(MaxDifference(t, atH), 0, 2 * PlateTemperatureSolver.RiseAccuracy * t.MaxRiseK);
    }

    // Held edges and radiation: the iteration converges (h at the mean rise within 1e-6 (h + 4 eps sigma T_inf^3) / h of the h solved
    // with: the solver's stopping rule, which holds the rise it moves within 1e-6 of the largest rise) to the fixed-h
    // solve at the converged h with the same radiation: tolerance 1e-5 of the largest rise (the stopping test bounds each
    // step's change by 1e-6 of the largest rise; the contraction of the iteration leaves the error a few times that).
    [Fact]
    public void Natural_convection_with_held_edges_and_radiation_converges_to_its_own_h()
    {
        var grid = SlottedGrid();
        var loss = Loss(grid, 3);
        var air = new PlateCooling(CoolingMedium.Air, 313.15, 0.8, ThermalEdge.Ambient, verticalLengthM: 0.15);
        var t = PlateTemperatureSolver.Solve(grid, loss, 16.2, 0.01, air);
        double radiationSlope = 4 * 0.8 * SurfaceRadiation.StefanBoltzmann * Math.Pow(313.15, 3);
        Assert.Equal(NaturalConvection.AverageCoefficient(CoolingFluid.Air, 313.15, t.MeanRiseK, 0.15), t.ConvectionCoefficientWPerM2K, (t.ConvectionCoefficientWPerM2K + radiationSlope) * 1e-6);
        var atH = PlateTemperatureSolver.Solve(grid, loss, 16.2, 0.01, new PlateCooling(CoolingMedium.Fixed, 313.15, 0.8, ThermalEdge.Ambient, t.ConvectionCoefficientWPerM2K));
        Assert.InRange(MaxDifference(t, atH), 0, 1e-5 * t.MaxRiseK);
    }

    // The screen's reuse (one network rescaled to each k t, one preconditioner, warm starts from the last option) against a
    // cold solve of each option on its own network: tolerance 2 x (RiseAccuracy + RelativeTolerance) of the largest rise, 4e-6
    // (each answer within the linear solves' promised accuracy of the network's exact solution, and within the iteration's
    // stopping tolerance through h and the radiation's linearisation; measured: under 2e-7).
    [Theory]
    [InlineData(ThermalEdge.Insulated, 0.0)]
    [InlineData(ThermalEdge.Ambient, 0.9)]
    public void Screen_reuse_changes_iterations_not_answers(ThermalEdge edges, double emissivity)
    {
        var grid = SlottedGrid();
        var screen = new ThermalScreen(grid, edges);
        var oil = new PlateCooling(CoolingMedium.Oil, AmbientK, emissivity, edges, verticalLengthM: 0.15);
        foreach (var (k, t, scale) in new[] { (16.2, 0.008, 1.0), (16.3, 0.008, 0.97), (16.2, 0.012, 1.5), (237.0, 0.01, 0.1), (16.3, 0.012, 1.45) })
        {
            var loss = Loss(grid, scale);
            var reused = screen.Solve(loss, k, t, oil);
            var cold = PlateTemperatureSolver.Solve(grid, loss, k, t, oil);
            Assert.InRange(MaxDifference(reused, cold), 0, 2 * (PlateTemperatureSolver.RiseAccuracy + PlateTemperatureSolver.RelativeTolerance) * cold.MaxRiseK);
        }
    }

    // A network rescaled to another k t is the network assembled at that k t: the matrices agree to rounding (1e-15 relative).
    [Fact]
    public void Rescaled_network_is_the_assembled_one()
    {
        var grid = SlottedGrid();
        var rescaled = ThermalNetwork.Assemble(grid, 16.2, 0.008, ThermalEdge.Ambient).WithConductivity(45, 0.012);
        var assembled = ThermalNetwork.Assemble(grid, 45, 0.012, ThermalEdge.Ambient);
        var h = Enumerable.Repeat(30.0, assembled.Unknowns).ToArray();
        var a = rescaled.Matrix(h);
        var b = assembled.Matrix(h);
        Assert.Equal(b.ColumnIndex, a.ColumnIndex);
        double scale = b.Value.Max(Math.Abs);
        for (int k = 0; k < a.Value.Length; k++) Assert.Equal(b.Value[k], a.Value[k], scale * 1e-15);
        for (int u = 0; u < assembled.Unknowns; u++) Assert.Equal(assembled.ConductanceToHeld(u), rescaled.ConductanceToHeld(u), 1e-15);
    }
}
