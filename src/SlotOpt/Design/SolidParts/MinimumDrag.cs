using SlotOpt.Tables;
using System.Globalization;

namespace SlotOpt.Design.SolidParts;

/// <summary>
/// A braking force the plate must reach at a named speed (min_drag, beside max_drag for the designer who wants the drag gone):
/// the drag is wanted, so an option whose drag at <see cref="SpeedMPerS"/> falls short is dropped (<see cref="RuleKind.DragBelowMinimum"/>).
/// The screen's drag is the resistance-limited one, linear in speed (F = P / v with P ~ v^2); above the receding-image
/// speed the plate's own field lowers the real drag, so the chosen design is confirmed with its own field at this speed.
/// </summary>
public sealed record MinimumDrag
{
    public MinimumDrag(double forceN, double speedMPerS)
    {
        if (!(forceN > 0) || !double.IsFinite(forceN)) throw new InputException($"a minimum drag must be positive (got {forceN} N)");
        if (!(speedMPerS > 0) || !double.IsFinite(speedMPerS)) throw new InputException($"the speed of a minimum drag must be positive (got {speedMPerS} m/s)");
        ForceN = forceN;
        SpeedMPerS = speedMPerS;
    }

    public double ForceN { get; }
    public double SpeedMPerS { get; }

    /// <summary>The resistance-limited drag at this speed from the one at the source's speed: F(v) = F(v0) v / v0 (the loss grows as v^2, F = P / v).</summary>
    public double ScreenDragN(double dragAtSourceSpeedN, double sourceSpeedMPerS) => dragAtSourceSpeedN * SpeedMPerS / sourceSpeedMPerS;

    /// <summary>The rule break when the drag at this speed falls short; null when it reaches the minimum.</summary>
    public RuleBreak? Check(double dragAtSourceSpeedN, double sourceSpeedMPerS)
    {
        var drag = ScreenDragN(dragAtSourceSpeedN, sourceSpeedMPerS);
        return drag >= ForceN ? null
            : new RuleBreak(RuleKind.DragBelowMinimum, string.Create(CultureInfo.InvariantCulture, $"drag {Numbers.Of(drag, "N")} at {SpeedMPerS:0.###} m/s is below the part's minimum of {Numbers.Of(ForceN, "N")}"));
    }
}
