namespace SlotOpt.Materials;

/// <summary>How a conductor's resistivity follows temperature.</summary>
public enum TemperatureModel
{
    /// <summary>rho(T) = rho(20 degC) (1 + alpha (T - 20 degC)); trusted from 150 K to 500 K, refused outside.</summary>
    Linear,
    /// <summary>Matthiessen's rule on the intrinsic resistivity table of copper.</summary>
    MatthiessenCopper,
    /// <summary>Matthiessen's rule on the intrinsic resistivity table of aluminium.</summary>
    MatthiessenAluminium,
    /// <summary>Matthiessen's rule on the intrinsic resistivity table of iron (carbon and alloy steels).</summary>
    MatthiessenIron,
}
