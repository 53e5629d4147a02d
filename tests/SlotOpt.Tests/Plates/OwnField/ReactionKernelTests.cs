using System.Numerics;
using SlotOpt.Plates.Conductors;
using SlotOpt.Plates.Geometry;
using SlotOpt.Plates.Grid;
using SlotOpt.Plates.OwnField;
using Xunit.Abstractions;

namespace SlotOpt.Tests.Plates.OwnField;

public class ReactionKernelTests(ITestOutputHelper output)
{
    // Independent computation: the near-field kernel (Neumann's 1/r form, Duffy-Gauss quadrature) and the
    // far-field kernel (dipole 1/r^3 form, moment expansion) are two different formulas for the same mutual
    // inductance. Where both apply (24-32 cells) they must agree. Tolerance 1e-6 relative: the expansion's
    // truncation is about 11 (h/D)^6 = 6e-8 at 24 cells and the quadrature is converged to ~1e-10.
    // The same holds between two layers z apart (thick plates): 1/sqrt(r^2 + z^2) against (3 z^2 - R^2)/R^5.
    [Theory]
    [InlineData(1.0, 0.0)]
    [InlineData(1.3, 0.0)]
    [InlineData(1.0, 0.3)]
    [InlineData(1.0, 6.0)]
    public void Near_and_far_forms_agree_where_both_apply(double aspect, double zOverH)
    {
        double hx = 1e-3, hy = aspect * 1e-3, z = zOverH * 1e-3;
        foreach (var (dx, dy) in new[] { (24, 0), (0, 26), (20, 17), (30, 5) })
        {
            double near = ReactionKernel.NearField(hx, hy, dx, dy, z), far = ReactionKernel.FarField(hx, hy, dx, dy, z);
            output.WriteLine($"aspect {aspect} z/h {zOverH} ({dx},{dy}): near {near:E10} far {far:E10} rel {near / far - 1:E2}");
            Assert.InRange(near / far - 1, -1e-6, 1e-6);
        }
    }

    // Biot-Savart: a circular current loop of radius a carrying I has Bz = mu0 I / (2 a) at its centre
    // (e.g. Jackson, "Classical Electrodynamics", 3rd ed., sec. 5.5). A loop is a uniform dipole layer
    // psi = I over the disc; R psi at the centre node divided by the cell area is the mean Bz over the
    // centre hat. Tolerance 1 %: the disc's rim is resolved to a node (a = 40 cells: O(h/a)^2 and
    // rim-staircase errors of a few 0.1 %).
    [Fact]
    public void Uniform_dipole_disc_gives_the_loop_field_at_its_centre()
    {
        double h = 1e-3, a = 40 * h, current = 2.0;
        var model = SheetModel.Build(PlateGeometry.Rectangle(100 * h, 100 * h), new GridOptions { CellSizeM = h });
        var reaction = ReactionOperator.Build(model);
        var l = model.Lattice;
        var u = new Complex[model.Unknowns];
        int centre = -1;
        for (int j = 0; j < l.NodesY; j++)
            for (int i = 0; i < l.NodesX; i++)
            {
                int k = model.Regions.NodeUnknown[j * l.NodesX + i];
                if (k < 0) continue;
                double x = l.NodeX(i) - 50 * h, y = l.NodeY(j) - 50 * h;
                if (x * x + y * y < a * a) u[k] = current;
                if (i == 50 && j == 50) centre = k;
            }
        var flux = new Complex[model.Unknowns];
        reaction.ApplyR(u, flux);
        double b = flux[centre].Real / l.CellAreaM2;
        double expected = Validity.Mu0 * current / (2 * a);
        output.WriteLine($"Bz centre {b:E6} expected {expected:E6} rel {b / expected - 1:E3}");
        Assert.InRange(b / expected - 1, -0.01, 0.01);
    }

    // The FFT application on the zero-padded lattice must equal the direct (linear, not circular) sum
    // sum_n R(i - i', j - j') psi_n on a small plate, including a merged hole unknown (rows add up).
    // Tolerance 1e-10 relative: FFT rounding only.
    [Fact]
    public void Padded_FFT_equals_the_direct_sum()
    {
        var plate = PlateGeometry.Rectangle(0.013, 0.009);
        plate.AddCutout(Polygon.Rectangle(0.004, 0.003, 0.007, 0.006));
        var model = SheetModel.Build(plate, new GridOptions { CellSizeM = 0.001 });
        var reaction = ReactionOperator.Build(model);
        var l = model.Lattice;
        var map = model.Regions.NodeUnknown;
        var random = new Random(7);
        var u = Enumerable.Range(0, model.Unknowns).Select(_ => new Complex(random.NextDouble() - 0.5, random.NextDouble() - 0.5)).ToArray();
        var fft = new Complex[model.Unknowns];
        reaction.ApplyR(u, fft);
        var direct = new Complex[model.Unknowns];
        for (int m = 0; m < map.Length; m++)
        {
            if (map[m] < 0) continue;
            for (int n = 0; n < map.Length; n++)
                if (map[n] >= 0)
                    direct[map[m]] += reaction.Kernel[m % l.NodesX - n % l.NodesX, m / l.NodesX - n / l.NodesX] * u[map[n]];
        }
        double scale = direct.Max(c => c.Magnitude);
        double error = fft.Zip(direct, (p, q) => (p - q).Magnitude).Max();
        Assert.True(error < 1e-10 * scale, $"max difference {error / scale:E2} of the largest entry");
        Assert.True(model.Regions.MergedCount == 1);
    }

    // Between two layers z apart the flux of a uniform dipole disc (a current loop, radius a) through the centre
    // hat of the other layer is the loop's axial field mu0 I a^2 / (2 (a^2 + z^2)^(3/2)) (Biot-Savart, e.g. Jackson
    // sec. 5.5). Checked through the near quadrature with its graded Duffy panels (z = 0.2 h and 2 h) and the far form
    // (z = 30 h). Tolerance 1 %, as for the in-plane loop.
    [Theory]
    [InlineData(0.2)]
    [InlineData(2.0)]
    [InlineData(30.0)]
    public void Loop_field_on_the_axis_between_layers(double zOverH)
    {
        double h = 1e-3, a = 40 * h, z = zOverH * h, current = 1;
        var kernel = ReactionKernel.Build(h, h, 50, 50, z);
        double flux = 0;
        for (int dy = -50; dy <= 50; dy++)
            for (int dx = -50; dx <= 50; dx++)
                if ((dx * dx + dy * dy) * h * h < a * a) flux += kernel[dx, dy] * current;
        double b = flux / (h * h), expected = Validity.Mu0 * current * a * a / (2 * Math.Pow(a * a + z * z, 1.5));
        output.WriteLine($"z/h {zOverH}: Bz {b:E6} expected {expected:E6} rel {b / expected - 1:E3}");
        Assert.InRange(b / expected - 1, -0.01, 0.01);
    }

    // Scaling: Neumann's form M = (mu0/4pi) double integral of dl . dl' / r is homogeneous of degree 1 in length (e.g. Jackson,
    // "Classical Electrodynamics", 3rd ed., sec. 5.17), so a kernel on cells k times larger (aspect and layer gap in cells kept) is
    // k times the kernel, entry by entry, and the kernel Build tabulates equals the quadrature run in metres for that lattice.
    // Tolerance 1e-11 relative, both checks: at distant offsets the quadrature and the moment expansion sum terms of both signs
    // (the hat's gradient correlation integrates to zero), so scaling the lengths moves the last digits (measured 3.4e-13 at 23
    // cells); a wrong scale or a wrong table entry is of order 1.
    [Theory]
    [InlineData(1.0, 0.0)]
    [InlineData(1.3, 0.0)]
    [InlineData(1.0, 0.7)]
    public void Kernels_of_similar_lattices_scale_with_the_cell(double aspect, double gapCells)
    {
        double h = 1e-3, k = 4;
        var small = ReactionKernel.Build(h, aspect * h, 30, 30, gapCells * h);
        var large = ReactionKernel.Build(k * h, k * aspect * h, 30, 30, k * gapCells * h);
        foreach (var (dx, dy) in new[] { (0, 0), (1, 0), (0, 1), (3, 2), (10, 17), (23, 0), (30, 30) })
        {
            Assert.Equal(k * small[dx, dy], large[dx, dy], 1e-11 * Math.Abs(large[dx, dy]));
            double direct = Math.Sqrt(dx * dx + dy * dy * aspect * aspect + gapCells * gapCells) >= ReactionKernel.FarFieldRadiusCells * Math.Max(1, aspect)
                ? ReactionKernel.FarField(h, aspect * h, dx, dy, gapCells * h) : ReactionKernel.NearField(h, aspect * h, dx, dy, gapCells * h);
            Assert.Equal(direct, small[dx, dy], 1e-11 * Math.Abs(direct));
        }
    }
}
