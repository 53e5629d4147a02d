using SlotOpt.Waveforms;

namespace SlotOpt.Design.Cores;

/// <summary>
/// A laminated core (or one section of it): a stack of identical sheets of a given outline area and
/// stack height, carrying a flux waveform; the choice is grade (with its gauge) and cutting process.
/// </summary>
public sealed record CorePart(
    string Name,
    int Line,
    double TemperatureK,
    double? MaxLossW,
    IReadOnlyList<string> Grades,
    IReadOnlyList<string> Processes,
    double LaminationAreaM2,
    double StackHeightM,
    double CutLengthPerSheetM,
    IFluxWaveform Flux,
    double FeatureWidthM,
    CoreChoice? Current) : Part(Name, Line, TemperatureK, MaxLossW)
{
    /// <summary>How the laminations are built up; null when not given (no building factor, no direction rule).</summary>
    public CoreConstruction? Construction { get; init; }

    /// <summary>A building factor given in the problem file, replacing the table's default for every grade.</summary>
    public double? BuildingFactorOverride { get; init; }

    protected override LossKind DefaultLossKind => LossKind.NoLoad;
}

/// <summary>One fixed design of a core part: the grade and the process.</summary>
public sealed record CoreChoice(string Grade, string Process) : DesignChoice;
