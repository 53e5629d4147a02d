using SlotOpt.Plates.Sources.Rotation;

namespace SlotOpt.Plates;

/// <summary>
/// Torque and loss of a thin disc turning under a fixed source at one speed, from the model <see cref="ReactionModelChoice"/> picked for the
/// source's path speed (Choice says which and why; <see cref="ReactionModelChoice.Name"/> spells it): one entry per disc angle.
/// T = P / omega at every angle (power balance of a steady rotation). ResistanceLimitedLossW is the same angles' low-speed answer, for comparison.
/// ResistanceLimited is the unit-conductance resistance-limited solution of the same angles (for the current-density map): the model's own
/// answer when it ran, else the own-field solve's starts (solved once, not again for the map); OwnFieldU is u = psi / G at the first angle when the own-field model ran (a warm start for a nearby speed), else null.
/// Iterations counts the linear-solver iterations of the model that ran; RelativeResidual is the worst final true relative residual.
/// </summary>
public sealed record DiscSolution(
    ModelChoice Choice, double AngularSpeedRadPerS, double[] AnglesRad, double[] LossW, double[] ResistanceLimitedLossW,
    IReadOnlyList<string> Notes, int Iterations, double RelativeResidual, DiscTorqueSolution ResistanceLimited, double[]? OwnFieldU)
{
    public string ModelName => ReactionModelChoice.Name(Choice.Kind);
    public double MeanLossW => LossW.Average();
    /// <summary>Mean braking torque (N m), T = P / omega.</summary>
    public double MeanTorqueNm => MeanLossW / AngularSpeedRadPerS;
    public double[] TorqueNm => LossW.Select(p => p / AngularSpeedRadPerS).ToArray();
}
