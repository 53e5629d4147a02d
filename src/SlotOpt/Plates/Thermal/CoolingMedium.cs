namespace SlotOpt.Plates.Thermal;

/// <summary>How the plate's faces shed heat by convection.</summary>
public enum CoolingMedium
{
    /// <summary>Natural convection in still air (Churchill-Chu vertical-plate correlation).</summary>
    Air,
    /// <summary>Natural convection in mineral transformer oil (same correlation).</summary>
    Oil,
    /// <summary>A given heat transfer coefficient.</summary>
    Fixed,
}
