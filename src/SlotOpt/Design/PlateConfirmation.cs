using SlotOpt.Materials;
using SlotOpt.Sheets;

namespace SlotOpt.Design;

/// <summary>
/// A chosen plate design confirmed with the model its validity figures call for: the resistance-limited
/// screen (one solve per geometry, scaled by sigma t) overstates loss and drag once the plate's own eddy
/// currents push back on the field, so the finalists are solved again with the thin-sheet reaction field or
/// the layered thick-plate model (Sheets/CorrectedSheetSolver), and the output says which model ran.
/// </summary>
public sealed record PlateConfirmation(
    string PartName,
    SheetModelKind Model,
    string Reason,
    double LossW,
    double? DragN,
    double? LiftN,
    double ResistanceLimitedLossW,
    IReadOnlyList<string> Notes)
{
    /// <summary>Solves the choice with the model its validity figures call for (accuracy 1 %, ReactionModelChoice).</summary>
    public static PlateConfirmation Confirm(PlatePart part, PlateChoice choice, MaterialLibrary library, EvaluationLimits? limits = null)
    {
        limits ??= EvaluationLimits.Default;
        var (geometry, _) = PlateGeometryFactory.Build(part.Outline, choice.Slots);
        var grid = new GridOptions { CellSizeM = part.CellSizeM };
        grid = grid with { MaxAutoCells = Math.Min(grid.MaxAutoCells, limits.MaxCellsPerSolve) };
        var model = SheetModel.Build(geometry, grid);
        var material = library.GetConductor(choice.Material, part.Name);
        var conductor = new Sheets.Conductor(material.ConductivityAt(part.TemperatureK), choice.ThicknessM, material.RelativePermeability);
        CorrectedSolution solution;
        if (part.Excitation.Moving is { } poles)
        {
            var offsets = part.Excitation.Offsets(part.Outline, choice.Slots?.PitchM ?? (part.SlotFamilies.Count > 0 ? part.SlotFamilies.SelectMany(f => f.PitchesM).Max() : null));
            // the moving skin depth's length scale: the pole's size along the travel
            var poleSize = 2 * poles.Poles.Min(p => p.Face.HalfWidthXM);
            solution = CorrectedSheetSolver.SolveMoving(model, new MovingPoleField(poles), conductor, offsets, poleSize);
        }
        else
        {
            solution = CorrectedSheetSolver.SolveAc(model, part.Excitation.Ac!, conductor);
        }
        return new PlateConfirmation(part.Name, solution.Choice.Kind, solution.Choice.Reason, solution.MeanLossW, solution.MeanDragN, solution.MeanLiftN,
            solution.ResistanceLimitedLossW.Average(), solution.Notes);
    }

    /// <summary>The model in words for the console and the report.</summary>
    public string ModelWords => Model switch
    {
        SheetModelKind.ResistanceLimited => "resistance-limited (the plate's own field is negligible)",
        SheetModelKind.ThinSheetReaction => "thin sheet with its own field",
        _ => "layered thick plate",
    };
}
