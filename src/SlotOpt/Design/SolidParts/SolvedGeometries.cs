namespace SlotOpt.Design.SolidParts;

/// <summary>
/// The plate geometries a run solves again after the selection (the confirmation, the current-density maps, the torque-speed lines), each
/// solved once at unit conductance (<see cref="PlateOptions.Solve"/>) and shared: the chosen plate, its solid counterpart and the reference
/// ask for the same geometry several times. Kept for one run's confirmation and figures only (the caller drops it after); not thread-safe (they run one after another).
/// </summary>
public sealed class SolvedGeometries(EvaluationLimits limits)
{
    private readonly Dictionary<(string Part, SlotChoice? Slots), PlateOptions.SolvedGeometry> _solved = [];

    public EvaluationLimits Limits { get; } = limits;

    /// <summary>The geometry of one slot choice of a part (null: the solid plate), solved the first time it is asked for.</summary>
    public PlateOptions.SolvedGeometry Of(PlatePart part, SlotChoice? slots)
    {
        if (!_solved.TryGetValue((part.Name, slots), out var solved))
            _solved[(part.Name, slots)] = solved = PlateOptions.Solve(part, slots, Limits);
        return solved;
    }
}
