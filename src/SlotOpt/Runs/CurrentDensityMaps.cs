using SlotOpt.Design.SolidParts;
using SlotOpt.Design;
using SlotOpt.Plates.Conductors;
using SlotOpt.Plates.ResistanceLimited;

namespace SlotOpt.Runs;

/// <summary>
/// Current density in a chosen plate and in the solid plate cut from the same sheet (solid first; one panel when
/// the chosen plate is solid): each geometry solved again with the engine (<see cref="PlateOptions.Solve"/>, once a run: <see cref="SolvedGeometries"/>), the
/// unit-conductance solution scaled to the chosen sheet. For a moving source the map is the travel position with the largest loss.
/// </summary>
public sealed record CurrentDensityMaps(string PartName, IReadOnlyList<CurrentDensityMaps.Panel> Panels)
{
    /// <summary>One plate's map, its peak |J| (A/m^2) and its outline, slots and grooves.</summary>
    public sealed record Panel(EvaluatedOption Option, DesignRole Role, CurrentDensityMap Map, double PeakAPerM2, PlateDrawing Drawing);

    public static CurrentDensityMaps Of(PartEvaluation plate, EvaluatedOption chosen, Problem problem, SolvedGeometries geometries)
    {
        var part = (PlatePart)plate.Part;
        var solid = SolidCounterpart.Of(plate, chosen);
        var designs = new List<(EvaluatedOption Option, DesignRole Role)> { (solid, DesignRole.SolidCounterpart) };
        if (!ReferenceEquals(solid, chosen)) designs.Add((chosen, DesignRole.Chosen));
        var choice = (PlateChoice)chosen.Choice;
        var material = problem.Library.GetConductor(choice.Material, part.Name);
        var sheet = new ConductingSheet(material.ConductivityAt(part.TemperatureK), choice.ThicknessM, material.RelativePermeability);
        return new CurrentDensityMaps(part.Name, designs.Select(d =>
        {
            var solved = geometries.Of(part, ((PlateChoice)d.Option.Choice).Slots);
            if (solved.Peak is null || solved.Geometry is null) throw new InvalidOperationException($"{part.Name}: the geometry solved during the run no longer solves: {solved.Failure}");
            var result = solved.Peak.ScaleTo(sheet);
            return new Panel(d.Option, d.Role, result.Map, result.PeakCurrentDensityAPerM2, PlateDrawing.Of(solved.Geometry));
        }).ToList());
    }
}
