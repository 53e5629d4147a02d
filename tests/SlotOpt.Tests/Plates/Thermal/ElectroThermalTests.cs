using SlotOpt.Plates.Conductors;
using SlotOpt.Plates.Geometry;
using SlotOpt.Plates.Grid;
using SlotOpt.Plates.ResistanceLimited;
using SlotOpt.Plates.Sources;
using SlotOpt.Plates.Thermal;

namespace SlotOpt.Tests.Plates.Thermal;

/// <summary>The loss map, the heat balance and the electro-thermal coupling on a real eddy-current solve.</summary>
public class ElectroThermalTests
{
    private const double AmbientK = 313.15;
    private static readonly GridOptions Cells = new() { CellSizeM = 0.005 };
    private static readonly UniformAcField Field = new(0.08, 50);

    /// <summary>A 400 x 200 mm plate, comb of slots from the bottom edge and a round hole (an invented demo shape).</summary>
    private static PlateGeometry SlottedPlate()
    {
        var g = PlateGeometry.Rectangle(0.4, 0.2);
        g.AddPattern(SlotPatterns.Comb(g.Outline, PlateEdge.Bottom, 0.05, 0.15, 0.01));
        g.AddCutout(Polygon.Circle(new Vec2(0.2, 0.17), 0.012));
        return g;
    }

    // Stainless steel plate: 0.72 uOhm m at 20 degC, alpha 0.001/K, k 14.9 W/(m K) (the built-in SS-304 rows).
    private static readonly ConductingSheet Steel = new(1 / 0.72e-6, 0.008);
    private static ThermalMaterial SteelHeat => ThermalMaterial.Linear(14.9, 0.001, 293.15, "SS-304");

    // The cells' shares of the edge losses add up to the solver's loss psi^T A psi (exact algebra; 1e-12 is rounding).
    [Fact]
    public void Cell_loss_map_sums_to_the_solver_loss()
    {
        var model = SheetModel.Build(SlottedPlate(), Cells);
        var solution = ResistanceLimitedSolver.SolveAc(model, Field);
        double g = Steel.SheetConductanceS;
        Assert.Equal(solution.LossW(g), CellLossMap.Of(solution, g).Sum(), solution.LossW(g) * 1e-12);
    }

    // Energy balance (the acceptance test): heat convected plus radiated from both faces equals the
    // eddy-current loss within 0.5 %, here with natural convection in air and radiation (eps 0.6), insulated
    // edges, coupled. The heat out is summed with the exact T^4 law, not the linearisation that was solved.
    [Fact]
    public void Convected_plus_radiated_equals_the_eddy_current_loss()
    {
        var cooling = new PlateCooling(CoolingMedium.Air, AmbientK, 0.6, ThermalEdge.Insulated, verticalLengthM: 0.2);
        var heated = PlateHeating.SolveAc(SlottedPlate(), Cells, Field, Steel, SteelHeat, cooling);
        var t = heated.Temperature;
        Assert.True(t.MaxRiseK > 5, $"the case should heat noticeably (rise {t.MaxRiseK} K)");
        Assert.True(t.RadiatedW > 0.1 * heated.LossW, "radiation should carry a real share");
        Assert.Equal(heated.LossW, t.ConvectedW + t.RadiatedW, heated.LossW * 0.005);
        Assert.Equal(0, t.EdgeW);
    }

    // With the outer edge held at ambient the edge takes its share: convected + radiated + edge = loss within 0.5 %.
    [Fact]
    public void Held_edges_close_the_balance_too()
    {
        var cooling = new PlateCooling(CoolingMedium.Oil, AmbientK, 0, ThermalEdge.Ambient, verticalLengthM: 0.2);
        var heated = PlateHeating.SolveAc(SlottedPlate(), Cells, Field, Steel, SteelHeat, cooling);
        var t = heated.Temperature;
        Assert.True(t.EdgeW > 0);
        Assert.Equal(heated.LossW, t.ConvectedW + t.EdgeW, heated.LossW * 0.005);
    }

    // The coupling closes: the loss the coupled solve reports equals a plain eddy-current run with each cell's
    // conductivity fixed at the computed temperature. Tolerance 1e-4: the coupling stops when the conductivity
    // factors agree within 1e-5, and the loss moves by no more than that relative amount.
    [Fact]
    public void Loss_at_the_computed_temperature_equals_a_run_at_that_temperature()
    {
        var cooling = new PlateCooling(CoolingMedium.Fixed, AmbientK, 0, ThermalEdge.Insulated, 8);
        var geometry = SlottedPlate();
        var heated = PlateHeating.SolveAc(geometry, Cells, Field, Steel, SteelHeat, cooling);
        Assert.True(heated.Temperature.MaxRiseK > 20, "the case should heat enough for the coupling to matter");
        var cellT = heated.Temperature.CellTemperatureK();
        var l = heated.Model.Lattice;
        var fixedAtT = geometry.WithConductivityFactor(p =>
        {
            int i = (int)Math.Floor((p.X - l.X0) / l.Hx), j = (int)Math.Floor((p.Y - l.Y0) / l.Hy);
            double t = cellT[j * l.Nx + i];
            return double.IsNaN(t) ? 1 : SteelHeat.ConductivityFactorAtK(t);
        });
        var plain = ResistanceLimitedSolver.SolveAc(SheetModel.Build(fixedAtT, Cells), Field).LossW(Steel.SheetConductanceS);
        Assert.Equal(plain, heated.LossW, plain * 1e-4);
        // and it lies below the loss at the reference (20 degC) conductivity: the plate runs hotter than 20 degC
        double cold = ResistanceLimitedSolver.SolveAc(SheetModel.Build(geometry, Cells), Field).LossW(Steel.SheetConductanceS);
        Assert.True(heated.LossW < cold);
    }

    // A nearly isothermal plate (copper-like k = 400 W/(m K), a 100 x 100 mm square): the coupled loss equals a
    // plain run at the single temperature it settles at. The resistance-limited loss at a given field rises with
    // every cell's conductance, so it lies between the runs at the coldest and the hottest cell's conductivity;
    // the plate's spread is a fraction of a kelvin, so both bounds are within 0.1 % of each other.
    [Fact]
    public void Isothermal_plate_loss_equals_a_run_at_its_temperature()
    {
        var square = PlateGeometry.Rectangle(0.1, 0.1);
        var cells = new GridOptions { CellSizeM = 0.0025 };
        var sheet = new ConductingSheet(58e6, 0.002);
        var material = ThermalMaterial.Linear(400, 0.00393, 293.15, "copper-like");
        var cooling = new PlateCooling(CoolingMedium.Fixed, AmbientK, 0, ThermalEdge.Insulated, 10);
        var heated = PlateHeating.SolveAc(square, cells, new UniformAcField(0.01, 50), sheet, material, cooling);
        var unit = ResistanceLimitedSolver.SolveAc(SheetModel.Build(square, cells), new UniformAcField(0.01, 50));
        double LossAt(double k) => unit.LossW(sheet.SheetConductanceS * material.ConductivityFactorAtK(k));
        Assert.True(heated.ResistivityMaxK - heated.ResistivityMinK < 1, "the plate should be nearly isothermal");
        Assert.InRange(heated.LossW, LossAt(heated.ResistivityMaxK) * (1 - 1e-6), LossAt(heated.ResistivityMinK) * (1 + 1e-6));
        Assert.Equal(LossAt(heated.LossWeightedTemperatureK), heated.LossW, heated.LossW * 1e-3);
    }

    // Moving poles: the plate is heated by the mean of the offsets' loss maps, so the heat out equals the mean
    // loss over the offsets within 0.5 % (the tolerance), and the coupling closes on the sweep's mean loss.
    [Fact]
    public void Moving_poles_heat_the_plate_with_their_mean_loss()
    {
        var poles = MovingPoles.Row(PoleFace.Rectangle(0.04, 0.06), new Vec2(0.1, 0.1), 2, 0.1, 0.3, 2);
        var offsets = MovingSweepSolution.OffsetsOverPitch(0.05, 4);
        var cooling = new PlateCooling(CoolingMedium.Fixed, AmbientK, 0.3, ThermalEdge.Insulated, 15);
        var heated = PlateHeating.SolveMoving(SlottedPlate(), Cells, poles, offsets, Steel, SteelHeat, cooling);
        var sweep = Assert.IsType<MovingSweepSolution>(heated.Sweep);
        Assert.Equal(sweep.MeanLossW(Steel.SheetConductanceS), heated.LossW, heated.LossW * 1e-12);
        Assert.True(heated.Temperature.MaxRiseK > 3, $"the case should heat noticeably (rise {heated.Temperature.MaxRiseK} K)");   // 4.4 K since the pole edges' sub-cell placement (the old nearest-node edges overstated the loss)
        Assert.Equal(heated.LossW, heated.Temperature.ConvectedW + heated.Temperature.RadiatedW, heated.LossW * 0.005);
    }

    // Thermal runaway is a reported failure: a made-up material whose conductivity rises steeply with temperature
    // (resistivity falling 0.4 %/K) feeds the loss back until the resistivity law leaves its range.
    [Fact]
    public void Runaway_is_a_numerical_failure_not_a_number()
    {
        var cooling = new PlateCooling(CoolingMedium.Fixed, AmbientK, 0, ThermalEdge.Insulated, 2);
        var runaway = ThermalMaterial.Linear(14.9, -0.004, 293.15, "negative coefficient");
        var e = Assert.Throws<NumericalFailureException>(() => PlateHeating.SolveAc(SlottedPlate(), Cells, new UniformAcField(0.05, 50), Steel, runaway, cooling));
        Assert.Contains("electro-thermal coupling", e.Message);
    }
}
