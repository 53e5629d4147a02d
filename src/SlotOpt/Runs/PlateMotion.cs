using SlotOpt.Plates.Sources.Magnets;
using SlotOpt.Plates.Sources.Rotation;

namespace SlotOpt.Runs;

/// <summary>A disc turning under fixed magnets (a plate file's motion = "rotation"): the source at its speed and the disc angles whose mean gives the torque.</summary>
public sealed record DiscRotation(RotatingSource Source, IReadOnlyList<double> AnglesRad, string AveragedOver);

/// <summary>Torque against speed for a turning disc: at SpeedsRadPerS (rad/s), or at the default sweep up to past the peak when null (<see cref="Plates.DiscSpeedCurve.DefaultSpeedsRadPerS"/>).</summary>
public sealed record DiscSweep(IReadOnlyList<double>? SpeedsRadPerS);

/// <summary>
/// Magnets moving straight toward the plate (a plate file's motion = "approach") at SpeedMPerS, the damping force evaluated at each
/// gap of GapsM (the magnets' face to the plate's near surface); Magnets holds the magnets at the first gap.
/// </summary>
public sealed record MagnetApproach(MagnetArray Magnets, double SpeedMPerS, IReadOnlyList<double> GapsM);

/// <summary>The damping force opposing an approach at one gap (newtons), at the approach speed.</summary>
public sealed record GapPoint(double GapM, double ForceN, double LossW);
