using SlotOpt.Plates.Conductors;

namespace SlotOpt.Plates.ResistanceLimited;

/// <summary>
/// One plate state scaled to a material and thickness: loss (W, time average for AC), drag (N,
/// moving sources only), peak and RMS current density (A/m^2), the map, validity, and how the solve went.
/// </summary>
public sealed record PlateResult(
    double LossW,
    double? DragN,
    double PeakCurrentDensityAPerM2,
    double RmsCurrentDensityAPerM2,
    CurrentDensityMap Map,
    Validity Validity,
    int Unknowns,
    int Iterations,
    double RelativeResidual,
    IReadOnlyList<string> Notes);
