namespace SlotOpt.Materials;

/// <summary>Kinds of electrical steel, by the standard that specifies them.</summary>
public enum SteelFamily
{
    /// <summary>Non-oriented, fully processed (IEC 60404-8-4 / EN 10106), specified at 1.5 T 50 Hz.</summary>
    NonOriented,
    /// <summary>Grain-oriented (IEC 60404-8-7 / EN 10107), specified at 1.7 T 50 Hz along the rolling direction.</summary>
    GrainOriented,
    /// <summary>Thin non-oriented for medium frequencies (IEC 60404-8-8), specified at 1.0 T 400 Hz.</summary>
    ThinNonOriented,
}
