using SlotOpt.Design.SolidParts;
using SlotOpt.Design;
using SlotOpt.Design.Cores;

namespace SlotOpt.Runs;

/// <summary>
/// The designs a result is measured against: the user's current design of each part where the file gives
/// one, else a baseline (a core of the file's first grade and process; a solid plate of the first
/// thickness, material and process).
/// </summary>
public static class ReferenceDesigns
{
    public static EvaluatedOption CurrentOrBaseline(Part part, Problem problem, EvaluationLimits? limits = null) => part switch
    {
        CorePart core => CoreOptions.EvaluateOne(core,
            problem.Library.GetSteel(core.Current?.Grade ?? core.Grades[0], core.Name),
            problem.Shop.Processes[core.Current?.Process ?? core.Processes[0]], problem.Shop),
        PlatePart plate => PlateOptions.EvaluateOne(plate,
            plate.Current ?? new PlateChoice(plate.ThicknessesM[0], plate.Materials[0], plate.Processes[0], null),
            problem.Library, problem.Shop, limits),
        _ => throw new ArgumentOutOfRangeException(nameof(part), part.GetType().Name, "unknown part kind"),
    };

    /// <summary>Whether the part's reference is the user's own design (true) or the baseline (false).</summary>
    public static bool IsCurrent(Part part) => part switch
    {
        CorePart core => core.Current is not null,
        PlatePart plate => plate.Current is not null,
        _ => false,
    };
}
