using SlotOpt.Numerics;
using SlotOpt.Plates.Conductors;
using SlotOpt.Plates.OwnField;

namespace SlotOpt.Plates.Sources.Rotation;

/// <summary>
/// The braking torque on a thin disc turning under a fixed source with the eddy currents' own field (model `own-field`): per angle, the
/// coupled steady state (A + omega G M) u = -s of <see cref="RotatingOwnFieldOperator"/> (u = psi / G) by right-preconditioned real GMRES
/// (<see cref="Gmres"/>, restart <see cref="ComplexGmres.DefaultRestart"/>), started from the resistance-limited solution of the same angle
/// (<see cref="DiscTorque"/>'s equation, solved as DiscTorque solves it and kept: <see cref="DiscReactionSolution.ResistanceLimited"/>) or from the caller's guess. The loss is P = G u^T A u and the torque T = P / omega (power balance of a
/// steady rotation; exact in the discrete model because M is skew-symmetric). Not linear in G: one solve per conductor and speed.
/// Non-convergence, NaN or Inf: false with the reason (TrySolve) or <see cref="NumericalFailureException"/> (Solve).
/// </summary>
public static class DiscReaction
{
    /// <param name="initialGuess">u = psi / G to start the first angle from (e.g. <see cref="DiscReactionSolution.FirstU"/> of a nearby speed); null starts from the resistance-limited solution</param>
    /// <param name="threads">workers for the source's edge moments (<see cref="RotatingSource.IntegrateRate"/>) where the caller solves one disc at a time; the same bits for any count</param>
    public static bool TrySolve(ReactionOperator reaction, RotatingSource source, ConductingSheet conductor, IReadOnlyList<double> anglesRad,
        ConvergenceCriterion? criterion, double[]? initialGuess, out DiscReactionSolution? solution, out string failure, int threads = 1)
    {
        if (anglesRad.Count == 0) throw new InputException("a turning disc needs at least one angle");
        criterion ??= ConvergenceCriterion.Default;
        solution = null;
        var model = reaction.Model;
        int n = model.Unknowns;
        if (initialGuess is not null && initialGuess.Length != n) throw new ArgumentException($"the initial guess has {initialGuess.Length} values for a model of {n} unknowns", nameof(initialGuess));
        double g = conductor.SheetConductanceS, omega = source.AngularSpeedRadPerS;
        var op = new RotatingOwnFieldOperator(reaction, source.Axis, omega, g);
        var node = new double[model.Lattice.NodeCount];
        var low = new double[n];
        var u = new double[n];
        double[]? first = null;
        var loss = new double[anglesRad.Count];
        var lowPerSiemens = new double[anglesRad.Count];
        int iterations = 0, lowIterations = 0, lowPeak = 0;
        double worst = 0, lowWorst = 0;
        double[]? lowPeakPsi = null;
        for (int k = 0; k < anglesRad.Count; k++)
        {
            string at = $"turning disc at {anglesRad[k] * 180 / Math.PI:0.##} deg, {omega:G4} rad/s";
            source.IntegrateRate(model.Lattice, anglesRad[k], node, threads);
            var rhs = model.RightHandSide(node);
            if (!model.TrySolve(rhs, low, criterion, out var r0))
            {
                failure = $"{at}, resistance-limited start: {r0.Description}";
                return false;
            }
            // the resistance-limited solve of this angle, as DiscTorque.TrySolve makes it (zero start, then the previous angle's): its loss and the map's angle
            lowPerSiemens[k] = model.LossPerSiemens(low);
            lowIterations += r0.Iterations;
            lowWorst = Math.Max(lowWorst, r0.RelativeResidual);
            if (lowPeakPsi is null || lowPerSiemens[k] > lowPerSiemens[lowPeak]) { lowPeakPsi = (double[])low.Clone(); lowPeak = k; }
            if (k == 0) Array.Copy(initialGuess ?? low, u, n);
            if (!Gmres.TrySolve(op.Apply, op.Precondition, rhs, u, criterion, ComplexGmres.DefaultRestart, out var report))
            {
                failure = $"{at}, own-field solve: {report.Description}";
                return false;
            }
            if (k == 0) first = (double[])u.Clone();
            iterations += report.Iterations;
            worst = Math.Max(worst, report.RelativeResidual);
            loss[k] = g * model.LossPerSiemens(u);     // P = G u^T A u
            if (!double.IsFinite(loss[k])) { failure = $"{at}: the loss is not finite"; return false; }
        }
        var resistanceLimited = new DiscTorqueSolution(anglesRad.ToArray(), lowPerSiemens, omega, lowIterations, lowWorst, lowPeak, lowPeakPsi!);
        solution = new DiscReactionSolution(anglesRad.ToArray(), loss, resistanceLimited, g, omega, iterations, worst, first!);
        failure = "";
        return true;
    }

    public static DiscReactionSolution Solve(ReactionOperator reaction, RotatingSource source, ConductingSheet conductor, IReadOnlyList<double> anglesRad,
        ConvergenceCriterion? criterion = null, double[]? initialGuess = null, int threads = 1) =>
        TrySolve(reaction, source, conductor, anglesRad, criterion, initialGuess, out var s, out var failure, threads) ? s! : throw new NumericalFailureException(failure);
}

/// <summary>
/// The own-field turning-disc solves for one conductor and speed: loss per angle (W) with the eddy currents' own field and, for comparison
/// and the current-density map, the resistance-limited solves at unit conductance (the same angles' starts, <see cref="DiscTorque"/>'s answer);
/// torque T = P / omega. Iterations and MaxRelativeResidual are the own-field solves'. FirstU is u = psi / G at the first angle (the warm start for a nearby speed).
/// </summary>
public sealed record DiscReactionSolution(double[] AnglesRad, double[] LossW, DiscTorqueSolution ResistanceLimited, double SheetConductanceS, double AngularSpeedRadPerS,
    int Iterations, double MaxRelativeResidual, double[] FirstU)
{
    /// <summary>The resistance-limited loss per angle (W) at this conductance, P = G P_unit.</summary>
    public double[] ResistanceLimitedLossW => ResistanceLimited.LossPerSiemensW.Select(p => SheetConductanceS * p).ToArray();

    public double MeanLossW => LossW.Average();
    public double MeanTorqueNm => MeanLossW / AngularSpeedRadPerS;
    /// <summary>Own-field over resistance-limited torque (1 at low speed, falling as the own field screens the source).</summary>
    public double TorqueRatio => ResistanceLimitedLossW.Average() is var p && p > 0 ? MeanLossW / p : 1;
}
