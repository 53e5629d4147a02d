using SlotOpt.Plates.Geometry;

namespace SlotOpt.Design;

/// <summary>
/// A solid conductive part (clamp or tie plate, rail, carrier plate, shield) in an AC field or past
/// moving poles. The choice is thickness x material x (solid, or one slot pattern of a family) x process.
/// </summary>
public sealed record PlatePart(
    string Name,
    int Line,
    double TemperatureK,
    double? MaxLossW,
    Polygon Outline,
    IReadOnlyList<double> ThicknessesM,
    IReadOnlyList<string> Materials,
    PlateExcitation Excitation,
    IReadOnlyList<SlotFamily> SlotFamilies,
    IReadOnlyList<string> Processes,
    double? MaxDragN,
    double MinLigamentM,
    double? CellSizeM,
    PlateChoice? Current) : Part(Name, Line, TemperatureK, MaxLossW)
{
    /// <summary>thickness x material x (solid x processes + every slot option).</summary>
    public long OptionCount => (long)ThicknessesM.Count * Materials.Count * (Processes.Count + SlotFamilies.Sum(f => f.OptionCount));

    protected override LossKind DefaultLossKind => LossKind.Load;
}

/// <summary>One fixed design of a plate: thickness, material, process, and its slots (null for a solid plate).</summary>
public sealed record PlateChoice(double ThicknessM, string Material, string Process, SlotChoice? Slots) : DesignChoice;
