using MathNet.Numerics;
using SlotOpt.Plates.Geometry;
using SlotOpt.Plates.Grid;
using SlotOpt.Plates.Sources;
using SlotOpt.Plates.Sources.Magnets;

namespace SlotOpt.Tests.Plates.Magnets;

public class MagnetArrayTests(Xunit.Abstractions.ITestOutputHelper output)
{
    private const double Br = 1.2, GapM = 0.002;

    private static MagnetArray Row(IPermanentMagnet magnet, int order = 4) =>
        MagnetArray.Row(magnet, new Vec2(0.03, 0.025), 3, 0.025, MagnetPolarity.Alternating, GapM).WithLineQuadratureOrder(order);

    // The 4-point Gauss-Legendre rule per dual-cell edge against a 12-point rule (both Abramowitz and Stegun 25.4.29) at a cell
    // size equal to the gap (the coarsest a user should run): the field is analytic below the magnets with length scale the gap,
    // so the 4-point rule's error falls as h^8. Measured worst difference 1.5e-6 (cuboid) and 2.0e-6 (cylinder) of the largest node
    // value for dBz/dx, below 7e-7 for dBz/dz; tolerance 1e-5 of the largest node value.
    [Theory]
    [InlineData("cuboid")]
    [InlineData("cylinder")]
    public void Four_point_edge_rule_agrees_with_twelve_point_rule(string shape)
    {
        IPermanentMagnet magnet = shape == "cuboid" ? new CuboidMagnet(0.02, 0.015, 0.008, Br) : new CylinderMagnet(0.02, 0.008, Br);
        var lattice = new CellLattice(0, 0, GapM, GapM, 50, 25);
        foreach (bool slope in new[] { true, false })
        {
            var coarse = new double[lattice.NodeCount];
            var fine = new double[lattice.NodeCount];
            void Fill(MagnetArray a, double[] node) { if (slope) a.IntegrateSlope(lattice, 0.001, 0, node); else a.IntegrateNormalGradient(lattice, 0.001, 0, node); }
            Fill(Row(magnet, 4), coarse);
            Fill(Row(magnet, 12), fine);
            double peak = fine.Max(Math.Abs), worst = coarse.Zip(fine, (p, q) => Math.Abs(p - q)).Max();
            output.WriteLine($"{shape} {(slope ? "slope" : "normal gradient")}: 4-point vs 12-point worst difference {worst / peak:E2} of the peak");
            Assert.True(peak > 0);
            Assert.InRange(worst, 0, 1e-5 * peak);
        }
    }

    // The edge-integral forms against a direct area integral of the derivatives: dBz/dx and dBz/dz by central differences
    // (step 1e-7 m, truncation ~1e-9 relative) integrated over the dual cell with MathNet's Gauss-Legendre product rule of order 16.
    // This checks Gauss's theorem (div B = 0 below the magnets) and the telescoping edge bookkeeping; tolerance 1e-6 of the node value's scale.
    [Theory]
    [InlineData(10, 12)]
    [InlineData(17, 6)]
    [InlineData(3, 20)]
    public void Edge_integrals_equal_the_area_integrals_of_the_derivatives(int i, int j)
    {
        var array = Row(new CuboidMagnet(0.02, 0.015, 0.008, Br));
        var lattice = new CellLattice(0, 0, 0.003, 0.0025, 40, 24);
        var slope = new double[lattice.NodeCount];
        var normal = new double[lattice.NodeCount];
        array.IntegrateSlope(lattice, 0, 0, slope);
        array.IntegrateNormalGradient(lattice, 0, 0, normal);
        const double s = 1e-7;
        double x0 = lattice.NodeX(i) - lattice.Hx / 2, y0 = lattice.NodeY(j) - lattice.Hy / 2;
        double dx = Integrate.OnRectangle((x, y) => (array.FluxDensityAt(x + s, y, 0).Z - array.FluxDensityAt(x - s, y, 0).Z) / (2 * s), x0, x0 + lattice.Hx, y0, y0 + lattice.Hy, 16);
        double dz = Integrate.OnRectangle((x, y) => (array.FluxDensityAt(x, y, s).Z - array.FluxDensityAt(x, y, -s).Z) / (2 * s), x0, x0 + lattice.Hx, y0, y0 + lattice.Hy, 16);
        double scale = Br * lattice.Hy;   // Br / (1 m) over one cell: the size of these integrals near a magnet edge
        int n = j * lattice.NodesX + i;
        Assert.InRange(slope[n] - dx, -1e-6 * scale, 1e-6 * scale);
        Assert.InRange(normal[n] - dz, -1e-6 * scale, 1e-6 * scale);
    }

    // Depth: the field at depth d below the top surface is the field at the surface of magnets d further away (the plate is not
    // magnetic: mu_r = 1 assumed by these sources), and it weakens with depth. Tolerance 1e-12 of the peak (the same closed form, rounding).
    [Fact]
    public void Field_at_depth_is_the_field_of_magnets_further_away()
    {
        var magnet = new CuboidMagnet(0.02, 0.015, 0.008, Br);
        var lattice = new CellLattice(0, 0, 0.002, 0.002, 30, 20);
        var deep = new double[lattice.NodeCount];
        var raised = new double[lattice.NodeCount];
        var surface = new double[lattice.NodeCount];
        new SlidingMagnets(MagnetArray.Row(magnet, new Vec2(0.03, 0.02), 1, 0, MagnetPolarity.Same, GapM), 2).IntegrateRate(lattice, 0, 0.003, deep);
        new SlidingMagnets(MagnetArray.Row(magnet, new Vec2(0.03, 0.02), 1, 0, MagnetPolarity.Same, GapM + 0.003), 2).IntegrateRate(lattice, 0, raised);
        new SlidingMagnets(MagnetArray.Row(magnet, new Vec2(0.03, 0.02), 1, 0, MagnetPolarity.Same, GapM), 2).IntegrateRate(lattice, 0, surface);
        double peak = raised.Max(Math.Abs);
        for (int n = 0; n < deep.Length; n++) Assert.InRange(deep[n] - raised[n], -1e-12 * peak, 1e-12 * peak);
        Assert.True(surface.Max(Math.Abs) > peak, "the rate is larger at the surface than 3 mm deeper");
    }

    // Rows: alternating polarity flips every other magnet, so the field below the second magnet is minus the first's by symmetry
    // of the row (a row of three is symmetric about its middle magnet). Tolerance 1e-12 relative (rounding).
    [Fact]
    public void Alternating_row_flips_every_other_magnet()
    {
        var array = MagnetArray.Row(new CylinderMagnet(0.02, 0.008, Br), new Vec2(0, 0), 3, 0.03, MagnetPolarity.Alternating, GapM);
        Assert.Equal(new[] { 1, -1, 1 }, array.Magnets.Select(m => m.Polarity).ToArray());
        Assert.InRange(array.ExtentX.MinXM + 0.01, -1e-15, 1e-15);
        Assert.InRange(array.ExtentX.MaxXM - 0.07, -1e-15, 1e-15);
        Assert.InRange(array.SmallestLengthXM - 0.02, -1e-15, 1e-15);
        double left = array.FluxDensityAt(0, 0, -0.001).Z, right = array.FluxDensityAt(0.06, 0, -0.001).Z, middle = array.FluxDensityAt(0.03, 0, -0.001).Z;
        Assert.True(left > 0 && middle < 0);
        Assert.InRange(right / left - 1, -1e-12, 1e-12);
        var same = MagnetArray.Row(new CylinderMagnet(0.02, 0.008, Br), new Vec2(0, 0), 3, 0.03, MagnetPolarity.Same, GapM);
        Assert.True(same.FluxDensityAt(0.03, 0, -0.001).Z > 0);
    }

    // Bad input is an InputException naming the quantity (no stack trace for a user mistake).
    [Fact]
    public void Overlapping_row_or_bad_gap_is_an_input_error()
    {
        var magnet = new CuboidMagnet(0.02, 0.01, 0.005, Br);
        Assert.Throws<InputException>(() => MagnetArray.Row(magnet, new Vec2(0, 0), 2, 0.015, MagnetPolarity.Same, GapM));
        Assert.Throws<InputException>(() => MagnetArray.Row(magnet, new Vec2(0, 0), 2, 0.03, MagnetPolarity.Same, 0));
        Assert.Throws<InputException>(() => new CylinderMagnet(-0.01, 0.005, Br));
        Assert.Throws<InputException>(() => new MagnetPlacement(magnet, new Vec2(0, 0), 0));
        Assert.Throws<InputException>(() => new SlidingMagnets(MagnetArray.Row(magnet, new Vec2(0, 0), 1, 0, MagnetPolarity.Same, GapM), 0));
    }

    // The moving source writes -v times the slope integrals and reports its lift field as the normal gradient.
    // Tolerance: exact (the same numbers scaled by -v).
    [Fact]
    public void Sliding_source_rate_is_minus_speed_times_slope()
    {
        var array = Row(new CuboidMagnet(0.02, 0.015, 0.008, Br));
        var lattice = new CellLattice(0, 0, 0.004, 0.004, 20, 12);
        var slope = new double[lattice.NodeCount];
        var rate = new double[lattice.NodeCount];
        var lift = new double[lattice.NodeCount];
        array.IntegrateSlope(lattice, 0.002, 0, slope);
        var source = new SlidingMagnets(array, 3.0);
        source.IntegrateRate(lattice, 0.002, rate);
        for (int n = 0; n < rate.Length; n++) Assert.Equal(-3.0 * slope[n], rate[n]);
        Assert.Equal(LiftField.NormalGradient, source.IntegrateLiftField(lattice, 0.002, lift));
    }
}
