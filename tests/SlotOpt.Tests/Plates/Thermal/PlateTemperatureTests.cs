using MathNet.Numerics.RootFinding;
using SlotOpt.Plates.Geometry;
using SlotOpt.Plates.Grid;
using SlotOpt.Plates.Thermal;

namespace SlotOpt.Tests.Plates.Thermal;

/// <summary>The temperature solver alone, on loss maps given directly, against closed-form solutions.</summary>
public class PlateTemperatureTests
{
    private const double AmbientK = 293.15;

    private static PlateGrid Grid(double widthM, double heightM, double cellM) =>
        PlateGrid.Build(PlateGeometry.Rectangle(widthM, heightM), new GridOptions { CellSizeM = cellM });

    /// <summary>A uniform areal loss q (W/m^2) as a loss per cell.</summary>
    private static double[] Uniform(PlateGrid grid, double qWPerM2) =>
        Enumerable.Repeat(qWPerM2 * grid.Lattice.CellAreaM2, grid.Lattice.CellCount).ToArray();

    private static PlateCooling Fixed(double h, ThermalEdge edges, double emissivity = 0) =>
        new(CoolingMedium.Fixed, AmbientK, emissivity, edges, h);

    // Infinite plate: with insulated edges and a uniform loss q per unit face area, no heat flows in the
    // plane and each face sheds h (T - T_inf) (Newton's law of cooling, Incropera, DeWitt, Bergman, Lavine,
    // Fundamentals of Heat and Mass Transfer, 6th ed., 2007, eq. 1.3a), so the rise is q / (2 h) everywhere.
    // The discrete scheme reproduces this exactly; tolerance 1e-7 relative: the linear solve stops at a relative residual of 1e-9.
    [Fact]
    public void Infinite_plate_rises_by_q_over_2h()
    {
        var grid = Grid(0.3, 0.2, 0.005);
        double q = 800, h = 12;
        var t = PlateTemperatureSolver.Solve(grid, Uniform(grid, q), 16, 0.01, Fixed(h, ThermalEdge.Insulated));
        Assert.Equal(q / (2 * h), t.MaxRiseK, q / (2 * h) * 1e-7);
        Assert.Equal(q / (2 * h), t.MeanRiseK, q / (2 * h) * 1e-7);
        Assert.Equal(q * 0.3 * 0.2, t.ConvectedW, q * 0.06 * 1e-7);
    }

    // The same plate with grey-body radiation as well: the rise solves q = 2 h r + 2 eps sigma ((T_inf + r)^4 - T_inf^4)
    // (Incropera et al. 2007, eqs. 1.3a and 1.7), found here by Brent's method (MathNet.Numerics) as the reference.
    // Tolerance 1e-6 relative: the Newton iteration on the radiation stops when a step moves less than 1e-6 of the rise.
    [Fact]
    public void Infinite_plate_with_radiation_matches_the_scalar_balance()
    {
        var grid = Grid(0.3, 0.2, 0.01);
        double q = 1500, h = 6, eps = 0.8;
        var t = PlateTemperatureSolver.Solve(grid, Uniform(grid, q), 16, 0.01, Fixed(h, ThermalEdge.Insulated, eps));
        double reference = Brent.FindRoot(r => 2 * h * r + 2 * SurfaceRadiation.HeatFluxWPerM2(eps, AmbientK + r, AmbientK) - q, 0, 500, 1e-12);
        Assert.Equal(reference, t.MaxRiseK, reference * 1e-6);
        Assert.Equal(q * 0.06, t.ConvectedW + t.RadiatedW, q * 0.06 * 1e-6);
    }

    // The radiation law's slope, used to linearise it: dq/dT = 4 eps sigma T^3 (the derivative of Incropera et al. 2007, eq. 1.7),
    // against a central difference of the law itself (step 1e-3 K: truncation d^2 q_TTT / (6 q_T) ~ 1e-8 relative), and the flux the
    // same as HeatFluxWPerM2 to the bit (the same products). Tolerance 1e-7 relative: above the difference's truncation and rounding.
    [Theory]
    [InlineData(0.8, 373.15, 313.15)]
    [InlineData(0.3, 900.0, 293.15)]
    public void Radiation_slope_is_the_derivative_of_the_law(double eps, double surfaceK, double ambientK)
    {
        var (flux, slope) = SurfaceRadiation.HeatFluxAndSlope(eps, surfaceK, ambientK);
        Assert.Equal(SurfaceRadiation.HeatFluxWPerM2(eps, surfaceK, ambientK), flux);
        double d = 1e-3, central = (SurfaceRadiation.HeatFluxWPerM2(eps, surfaceK + d, ambientK) - SurfaceRadiation.HeatFluxWPerM2(eps, surfaceK - d, ambientK)) / (2 * d);
        Assert.Equal(central, slope, 1e-7 * slope);
    }

    /// <summary>
    /// Strip of width W (x) heated uniformly (q W/m^2) with both long edges at ambient, cooled from both faces:
    /// far from the ends the fin equation with a uniform source, theta'' - m^2 theta = -q / (k t), m^2 = 2 h / (k t)
    /// (the plane fin of Incropera, DeWitt, Bergman, Lavine, Fundamentals of Heat and Mass Transfer, 6th ed., 2007,
    /// eq. 3.69, with the source term added), theta(0) = theta(W) = 0, has the solution
    /// theta(x) = q / (2 h) [1 - cosh(m (x - W/2)) / cosh(m W / 2)]  (derived: particular q/(2h) plus the even homogeneous part).
    /// The strip is 1.5 m long so the ends (also at ambient) decay by exp(-sqrt(m^2 + (pi/W)^2) L/2) ~ 1e-6 at mid-length.
    /// </summary>
    private static (double CentreError, double MaxError) FinErrors(int cellsAcross)
    {
        const double W = 0.2, L = 1.5, k = 50, t = 0.004, h = 10, q = 400;
        double cell = W / cellsAcross;
        var grid = Grid(W, L, cell);
        var temp = PlateTemperatureSolver.Solve(grid, Uniform(grid, q), k, t, Fixed(h, ThermalEdge.Ambient));
        double m = Math.Sqrt(2 * h / (k * t));
        double Exact(double x) => q / (2 * h) * (1 - Math.Cosh(m * (x - W / 2)) / Math.Cosh(m * W / 2));
        var l = grid.Lattice;
        int j = l.Ny / 2;
        double maxError = 0, centre = 0;
        for (int i = 0; i <= l.Nx; i++)
        {
            double error = temp.NodeTemperatureK[j * l.NodesX + i] - AmbientK - Exact(l.NodeX(i));
            maxError = Math.Max(maxError, Math.Abs(error));
            if (i == l.Nx / 2) centre = error;
        }
        return (Math.Abs(centre) / Exact(W / 2), maxError / Exact(W / 2));
    }

    // The cosh solution at 64 cells across: measured error 7e-5 of the centre rise; tolerance 5e-4 (the
    // 3-point scheme's error is (m h)^2 / 12 relative, about 1e-4 here, plus solver and end effects near 1e-6).
    [Fact]
    public void Fin_with_edges_at_ambient_follows_the_cosh_solution()
    {
        var (centre, max) = FinErrors(64);
        Assert.InRange(centre, 0, 5e-4);
        Assert.InRange(max, 0, 5e-4);
    }

    // Second order: halving the cell divides the centre error by 4 (observed order log2(e_h / e_h/2) = 2 for the
    // 5-point finite-volume scheme on a smooth solution). Tolerance +-0.1 on the order: the errors are far
    // (2e-3 to 1e-4 of the rise) far above the solver's 1e-9 and the end effect's 1e-6, so the ratio is the scheme's own.
    [Fact]
    public void Fin_converges_at_second_order()
    {
        var errors = new[] { 8, 16, 32 }.Select(n => FinErrors(n).CentreError).ToArray();
        for (int k = 0; k + 1 < errors.Length; k++)
            Assert.InRange(Math.Log2(errors[k] / errors[k + 1]), 1.9, 2.1);
    }
}
