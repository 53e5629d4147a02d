using System.Numerics;
using SlotOpt.Numerics;
using SlotOpt.Plates.Conductors;

namespace SlotOpt.Plates.Thick;

/// <summary>
/// A laterally infinite conducting slab (conductivity sigma, thickness d, or a half-space) under sources sliding
/// along +x at speed v, exact per Fourier mode of the sources' field, with the slab's own field (any speed) and in
/// the resistance-limited limit. The derivation is in Plates/REACTION.md ("The thick slab under moving magnets"); in short:
/// <list type="bullet">
/// <item>In the sources' frame the slab moves at -v x and the field is steady: J = sigma (E + u x B), E = -grad phi, so
/// curl curl B = mu0 sigma curl(u x B) gives laplacian(B) = -mu0 sigma v dB/dx; a mode e^{i (kx x + ky y)} varies
/// across the slab as e^{+-gamma z}, gamma^2 = k^2 - i mu0 sigma v kx (J. R. Reitz, "Forces on moving magnets due to
/// eddy currents", J. Appl. Phys. 41 (1970) 2067, eq. for the thick plate).</item>
/// <item>Every component of B is continuous at both faces (mu = mu0 throughout, no surface currents); the horizontal
/// field that does not come from Bz obeys the same equation with zero values on both faces and so vanishes: the currents
/// are horizontal, J = sigma v (kx / k^2) (-ky, kx) Bz(z), J_z = 0 everywhere in the laterally infinite slab at any speed.</item>
/// <item>Matching Bz = b (e^{k z} + r e^{-k z}) above, P e^{gamma z} + Q e^{-gamma z} inside, T e^{k z} below gives the
/// reflection r = (k^2 - gamma^2)(1 - e^{-2 gamma d}) / ((k + gamma)^2 - (k - gamma)^2 e^{-2 gamma d}).</item>
/// <item>Maxwell's stress on a plane between slab and sources (only the incident x reflected products survive, Parseval):
/// drag on the sources F_D = (1 / (2 pi^2 mu0)) integral (kx / k) |b|^2 Im r d^2k, lift (repulsion)
/// F_L = (1 / (2 pi^2 mu0)) integral |b|^2 (-Re r) d^2k; Joule loss P = (sigma v^2 / (4 pi^2)) integral (kx^2 / k^2)
/// integral over the thickness |Bz(z)|^2 dz d^2k, and F_D v = P (checked in the tests).</item>
/// <item>Low speed (resistance-limited): r = i mu0 sigma v kx (1 - e^{-2 k d}) / (4 k^2), so
/// F_D = (sigma v / (4 pi^2)) integral |b|^2 (kx^2 / k^2) (1 - e^{-2 k d}) / (2 k) d^2k: each depth carries the thin-sheet
/// currents of its own Bz. Thin: (1/2) sigma d v integral Bz^2 dA for a source with 90-degree symmetry; half-space under a
/// normal dipole m at height h: mu0^2 m^2 sigma v / (128 pi h^3), a thin sheet of thickness h / 3.</item>
/// </list>
/// Numerics: the integrals over the wavenumber half-plane kx &gt;= 0 (the integrands are even under k -&gt; -k) in polar
/// coordinates (k, theta), 8-point Gauss-Legendre panels on k in [0, K], K h = ln(1 / eps) / 2 + 8 (h the nearest source
/// height, eps the wanted relative accuracy: the integrands fall as e^{-2 k h}, so the part beyond K is below 1e-3 eps),
/// radial panels min(2 / h, 2 pi / span) wide, 3 span / h + 4 angular panels over the half circle (about one period of
/// |b|^2's oscillation along the circle where the integrands peak, k ~ 3 / h), the panels at k = 0 and theta = +-pi/2 graded geometrically (see GradedPanels);
/// all panels halved per level until two levels agree within the wanted relative accuracy for every output (drag, lift, loss at
/// every speed); the difference of the last two levels is reported as the error estimate, a failure to agree within
/// <see cref="MaxLevels"/> levels as a <see cref="NumericalFailureException"/> (or TrySolve false).
/// </summary>
public sealed class SlabUnderMovingMagnets
{
    public const double DefaultRelativeAccuracy = 1e-7;
    public const int MaxLevels = 3;
    private const int GaussPoints = 8;

    /// <param name="conductivitySPerM">sigma (S/m).</param>
    /// <param name="thicknessM">d (m), or double.PositiveInfinity for a half-space.</param>
    public SlabUnderMovingMagnets(double conductivitySPerM, double thicknessM)
    {
        if (!(conductivitySPerM > 0) || !double.IsFinite(conductivitySPerM)) throw new InputException($"the slab's conductivity must be positive (got {conductivitySPerM} S/m)");
        if (!(thicknessM > 0) || double.IsNaN(thicknessM)) throw new InputException($"the slab's thickness must be positive (got {thicknessM} m)");
        ConductivitySPerM = conductivitySPerM;
        ThicknessM = thicknessM;
    }

    public double ConductivitySPerM { get; }
    /// <summary>d, or +infinity for a half-space.</summary>
    public double ThicknessM { get; }
    public bool IsHalfSpace => double.IsPositiveInfinity(ThicknessM);

    /// <summary>Drag, lift and loss at each speed, with the slab's own field.</summary>
    public bool TrySolve(SurfaceFieldSpectrum source, IReadOnlyList<double> speedsMPerS, double relativeAccuracy, out SlabForces[]? forces, out string failure)
    {
        CheckSpeeds(speedsMPerS);
        int n = speedsMPerS.Count;
        var result = Integrate(source, relativeAccuracy, 3 * n, (kx, ky, b2, sums, w) =>
        {
            double k = Math.Sqrt(kx * kx + ky * ky);
            for (int s = 0; s < n; s++)
            {
                var mode = Mode(kx, ky, speedsMPerS[s]);
                sums[3 * s] += w * kx / k * b2 * mode.Reflection.Imaginary;              // (kx / k) |b|^2 Im r
                sums[3 * s + 1] -= w * b2 * mode.Reflection.Real;                        // |b|^2 (-Re r)
                sums[3 * s + 2] += w * kx * kx / (k * k) * b2 * mode.ThicknessIntegralOfBz2;   // (kx / k)^2 integral |Bz / b|^2 dz |b|^2
            }
        }, out var level, out var error, out failure);
        forces = null;
        if (result is null) return false;
        forces = new SlabForces[n];
        for (int s = 0; s < n; s++)
        {
            double v = speedsMPerS[s];
            double forceScale = 2 / (2 * Math.PI * Math.PI * Validity.Mu0);              // half-plane doubled, 1 / (2 pi^2 mu0)
            double lossScale = 2 * ConductivitySPerM * v * v / (4 * Math.PI * Math.PI);   // half-plane doubled, sigma v^2 / (4 pi^2)
            forces[s] = new SlabForces(v, forceScale * result[3 * s], forceScale * result[3 * s + 1], lossScale * result[3 * s + 2],
                Math.Max(error[3 * s], Math.Max(error[3 * s + 1], error[3 * s + 2])), level);
        }
        return true;
    }

    public SlabForces[] Solve(SurfaceFieldSpectrum source, IReadOnlyList<double> speedsMPerS, double relativeAccuracy = DefaultRelativeAccuracy) =>
        TrySolve(source, speedsMPerS, relativeAccuracy, out var f, out var failure) ? f! : throw new NumericalFailureException(failure);

    /// <summary>
    /// The resistance-limited drag (the slab's own field neglected), per unit speed: F_D / v in N s/m, with its relative
    /// error estimate.
    /// </summary>
    public bool TryLowSpeedDragPerSpeed(SurfaceFieldSpectrum source, double relativeAccuracy, out double dragPerSpeedNsPerM, out double relativeError, out string failure)
    {
        double d = ThicknessM;
        var result = Integrate(source, relativeAccuracy, 1, (kx, ky, b2, sums, w) =>
        {
            double k = Math.Sqrt(kx * kx + ky * ky);
            double depth = IsHalfSpace ? 1 / (2 * k) : -double.ExpM1(-2 * k * d) / (2 * k);   // integral of e^{2 k z} over the thickness
            sums[0] += w * b2 * kx * kx / (k * k) * depth;                                     // |b|^2 (kx^2 / k^2) (1 - e^{-2 k d}) / (2 k)
        }, out _, out var error, out failure);
        dragPerSpeedNsPerM = result is null ? double.NaN : 2 * ConductivitySPerM / (4 * Math.PI * Math.PI) * result[0];   // half-plane doubled
        relativeError = result is null ? double.NaN : error[0];
        return result is not null;
    }

    public double LowSpeedDragPerSpeed(SurfaceFieldSpectrum source, double relativeAccuracy = DefaultRelativeAccuracy) =>
        TryLowSpeedDragPerSpeed(source, relativeAccuracy, out var c, out _, out var failure) ? c : throw new NumericalFailureException(failure);

    private static void CheckSpeeds(IReadOnlyList<double> speeds)
    {
        if (speeds.Count == 0) throw new InputException("no speeds to solve for");
        foreach (double v in speeds)
            if (!(v > 0) || !double.IsFinite(v)) throw new InputException($"a speed must be positive and finite (got {v} m/s)");
    }

    /// <summary>One mode: the reflection r and the integral over the thickness of |Bz(z) / b|^2.</summary>
    private (Complex Reflection, double ThicknessIntegralOfBz2) Mode(double kx, double ky, double v)
    {
        double k = Math.Sqrt(kx * kx + ky * ky);
        var iAlpha = new Complex(0, Validity.Mu0 * ConductivitySPerM * v * kx);               // k^2 - gamma^2 = i mu0 sigma v kx
        var gamma = Complex.Sqrt(k * k - iAlpha);                                               // Re gamma >= k > 0
        var e = IsHalfSpace ? Complex.Zero : Complex.Exp(-2 * gamma * ThicknessM);             // e^{-2 gamma d}
        var oneMinusE = IsHalfSpace ? Complex.One : -ExpM1(-2 * gamma * ThicknessM);
        var kMinusG = iAlpha / (k + gamma);                                                     // k - gamma without cancellation
        var r = iAlpha * oneMinusE / ((k + gamma) * (k + gamma) - e * kMinusG * kMinusG);
        // inside: Bz / b = p (e^{gamma z} + rho e^{-2 gamma d} e^{-gamma z}), rho = (gamma - k) / (gamma + k), p (1 + rho e^{-2 gamma d}) = 1 + r
        var rho = -kMinusG / (gamma + k);
        var p = (1 + r) / (1 + rho * e);
        double a = gamma.Real, beta = gamma.Imaginary;
        double integral;
        if (IsHalfSpace) integral = 1 / (2 * a);
        else
        {
            double d = ThicknessM, decay = -double.ExpM1(-2 * a * d);                            // 1 - e^{-2 a d}
            double direct = decay / (2 * a);                                                    // integral of |e^{gamma z}|^2
            double reflected = rho.Magnitude * rho.Magnitude * Math.Exp(-2 * a * d) * decay / (2 * a);   // integral of |rho e^{-2 gamma d} e^{-gamma z}|^2
            var oscillation = Math.Abs(beta * d) < 1e-8 ? new Complex(d, 0) : -ExpM1(new Complex(0, -2 * beta * d)) / new Complex(0, 2 * beta);   // integral of e^{2 i beta z}
            double cross = 2 * (Complex.Conjugate(rho * e) * oscillation).Real;
            integral = direct + reflected + cross;
        }
        return (r, p.Magnitude * p.Magnitude * integral);
    }

    /// <summary>e^z - 1 without cancellation for small |z|: (expm1(x) cos y - 2 sin^2(y / 2)) + i e^x sin y.</summary>
    private static Complex ExpM1(Complex z)
    {
        double s = Math.Sin(z.Imaginary / 2);
        return new Complex(double.ExpM1(z.Real) * Math.Cos(z.Imaginary) - 2 * s * s, Math.Exp(z.Real) * Math.Sin(z.Imaginary));
    }

    private delegate void NodeAccumulator(double kx, double ky, double spectrumSquared, double[] sums, double weight);

    /// <summary>Gauss-Legendre panels over the half-plane in polar coordinates, halved per level until two levels agree (see the class comment).</summary>
    private static double[]? Integrate(SurfaceFieldSpectrum source, double relativeAccuracy, int outputs, NodeAccumulator add,
        out int level, out double[] relativeError, out string failure)
    {
        if (!(relativeAccuracy > 0 && relativeAccuracy < 1)) throw new InputException($"the wanted relative accuracy must lie between 0 and 1 (got {relativeAccuracy})");
        double h = source.NearestSourceHeightM, span = Math.Max(source.SpanXM, source.SpanYM);
        double cutOff = (Math.Log(1 / relativeAccuracy) / 2 + 8) / h;          // |b|^2 ~ e^{-2 k h}: the part beyond K is below 1e-3 eps
        double radialPanel = Math.Min(2 / h, 2 * Math.PI / span);                // one period of |b|^2's oscillation along k
        int angularPanels = (int)Math.Ceiling(3 * span / h) + 4;                 // about one period of its oscillation along the circle at k = 3 / h, where the integrands peak
        double[]? previous = null;
        relativeError = new double[outputs];
        for (level = 0; level <= MaxLevels; level++)
        {
            var radial = GradedPanels(0, cutOff, (int)Math.Ceiling(cutOff / radialPanel) << level, gradeStart: true, gradeEnd: false);
            var angular = GradedPanels(-Math.PI / 2, Math.PI / 2, angularPanels << level, gradeStart: true, gradeEnd: true);
            var sums = Sweep(source, radial, angular, outputs, add);
            foreach (double s in sums)
                if (!double.IsFinite(s)) { failure = $"the wavenumber integral is not finite at level {level}"; return null; }
            if (previous is not null)
            {
                bool converged = true;
                for (int o = 0; o < outputs; o++)
                {
                    relativeError[o] = Math.Abs(sums[o] - previous[o]) / Math.Max(Math.Abs(sums[o]), double.Epsilon);
                    if (relativeError[o] > relativeAccuracy) converged = false;
                }
                if (converged) { failure = ""; return sums; }
            }
            previous = sums;
        }
        level = MaxLevels;
        failure = $"the wavenumber integral did not converge: two panel levels differ by {relativeError.Max():E2} (wanted {relativeAccuracy:E1}) after {MaxLevels} halvings";
        return null;
    }

    /// <summary>
    /// count equal panels on [a, b], the first (and last) split geometrically toward its end point into GradingDepth pieces
    /// halving in width: the integrands go as sqrt(k) near k = 0 (gamma ~ sqrt(-i mu0 sigma v kx)) and turn sharply within
    /// k / (mu0 sigma v) of theta = +-pi/2, and graded Gauss panels keep exponential convergence there.
    /// </summary>
    private static List<(double From, double To)> GradedPanels(double a, double b, int count, bool gradeStart, bool gradeEnd)
    {
        const int GradingDepth = 16;
        double width = (b - a) / count;
        var panels = new List<(double, double)>();
        for (int p = 0; p < count; p++)
        {
            double from = a + p * width, to = p == count - 1 ? b : a + (p + 1) * width;
            if (p == 0 && gradeStart)
            {
                double piece = width;
                for (int j = 0; j < GradingDepth; j++) { panels.Add((from + piece / 2, from + piece)); piece /= 2; }
                panels.Add((from, from + piece));
            }
            else if (p == count - 1 && gradeEnd)
            {
                double piece = width;
                for (int j = 0; j < GradingDepth; j++) { panels.Add((to - piece, to - piece / 2)); piece /= 2; }
                panels.Add((to - piece, to));
            }
            else panels.Add((from, to));
        }
        return panels;
    }

    private static double[] Sweep(SurfaceFieldSpectrum source, List<(double From, double To)> radial, List<(double From, double To)> angular, int outputs, NodeAccumulator add)
    {
        var (nodes, weights) = Quadrature.GaussLegendre01(GaussPoints);
        var cos = new List<(double Cos, double Sin, double Weight)>();
        foreach (var (from, to) in angular)
            for (int j = 0; j < GaussPoints; j++)
            {
                double theta = from + nodes[j] * (to - from);
                cos.Add((Math.Cos(theta), Math.Sin(theta), weights[j] * (to - from)));
            }
        var sums = new double[outputs];
        foreach (var (from, to) in radial)
        {
            ConvergenceCriterion.Default.ThrowIfCancelled();   // the run's time limit reaches the sweep once per radial panel
            for (int i = 0; i < GaussPoints; i++)
            {
                double k = from + nodes[i] * (to - from), radialWeight = weights[i] * (to - from) * k;   // d^2k = k dk dtheta
                foreach (var (c, s, w) in cos)
                {
                    double kx = k * c, ky = k * s;
                    double b2 = source.At(kx, ky).Magnitude;
                    add(kx, ky, b2 * b2, sums, radialWeight * w);
                }
            }
        }
        return sums;
    }
}

/// <summary>
/// The slab's answer at one speed: drag on the sources (N, opposing their motion), lift (N, pushing them away from the
/// slab), Joule loss in the slab (W; equals drag x speed), the wavenumber quadrature's relative error estimate (the
/// difference of the last two panel levels) and the level reached.
/// </summary>
public sealed record SlabForces(double SpeedMPerS, double DragN, double LiftN, double LossW, double RelativeErrorEstimate, int QuadratureLevel);
