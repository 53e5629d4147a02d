namespace SlotOpt.Design;

/// <summary>How a part's loss is valued: transformer buyers price no-load and load loss apart (IEEE Std C57.120-1991).</summary>
public enum LossKind
{
    /// <summary>Loss while energised, whatever the load (core loss): default of core parts.</summary>
    NoLoad,
    /// <summary>Loss that scales with the load current squared (stray loss in tie and clamp plates): default of plates.</summary>
    Load,
}
