using SlotOpt.Tables;
using SlotOpt.Numerics;
using SlotOpt.Plates.Grid;

namespace SlotOpt.Plates.Sources.Rotation;

/// <summary>
/// The braking torque on a thin disc turning under a fixed source, resistance-limited (the eddy currents' own field neglected):
/// per angle, one solve of div(grad(psi) / G) = omega dBz/dtheta (<see cref="RotatingSource"/>) at unit sheet conductance; the loss P
/// is the mechanical power the drive supplies, so the torque is T = P / omega (power balance of a steady rotation, common practice, no source).
/// threads: workers for the source's edge moments (<see cref="RotatingSource.IntegrateRate"/>) where the caller solves one disc at a time; the same bits for any count.
/// </summary>
public static class DiscTorque
{
    public static bool TrySolve(SheetModel model, RotatingSource source, IReadOnlyList<double> anglesRad, ConvergenceCriterion? criterion,
        out DiscTorqueSolution? solution, out string failure, int threads = 1)
    {
        if (anglesRad.Count == 0) throw new InputException("a turning disc needs at least one angle");
        criterion ??= ConvergenceCriterion.Default;
        solution = null;
        var l = model.Lattice;
        var node = new double[l.NodeCount];
        var psi = new double[model.Unknowns];
        var losses = new double[anglesRad.Count];
        int iterations = 0, peak = 0;
        double residual = 0;
        double[]? peakPsi = null;
        for (int k = 0; k < anglesRad.Count; k++)
        {
            source.IntegrateRate(l, anglesRad[k], node, threads);
            var b = model.RightHandSide(node);
            if (!model.TrySolve(b, psi, criterion, out var report))
            {
                failure = $"turning disc at {Numbers.Of(anglesRad[k] * 180 / Math.PI, "deg")}: sheet solver: {report.Description}";
                return false;
            }
            losses[k] = model.LossPerSiemens(psi);
            if (!double.IsFinite(losses[k])) { failure = $"turning disc at {Numbers.Of(anglesRad[k] * 180 / Math.PI, "deg")}: the loss is not finite"; return false; }
            iterations += report.Iterations;
            residual = Math.Max(residual, report.RelativeResidual);
            if (peakPsi is null || losses[k] > losses[peak]) { peakPsi = (double[])psi.Clone(); peak = k; }
        }
        solution = new DiscTorqueSolution(anglesRad.ToArray(), losses, source.AngularSpeedRadPerS, iterations, residual, peak, peakPsi!);
        failure = "";
        return true;
    }

    public static DiscTorqueSolution Solve(SheetModel model, RotatingSource source, IReadOnlyList<double> anglesRad, ConvergenceCriterion? criterion = null, int threads = 1) =>
        TrySolve(model, source, anglesRad, criterion, out var s, out var failure, threads) ? s! : throw new NumericalFailureException(failure);
}

/// <summary>
/// The turning-disc solves at unit sheet conductance (1 S): loss per angle (W per S), and psi per unknown at the angle with the most loss
/// (amperes per siemens); loss, torque and psi scale linearly with G = sigma t.
/// </summary>
public sealed record DiscTorqueSolution(double[] AnglesRad, double[] LossPerSiemensW, double AngularSpeedRadPerS, int Iterations, double MaxRelativeResidual,
    int PeakIndex, double[] PeakPsiPerSiemens)
{
    /// <summary>Mean loss over the angles (W) at sheet conductance G.</summary>
    public double MeanLossW(double sheetConductanceS) => sheetConductanceS * LossPerSiemensW.Average();
    /// <summary>Mean braking torque T = P / omega (N m) at sheet conductance G.</summary>
    public double MeanTorqueNm(double sheetConductanceS) => MeanLossW(sheetConductanceS) / AngularSpeedRadPerS;
    /// <summary>Torque at each angle (N m).</summary>
    public double[] TorqueNm(double sheetConductanceS) => LossPerSiemensW.Select(p => sheetConductanceS * p / AngularSpeedRadPerS).ToArray();
}
