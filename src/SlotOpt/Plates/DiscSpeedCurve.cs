using SlotOpt.Numerics;
using SlotOpt.Plates.Conductors;
using SlotOpt.Plates.Grid;
using SlotOpt.Plates.OwnField;
using SlotOpt.Plates.Sources.Rotation;

namespace SlotOpt.Plates;

/// <summary>Torque and loss of a turning disc at one speed, with the model that made them (`resistance-limited` or `own-field`).</summary>
public sealed record DiscSpeedPoint(double AngularSpeedRadPerS, double TorqueNm, double LossW, string Model, int Iterations)
{
    public double Rpm => RotationalSpeed.RpmFromRadPerS(AngularSpeedRadPerS);
}

/// <summary>
/// Braking torque against speed of a thin disc under a fixed source (<see cref="PlateModels.SolveDisc"/> at each speed, the model chosen per
/// speed), and the torque's peak: the largest torque of the sweep brackets it between its neighbours, then golden-section search on
/// log(omega) (J. Kiefer, "Sequential minimax search for a maximum", Proc. AMS 4 (1953) 502-506) narrows the bracket until
/// omega_high / omega_low - 1 &lt;= <see cref="PeakSpeedTolerance"/>; the peak is the best point evaluated. The torque is flat at its peak
/// (a maximum of a smooth curve), so a 1 % bracket puts the peak torque within about 1e-4 of its value. Peak is null when the sweep's largest
/// torque lies at either end (the peak is outside the sweep: extend it). Assumes one peak within the bracket (true of the thin-sheet curves:
/// J. R. Reitz, J. Appl. Phys. 41 (1970) 2067).
/// </summary>
public sealed record DiscSpeedCurve(IReadOnlyList<DiscSpeedPoint> Points, DiscSpeedPoint? Peak, IReadOnlyList<DiscSpeedPoint> PeakSearch)
{
    public const double PeakSpeedTolerance = 0.01;

    /// <summary>The default sweep: path speeds omega R = w x 2^k for k = -4..2 (w the receding-image speed <see cref="ConductingSheet.RecedingImageSpeedMPerS"/>; the thin-sheet peak lies near 1.27 w).</summary>
    public static double[] DefaultSpeedsRadPerS(RotatingSource source, ConductingSheet conductor)
    {
        if (!(source.SourceRadiusM > 0)) throw new InputException("a torque-speed sweep needs the source off the axis (its radius on the disc is zero)");
        double w = conductor.RecedingImageSpeedMPerS;
        return Enumerable.Range(-4, 7).Select(k => w * Math.Pow(2, k) / source.SourceRadiusM).ToArray();
    }

    /// <param name="fftThreads">FFT workers of the one reaction operator the own-field speeds share (the run's --threads; answers are the same for any count)</param>
    public static DiscSpeedCurve Solve(SheetModel model, RotatingSource source, ConductingSheet conductor, IReadOnlyList<double> anglesRad, IReadOnlyList<double> speedsRadPerS,
        double accuracy = ReactionModelChoice.DefaultAccuracy, ConvergenceCriterion? criterion = null, SheetModelKind? forcedKind = null, int fftThreads = 1)
    {
        if (speedsRadPerS.Count == 0) throw new InputException("a torque-speed sweep needs at least one speed");
        var speeds = speedsRadPerS.OrderBy(s => s).ToArray();
        ReactionOperator? reaction = null;
        double[]? guess = null;
        DiscSpeedPoint At(double omega)
        {
            var s = source.AtSpeed(omega);
            var choice = ReactionModelChoice.Forced(ReactionModelChoice.ForMoving(conductor, omega * s.SourceRadiusM, s.LoopLengthM, accuracy), forcedKind);
            if (choice.Kind != SheetModelKind.ResistanceLimited) reaction ??= ReactionOperator.Build(model, fftThreads);
            var d = PlateModels.SolveDisc(model, s, conductor, anglesRad, accuracy, reaction, criterion, forcedKind, guess);
            guess = d.OwnFieldU ?? guess;
            return new DiscSpeedPoint(omega, d.MeanTorqueNm, d.MeanLossW, d.ModelName, d.Iterations);
        }
        var points = speeds.Select(At).ToList();
        int best = 0;
        for (int k = 1; k < points.Count; k++) if (points[k].TorqueNm > points[best].TorqueNm) best = k;
        if (best == 0 || best == points.Count - 1) return new DiscSpeedCurve(points, null, []);
        var search = new List<DiscSpeedPoint>();
        var peak = GoldenSection(Math.Log(speeds[best - 1]), Math.Log(speeds[best + 1]), x => { var p = At(Math.Exp(x)); search.Add(p); return p; });
        if (points[best].TorqueNm > peak.TorqueNm) peak = points[best];
        return new DiscSpeedCurve(points, peak, search);
    }

    /// <summary>Golden-section search for the maximum of f on [a, b] (log speeds) until exp(b - a) - 1 &lt;= the tolerance; the best point evaluated.</summary>
    private static DiscSpeedPoint GoldenSection(double a, double b, Func<double, DiscSpeedPoint> f)
    {
        double r = (Math.Sqrt(5) - 1) / 2;                  // 1 / golden ratio
        double x1 = b - r * (b - a), x2 = a + r * (b - a);
        DiscSpeedPoint f1 = f(x1), f2 = f(x2);
        while (Math.Exp(b - a) - 1 > PeakSpeedTolerance)
        {
            if (f1.TorqueNm >= f2.TorqueNm) { b = x2; x2 = x1; f2 = f1; x1 = b - r * (b - a); f1 = f(x1); }
            else { a = x1; x1 = x2; f1 = f2; x2 = a + r * (b - a); f2 = f(x2); }
        }
        return f1.TorqueNm >= f2.TorqueNm ? f1 : f2;
    }
}
