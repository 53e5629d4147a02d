namespace SlotOpt.Plates.Thermal;

/// <summary>What the plate's outer edge does thermally; edges of holes and slots are always insulated.</summary>
public enum ThermalEdge
{
    /// <summary>No heat crosses the edge.</summary>
    Insulated,
    /// <summary>The edge is held at ambient temperature (clamped to a large cold body).</summary>
    Ambient,
}
