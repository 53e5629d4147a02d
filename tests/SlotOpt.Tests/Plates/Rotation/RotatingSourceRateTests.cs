using SlotOpt.Numerics;
using SlotOpt.Plates.Geometry;
using SlotOpt.Plates.Grid;
using SlotOpt.Plates.Sources.Magnets;
using SlotOpt.Plates.Sources.Rotation;

namespace SlotOpt.Tests.Plates.Rotation;

/// <summary>
/// The turning disc's source integration (RotatingSource.IntegrateRate): the same bits on one and two threads, and the same bits as the
/// edge moments read directly off the magnets' full field. Its physics (the published disc-brake torques) is checked in SourcesRotationTests.
/// </summary>
public class RotatingSourceRateTests
{
    private static CellLattice Lattice(double radiusM, double cellM) =>
        SheetModel.Build(new PlateGeometry(Polygon.Circle(new Vec2(radiusM, radiusM), radiusM)), new GridOptions { CellSizeM = cellM }).Lattice;

    private static RotatingMagnets Ring(IPermanentMagnet magnet, double a) =>
        new(magnet, 0.026, 5, 2 * Math.PI / 5, MagnetPolarity.Alternating, 0.002, new Vec2(a, a), 40);

    public static TheoryData<string> Sources => ["cylinder ring", "cuboid ring", "pole"];

    private static RotatingSource Source(string name, double a) => name switch
    {
        "cylinder ring" => Ring(new CylinderMagnet(0.012, 0.005, 1.2), a),
        "cuboid ring" => Ring(new CuboidMagnet(0.012, 0.008, 0.005, 1.2), a),
        _ => new RotatingPole(new Vec2(a, a), 0.025, 0.008, 0.6, 40),
    };

    // Each edge moment is computed by one worker from read-only data, so the rows split over two threads give the same array bit for bit
    // (common practice, no source). Fresh sources each time: the kept rates of one source would otherwise hand back the first array. Exact.
    [Theory]
    [MemberData(nameof(Sources))]
    public void Rates_on_one_and_two_threads_are_bit_identical(string name)
    {
        double a = 0.04;
        var lattice = Lattice(a, 0.0015);
        foreach (var angle in new[] { 0.0, 0.37, 2.9 })
        {
            var one = new double[lattice.NodeCount];
            var two = new double[lattice.NodeCount];
            Source(name, a).IntegrateRate(lattice, angle, one, threads: 1);
            Source(name, a).IntegrateRate(lattice, angle, two, threads: 2);
            Assert.Contains(one, v => v != 0);
            Assert.Equal(one, two);
        }
    }

    // The ring's rate against its definition read straight off the magnets' full field: per dual cell, omega times the Gauss-Legendre edge moments
    // (Abramowitz and Stegun 25.4.29) of x Bz along the top and bottom edges less y Bz along the right and left (Gauss's theorem on
    // dBz/dtheta = d(x Bz)/dy - d(y Bz)/dx), Bz the Z of FluxDensityAt with each magnet's cos and sin taken at every point. The source
    // takes the angles' cos and sin once and Bz alone, in the same operation order, so the two agree bit for bit. Exact.
    [Theory]
    [InlineData("cylinder ring")]
    [InlineData("cuboid ring")]
    public void Ring_rate_equals_the_edge_moments_of_the_full_field(string name)
    {
        double a = 0.04, angle = 0.41;
        var lattice = Lattice(a, 0.002);
        var ring = (RotatingMagnets)Source(name, a);
        var rate = new double[lattice.NodeCount];
        ring.IntegrateRate(lattice, angle, rate, threads: 2);
        var (t, w) = Quadrature.GaussLegendre01(ring.LineQuadratureOrder);
        double Bz(double x, double y)
        {
            double sum = 0;
            for (int k = 0; k < ring.Count; k++)
            {
                double phi = angle + k * ring.PitchRad, c = Math.Cos(phi), s = Math.Sin(phi);
                double sign = k % 2 == 1 ? -1 : 1;
                sum += sign * ring.Magnet.FluxDensityAt(-x * s + y * c, x * c + y * s - ring.RadiusM, -(ring.GapM + ring.Magnet.HeightM / 2)).Z;
            }
            return sum;
        }
        double AlongX(double y, double x0, double x1)
        {
            double sum = 0, d = x1 - x0;
            for (int q = 0; q < t.Length; q++) { double x = x0 + t[q] * d; sum += w[q] * x * Bz(x, y); }
            return sum * d;
        }
        double AlongY(double x, double y0, double y1)
        {
            double sum = 0, d = y1 - y0;
            for (int q = 0; q < t.Length; q++) { double y = y0 + t[q] * d; sum += w[q] * y * Bz(x, y); }
            return sum * d;
        }
        for (int j = 0; j < lattice.NodesY; j++)
            for (int i = 0; i < lattice.NodesX; i++)
            {
                // the cell's edge lines from the axis, as the lattice places them (x_i - hx/2 ... x_(i+1) - hx/2)
                double left = lattice.NodeX(i) - lattice.Hx / 2 - a, right = lattice.NodeX(i + 1) - lattice.Hx / 2 - a;
                double bottom = lattice.NodeY(j) - lattice.Hy / 2 - a, top = lattice.NodeY(j + 1) - lattice.Hy / 2 - a;
                double unit = AlongX(top, left, left + lattice.Hx) - AlongX(bottom, left, left + lattice.Hx)
                    - AlongY(right, bottom, bottom + lattice.Hy) + AlongY(left, bottom, bottom + lattice.Hy);
                Assert.Equal(ring.AngularSpeedRadPerS * unit, rate[j * lattice.NodesX + i]);
            }
    }
}
