namespace SlotOpt.Plates.Thermal;

/// <summary>
/// Grey-body radiation from a face to large surroundings at ambient: q = eps sigma (T^4 - T_inf^4)
/// (Incropera, DeWitt, Bergman, Lavine, Fundamentals of Heat and Mass Transfer, 6th ed., 2007, eq. 1.7);
/// the temperature solver linearises it about the last temperature (slope 4 eps sigma T^3).
/// </summary>
public static class SurfaceRadiation
{
    /// <summary>Stefan-Boltzmann constant (W/(m^2 K^4)), CODATA 2018 (exact from the SI defining constants).</summary>
    public const double StefanBoltzmann = 5.670374419e-8;

    public static double HeatFluxWPerM2(double emissivity, double surfaceK, double ambientK)
    {
        double s2 = surfaceK * surfaceK, a2 = ambientK * ambientK;
        return emissivity * StefanBoltzmann * (s2 * s2 - a2 * a2);
    }

    /// <summary><see cref="HeatFluxWPerM2"/> (the same products) and its slope dq/dT = 4 eps sigma T^3, the linearisation's, from one square of T.</summary>
    public static (double FluxWPerM2, double SlopeWPerM2K) HeatFluxAndSlope(double emissivity, double surfaceK, double ambientK)
    {
        double s2 = surfaceK * surfaceK, a2 = ambientK * ambientK, factor = emissivity * StefanBoltzmann;
        return (factor * (s2 * s2 - a2 * a2), 4 * factor * (s2 * surfaceK));
    }
}
