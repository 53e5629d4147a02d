using SlotOpt.Design.SolidParts;
using SlotOpt.Design;

namespace SlotOpt.Runs;

/// <summary>The solid (unslotted) option of a plate cut from the same sheet as a given option: same thickness and material, the same process where the solid plate may use it.</summary>
public static class SolidCounterpart
{
    public static EvaluatedOption Of(PartEvaluation plate, EvaluatedOption option)
    {
        var choice = (PlateChoice)option.Choice;
        var solids = plate.Options.Where(o => o.Choice is PlateChoice { Slots: null } c && c.ThicknessM == choice.ThicknessM && c.Material == choice.Material).ToList();
        return solids.FirstOrDefault(o => ((PlateChoice)o.Choice).Process == choice.Process) ?? solids[0];
    }
}
