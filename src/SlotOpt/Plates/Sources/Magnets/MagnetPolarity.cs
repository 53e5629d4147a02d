namespace SlotOpt.Plates.Sources.Magnets;

/// <summary>How the magnets of a row are magnetised one after the other.</summary>
public enum MagnetPolarity
{
    /// <summary>North and south faces toward the plate in turn (a brake or coupling row).</summary>
    Alternating,
    /// <summary>Every magnet the same way round.</summary>
    Same,
}
