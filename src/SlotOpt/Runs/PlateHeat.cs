using SlotOpt.Design.SolidParts;
using SlotOpt.Design;
using SlotOpt.Plates.Thermal;

namespace SlotOpt.Runs;

/// <summary>
/// A plate design of the run (the chosen one or the reference) solved with its resistivity at its own temperature
/// (<see cref="PlateOptions.SolveHeated"/>): the same answer `slotopt plate` gives on the same plate. Heating is
/// null when the coupled solve failed (thermal runaway, or a plate hotter than the data), with the reason in Failure.
/// </summary>
public sealed record PlateHeat(string PartName, DesignRole Role, EvaluatedOption Option, HeatedPlate? Heating, string? Failure, TemperatureLimit Limit, PlateDrawing Drawing)
{
    public string? Breach => Heating is { } h ? Limit.Breach(h.Temperature) : Failure is null ? null : $"too hot to compute: {Failure}";

    public static PlateHeat Of(PlatePart part, EvaluatedOption option, DesignRole role, Problem problem, EvaluationLimits? limits)
    {
        var choice = (PlateChoice)option.Choice;
        var (geometry, _) = PlateGeometryFactory.Build(part.Outline, choice.Slots);
        var material = problem.Library.GetConductor(choice.Material, part.Name);
        try
        {
            var heated = PlateOptions.SolveHeated(part, choice.Slots, choice.ThicknessM, material, limits ?? EvaluationLimits.Default);
            return new PlateHeat(part.Name, role, option, heated, null, part.Thermal!.Limit, PlateDrawing.Of(geometry));
        }
        catch (NumericalFailureException e)
        {
            return new PlateHeat(part.Name, role, option, null, e.Message, part.Thermal!.Limit, PlateDrawing.Of(geometry));
        }
    }
}
