namespace SlotOpt.Runs;

/// <summary>Which design of a part a plate figure shows: the chosen one, the solid plate cut from the same sheet, or the part's reference (current design or baseline).</summary>
public enum DesignRole
{
    Chosen,
    SolidCounterpart,
    Reference,
}
