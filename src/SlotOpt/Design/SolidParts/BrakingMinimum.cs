using SlotOpt.Tables;

namespace SlotOpt.Design.SolidParts;

/// <summary>The braking quantity a <see cref="BrakingMinimum"/> asks for: a sliding part's drag (N at m/s) or a turning disc's torque (N m at rpm).</summary>
public enum BrakingQuantity
{
    Drag,
    Torque,
}

/// <summary>
/// A braking quantity the plate must reach at a named speed (min_drag for sliding parts, min_torque for turning discs, beside max_drag and
/// max_torque for the designer who wants it gone): the braking is wanted, so an option that falls short at <see cref="Speed"/> is dropped
/// (<see cref="RuleKind.DragBelowMinimum"/>, <see cref="RuleKind.TorqueBelowMinimum"/>). The screen's number is the resistance-limited one,
/// linear in speed (F = P / v and T = P / omega with P ~ v^2); above the receding-image speed the plate's own field lowers the real number,
/// so the chosen design is confirmed with its own field at this speed (Runs/PlateConfirmation).
/// </summary>
public sealed record BrakingMinimum
{
    private BrakingMinimum(BrakingQuantity quantity, double value, double speed)
    {
        Quantity = quantity;
        if (!(value > 0) || !double.IsFinite(value)) throw new InputException($"a minimum {Name} must be positive (got {value} {Unit})");
        if (!(speed > 0) || !double.IsFinite(speed)) throw new InputException($"the speed of a minimum {Name} must be positive (got {speed} {SpeedUnit})");
        Value = value;
        Speed = speed;
    }

    /// <summary>A wanted drag (N) on a sliding part at a speed in m/s (min_drag).</summary>
    public static BrakingMinimum Drag(double forceN, double speedMPerS) => new(BrakingQuantity.Drag, forceN, speedMPerS);

    /// <summary>A wanted braking torque (N m) on a turning disc at a speed in revolutions per minute (min_torque).</summary>
    public static BrakingMinimum Torque(double torqueNm, double rpm) => new(BrakingQuantity.Torque, torqueNm, rpm);

    public BrakingQuantity Quantity { get; }

    /// <summary>The wanted drag (N) or torque (N m).</summary>
    public double Value { get; }

    /// <summary>The named speed: m/s for a drag, rpm for a torque.</summary>
    public double Speed { get; }

    /// <summary>The quantity's word: "drag" or "torque".</summary>
    public string Name => Quantity == BrakingQuantity.Drag ? "drag" : "torque";

    /// <summary>The unit of <see cref="Value"/>: "N" or "N m".</summary>
    public string Unit => Quantity == BrakingQuantity.Drag ? "N" : "N m";

    /// <summary>The unit of <see cref="Speed"/>: "m/s" or "rpm".</summary>
    public string SpeedUnit => Quantity == BrakingQuantity.Drag ? "m/s" : "rpm";

    /// <summary>The named speed with its unit, as warnings and rule breaks print it.</summary>
    public string SpeedWords => Numbers.Of(Speed, SpeedUnit);

    /// <summary>The resistance-limited number at this speed from the one at the source's speed: X(v) = X(v0) v / v0 (the loss grows as v^2, F = P / v, T = P / omega).</summary>
    public double ScreenValue(double atSourceSpeed, double sourceSpeed) => atSourceSpeed * Speed / sourceSpeed;

    /// <summary>The rule break when the number at this speed falls short; null when it reaches the minimum.</summary>
    public RuleBreak? Check(double atSourceSpeed, double sourceSpeed)
    {
        var value = ScreenValue(atSourceSpeed, sourceSpeed);
        return value >= Value ? null
            : new RuleBreak(Quantity == BrakingQuantity.Drag ? RuleKind.DragBelowMinimum : RuleKind.TorqueBelowMinimum,
                $"{Name} {Numbers.Of(value, Unit)} at {SpeedWords} is below the part's minimum of {Numbers.Of(Value, Unit)}");
    }
}
