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
    /// <summary>The plate on 4 mm cells, or on <paramref name="cellSizeM"/> (5 mm: 49 x 19 nodes, a count that is not a multiple of the
    /// operator's four-row blocks, so the rows after the last block are checked too).</summary>
    private static ThermalNetwork Network(ThermalEdge edges, double cellSizeM = 0.004)
    {
        var g = PlateGeometry.Rectangle(0.24, 0.09);
        g.AddPattern(SlotPatterns.Comb(g.Outline, PlateEdge.Bottom, 0.05, 0.06, 0.008));
        return ThermalNetwork.Assemble(PlateGrid.Build(g, new GridOptions { CellSizeM = cellSizeM }), 16.2, 0.008, edges);
    }

    /// <summary>Values by unknown spread on the operator's padded lattice (0 at nodes without an unknown).</summary>
    private static double[] OnLattice(ThermalOperator op, double[] byUnknown)
    {
        var v = new double[op.LatticeLength];
        var map = op.Network.NodeUnknown;
        for (int n = 0; n < map.Length; n++) if (map[n] >= 0) v[op.Pad + n] = byUnknown[map[n]];
        return v;
    }

    /// <summary>Largest |lattice value - expected value| over the nodes with an unknown, and largest |lattice value| elsewhere (the identity rows).</summary>
    private static (double Unknowns, double Elsewhere) Misfit(ThermalOperator op, double[] lattice, double[] expected)
    {
        double unknowns = 0, elsewhere = 0;
        var map = op.Network.NodeUnknown;
        for (int n = 0; n < map.Length; n++)
            if (map[n] >= 0) unknowns = Math.Max(unknowns, Math.Abs(lattice[op.Pad + n] - expected[map[n]]));
            else elsewhere = Math.Max(elsewhere, Math.Abs(lattice[op.Pad + n]));
        return (unknowns, elsewhere);
    }

    // The same matrix applied to a random vector, with an uneven h and after the diagonal is changed in place: 1e-12 relative
    // (the same few products summed in another order); the pass's dot product x . Ax to the same relative tolerance; the nodes
    // without an unknown (identity rows) stay 0.
    [Theory]
    [InlineData(ThermalEdge.Insulated, 0.004)]
    [InlineData(ThermalEdge.Ambient, 0.004)]
    [InlineData(ThermalEdge.Insulated, 0.005)]
    [InlineData(ThermalEdge.Ambient, 0.005)]
    public void Lattice_operator_is_the_assembled_matrix(ThermalEdge edges, double cellSizeM)
    {
        var network = Network(edges, cellSizeM);
        Assert.True(cellSizeM == 0.004 || network.Lattice.NodeCount % 4 != 0);
        var random = new Random(11);
        var x = Enumerable.Range(0, network.Unknowns).Select(_ => random.NextDouble() - 0.5).ToArray();
        var op = new ThermalOperator(network);
        var onLattice = OnLattice(op, x);
        foreach (double scale in new[] { 1.0, 7.0 })
        {
            var h = Enumerable.Range(0, network.Unknowns).Select(u => scale * (20 + 30 * Math.Sin(u))).ToArray();
            op.SetSurfaceCoefficients(h);
            var expected = new double[x.Length];
            network.Matrix(h).Multiply(x, expected);
            var actual = new double[op.LatticeLength];
            double dot = op.Multiply(onLattice, actual);
            double largest = expected.Max(Math.Abs);
            var (misfit, elsewhere) = Misfit(op, actual, expected);
            Assert.InRange(misfit, 0, largest * 1e-12);
            Assert.Equal(0, elsewhere);
            double expectedDot = x.Zip(expected, (a, b) => a * b).Sum();
            Assert.Equal(expectedDot, dot, Math.Abs(expectedDot) * 1e-12);
        }
    }

    // The residual pass (ThermalOperator.Residual: r = b - A x, four rows at a time, with r . r and max |r| in the same pass) against
    // b - A x from the assembled matrix: 1e-12 of |b| (the same few products summed in another order), r . r and max |r| to 1e-12
    // relative; the nodes without an unknown keep r = 0.
    [Theory]
    [InlineData(ThermalEdge.Insulated, 0.004)]
    [InlineData(ThermalEdge.Ambient, 0.004)]
    [InlineData(ThermalEdge.Insulated, 0.005)]
    [InlineData(ThermalEdge.Ambient, 0.005)]
    public void Residual_pass_is_b_minus_the_assembled_matrix_times_x(ThermalEdge edges, double cellSizeM)
    {
        var network = Network(edges, cellSizeM);
        var random = new Random(13);
        var op = new ThermalOperator(network);
        var h = Enumerable.Range(0, network.Unknowns).Select(u => 20 + 30 * Math.Sin(u)).ToArray();
        op.SetSurfaceCoefficients(h);
        var x = Enumerable.Range(0, network.Unknowns).Select(_ => random.NextDouble() - 0.5).ToArray();
        var b = Enumerable.Range(0, network.Unknowns).Select(_ => random.NextDouble() - 0.5).ToArray();
        var ax = new double[x.Length];
        network.Matrix(h).Multiply(x, ax);
        var expected = b.Zip(ax, (p, q) => p - q).ToArray();
        var r = new double[op.LatticeLength];
        var (squared, largest) = op.Residual(OnLattice(op, b), OnLattice(op, x), r);
        var (misfit, elsewhere) = Misfit(op, r, expected);
        Assert.InRange(misfit, 0, Math.Sqrt(b.Sum(v => v * v)) * 1e-12);
        Assert.Equal(0, elsewhere);
        double expectedSquared = expected.Sum(v => v * v), expectedLargest = expected.Max(Math.Abs);
        Assert.Equal(expectedSquared, squared, expectedSquared * 1e-12);
        Assert.Equal(expectedLargest, largest, expectedLargest * 1e-12);
    }

    // The conjugate gradients' residual kept across a change of diagonal and right-hand side (ThermalConjugateGradient.Update: r += db
    // - dd x, the conduction unchanged) against b' - A' x from the assembled matrix with the new h: 1e-12 of |b'| (rounding of a few
    // products of terms no larger than |b'| and |A' x|).
    [Theory]
    [InlineData(ThermalEdge.Insulated)]
    [InlineData(ThermalEdge.Ambient)]
    public void Residual_follows_a_change_of_diagonal_and_right_hand_side(ThermalEdge edges)
    {
        var network = Network(edges);
        var random = new Random(3);
        var op = new ThermalOperator(network);
        var cg = new ThermalConjugateGradient(op);
        var x = Enumerable.Range(0, network.Unknowns).Select(_ => random.NextDouble()).ToArray();
        var b = Enumerable.Range(0, network.Unknowns).Select(_ => random.NextDouble()).ToArray();
        var h = Enumerable.Range(0, network.Unknowns).Select(u => 20 + 30 * Math.Sin(u)).ToArray();
        op.SetSurfaceCoefficients(h);
        Array.Copy(OnLattice(op, x), cg.X, op.LatticeLength);
        Array.Copy(OnLattice(op, b), cg.B, op.LatticeLength);
        cg.StartResidual();
        var hNew = h.Select((v, u) => v + 5 + 3 * Math.Cos(u)).ToArray();
        var bNew = b.Select((v, u) => v * (1 + 0.1 * Math.Sin(3 * u))).ToArray();
        var map = network.NodeUnknown;
        for (int n = 0; n < map.Length; n++) if (map[n] >= 0) cg.Update(n, network.DiagonalAt(n, hNew[map[n]]), bNew[map[n]]);
        var ax = new double[x.Length];
        network.Matrix(hNew).Multiply(x, ax);
        var expected = bNew.Zip(ax, (p, q) => p - q).ToArray();
        var (misfit, elsewhere) = Misfit(op, cg.R, expected);
        double normB = Math.Sqrt(bNew.Sum(v => v * v));
        Assert.InRange(misfit, 0, normB * 1e-12);
        Assert.Equal(0, elsewhere);
    }

    // The multigrid built from the stencil (StructuredMultigrid.ForNodeStencil, one unknown per lattice node) holds the assembled
    // matrix as its finest operator, with identity rows at the nodes without an unknown: 1e-12 relative (the same few products summed
    // in another order). Its V-cycle is checked through CG against MathNet's dense solve in ThermalMultigridTests.
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
        a.Multiply(r, expected);
        int nodes = network.Lattice.NodeCount;
        var actual = new double[op.LatticeLength];
        fromStencil.Operator.Multiply(OnLattice(op, r).AsSpan(op.Pad, nodes), actual.AsSpan(op.Pad, nodes));
        var (misfit, elsewhere) = Misfit(op, actual, expected);
        Assert.InRange(misfit, 0, expected.Max(Math.Abs) * 1e-12);
        Assert.Equal(0, elsewhere);
    }

    // The V-cycle on the conjugate gradients' lattice vectors (StructuredMultigrid.ApplyOnLattice: r read in place, z left in the
    // cycle's single-precision iterate times a scale) gives the numbers of the public Apply (copy in, cycle, copy out) bit for bit, and
    // r . z: 1e-14 relative (the same products, summed by the cycle's last sweep instead of a pass of their own). Two of the project's
    // own paths compared, common practice, no source; the solver against a dense reference is ThermalMultigridTests.
    [Theory]
    [InlineData(ThermalEdge.Insulated)]
    [InlineData(ThermalEdge.Ambient)]
    public void Lattice_apply_gives_the_numbers_of_apply(ThermalEdge edges)
    {
        var network = Network(edges);
        var h = Enumerable.Repeat(50.0, network.Unknowns).ToArray();
        var op = new ThermalOperator(network);
        op.SetSurfaceCoefficients(h);
        var multigrid = network.Preconditioner(op, 50);
        var random = new Random(11);
        var r = Enumerable.Range(0, network.Unknowns).Select(_ => 1e3 * (random.NextDouble() - 0.5)).ToArray();
        var rOnLattice = OnLattice(op, r);
        int nodes = network.Lattice.NodeCount;
        var expected = new double[op.LatticeLength];
        multigrid.Apply(rOnLattice.AsSpan(op.Pad, nodes), expected.AsSpan(op.Pad, nodes));
        double largest = r.Max(Math.Abs);
        double rz = multigrid.ApplyOnLattice(rOnLattice, largest, out var z, out double zScale);
        int differing = 0;
        for (int i = 0; i < op.LatticeLength; i++) if (z[i] * zScale != expected[i]) differing++;
        Assert.Equal(0, differing);
        double expectedDot = 0;
        for (int i = 0; i < op.LatticeLength; i++) expectedDot += rOnLattice[i] * expected[i];
        Assert.Equal(expectedDot, rz, Math.Abs(expectedDot) * 1e-14);
    }

    // Conjugate gradients' fused pass (ThermalOperator.MultiplyNextDirection: p = s z + beta p with z the multigrid's single-precision
    // output and s its scale, q = A p, p . q) against the two steps done apart with the assembled matrix: 1e-12 relative (the same few
    // products summed in another order).
    [Theory]
    [InlineData(ThermalEdge.Insulated, 0.004)]
    [InlineData(ThermalEdge.Ambient, 0.004)]
    [InlineData(ThermalEdge.Insulated, 0.005)]
    [InlineData(ThermalEdge.Ambient, 0.005)]
    public void Next_direction_and_its_product_in_one_pass(ThermalEdge edges, double cellSizeM)
    {
        var network = Network(edges, cellSizeM);
        var random = new Random(7);
        var op = new ThermalOperator(network);
        var h = Enumerable.Range(0, network.Unknowns).Select(u => 20 + 30 * Math.Sin(u)).ToArray();
        op.SetSurfaceCoefficients(h);
        var z = Enumerable.Range(0, network.Unknowns).Select(_ => (float)(random.NextDouble() - 0.5)).ToArray();
        var p = Enumerable.Range(0, network.Unknowns).Select(_ => random.NextDouble() - 0.5).ToArray();
        const double beta = 0.37, zScale = 0.3;
        var direction = z.Zip(p, (a, b) => a * zScale + beta * b).ToArray();
        var expected = new double[direction.Length];
        network.Matrix(h).Multiply(direction, expected);
        var pOnLattice = OnLattice(op, p);
        var q = new double[op.LatticeLength];
        var zOnLattice = new float[op.LatticeLength];
        var map = network.NodeUnknown;
        for (int n = 0; n < map.Length; n++) if (map[n] >= 0) zOnLattice[op.Pad + n] = z[map[n]];
        double dot = op.MultiplyNextDirection(zOnLattice, zScale, beta, pOnLattice, q);
        double largest = expected.Max(Math.Abs);
        var (misfit, elsewhere) = Misfit(op, q, expected);
        Assert.InRange(misfit, 0, largest * 1e-12);
        Assert.Equal(0, elsewhere);
        var (directionMisfit, _) = Misfit(op, pOnLattice, direction);
        Assert.InRange(directionMisfit, 0, 1e-15);
        double expectedDot = direction.Zip(expected, (a, b) => a * b).Sum();
        Assert.Equal(expectedDot, dot, Math.Abs(expectedDot) * 1e-12);
    }
}
