using SlotOpt.Design.SolidParts;
using SlotOpt.Design;
using SlotOpt.Design.Cores;
using SlotOpt.Plates.Conductors;

namespace SlotOpt.Runs;

/// <summary>
/// The numbers behind the report's plots that the selection itself does not give, computed once by the run:
/// loss against frequency for each core part, and for each chosen plate the current-density maps (and, under
/// moving poles, drag against speed in the low-speed model, on a turning disc braking torque against speed, and with [parts.thermal] the temperature maps of the chosen and reference plates, valid below <see cref="LowSpeedReynoldsLimit"/>). The
/// coupled speed sweep is in the plate's confirmation.
/// </summary>
public sealed record RunFigures(
    IReadOnlyList<LossFrequencyCurves> LossFrequency,
    IReadOnlyList<CurrentDensityMaps> CurrentDensity,
    IReadOnlyList<DragSpeedLines> DragSpeed,
    IReadOnlyList<TemperatureMaps> Temperature,
    double LowSpeedReynoldsLimit)
{
    /// <summary>Turning disc parts: braking torque against speed.</summary>
    public IReadOnlyList<TorqueSpeedLines> TorqueSpeed { get; init; } = [];

    /// <param name="chosen">The chosen option of each part, in part order; null when the run found no design.</param>
    /// <param name="geometries">the plate geometries solved after the selection, shared with the confirmation</param>
    public static RunFigures Compute(Problem problem, IReadOnlyList<PartEvaluation> parts, IReadOnlyList<EvaluatedOption>? chosen, IReadOnlyList<PlateHeat> heat, SolvedGeometries geometries)
    {
        var lossFrequency = new List<LossFrequencyCurves>();
        var currentDensity = new List<CurrentDensityMaps>();
        var dragSpeed = new List<DragSpeedLines>();
        var temperature = new List<TemperatureMaps>();
        var torqueSpeed = new List<TorqueSpeedLines>();
        for (var i = 0; i < parts.Count; i++)
        {
            switch (parts[i].Part)
            {
                case CorePart core:
                    lossFrequency.Add(LossFrequencyCurves.Of(core, problem));
                    break;
                case PlatePart plate when chosen is not null:
                    currentDensity.Add(CurrentDensityMaps.Of(parts[i], chosen[i], problem, geometries));
                    if (plate.Excitation.IsMoving) dragSpeed.Add(DragSpeedLines.Of(parts[i], chosen[i], problem));
                    if (plate.Excitation is PlateExcitation.Turning) torqueSpeed.Add(TorqueSpeedLines.Of(parts[i], chosen[i], problem, geometries));
                    if (TemperatureMaps.Of(plate.Name, heat) is { } maps) temperature.Add(maps);
                    break;
            }
        }
        return new RunFigures(lossFrequency, currentDensity, dragSpeed, temperature, Validity.ReynoldsLimit) { TorqueSpeed = torqueSpeed };
    }

    public LossFrequencyCurves LossFrequencyOf(string partName) => LossFrequency.First(c => c.Part.Name == partName);
    public CurrentDensityMaps CurrentDensityOf(string partName) => CurrentDensity.First(m => m.PartName == partName);
    public DragSpeedLines DragSpeedOf(string partName) => DragSpeed.First(d => d.PartName == partName);
    public TorqueSpeedLines TorqueSpeedOf(string partName) => TorqueSpeed.First(d => d.PartName == partName);
    public TemperatureMaps? TemperatureOf(string partName) => Temperature.FirstOrDefault(t => t.PartName == partName);
}
