using SlotOpt.Design.SolidParts;
using SlotOpt.Design;
using SlotOpt.Design.Cores;
using SlotOpt.Plates.Conductors;

namespace SlotOpt.Runs;

/// <summary>
/// The numbers behind the report's plots that the selection itself does not give, computed once by the run:
/// loss against frequency for each core part, and for each chosen plate the current-density maps (and, under
/// moving poles, drag against speed in the low-speed model, and with [parts.thermal] the temperature maps of the chosen and reference plates, valid below <see cref="LowSpeedReynoldsLimit"/>). The
/// coupled speed sweep is in the plate's confirmation.
/// </summary>
public sealed record RunFigures(
    IReadOnlyList<LossFrequencyCurves> LossFrequency,
    IReadOnlyList<CurrentDensityMaps> CurrentDensity,
    IReadOnlyList<DragSpeedLines> DragSpeed,
    IReadOnlyList<TemperatureMaps> Temperature,
    double LowSpeedReynoldsLimit)
{
    /// <param name="chosen">The chosen option of each part, in part order; null when the run found no design.</param>
    public static RunFigures Compute(Problem problem, IReadOnlyList<PartEvaluation> parts, IReadOnlyList<EvaluatedOption>? chosen, IReadOnlyList<PlateHeat> heat, EvaluationLimits? limits = null)
    {
        var lossFrequency = new List<LossFrequencyCurves>();
        var currentDensity = new List<CurrentDensityMaps>();
        var dragSpeed = new List<DragSpeedLines>();
        var temperature = new List<TemperatureMaps>();
        for (var i = 0; i < parts.Count; i++)
        {
            switch (parts[i].Part)
            {
                case CorePart core:
                    lossFrequency.Add(LossFrequencyCurves.Of(core, problem));
                    break;
                case PlatePart plate when chosen is not null:
                    currentDensity.Add(CurrentDensityMaps.Of(parts[i], chosen[i], problem, limits));
                    if (plate.Excitation.IsMoving) dragSpeed.Add(DragSpeedLines.Of(parts[i], chosen[i], problem));
                    if (TemperatureMaps.Of(plate.Name, heat) is { } maps) temperature.Add(maps);
                    break;
            }
        }
        return new RunFigures(lossFrequency, currentDensity, dragSpeed, temperature, Validity.ReynoldsLimit);
    }

    public LossFrequencyCurves LossFrequencyOf(string partName) => LossFrequency.First(c => c.Part.Name == partName);
    public CurrentDensityMaps CurrentDensityOf(string partName) => CurrentDensity.First(m => m.PartName == partName);
    public DragSpeedLines DragSpeedOf(string partName) => DragSpeed.First(d => d.PartName == partName);
    public TemperatureMaps? TemperatureOf(string partName) => Temperature.FirstOrDefault(t => t.PartName == partName);
}
