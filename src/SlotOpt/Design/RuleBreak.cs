namespace SlotOpt.Design;

/// <summary>The ways a design option can be rejected; each kind has one short name (RuleBreak.ShortName) for the counts.</summary>
public enum RuleKind
{
    /// <summary>A slot narrower than the cutting process can cut.</summary>
    SlotNarrowerThanProcess,
    /// <summary>A strip between slots narrower than the process allows for the thickness.</summary>
    StripTooNarrow,
    /// <summary>An uncut ligament smaller than the part's or the process's minimum.</summary>
    LigamentTooSmall,
    /// <summary>More slots than the process allows on one plate.</summary>
    TooManySlots,
    /// <summary>Fingers between slots so slender that their first bending mode lies near twice the AC frequency.</summary>
    FingerResonance,
    /// <summary>Drag above the part's limit.</summary>
    DragAboveLimit,
    /// <summary>Loss above the part's limit.</summary>
    LossAboveLimit,
    /// <summary>Drag (a wanted braking force) below the part's minimum at its named speed.</summary>
    DragBelowMinimum,
    /// <summary>Peak flux density in a core beyond what the grade carries.</summary>
    FluxBeyondGrade,
    /// <summary>The slot pattern does not fit the plate's outline.</summary>
    PatternDoesNotFit,
    /// <summary>A grain-oriented grade in a core whose flux crosses the rolling direction (E-I laminations, machine stators).</summary>
    GrainOrientedAcrossRollingDirection,
    /// <summary>The plate's hottest point above the part's temperature limit ([parts.thermal]).</summary>
    HotterThanLimit,
    /// <summary>Braking torque on a turning disc above the part's limit (max_torque: the torque is unwanted).</summary>
    TorqueAboveLimit,
    /// <summary>Braking torque on a turning disc below the part's minimum at its named speed (min_torque: the torque is wanted).</summary>
    TorqueBelowMinimum,
}

/// <summary>Why an option was rejected: the rule it breaks (a kind) and the reason with its numbers (a message).</summary>
public sealed record RuleBreak(RuleKind Kind, string Message)
{
    /// <summary>The rule in a few words, without numbers (the report counts rejections by it).</summary>
    public string ShortName => ShortNameOf(Kind);

    public static string ShortNameOf(RuleKind kind) => kind switch
    {
        RuleKind.SlotNarrowerThanProcess => "slot narrower than the process cuts",
        RuleKind.StripTooNarrow => "strip between slots too narrow",
        RuleKind.LigamentTooSmall => "uncut ligament too small",
        RuleKind.TooManySlots => "too many slots for the process",
        RuleKind.FingerResonance => "fingers too slender (resonance)",
        RuleKind.DragAboveLimit => "drag above the part's limit",
        RuleKind.LossAboveLimit => "loss above the part's limit",
        RuleKind.DragBelowMinimum => "drag below the part's minimum",
        RuleKind.FluxBeyondGrade => "flux beyond the grade",
        RuleKind.PatternDoesNotFit => "slot pattern does not fit the plate",
        RuleKind.GrainOrientedAcrossRollingDirection => "grain-oriented steel across its rolling direction",
        RuleKind.HotterThanLimit => "hotter than the part's limit",
        RuleKind.TorqueAboveLimit => "torque above the part's limit",
        RuleKind.TorqueBelowMinimum => "torque below the part's minimum",
        _ => throw new ArgumentOutOfRangeException(nameof(kind), kind, "unknown rule kind"),
    };

    public override string ToString() => Message;
}
