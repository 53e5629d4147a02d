using SlotOpt.Plates;
using SlotOpt.Plates.Thermal;

namespace SlotOpt.Design;

/// <summary>
/// One design option of one part, evaluated: what it is (in words and as attributes for the search),
/// what it costs to build, what it loses, why it was rejected if it was, (plates) which model gave the loss, and (plates with [parts.thermal]) how hot it runs.
/// </summary>
public sealed record EvaluatedOption(
    string PartName,
    string Id,
    DesignChoice Choice,
    string Description,
    IReadOnlyDictionary<string, string> Attributes,
    double BuildCost,
    LossBreakdown Loss,
    double? DragN,
    IReadOnlyList<string> Flags,
    RuleBreak? Rejection,
    OptionTemperature? Temperature = null)
{
    public bool IsFeasible => Rejection is null;

    /// <summary>Plates: the model that gave the loss and drag (null for cores).</summary>
    public OptionModel? Model { get; init; }

    /// <summary>Turning discs: the mean braking torque (N m); DragN is then the tangential force at the magnets' radius, torque over that radius.</summary>
    public double? TorqueNm { get; init; }
}

/// <summary>
/// A plate option's steady temperature: hottest point (K and where, m), rises above ambient (K), the temperature the
/// resistivity was taken at (K; the loss-weighted mean for a coupled solve), and how it was found (<see cref="TemperatureBracket"/>).
/// </summary>
public sealed record OptionTemperature(double HottestK, double HottestXM, double HottestYM, double MaxRiseK, double MeanRiseK, double ResistivityK, TemperatureMethod Method)
{
    public static OptionTemperature Of(PlateTemperature t, double resistivityK, TemperatureMethod method) =>
        new(t.HottestK, t.HottestXM, t.HottestYM, t.MaxRiseK, t.MeanRiseK, resistivityK, method);
}

/// <summary>
/// Which plate model gave an option's loss and drag, and why: the model its validity figures call for
/// (<see cref="ReactionModelChoice"/>), or the resistance-limited screen kept for an option a loss-independent rule
/// already removed or that provably can be neither chosen nor on the trade-off curve (IsScreenOnly; Reason says why).
/// Name is the model as the command line and every output spell it.
/// </summary>
public sealed record OptionModel(SheetModelKind Kind, string Reason, bool IsScreenOnly = false)
{
    public string Name => ReactionModelChoice.Name(Kind);
}
