namespace SlotOpt.Plates.Geometry;

/// <summary>What a width the grid must resolve belongs to; <see cref="Grid.GridOptions"/> says how many cells each kind needs across.</summary>
public enum GridFeatureKind
{
    /// <summary>Conducting width: the plate's smaller side, the strip between slots, a ligament beyond a slot or between cut-outs and cuts.</summary>
    ConductingStrip,
    /// <summary>Width of a through cut-out (the current must not bridge it).</summary>
    Cutout,
    /// <summary>A pole's width (along or across the travel).</summary>
    Pole,
    /// <summary>The gap between neighbouring poles.</summary>
    PoleGap,
}

/// <summary>One width the grid must resolve, named for the warning when an explicit cell under-resolves it (metres).</summary>
public sealed record GridFeature(GridFeatureKind Kind, string Name, double WidthM);
