using SlotOpt.Plates.Grid;
using SlotOpt.Plates.ResistanceLimited;

namespace SlotOpt.Plates.Thermal;

/// <summary>
/// A plate solved with its resistivity at its own temperature: the eddy-current model and solution
/// at the converged per-cell conductivity (Ac for an AC source, Sweep for moving poles; scale them
/// with the sheet at its reference conductivity, as usual), the loss (W, time or travel average), the
/// temperature, and how the coupling went.
/// </summary>
public sealed record HeatedPlate(
    SheetModel Model,
    UnitConductanceSolution? Ac,
    MovingSweepSolution? Sweep,
    double LossW,
    PlateTemperature Temperature,
    int CouplingIterations,
    double CouplingTolerance,
    double ResistivityMinK,
    double ResistivityMaxK,
    double LossWeightedTemperatureK,
    IReadOnlyList<string> Notes);
