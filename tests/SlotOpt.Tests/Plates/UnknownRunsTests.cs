using SlotOpt.Plates.Geometry;
using SlotOpt.Plates.Grid;

namespace SlotOpt.Tests.Plates;

/// <summary>
/// The one way vectors move between the unknowns' numbering and the sheet operator's padded lattice: <see cref="UnknownRuns"/>' block
/// copies, against the reference, the element-by-element node-to-unknown map (<see cref="NodeRegions.NodeUnknown"/>, the definition
/// of E: unknown u at every node p with map[p] = u). Both copy, or multiply by one scale, the same double once, so the check is exact
/// equality (common practice, no source: a copy is exact and one IEEE multiply rounds the same wherever it is done). The plate has
/// open slots from one edge (runs broken within rows), an enclosed hole and slits narrower than a cell (merged regions, which no run
/// holds), so every case of the layout occurs.
/// </summary>
public class UnknownRunsTests
{
    private static SheetModel Model()
    {
        var g = PlateGeometry.Rectangle(1.2, 1);
        g.AddPattern(SlotPatterns.Comb(g.Outline, PlateEdge.Bottom, 0.3, 0.25, 0.02));
        g.AddPattern(SlotPatterns.EnclosedSlits(g.Outline, PlateEdge.Left, 0.25, 0.4, 0.003));
        g.AddCutout(Polygon.Circle(new Vec2(0.2, 0.6), 0.08, 256));
        var model = SheetModel.Build(g, new GridOptions { CellSizeM = 0.01 });
        Assert.True(model.Regions.MergedCount >= 2, $"the plate should have merged regions (has {model.Regions.MergedCount})");
        return model;
    }

    private static double[] Random(int length, int seed)
    {
        var random = new Random(seed);
        return Enumerable.Range(0, length).Select(_ => random.NextDouble() - 0.5).ToArray();
    }

    [Fact]
    public void Block_copies_onto_the_lattice_equal_the_node_to_unknown_map()
    {
        var model = Model();
        var map = model.Regions.NodeUnknown;
        var merged = model.Regions.IsMerged;
        var runs = model.Multigrid.Operator.Runs;
        int pad = model.Multigrid.Finest.Pad, length = model.Multigrid.Finest.X.Length;
        Assert.True(runs.Count > model.Lattice.NodesY, "open slots should break rows into several runs");
        var v = Random(model.Unknowns, 1);
        foreach (double? scale in new double?[] { null, 3.0 })
        {
            var lattice = Enumerable.Repeat(double.NaN, length).ToArray();   // every entry must be written
            if (scale is double f) runs.ToLattice(v, lattice, pad, f);
            else runs.ToLattice(v, lattice, pad);
            var expected = new double[length];
            for (int p = 0; p < map.Length; p++)
                if (map[p] >= 0 && !merged[map[p]]) expected[pad + p] = scale is double g ? g * v[map[p]] : v[map[p]];
            for (int i = 0; i < length; i++) Assert.True(expected[i].Equals(lattice[i]), $"scale {scale}: lattice entry {i}: {lattice[i]} vs {expected[i]}");
        }
    }

    [Fact]
    public void Block_copies_from_the_lattice_equal_the_node_to_unknown_map()
    {
        var model = Model();
        var map = model.Regions.NodeUnknown;
        var merged = model.Regions.IsMerged;
        var runs = model.Multigrid.Operator.Runs;
        int pad = model.Multigrid.Finest.Pad, length = model.Multigrid.Finest.X.Length;
        var lattice = Random(length, 2);
        var single = lattice.Select(x => (float)x).ToArray();
        const double Scale = 0.3;
        var fromDouble = Enumerable.Repeat(double.NaN, model.Unknowns).ToArray();   // merged regions' entries must stay untouched
        var fromSingle = Enumerable.Repeat(double.NaN, model.Unknowns).ToArray();
        runs.FromLattice(lattice, pad, Scale, fromDouble);
        runs.FromLattice(single, pad, Scale, fromSingle);
        var expectedDouble = Enumerable.Repeat(double.NaN, model.Unknowns).ToArray();
        var expectedSingle = Enumerable.Repeat(double.NaN, model.Unknowns).ToArray();
        for (int p = 0; p < map.Length; p++)
        {
            int u = map[p];
            if (u < 0 || merged[u]) continue;
            expectedDouble[u] = Scale * lattice[pad + p];
            expectedSingle[u] = single[pad + p] * Scale;
        }
        for (int u = 0; u < model.Unknowns; u++)
        {
            Assert.True(expectedDouble[u].Equals(fromDouble[u]), $"double lattice, unknown {u}: {fromDouble[u]} vs {expectedDouble[u]}");
            Assert.True(expectedSingle[u].Equals(fromSingle[u]), $"single lattice, unknown {u}: {fromSingle[u]} vs {expectedSingle[u]}");
        }
    }

    // The conjugate gradients' layout (a merged region's value at its first node, 0 at its other nodes, the outside and the pads)
    // against the map: the first node of a region is the lowest node the map gives its unknown.
    [Fact]
    public void Conjugate_gradient_layout_equals_the_node_to_unknown_map()
    {
        var model = Model();
        var map = model.Regions.NodeUnknown;
        var op = model.Multigrid.Operator;
        int pad = model.Multigrid.Finest.Pad, length = model.Multigrid.Finest.X.Length;
        var v = Random(model.Unknowns, 3);
        const double Scale = 0.25;
        var lattice = Enumerable.Repeat(double.NaN, length).ToArray();
        op.ToLattice(v, lattice, Scale);
        var expected = new double[length];
        var firstNode = Enumerable.Repeat(-1, model.Unknowns).ToArray();
        for (int p = 0; p < map.Length; p++)
        {
            int u = map[p];
            if (u < 0 || firstNode[u] >= 0) continue;
            firstNode[u] = p;
            expected[pad + p] = Scale * v[u];
        }
        for (int i = 0; i < length; i++) Assert.True(expected[i].Equals(lattice[i]), $"lattice entry {i}: {lattice[i]} vs {expected[i]}");
        var back = new double[model.Unknowns];
        op.FromLattice(lattice, back, 1 / Scale);   // a power of two each way, as the conjugate gradients scale: exact
        Assert.Equal(v, back);
        var other = Random(length, 4);
        op.FromLattice(other, back, 3);
        for (int u = 0; u < model.Unknowns; u++) Assert.True((3 * other[pad + firstNode[u]]).Equals(back[u]), $"unknown {u}");
    }

    // The product borrows its lattice vector from the shared pool, so the vector it gets back holds the last product's E x: the
    // answer must not depend on it (every entry is written before it is read). Residual forms the same rows as Multiply, so
    // r = b - A x holds bit for bit.
    [Fact]
    public void Products_do_not_depend_on_the_borrowed_vector_and_residual_matches_product()
    {
        var model = Model();
        var op = model.Multigrid.Operator;
        var x = Random(model.Unknowns, 5);
        var other = Random(model.Unknowns, 6);
        var b = Random(model.Unknowns, 7);
        var first = new double[model.Unknowns];
        var again = new double[model.Unknowns];
        var residual = new double[model.Unknowns];
        op.Multiply(x, first);
        op.Multiply(other, again);
        op.Multiply(x, again);
        Assert.Equal(first, again);
        op.Residual(b, x, residual);
        for (int u = 0; u < model.Unknowns; u++) Assert.True((b[u] - first[u]).Equals(residual[u]), $"unknown {u}: {residual[u]} vs {b[u] - first[u]}");
    }

    // No allocation inside a solve loop: after a thread's first product the shared array pool hands the same lattice vector back
    // (ArrayPool<T>.Shared keeps one returned array a size class a thread). Asserted: 100 products (Multiply and Residual) allocate
    // less than one lattice vector (measured 0 bytes). The pool gives its arrays up only at a full collection under high memory
    // pressure, which would then cost one vector again.
    [Fact]
    public void Products_allocate_no_lattice_vector_after_the_first()
    {
        var model = Model();
        var op = model.Multigrid.Operator;
        var x = Random(model.Unknowns, 8);
        var y = new double[model.Unknowns];
        op.Multiply(x, y);
        long before = GC.GetAllocatedBytesForCurrentThread();
        for (int i = 0; i < 50; i++)
        {
            op.Multiply(x, y);
            op.Residual(x, x, y);
        }
        long allocated = GC.GetAllocatedBytesForCurrentThread() - before;
        Assert.True(allocated < 8L * model.Multigrid.Finest.X.Length, $"100 products allocated {allocated} bytes");
    }
}
