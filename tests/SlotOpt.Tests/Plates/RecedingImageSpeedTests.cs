using Complex = System.Numerics.Complex;
using MathNet.Numerics.LinearAlgebra;
using SlotOpt.Plates;
using SlotOpt.Plates.Conductors;
using SlotOpt.Plates.Geometry;
using SlotOpt.Plates.Sources.Magnets;
using SlotOpt.Plates.Sources.Rotation;

namespace SlotOpt.Tests.Plates;

/// <summary>
/// The receding-image speed w = 2 / (mu0 sigma t) (<see cref="ConductingSheet.RecedingImageSpeedMPerS"/>), the one definition every
/// sweep and the resistance-limited lift use: its value against the published formula, and that it holds no permeability.
/// </summary>
public class RecedingImageSpeedTests(Xunit.Abstractions.ITestOutputHelper output)
{
    // Copper at 20 degC, IACS resistivity 0.017241 uOhm m (IEC 60028:1925 annealed-copper standard).
    private const double CopperSPerM = 1 / 0.017241e-6;
    private const double Mu0 = 4e-7 * Math.PI;   // H/m, the pre-2019 SI definition (the engine's value)

    // W. M. Saslow, "Maxwell's theory of eddy currents in thin conducting sheets...", Am. J. Phys. 60 (1992) 693 (abstract and sec. II): the
    // recession velocity v0 = 2 / (mu0 sigma d), 27.4 m/s for 1 mm of copper. The property is that formula to round-off (1e-15), and a slide at
    // w has magnetic Reynolds number 1 (Validity, Rm = v / w; 1e-12, round-off of a different product order).
    [Fact]
    public void Receding_image_speed_is_Saslows_recession_velocity()
    {
        var sheet = new ConductingSheet(CopperSPerM, 1e-3);
        Assert.Equal(2 / (Mu0 * CopperSPerM * 1e-3), sheet.RecedingImageSpeedMPerS, 1e-15 * sheet.RecedingImageSpeedMPerS);
        Assert.InRange(sheet.RecedingImageSpeedMPerS, 27.35, 27.45);                         // 27.4 m/s, three figures in the reference
        Assert.Equal(1, Validity.ForMoving(sheet, sheet.RecedingImageSpeedMPerS).ReynoldsNumber, 1e-12);
    }

    // The exact field of a uniform conducting, permeable slab under a field harmonic of wavenumber k sliding at v (frequency k v in the slab):
    // vector potential A_y with A'' = k^2 A outside and A'' = (k^2 - i k v mu sigma) A inside, A and H_x = -A' / mu continuous at both faces
    // (the transfer relations of a moving conducting layer, J. R. Melcher, Continuum Electromechanics, MIT Press 1981, sec. 6.5), solved as a
    // 4 x 4 complex system by MathNet's dense LU. The drag is proportional to |Im R|, R the reflected amplitude; for a thin non-magnetic sheet
    // Im R = -(v/w) / (1 + (v/w)^2), which peaks at v = w. A slab 1 mm thick, k = 10 /m, copper: with mu_r = 1 the peak lies at 1.003 w, with
    // mu_r = 10 (mu_r k t = 0.1: magnetically thin) at 0.985 w (measured on a 0.25 % speed grid), not at w / mu_r as a permeability in w would
    // put it. Tolerance 2.5 %: the separate flux condition couples at O(mu_r k t) = 0.1 and moves the peak by 1.5 %.
    [Theory]
    [InlineData(1.0)]
    [InlineData(10.0)]
    public void Receding_image_speed_is_the_drag_peak_of_a_thin_permeable_slab(double relativePermeability)
    {
        const double k = 10, t = 1e-3;
        var sheet = new ConductingSheet(CopperSPerM, t, relativePermeability);
        double w = sheet.RecedingImageSpeedMPerS, peak = 0, largest = 0;
        for (int i = 0; i <= 1200; i++)
        {
            double v = w * Math.Exp(Math.Log(0.2) + Math.Log(25) * i / 1200);     // 0.2 w to 5 w, steps of 0.27 %
            double drag = Math.Abs(SlabReflection(k, t, CopperSPerM, relativePermeability, v).Imaginary);
            if (drag > largest) { largest = drag; peak = v; }
        }
        output.WriteLine($"mu_r {relativePermeability}: drag peak at {peak / w:F4} w (|Im R| {largest:F4})");
        Assert.InRange(peak / w, 0.975, 1.025);
    }

    /// <summary>R: the reflected amplitude of A_y above a slab 0 &lt; z &lt; t for an incident e^(k (z - t)) (see the test's comment).</summary>
    private static Complex SlabReflection(double k, double t, double sigma, double mur, double v)
    {
        double mu = Mu0 * mur;
        var g = Complex.Sqrt(new Complex(k * k, -k * v * mu * sigma));
        Complex up = Complex.Exp(g * t), down = Complex.Exp(-g * t);
        // unknowns R, c1, c2, T: above 1 e^(k (z - t)) + R e^(-k (z - t)), inside c1 e^(g z) + c2 e^(-g z), below T e^(k z)
        var m = Matrix<Complex>.Build.DenseOfArray(new Complex[,]
        {
            { 1, -up, -down, 0 },                                   // A continuous at z = t
            { -k / Mu0, -g * up / mu, g * down / mu, 0 },           // A' / mu continuous at z = t
            { 0, 1, 1, -1 },                                        // A continuous at z = 0
            { 0, g / mu, -g / mu, -k / Mu0 },                       // A' / mu continuous at z = 0
        });
        var b = Vector<Complex>.Build.DenseOfArray([-1, -k / Mu0, 0, 0]);
        return m.LU().Solve(b)[0];
    }

    // The default torque-speed sweep is centred on the receding-image speed of the disc's sheet, w x 2^k at the magnets' radius, and so does
    // not depend on the permeability (it divided w by mu_r before, putting a steel disc's sweep 250 times too slow). Exact: the same arithmetic.
    [Fact]
    public void Default_disc_sweep_uses_the_same_receding_image_speed_for_a_permeable_disc()
    {
        var source = new RotatingMagnets(new CylinderMagnet(0.01, 0.005, 1.2), 0.03, 1, 0, MagnetPolarity.Same, 0.002, new Vec2(0.05, 0.05), 10);
        var plain = new ConductingSheet(6.25e6, 0.002);
        var steel = new ConductingSheet(6.25e6, 0.002, 250);
        var speeds = DiscSpeedCurve.DefaultSpeedsRadPerS(source, steel);
        Assert.Equal(DiscSpeedCurve.DefaultSpeedsRadPerS(source, plain), speeds);
        Assert.Equal(steel.RecedingImageSpeedMPerS / 0.03, speeds[4], 1e-12 * speeds[4]);   // 2^0 w at k = 0
    }
}
