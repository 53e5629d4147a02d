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

    // The own-field solve starts every angle from its resistance-limited solution and keeps it for the current-density map: it must be the
    // resistance-limited disc's own answer (DiscTorque: the same equations from the same starts), so the map of an own-field disc is the one
    // a resistance-limited solve gives, without solving again. Exact (bit for bit): the same operations in the same order. A slotted disc at
    // three angles, so the peak angle and the carried-over starts count.
    [Fact]
    public void Own_field_solve_keeps_the_resistance_limited_solution_of_every_angle()
    {
        var geometry = new PlateGeometry(Polygon.Circle(new Vec2(0.04, 0.04), 0.04));
        geometry.AddCutout(Polygon.Rectangle(0.04 - 0.001, 0.055, 0.04 + 0.001, 0.08));
        var model = SheetModel.Build(geometry, new GridOptions { CellSizeM = 0.002 });
        var source = Magnet(0.04, 0.024, 0.01, 0.002, W / 0.024);
        double[] angles = [0.0, 0.3, 0.6];
        var own = DiscReaction.Solve(ReactionOperator.Build(model), source, Sheet, angles);
        var low = DiscTorque.Solve(model, source, angles);
        Assert.Equal(low.LossPerSiemensW, own.ResistanceLimited.LossPerSiemensW);
        Assert.Equal(low.PeakIndex, own.ResistanceLimited.PeakIndex);
        Assert.Equal(low.PeakPsiPerSiemens, own.ResistanceLimited.PeakPsiPerSiemens);
        Assert.Equal(low.Iterations, own.ResistanceLimited.Iterations);
        Assert.True(own.MeanLossW < own.ResistanceLimitedLossW.Average());   // the own field lowers the loss at omega m = w (Lenz)
    }

    // The source keeps the summed edge moments of each lattice and angle and shares them with its copies at other speeds: the rate a copy
    // integrates from them must be the one a fresh source at that speed integrates, bit for bit (omega times the same sums), on two lattices
    // and at more angles than the source keeps (the rest integrated each time). Exact.
    [Fact]
    public void Kept_source_rates_equal_a_fresh_integration_at_any_speed()
    {
        double a = 0.04, m = 0.024, omega = 50, faster = 3.7 * omega;
        var source = Magnet(a, m, 0.01, 0.002, omega);
        foreach (var cell in new[] { 0.002, 0.004 })
        {
            var lattice = Disc(a, cell).Lattice;
            for (int k = 0; k < RotatingSource.KeptRates + 4; k++)
            {
                double angle = 0.01 * k;
                var kept = new double[lattice.NodeCount];
                var fresh = new double[lattice.NodeCount];
                source.IntegrateRate(lattice, angle, kept);                     // fills the kept sums (while there is room)
                source.AtSpeed(faster).IntegrateRate(lattice, angle, kept);
                Magnet(a, m, 0.01, 0.002, faster).IntegrateRate(lattice, angle, fresh);
                Assert.Equal(fresh, kept);
            }
        }
    }

    // --threads: the own-field disc and its torque-speed curve give the same numbers bit for bit with 1 and 2 FFT workers (PaddedConvolution
    // splits rows and column strips, each transformed whole by one worker; common practice, no source). Exact.
    [Fact]
    public void Disc_solves_are_bit_identical_with_one_and_two_threads()
    {
        double a = 0.04, m = 0.024;
        var model = Disc(a, 0.002);
        var source = Magnet(a, m, 0.01, 0.002, W / m);
        var one = PlateModels.SolveDisc(model, source, Sheet, [0.0], fftThreads: 1);
        var two = PlateModels.SolveDisc(model, source, Sheet, [0.0], fftThreads: 2);
        Assert.Equal("own-field", one.ModelName);
        Assert.Equal(one.LossW, two.LossW);
        Assert.Equal(one.Iterations, two.Iterations);
        var speeds = new[] { 0.5 * W / m, W / m };
        var curveOne = DiscSpeedCurve.Solve(model, source, Sheet, [0.0], speeds, fftThreads: 1);
        var curveTwo = DiscSpeedCurve.Solve(model, source, Sheet, [0.0], speeds, fftThreads: 2);
        Assert.Equal(curveOne.Points.Select(p => p.TorqueNm), curveTwo.Points.Select(p => p.TorqueNm));
    }

    // Reitz (1970), thin sheet, any axisymmetric source moving at v: F_D/F_D,low = (2 w^2/v^2)(1 - w/sqrt(v^2 + w^2)) (the reflection coefficient
    // R = i s/(1 + i s), s = (v/w) cos(phi), does not depend on |k|); at the drag peak v = 1.27202 w it is 0.47214. A cylinder magnet 6 mm across,
    // 1 mm from a copper disc 1 mm thick (w = 27.4 m/s), its centre at m = 24 mm on a disc 40 mm in radius, turning at omega m = 1.27202 w.
    // The ratio is second order in the cell (measured at 1, 0.5, 0.25 mm: 0.50594, 0.48171, 0.47551, differences shrinking 3.9 times), so
    // T(h/2) + (T(h/2) - T(h))/3: measured 0.47363 (from 0.5/0.25 mm: 0.47344), +0.3 % against Reitz. The sliding own-field solver on the equivalent
    // straight strip (40 mm wide, 120 mm long, the magnet 24 mm from an edge) gives the same ratio on the same grid to 0.03 %, so the +0.3 % is the
    // finite plate's, not the disc's curvature or the rotation's; a larger disc (80 mm, m = 50 mm) moves it by 0.25 %. Tolerance 0.5 %.
    [Fact]
    public void Torque_ratio_at_the_thin_sheet_peak_speed_follows_Reitz()
    {
        double a = 0.04, m = 0.024, omega = 1.27202 * W / m;
        double Ratio(double cell)
        {
            var model = Disc(a, cell);
            return DiscReaction.Solve(ReactionOperator.Build(model), Magnet(a, m, 0.006, 0.001, omega), Sheet, [0.0]).TorqueRatio;
        }
        double coarse = Ratio(0.001), fine = Ratio(0.0005), extrapolated = fine + (fine - coarse) / 3;
        // the equivalent straight strip on the 1 mm grid: width a, the magnet m from one edge and 2 a behind the front end, sliding at omega m
        var strip = SheetModel.Build(new PlateGeometry(Polygon.Rectangle(0, 0, 3 * a, a)), new GridOptions { CellSizeM = 0.001 });
        var magnets = new MagnetArray([new MagnetPlacement(new CylinderMagnet(0.006, 0.005, 1.2), new Vec2(2 * a, m), 1)], 0.001);
        double sliding = ReactionSolver.SolveMoving(ReactionOperator.Build(strip), new SlidingMagnets(magnets, omega * m), Sheet, [0.0]).DragRatio;
        double reitz = 2 / (1.27202 * 1.27202) * (1 - 1 / Math.Sqrt(1 + 1.27202 * 1.27202));
        output.WriteLine($"T/T_low at 1.272 w: {coarse:F5} (1 mm), {fine:F5} (0.5 mm), extrapolated {extrapolated:F5}, Reitz {reitz:F5}; strip F/F_low at 1 mm {sliding:F5}");
        Assert.InRange(extrapolated / reitz - 1, -0.005, 0.005);
        Assert.InRange(coarse / sliding - 1, -0.002, 0.002);   // measured 0.03 % (0.004 % at 0.25 mm in the study); 0.2 %: well below the 7 % grid error both share
    }

    // The peak search (golden section on log speed, DiscSpeedCurve): on one grid the peak it returns is a maximum of that grid's torque curve
    // (torque at 1.5 % above and below the peak speed is not larger: the search's bracket is 1 %), and it lies near the thin-sheet peak 1.27202 w
    // of Reitz (1970). On this coarse grid (2 mm cells, 2 mm gap, 10 mm magnet, kept coarse for the suite's time) the peak is high by the grid error:
    // measured 1.441 w (+13 %); on finer grids it converges to Reitz's at second order (REACTION.md: a 6 mm magnet 2 mm from the disc, 1.3375 w at
    // 1 mm cells, 1.2913 w at 0.5 mm, extrapolated 1.276 w, +0.3 %). Tolerance 15 %: this test checks the search, the ratio test the accuracy.
    [Fact]
    public void Torque_peak_is_a_maximum_near_the_thin_sheet_peak()
    {
        double a = 0.04, m = 0.024;
        var model = Disc(a, 0.002);
        var source = Magnet(a, m, 0.01, 0.002, W / m);
        var curve = DiscSpeedCurve.Solve(model, source, Sheet, [0.0], [W / m, 1.5 * W / m, 2.25 * W / m]);
        var peak = Assert.IsType<DiscSpeedPoint>(curve.Peak);
        var reaction = ReactionOperator.Build(model);
        double Torque(double omega) => DiscReaction.Solve(reaction, source.AtSpeed(omega), Sheet, [0.0]).MeanTorqueNm;
        double below = Torque(peak.AngularSpeedRadPerS / 1.015), above = Torque(peak.AngularSpeedRadPerS * 1.015);
        output.WriteLine($"peak {peak.TorqueNm:G6} N m at omega m / w = {peak.AngularSpeedRadPerS * m / W:F4} ({curve.PeakSearch.Count} search solves); 1.5 % below {below:G6}, above {above:G6}");
        Assert.Equal("own-field", peak.Model);
        Assert.True(peak.TorqueNm >= below && peak.TorqueNm >= above);
        Assert.InRange(peak.AngularSpeedRadPerS * m / W / 1.27202 - 1, -0.15, 0.15);
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
    // and 26000 rpm (thin-sheet peak at 1.272 w = 11100 rpm, J. R. Reitz, J. Appl. Phys. 41 (1970) 2067; on this coarse grid about 1.5 w, see
    // DiscOwnFieldTests) and is at least every point's torque.
    [Fact]
    public void Speeds_give_torque_against_speed_with_model_and_peak()
    {
        var path = Path.Combine(Path.GetTempPath(), "slotopt-discspeed-" + Guid.NewGuid().ToString("N") + ".toml");
        File.WriteAllText(path, CopperDisc);
        try
        {
            var run = SlotOptInProcess.Run("plate", path, "--json", "--speeds", "100,4400,8700,26000");
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
            Assert.InRange(rpm, 8700, 26000);
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

/// <summary>
/// A disc with many radial slots two cells wide (problems/plates/coupling-disc-slotted.toml with 48 narrower slots): the slots run through
/// the rim, so each is part of the outside (psi = 0) and the sheet solver converges as fast as on a plain disc. Before every slot was merged
/// along its centre line (NodeRegions), a slot two or three cells wide at an angle to the lattice broke into islands of empty cells joined by
/// partly covered cells: 56 merged unknowns on this disc, 113 conjugate-gradient iterations per angle (and past the 300 limit on the 160 mm
/// disc), a leaky slot. Now 0 and 7 (measured).
/// </summary>
public class SlottedDiscConvergenceTests
{
    private const string Slotted = """
        [plate]
        shape = "disc"
        diameter = "80 mm"
        thickness = "2 mm"
        resistivity = "0.72 uOhm m"

        [grid]
        cell = "0.5 mm"

        [[slots]]
        pattern = "radial"
        count = 48
        width = "1 mm"
        from = "15 mm"

        [source]
        kind = "magnets"
        motion = "rotation"
        shape = "cylinder"
        diameter = "10 mm"
        height = "5 mm"
        remanence = "1.2 T"
        gap = "2 mm"
        radius = "27 mm"
        count = 4
        polarity = "alternating"
        rotation_speed = 1000
        """;

    // Through-rim slots belong to the outside (no merged unknowns: topology, exact); every angle over a slot pitch converges with the default
    // criterion (relative residual 1e-8 within 300 iterations) and in at most 20 iterations (measured 7: the plain disc's count; common practice,
    // no source, for multigrid-preconditioned CG on a 2-D Laplacian-type operator).
    [Fact]
    public void Narrow_radial_slots_through_the_rim_join_the_outside_and_converge()
    {
        var plate = SlotOpt.Input.PlateFileReader.Parse(Slotted, "slotted.toml");
        var rotation = plate.Rotation!;
        var model = SheetModel.Build(plate.Geometry, plate.Grid with { SourceFeatures = rotation.Source.GridFeatures });
        Assert.Equal(0, model.Regions.MergedCount);
        foreach (var angle in rotation.AnglesRad)
        {
            var s = DiscTorque.Solve(model, rotation.Source, [angle]);
            Assert.InRange(s.Iterations, 1, 20);
            Assert.InRange(s.MaxRelativeResidual, 0, 1e-8);
        }
    }
}
