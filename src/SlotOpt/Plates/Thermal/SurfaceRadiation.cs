namespace SlotOpt.Plates.Thermal;

/// <summary>
/// Grey-body radiation from a face to large surroundings at ambient: q = eps sigma (T^4 - T_inf^4),
/// linearised as q = h_r (T - T_inf) with h_r = eps sigma (T^2 + T_inf^2)(T + T_inf)
/// (Incropera, DeWitt, Bergman, Lavine, Fundamentals of Heat and Mass Transfer, 6th ed., 2007, eqs. 1.7 and 1.9).
/// </summary>
public static class SurfaceRadiation
{
    /// <summary>Stefan-Boltzmann constant (W/(m^2 K^4)), CODATA 2018 (exact from the SI defining constants).</summary>
    public const double StefanBoltzmann = 5.670374419e-8;

    public static double LinearisedCoefficient(double emissivity, double surfaceK, double ambientK) =>
        emissivity * StefanBoltzmann * (surfaceK * surfaceK + ambientK * ambientK) * (surfaceK + ambientK);

    public static double HeatFluxWPerM2(double emissivity, double surfaceK, double ambientK) =>
        emissivity * StefanBoltzmann * (Math.Pow(surfaceK, 4) - Math.Pow(ambientK, 4));
}
