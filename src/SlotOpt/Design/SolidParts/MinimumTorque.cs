using SlotOpt.Tables;
using System.Globalization;

namespace SlotOpt.Design.SolidParts;

/// <summary>
/// A braking torque a turning disc must reach at a named speed (min_torque, beside max_torque for the designer who wants the torque gone):
/// the torque is wanted, so an option whose torque at <see cref="Rpm"/> falls short is dropped (<see cref="RuleKind.TorqueBelowMinimum"/>), as
/// <see cref="MinimumDrag"/> does for sliding parts. The screen's torque is the resistance-limited one, linear in speed (T = P / omega with P ~ omega^2).
/// </summary>
public sealed record MinimumTorque
{
    public MinimumTorque(double torqueNm, double rpm)
    {
        if (!(torqueNm > 0) || !double.IsFinite(torqueNm)) throw new InputException($"a minimum torque must be positive (got {torqueNm} N m)");
        if (!(rpm > 0) || !double.IsFinite(rpm)) throw new InputException($"the speed of a minimum torque must be positive (got {rpm} rpm)");
        TorqueNm = torqueNm;
        Rpm = rpm;
    }

    public double TorqueNm { get; }
    /// <summary>The named speed (revolutions per minute).</summary>
    public double Rpm { get; }

    /// <summary>The resistance-limited torque at this speed from the one at the source's speed: T(n) = T(n0) n / n0 (the loss grows as n^2, T = P / omega).</summary>
    public double ScreenTorqueNm(double torqueAtSourceSpeedNm, double sourceRpm) => torqueAtSourceSpeedNm * Rpm / sourceRpm;

    /// <summary>The rule break when the torque at this speed falls short; null when it reaches the minimum.</summary>
    public RuleBreak? Check(double torqueAtSourceSpeedNm, double sourceRpm)
    {
        var torque = ScreenTorqueNm(torqueAtSourceSpeedNm, sourceRpm);
        return torque >= TorqueNm ? null
            : new RuleBreak(RuleKind.TorqueBelowMinimum, string.Create(CultureInfo.InvariantCulture, $"torque {Numbers.Of(torque, "N m")} at {Rpm:0.##} rpm is below the part's minimum of {Numbers.Of(TorqueNm, "N m")}"));
    }
}
