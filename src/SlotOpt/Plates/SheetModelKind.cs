namespace SlotOpt.Plates;

/// <summary>Which thin-plate model a case needs (see <see cref="ReactionModelChoice"/>).</summary>
public enum SheetModelKind
{
    /// <summary>The eddy currents' own field is negligible: <see cref="ResistanceLimitedSolver"/>, one solve per geometry, scaled by G.</summary>
    ResistanceLimited,
    /// <summary>The eddy currents push back on the field but the field still crosses the thickness: <see cref="ReactionSolver"/>, one solve per conductor.</summary>
    ThinSheetReaction,
    /// <summary>The plate is thick against the skin depth: neither thin-sheet model holds; AC cases use the layered thick-plate solver (<see cref="ThickPlateSolver"/>).</summary>
    BeyondThinSheet,
    /// <summary>A wide plain block under sliding magnets: the exact laterally infinite slab (<see cref="Thick.SlabUnderMovingMagnets"/>), its own field and every depth included; plate edges and slots neglected.</summary>
    ThickSlab,
}
