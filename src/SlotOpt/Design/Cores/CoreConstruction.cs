namespace SlotOpt.Design.Cores;

/// <summary>How the laminations of a core are built up, in the trade's words.</summary>
public enum CoreConstruction
{
    /// <summary>Transformer limbs and yokes stacked with mitred (45 degree) single-step joints: "stacked-mitred".</summary>
    StackedMitred,
    /// <summary>Stacked with step-lap joints: "stacked-step-lap".</summary>
    StackedStepLap,
    /// <summary>Wound from one strip (cut or uncut): "wound".</summary>
    Wound,
    /// <summary>Punched E and I laminations: the back of the E and the I run across the strip: "e-i".</summary>
    EI,
    /// <summary>Machine laminations (stator or rotor): teeth and yoke see every direction and rotating flux: "stator".</summary>
    Stator,
}

/// <summary>The words of a problem file for each construction, and what each means for grain-oriented steel.</summary>
public static class CoreConstructionWords
{
    private static readonly (CoreConstruction Construction, string Word)[] Words =
    [
        (CoreConstruction.StackedMitred, "stacked-mitred"),
        (CoreConstruction.StackedStepLap, "stacked-step-lap"),
        (CoreConstruction.Wound, "wound"),
        (CoreConstruction.EI, "e-i"),
        (CoreConstruction.Stator, "stator"),
    ];

    public static IReadOnlyList<string> All => Words.Select(w => w.Word).ToList();

    public static string Word(CoreConstruction construction) => Words.First(w => w.Construction == construction).Word;

    public static bool TryParse(string word, out CoreConstruction construction)
    {
        foreach (var w in Words)
            if (w.Word == word) { construction = w.Construction; return true; }
        construction = default;
        return false;
    }

    /// <summary>
    /// True where part of the flux runs across the rolling direction: the back of an E and the I of an E-I stack run at
    /// 90 degrees to it, and machine teeth and yokes see every direction (IEC 60050 IEV 221-03-38/39 define the
    /// anisotropy of loss this meets; grain-oriented steel loses 2.5 to 4 times more at 90 degrees at 1.5 T, from memory).
    /// </summary>
    public static bool FluxCrossesRollingDirection(CoreConstruction construction) =>
        construction is CoreConstruction.EI or CoreConstruction.Stator;
}
