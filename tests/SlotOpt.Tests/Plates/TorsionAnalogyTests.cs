using SlotOpt.Plates.Geometry;
using SlotOpt.Plates.Grid;
using SlotOpt.Plates.ResistanceLimited;
using SlotOpt.Plates.Sources;

namespace SlotOpt.Tests.Plates;

/// <summary>
/// Plates in a uniform AC field against the torsion constants of their outlines
/// (P = G omega^2 Bp^2 J / 8, derivation in <see cref="TorsionReference"/>).
/// </summary>
public class TorsionAnalogyTests
{
    private const double Conductance = 1.0, PeakT = 1.0, FrequencyHz = 50;

    internal static double SolveLoss(PlateGeometry geometry, double cellM)
    {
        var model = SheetModel.Build(geometry, new GridOptions { CellSizeM = cellM });
        var solution = ResistanceLimitedSolver.SolveAc(model, new UniformAcField(PeakT, FrequencyHz));
        Assert.True(solution.RelativeResidual <= 1e-8, $"residual {solution.RelativeResidual}");
        return solution.LossW(Conductance);
    }

    private static double TorsionConstantFromLoss(double lossW) => lossW / TorsionReference.AcLossW(Conductance, PeakT, FrequencyHz, 1);

    // k1 table: Timoshenko & Goodier, Theory of Elasticity, 3rd ed., 1970, ch. 10 (4 decimals).
    // Tolerance 1 %: the brief's target on a fine grid (64 cells across the short side; the 5-point
    // scheme's error there is below 1e-3, measured -0.10 % (square) to -0.02 % (b/a = 10) against the table).
    [Theory]
    [InlineData(1.0, 0.1406)]   // T&G table, b/a = 1
    [InlineData(2.0, 0.2287)]   // T&G table, b/a = 2
    [InlineData(4.0, 0.2808)]   // T&G table, b/a = 4
    [InlineData(10.0, 0.3123)]  // T&G table, b/a = 10
    public void Rectangle_matches_Timoshenko_Goodier_k1(double bOverA, double k1)
    {
        double a = 0.1, b = bOverA * a;
        double j = TorsionConstantFromLoss(SolveLoss(PlateGeometry.Rectangle(b, a), a / 64));
        Assert.InRange(j / (k1 * a * a * a * b) - 1, -0.01, 0.01);
    }

    // Tolerance 1 % (the brief's target). Curved and slanted outlines cut cells; the cut-cell conductance
    // weighting moves the effective edge by O(h) (first order, see the order test), measured errors
    // -0.44 % (circle), -0.49 % (ellipse), -0.72 % (triangle) on these grids.
    [Theory]
    [InlineData("circle")]    // r = 1: J = pi r^4 / 2 (T&G ch. 10); 256 cells across the diameter
    [InlineData("ellipse")]   // a = 2, b = 1: J = pi a^3 b^3 / (a^2 + b^2) (T&G ch. 10); 128 cells across the minor axis
    [InlineData("triangle")]  // side s = 1: J = sqrt(3) s^4 / 80 (T&G ch. 10); 256 cells along a side
    public void Curved_and_slanted_outlines_match_closed_form_torsion_constants(string shape)
    {
        var (geometry, cellM, exactJ) = shape switch
        {
            "circle" => (new PlateGeometry(Polygon.Circle(new Vec2(0, 0), 1, 2048)), 2.0 / 256, Math.PI / 2),
            "ellipse" => (new PlateGeometry(Polygon.Ellipse(new Vec2(0, 0), 2, 1, 2048)), 2.0 / 128, Math.PI * 8 / 5),
            _ => (new PlateGeometry(Polygon.EquilateralTriangle(0, 0, 1)), 1.0 / 256, Math.Sqrt(3) / 80),
        };
        double j = TorsionConstantFromLoss(SolveLoss(geometry, cellM));
        Assert.True(Math.Abs(j / exactJ - 1) < 0.01, $"{shape}: J = {j:E6}, closed form {exactJ:E6}, error {j / exactJ - 1:P3}");
    }

    // Hollow circle ro = 1, ri = 0.5 whose hole carries the same dB/dt: J = pi (ro^4 - ri^4)/2 exactly
    // (T&G ch. 10; exact for the eddy analogue when the hole carries the same dB/dt). The hole is one merged unknown
    // fixed by Faraday's law. Tolerance 1 %: cut cells on both circles, measured -0.5 % at 256 cells across.
    [Fact]
    public void Hollow_circle_matches_exact_torsion_constant()
    {
        var ring = new PlateGeometry(Polygon.Circle(new Vec2(0, 0), 1, 2048)).AddCutout(Polygon.Circle(new Vec2(0, 0), 0.5, 1024));
        double j = TorsionConstantFromLoss(SolveLoss(ring, 2.0 / 256));
        double exact = Math.PI * (1 - Math.Pow(0.5, 4)) / 2;
        Assert.InRange(j / exact - 1, -0.01, 0.01);
    }

    // Thin ring (mean radius rm = 0.95, width w = 0.1) as one circuit: EMF = omega Bp pi rm^2 (Faraday's law),
    // resistance 2 pi rm / (G w), so P = EMF_rms^2 / R = G omega^2 Bp^2 pi rm^3 w / 4 [D, circuit theory].
    // The exact hollow-circle value exceeds it by the factor 1 + w^2/(4 rm^2) = 1.0028 [D, from
    // ro^4 - ri^4 = 4 rm^3 w + rm w^3], so the tolerance is 1 %: +0.28 % model difference and the grid's first-order
    // cut-cell error at 24 cells across the ring (about -1.1 %); measured -0.82 %.
    [Fact]
    public void Thin_ring_matches_Faraday_law_circuit()
    {
        double rm = 0.95, w = 0.1;
        var ring = new PlateGeometry(Polygon.Circle(new Vec2(0, 0), rm + w / 2, 2048)).AddCutout(Polygon.Circle(new Vec2(0, 0), rm - w / 2, 2048));
        double loss = SolveLoss(ring, 2 * (rm + w / 2) / 512);
        double omega = 2 * Math.PI * FrequencyHz;
        double circuit = Conductance * omega * omega * PeakT * PeakT * Math.PI * rm * rm * rm * w / 4;
        Assert.InRange(loss / circuit - 1, -0.01, 0.01);
    }

    // Observed order of convergence from a log-log fit of |error| against h over 4 grids.
    // Rectangle b/a = 2 against the exact series (Timoshenko & Goodier, Theory of Elasticity, 3rd ed., 1970, ch. 10): the 5-point finite-volume scheme on a
    // grid-aligned outline is second order; asserted 2 +- 0.2 (measured 1.997).
    // Circle against pi r^4/2: cut cells move the effective edge by O(h), so first order; asserted 1 +- 0.2 (measured 0.984).
    [Theory]
    [InlineData("rectangle", 2.0)]
    [InlineData("circle", 1.0)]
    public void Convergence_order_under_grid_refinement(string shape, double expectedOrder)
    {
        var hs = new List<double>();
        var errors = new List<double>();
        foreach (int n in new[] { 16, 32, 64, 128 })
        {
            double h, exact, j;
            if (shape == "rectangle")
            {
                h = 0.1 / n;
                exact = TorsionReference.Rectangle(0.1, 0.2);
                j = TorsionConstantFromLoss(SolveLoss(PlateGeometry.Rectangle(0.2, 0.1), h));
            }
            else
            {
                h = 2.0 / n;
                exact = Math.PI / 2;
                j = TorsionConstantFromLoss(SolveLoss(new PlateGeometry(Polygon.Circle(new Vec2(0, 0), 1, 2048)), h));
            }
            hs.Add(Math.Log(h));
            errors.Add(Math.Log(Math.Abs(j / exact - 1)));
        }
        double order = Slope(hs, errors);
        Assert.True(Math.Abs(order - expectedOrder) <= 0.2, $"{shape}: observed order {order:F3}");
    }

    private static double Slope(IReadOnlyList<double> x, IReadOnlyList<double> y)
    {
        double mx = x.Average(), my = y.Average();
        double sxy = 0, sxx = 0;
        for (int i = 0; i < x.Count; i++) { sxy += (x[i] - mx) * (y[i] - my); sxx += (x[i] - mx) * (x[i] - mx); }
        return sxy / sxx;
    }
}
