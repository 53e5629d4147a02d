using MathNet.Numerics.LinearAlgebra;
using SlotOpt.Materials;
using SlotOpt.Numerics;
using SlotOpt.Plates.Geometry;
using SlotOpt.Plates.Grid;
using SlotOpt.Plates.Thermal;

namespace SlotOpt.Tests.Plates.Thermal;

/// <summary>
/// The temperature operator (<see cref="ThermalOperator"/>) solved by <see cref="ThermalConjugateGradient"/> with the structured black-box
/// multigrid built from its stencil (<see cref="StructuredMultigrid.ForNodeStencil"/>, through <see cref="ThermalNetwork.Preconditioner"/>) against
/// MathNet.Numerics' dense Cholesky solve of the same matrix, on small plates with a cut-out (a hole without unknowns, insulated)
/// and a comb of slots, with insulated edges and with edges held at ambient.
/// </summary>
public class ThermalMultigridTests
{
    private const double AmbientK = 293.15;

    public static TheoryData<string, ThermalEdge> Plates() => new()
    {
        { "hole", ThermalEdge.Insulated },
        { "hole", ThermalEdge.Ambient },
        { "comb", ThermalEdge.Insulated },
        { "comb", ThermalEdge.Ambient },
    };

    private static PlateGrid Grid(string plate, double cellM = 0.004)
    {
        var g = PlateGeometry.Rectangle(0.24, 0.09);
        if (plate == "hole") g.AddCutout(Polygon.Rectangle(0.08, 0.03, 0.14, 0.06));
        else g.AddPattern(SlotPatterns.Comb(g.Outline, PlateEdge.Bottom, 0.05, 0.06, 0.008));
        return PlateGrid.Build(g, new GridOptions { CellSizeM = cellM });
    }

    /// <summary>A smooth uneven loss (W per cell, in the metal only) so that heat flows in the plane: more at the left, a bump in the middle.</summary>
    private static double[] Loss(PlateGrid grid)
    {
        var l = grid.Lattice;
        var loss = new double[l.CellCount];
        for (int j = 0; j < l.Ny; j++)
            for (int i = 0; i < l.Nx; i++)
                loss[j * l.Nx + i] = grid.Conductance[j * l.Nx + i] == 0 ? 0 : grid.AreaFraction[j * l.Nx + i] * l.CellAreaM2 * (300 + 900 * (1 - (double)i / l.Nx) + 500 * Math.Exp(-Math.Pow((j - l.Ny / 2.0) / 5, 2)));
        return loss;
    }

    private static Vector<double> DenseRise(ThermalNetwork network, double h, double[] loss)
    {
        var a = network.Matrix(Enumerable.Repeat(h, network.Unknowns).ToArray());
        var dense = Matrix<double>.Build.Dense(a.Rows, a.Rows);
        for (int u = 0; u < a.Rows; u++)
            for (int k = a.RowStart[u]; k < a.RowStart[u + 1]; k++) dense[u, a.ColumnIndex[k]] = a.Value[k];
        var heat = network.NodeHeat(loss);
        var b = Vector<double>.Build.Dense(a.Rows);
        for (int n = 0; n < heat.Length; n++) if (network.NodeUnknown[n] >= 0) b[network.NodeUnknown[n]] = heat[n];
        return dense.Cholesky().Solve(b);
    }

    // Multigrid-preconditioned CG run to a relative residual of 1e-12 against the dense Cholesky solution (MathNet.Numerics):
    // tolerance 1e-10 of the largest rise. The matrix's condition number here is below about 1e3 (k t / (2 h A) per node
    // ~ 8e1 times the square of ~ 20 nodes from a source to the edges it sheds heat by), so a residual of 1e-12 bounds the
    // error near 1e-9 at worst; CG's error in practice sits far below that bound, and both sides then differ by rounding only.
    [Theory]
    [MemberData(nameof(Plates))]
    public void Multigrid_solve_agrees_with_the_dense_solve(string plate, ThermalEdge edges)
    {
        var grid = Grid(plate);
        var network = ThermalNetwork.Assemble(grid, 16.2, 0.008, edges);
        var loss = Loss(grid);
        double h = 50;
        var reference = DenseRise(network, h, loss);
        var op = new ThermalOperator(network);
        op.SetSurfaceCoefficients(Enumerable.Repeat(h, network.Unknowns).ToArray());
        var multigrid = network.Preconditioner(op, h);
        var heat = network.NodeHeat(loss);
        var cg = new ThermalConjugateGradient(op);
        for (int n = 0; n < heat.Length; n++) if (network.NodeUnknown[n] >= 0) cg.B[op.Pad + n] = heat[n];
        cg.StartResidual();
        Assert.True(cg.TrySolve(multigrid, new ConvergenceCriterion { RelativeResidual = 1e-12, MaxIterations = 100 }, confirm: true, out var report), report.Reason);
        double largest = reference.AbsoluteMaximum();
        for (int n = 0; n < heat.Length; n++)
        {
            int u = network.NodeUnknown[n];
            Assert.Equal(u >= 0 ? reference[u] : 0, cg.X[op.Pad + n], largest * 1e-10);
        }
        // a good preconditioner: a handful of V-cycles per decade of residual (common practice for black-box multigrid, no source)
        Assert.InRange(report.Iterations, 1, 40);
    }

    // The public solver (fixed h, one linear solve to PlateTemperatureSolver.LinearCriterion, a relative residual of 1e-5) against
    // the dense solution: tolerance PlateTemperatureSolver.RiseAccuracy, 1e-6 of the largest rise, what the solver promises (a
    // hundredth of the last reported digit; the grid's discretisation error is of order a percent). The residual alone would bound
    // the error only near 1e-2 (condition number ~1e3); CG with the multigrid leaves a rough residual that moves the smooth rise
    // far less (measured on these plates below 1e-7 of the largest rise).
    [Theory]
    [MemberData(nameof(Plates))]
    public void Plate_temperature_solver_agrees_with_the_dense_solve(string plate, ThermalEdge edges)
    {
        var grid = Grid(plate);
        var loss = Loss(grid);
        var cooling = new PlateCooling(CoolingMedium.Fixed, AmbientK, 0, edges, 50);
        var t = PlateTemperatureSolver.Solve(grid, loss, 16.2, 0.008, cooling);
        var reference = DenseRise(t.Network, 50, loss);
        double largest = reference.AbsoluteMaximum(), worst = 0;
        for (int n = 0; n < t.NodeTemperatureK.Length; n++)
        {
            int u = t.Network.NodeUnknown[n];
            if (u >= 0) worst = Math.Max(worst, Math.Abs(reference[u] - (t.NodeTemperatureK[n] - AmbientK)));
        }
        Assert.InRange(worst, 0, PlateTemperatureSolver.RiseAccuracy * largest);
    }

    // Natural convection in air with radiation (eps 0.8, rises near 50 K): the public solver (three linearisation steps, the conjugate
    // gradients' residual carried across them) against the network's exact solution, found by Newton's method on the radiation with
    // MathNet.Numerics' dense Cholesky solve of each step and h from the correlation at the mean rise (S. W. Churchill and H. H. S. Chu
    // 1975 through NaturalConvection), iterated until the rise moves by less than 1e-12 K. Tolerance PlateTemperatureSolver.RiseAccuracy,
    // 1e-6 of the largest rise, what the solver promises. A coarser grid (6 mm cells, some 500 unknowns) keeps the dense solves quick;
    // held edges take more loss for a like rise.
    [Theory]
    [MemberData(nameof(Plates))]
    public void Radiating_plate_in_air_agrees_with_a_dense_newton_solve(string plate, ThermalEdge edges)
    {
        var grid = Grid(plate, 0.006);
        var loss = Loss(grid).Select(p => edges == ThermalEdge.Ambient ? 10 * p : p).ToArray();
        const double ambient = 313.15, emissivity = 0.8, height = 0.09;
        var cooling = new PlateCooling(CoolingMedium.Air, ambient, emissivity, edges, verticalLengthM: height);
        var t = PlateTemperatureSolver.Solve(grid, loss, 16.2, 0.008, cooling);
        var network = t.Network;
        var heat = network.NodeHeat(loss);
        var map = network.NodeUnknown;
        var rise = new double[network.Unknowns];
        double sigma = emissivity * SurfaceRadiation.StefanBoltzmann;
        for (int step = 0; step < 100; step++)
        {
            double weighted = 0, area = 0;
            for (int n = 0; n < map.Length; n++)
                if (network.NodeAreaM2[n] > 0) { area += network.NodeAreaM2[n]; if (map[n] >= 0) weighted += network.NodeAreaM2[n] * rise[map[n]]; }
            double hc = NaturalConvection.AverageCoefficient(CoolingFluid.Air, ambient, weighted / area, height);
            // Newton on q_r(T) = eps sigma (T^4 - T_inf^4): slope 4 eps sigma T^3 on the diagonal, the rest on the right-hand side
            var h = new double[network.Unknowns];
            var b = Vector<double>.Build.Dense(network.Unknowns);
            for (int n = 0; n < map.Length; n++)
            {
                int u = map[n];
                if (u < 0) continue;
                double temperature = ambient + rise[u], slope = 4 * sigma * Math.Pow(temperature, 3);
                h[u] = hc + slope;
                b[u] = heat[n] - 2 * network.NodeAreaM2[n] * (sigma * (Math.Pow(temperature, 4) - Math.Pow(ambient, 4)) - slope * rise[u]);
            }
            var a = network.Matrix(h);
            var dense = Matrix<double>.Build.Dense(a.Rows, a.Rows);
            for (int u = 0; u < a.Rows; u++)
                for (int k = a.RowStart[u]; k < a.RowStart[u + 1]; k++) dense[u, a.ColumnIndex[k]] = a.Value[k];
            var next = dense.Cholesky().Solve(b);
            double move = 0;
            for (int u = 0; u < rise.Length; u++) { move = Math.Max(move, Math.Abs(next[u] - rise[u])); rise[u] = next[u]; }
            if (move < 1e-12) break;
            Assert.True(step < 99, "the dense reference did not settle");
        }
        double largest = rise.Max(Math.Abs), worst = 0;
        for (int n = 0; n < map.Length; n++)
            if (map[n] >= 0) worst = Math.Max(worst, Math.Abs(rise[map[n]] - (t.NodeTemperatureK[n] - ambient)));
        Assert.InRange(largest, 20, 200);   // a plate hot enough for the radiation to matter
        Assert.InRange(worst, 0, PlateTemperatureSolver.RiseAccuracy * largest);
    }
}
