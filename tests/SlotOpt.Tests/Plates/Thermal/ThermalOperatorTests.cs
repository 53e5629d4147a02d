using SlotOpt.Plates.Geometry;
using SlotOpt.Plates.Grid;
using SlotOpt.Plates.Thermal;

namespace SlotOpt.Tests.Plates.Thermal;

/// <summary>
/// The solver's lattice operator (<see cref="ThermalOperator"/>) and the multigrid built from the stencil
/// (<see cref="StructuredMultigrid.ForNodeStencil"/>) against the assembled sparse matrix (<see cref="ThermalNetwork.Matrix"/>, itself
/// checked against MathNet.Numerics' dense solve in ThermalMultigridTests), on a plate with a comb of slots, edges insulated and held.
/// </summary>
public class ThermalOperatorTests
{
    private static ThermalNetwork Network(ThermalEdge edges)
    {
        var g = PlateGeometry.Rectangle(0.24, 0.09);
        g.AddPattern(SlotPatterns.Comb(g.Outline, PlateEdge.Bottom, 0.05, 0.06, 0.008));
        return ThermalNetwork.Assemble(PlateGrid.Build(g, new GridOptions { CellSizeM = 0.004 }), 16.2, 0.008, edges);
    }

    // The same matrix applied to a random vector, with an uneven h and after the diagonal is changed in place: 1e-12 relative
    // (the same few products summed in another order).
    [Theory]
    [InlineData(ThermalEdge.Insulated)]
    [InlineData(ThermalEdge.Ambient)]
    public void Lattice_operator_is_the_assembled_matrix(ThermalEdge edges)
    {
        var network = Network(edges);
        var random = new Random(11);
        var x = Enumerable.Range(0, network.Unknowns).Select(_ => random.NextDouble() - 0.5).ToArray();
        var op = new ThermalOperator(network);
        foreach (double scale in new[] { 1.0, 7.0 })
        {
            var h = Enumerable.Range(0, network.Unknowns).Select(u => scale * (20 + 30 * Math.Sin(u))).ToArray();
            op.SetSurfaceCoefficients(h);
            var expected = new double[x.Length];
            var actual = new double[x.Length];
            network.Matrix(h).Multiply(x, expected);
            op.Multiply(x, actual);
            double largest = expected.Max(Math.Abs);
            for (int u = 0; u < x.Length; u++) Assert.Equal(expected[u], actual[u], largest * 1e-12);
        }
    }

    // The multigrid built from the stencil (StructuredMultigrid.ForNodeStencil) holds the assembled matrix as its finest operator:
    // 1e-12 relative (the same few products summed in another order). Its V-cycle is checked through CG against MathNet's dense
    // solve in ThermalMultigridTests.
    [Theory]
    [InlineData(ThermalEdge.Insulated)]
    [InlineData(ThermalEdge.Ambient)]
    public void Stencil_multigrid_operator_is_the_assembled_matrix(ThermalEdge edges)
    {
        var network = Network(edges);
        var h = Enumerable.Repeat(50.0, network.Unknowns).ToArray();
        var op = new ThermalOperator(network);
        op.SetSurfaceCoefficients(h);
        var a = network.Matrix(h);
        var fromStencil = network.Preconditioner(op, 50);
        var random = new Random(5);
        var r = Enumerable.Range(0, network.Unknowns).Select(_ => random.NextDouble() - 0.5).ToArray();
        var expected = new double[r.Length];
        var actual = new double[r.Length];
        a.Multiply(r, expected);
        fromStencil.Operator.Multiply(r, actual);
        double largest = expected.Max(Math.Abs);
        for (int u = 0; u < r.Length; u++) Assert.Equal(expected[u], actual[u], largest * 1e-12);
    }
}
