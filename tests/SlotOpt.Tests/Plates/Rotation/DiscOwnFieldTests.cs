using SlotOpt.Plates;
using SlotOpt.Plates.Conductors;
using SlotOpt.Plates.Geometry;
using SlotOpt.Plates.Grid;
using SlotOpt.Plates.OwnField;
using SlotOpt.Plates.Sources.Magnets;
using SlotOpt.Plates.Sources.Rotation;
using SlotOpt.Tests.Cli;

namespace SlotOpt.Tests.Plates.Rotation;

/// <summary>
/// The turning disc with its own field ((A + omega G M) u = -s, see RotatingOwnFieldOperator): the discrete operator's skew symmetry (power
/// balance), the low-speed limit against the resistance-limited disc (Smythe 1942 / Schieber 1974 equation), and the torque peak against the
/// thin-sheet drag curve of J. R. Reitz, "Forces on moving magnets due to eddy currents", J. Appl. Phys. 41 (1970) 2067.
/// </summary>
public class DiscOwnFieldTests(Xunit.Abstractions.ITestOutputHelper output)
{
    private const double Copper = 5.8e7;   // S/m, annealed copper (IEC 60028, 1925: 1/58 ohm mm^2/m)
    private static readonly ConductingSheet Sheet = new(Copper, 0.001);
    private static double W => 2 / (Validity.Mu0 * Sheet.SheetConductanceS);   // receding-image speed w = 2 / (mu0 sigma t), 27.4 m/s

    private static SheetModel Disc(double radiusM, double cellM) =>
        SheetModel.Build(new PlateGeometry(Polygon.Circle(new Vec2(radiusM, radiusM), radiusM)), new GridOptions { CellSizeM = cellM });

    private static RotatingMagnets Magnet(double a, double m, double diameter, double gap, double omega) =>
        new(new CylinderMagnet(diameter, 0.005, 1.2), m, 1, 0, MagnetPolarity.Same, gap, new Vec2(a, a), omega);

    // x^T M y = -y^T M x for the turned reaction flux M (skew-symmetric by construction: D skew, R symmetric, M their symmetrised product), so
    // u^T M u = 0 and the discrete loss is the mechanical power. On a slotted disc (merged hole unknowns). Tolerance 1e-12 of |x||M||y|: round-off
    // of the FFT convolution (common practice, no source).
    [Fact]
    public void Turned_reaction_flux_is_skew_symmetric()
    {
        var geometry = new PlateGeometry(Polygon.Circle(new Vec2(0.03, 0.03), 0.03));
        geometry.AddCutout(Polygon.Circle(new Vec2(0.03, 0.03), 0.005));
        var model = SheetModel.Build(geometry, new GridOptions { CellSizeM = 0.001 });
        var reaction = ReactionOperator.Build(model);
        var random = new Random(7);
        var x = Enumerable.Range(0, model.Unknowns).Select(_ => random.NextDouble() - 0.5).ToArray();
        var y = Enumerable.Range(0, model.Unknowns).Select(_ => random.NextDouble() - 0.5).ToArray();
        var mx = new double[model.Unknowns];
        var my = new double[model.Unknowns];
        var axis = new Vec2(0.03, 0.03);
        reaction.ApplyThetaR(x, mx, axis);
        reaction.ApplyThetaR(y, my, axis);
        double xmy = x.Zip(my, (a, b) => a * b).Sum(), ymx = y.Zip(mx, (a, b) => a * b).Sum();
        double scale = Math.Sqrt(mx.Sum(v => v * v) * y.Sum(v => v * v));
        output.WriteLine($"x.My = {xmy:E6}, y.Mx = {ymx:E6}, scale {scale:E3}");
        Assert.True(scale > 0);
        Assert.InRange(Math.Abs(xmy + ymx) / scale, 0, 1e-12);
    }

    // At omega m = 0.01 w the own field changes the torque by O(Rm^2) = 1e-4 (Reitz 1970: F/F_low = (2/Rm^2)(1 - 1/sqrt(1 + Rm^2)) = 1 - 0.75 Rm^2),
    // so the own-field torque must equal the resistance-limited DiscTorque (the equation of W. R. Smythe, Trans. AIEE 61 (1942) 681, checked
    // against Smythe/Schieber in SourcesRotationTests) to within 1.5e-4 and be below it. 2 mm cells: both solve the same discrete equations.
    [Fact]
    public void Low_speed_equals_the_resistance_limited_torque()
    {
        double a = 0.05, m = 0.03;
        var model = Disc(a, 0.002);
        var source = Magnet(a, m, 0.01, 0.002, 0.01 * W / m);
        var own = DiscReaction.Solve(ReactionOperator.Build(model), source, Sheet, [0.0]);
        double low = DiscTorque.Solve(model, source, [0.0]).MeanTorqueNm(Sheet.SheetConductanceS);
        output.WriteLine($"own-field {own.MeanTorqueNm:G8} N m, resistance-limited {low:G8} N m, ratio {own.MeanTorqueNm / low:F7}, {own.Iterations} iterations");
        Assert.InRange(own.MeanTorqueNm / low, 1 - 1.5e-4, 1);
    }
}

/// <summary>`slotopt plate --speeds` on a turning disc: torque against speed with the model per point, and the peak.</summary>
public class DiscSpeedCommandTests
{
    private const string CopperDisc = """
        [plate]
        shape = "disc"
        diameter = "100 mm"
        thickness = "1 mm"
        conductivity = 5.8e7

        [grid]
        cell = "2 mm"

        [source]
        kind = "magnets"
        motion = "rotation"
        shape = "cylinder"
        diameter = "10 mm"
        height = "5 mm"
        remanence = "1.2 T"
        gap = "2 mm"
        radius = "30 mm"
        count = 1
        rotation_speed = 100
        """;

    // Copper 1 mm: w = 2 / (mu0 sigma t) = 27.4 m/s, so omega R = w at 8735 rpm. At 100 rpm (Rm = 0.011) the model is resistance-limited and its
    // torque is the file's own (same solve: 1e-12); at 4400 rpm and above own-field (Rm > 0.1, ReactionModelChoice). The peak lies between 8700
    // and 17500 rpm (thin-sheet peak at 1.272 w = 11100 rpm, J. R. Reitz, J. Appl. Phys. 41 (1970) 2067) and is at least every point's torque.
    [Fact]
    public void Speeds_give_torque_against_speed_with_model_and_peak()
    {
        var path = Path.Combine(Path.GetTempPath(), "slotopt-discspeed-" + Guid.NewGuid().ToString("N") + ".toml");
        File.WriteAllText(path, CopperDisc);
        try
        {
            var run = SlotOptInProcess.Run("plate", path, "--json", "--speeds", "100,4400,8700,17500");
            Assert.Equal(0, run.ExitCode);
            using var json = System.Text.Json.JsonDocument.Parse(run.Stdout);
            var curve = json.RootElement.GetProperty("torque_curve").EnumerateArray().ToList();
            Assert.Equal(4, curve.Count);
            Assert.Equal(["resistance-limited", "own-field", "own-field", "own-field"], curve.Select(p => p.GetProperty("model").GetString()));
            double fileTorque = json.RootElement.GetProperty("torque_n_m").GetDouble();
            Assert.Equal(fileTorque, curve[0].GetProperty("torque_n_m").GetDouble(), fileTorque * 1e-12);
            Assert.Equal(curve[0].GetProperty("torque_n_m").GetDouble() / 0.03, curve[0].GetProperty("drag_n").GetDouble(), 1e-12);
            var peak = json.RootElement.GetProperty("torque_peak");
            double rpm = peak.GetProperty("rotation_speed_rpm").GetDouble(), torque = peak.GetProperty("torque_n_m").GetDouble();
            Assert.InRange(rpm, 8700, 17500);
            Assert.All(curve, p => Assert.True(p.GetProperty("torque_n_m").GetDouble() <= torque));
        }
        finally { File.Delete(path); }
    }

    [Theory]
    [InlineData("fast", "--speeds: 'fast' is not a positive speed in rpm")]
    [InlineData("100,-5", "--speeds: '-5' is not a positive speed in rpm")]
    public void Bad_speeds_name_the_flag(string value, string expected)
    {
        var path = Path.Combine(Path.GetTempPath(), "slotopt-discspeed-" + Guid.NewGuid().ToString("N") + ".toml");
        File.WriteAllText(path, CopperDisc);
        try
        {
            var run = SlotOptInProcess.Run("plate", path, "--speeds", value);
            Assert.Equal(2, run.ExitCode);   // ExitCodes.InvalidInput
            Assert.Contains(expected, run.Stderr);
            Assert.DoesNotContain("   at ", run.Stderr);
        }
        finally { File.Delete(path); }
    }
}
