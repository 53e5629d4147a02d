using MathNet.Numerics.RootFinding;
using SlotOpt.Materials;

namespace SlotOpt.Plates.Thermal;

/// <summary>
/// Average natural-convection coefficient of a vertical plate from the correlation of
/// S. W. Churchill and H. H. S. Chu, "Correlating equations for laminar and turbulent free
/// convection from a vertical plate", Int. J. Heat Mass Transfer 18 (1975) 1323-1329, the equation
/// for the whole range of Rayleigh and Prandtl numbers (the paper's title page and abstract were read; its
/// equation numbering was not, so the equation is cited by content; it is also eq. 9.26 of Incropera, DeWitt,
/// Bergman, Lavine, Fundamentals of Heat and Mass Transfer, 6th ed., 2007, from memory). Properties at the film temperature.
/// </summary>
public static class NaturalConvection
{
    /// <summary>Standard acceleration of gravity (m/s^2), 3rd CGPM 1901.</summary>
    public const double GravityMPerS2 = 9.80665;

    /// <summary>Nu_L = {0.825 + 0.387 Ra_L^(1/6) / [1 + (0.492/Pr)^(9/16)]^(8/27)}^2 (Churchill and Chu 1975, all Ra_L).</summary>
    public static double AverageNusselt(double rayleigh, double prandtl)
    {
        if (!(rayleigh >= 0) || !(prandtl > 0)) throw new ArgumentOutOfRangeException(nameof(rayleigh), $"Ra = {rayleigh}, Pr = {prandtl}");
        double f = Math.Pow(1 + Math.Pow(0.492 / prandtl, 9.0 / 16), 8.0 / 27);
        double root = 0.825 + 0.387 * Math.Pow(rayleigh, 1.0 / 6) / f;
        return root * root;
    }

    /// <summary>Ra_L = g beta (T_s - T_inf) L^3 / (nu alpha), alpha = nu / Pr (Incropera et al. 2007, eq. 9.25).</summary>
    public static double Rayleigh(FluidProperties p, double riseK, double lengthM) =>
        GravityMPerS2 * p.ExpansionPerK * riseK * lengthM * lengthM * lengthM * p.PrandtlNumber / (p.KinematicViscosityM2PerS * p.KinematicViscosityM2PerS);

    /// <summary>h = Nu_L k / L (W/m^2K) for a plate of height L at a mean surface rise above ambient; film temperature (T_s + T_inf)/2.</summary>
    public static double AverageCoefficient(CoolingFluid fluid, double ambientK, double riseK, double lengthM)
    {
        double rise = Math.Max(riseK, 0);
        var p = fluid.At(ambientK + rise / 2);
        return AverageNusselt(Rayleigh(p, rise, lengthM), p.PrandtlNumber) * p.ThermalConductivityWPerMK / lengthM;
    }

    /// <summary>
    /// The mean rise r and coefficient h = h(r) of a face that sheds q (W/m^2): the root of r h(r) + other(r) = q (Newton's
    /// law of cooling with the correlation's h, plus any other outflow per unit face area that grows with the rise, such as
    /// radiation or conduction into held edges), by Brent's method (MathNet.Numerics) on [0, the rise whose film temperature
    /// is the top of the fluid's table], to 1e-13 K. The left side grows with r, so the root is unique; a plate that would
    /// need a rise beyond the table is a <see cref="NumericalFailureException"/>.
    /// </summary>
    public static (double CoefficientWPerM2K, double RiseK) AtHeatFlux(CoolingFluid fluid, double ambientK, double heatFluxWPerM2, double lengthM,
        Func<double, double>? otherFluxWPerM2 = null)
    {
        if (!(heatFluxWPerM2 >= 0) || !double.IsFinite(heatFluxWPerM2)) throw new NumericalFailureException($"natural convection: a heat flux of {heatFluxWPerM2} W/m^2 per face");
        if (heatFluxWPerM2 == 0) return (AverageCoefficient(fluid, ambientK, 0, lengthM), 0);
        double top = 2 * (fluid.MaxTemperatureK - ambientK);   // film temperature (T_s + T_inf) / 2 at the table's top
        double Excess(double r) => (r * AverageCoefficient(fluid, ambientK, r, lengthM) + (otherFluxWPerM2?.Invoke(r) ?? 0)) / heatFluxWPerM2 - 1;
        if (!(top > 0) || Excess(top) < 0)
            throw new NumericalFailureException(string.Create(System.Globalization.CultureInfo.InvariantCulture,
                $"natural convection: shedding {heatFluxWPerM2:G4} W/m^2 per face in {fluid.Name} needs a film temperature beyond its property table (top {fluid.MaxTemperatureK:0} K)"));
        double rise = Brent.FindRoot(Excess, 0, top, 1e-13, 200);
        return (AverageCoefficient(fluid, ambientK, rise, lengthM), rise);
    }
}
