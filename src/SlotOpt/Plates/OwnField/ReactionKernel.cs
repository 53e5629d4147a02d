using System.Collections.Concurrent;
using SlotOpt.Numerics;
using SlotOpt.Plates.Conductors;

namespace SlotOpt.Plates.OwnField;

/// <summary>
/// The mutual inductance between two bilinear stream-function basis functions ("hat" loops) of the
/// lattice, as a function of their offset (dx, dy) in nodes: the Toeplitz kernel of the reaction
/// operator R_mn = (mu0/2) &lt;phi_m, |k| phi_n&gt; (henry).
/// <para>
/// Physics: a sheet current K = curl(psi z) is a layer of magnetic dipoles of moment psi z per area.
/// Its normal field at the sheet is, in Fourier space, Bz(k) = +(mu0 |k| / 2) psi(k) (the double-layer
/// potential jumps by psi, phi_m = ±(psi/2) e^{-|k||z|}, Hz = -d phi_m/dz; with the solver's
/// K = (dpsi/dy, -dpsi/dx) a positive psi is a moment along +z, so its own field at the sheet is
/// +z inside the loop). The flux it sends through basis function m is sum_n R_mn psi_n, and the
/// magnetic energy is W = psi^T R psi / 2 (Neumann's formula).
/// </para>
/// <para>
/// Near offsets (physical distance below <see cref="FarFieldRadiusCells"/> cells) use Neumann's form,
/// R_mn = (mu0/4pi) integral integral K_m . K_n / |x - y| = (mu0/4pi) integral c(u) / |D - u| du, with c the
/// autocorrelation of grad(phi): c(u) = -(hy/hx) B3''(sx) B3(sy) - (hx/hy) B3(sx) B3''(sy), B3 the
/// cubic B-spline (the hat's self-convolution), s = u/h. c is a polynomial on each unit sub-square of
/// [-2, 2]^2 and the 1/r singularity sits on sub-square corners: Gauss-Legendre on each, with the
/// Duffy transform (M. G. Duffy, SIAM J. Numer. Anal. 19(6):1260-1262, 1982) on the sub-squares
/// that touch the singular point. Far offsets use the dipole form R = -(mu0/4pi) integral w(u)/|D - u|^3 du,
/// w = phi * phi, expanded to fourth order in the moments of w (relative error about 11 (h/D)^6,
/// below 1e-7 beyond 24 cells).
/// </para>
/// </summary>
public sealed class ReactionKernel
{
    /// <summary>Offsets at least this many (largest) cells apart use the far-field moment expansion.</summary>
    public const double FarFieldRadiusCells = 24;
    private const int GaussPoints = 12;
    private readonly double[] _value;   // [dy * (Kx + 1) + dx], dx = 0..Kx, dy = 0..Ky

    public double Hx { get; }
    public double Hy { get; }
    public int MaxOffsetX { get; }
    public int MaxOffsetY { get; }

    private ReactionKernel(double hx, double hy, int kx, int ky, double[] value)
    {
        Hx = hx; Hy = hy; MaxOffsetX = kx; MaxOffsetY = ky; _value = value;
    }

    /// <summary>Kernel value R(dx, dy) in henry; even in dx and in dy.</summary>
    public double this[int dx, int dy] => _value[Math.Abs(dy) * (MaxOffsetX + 1) + Math.Abs(dx)];

    /// <summary>
    /// Tabulates R for 0 &lt;= dx &lt;= maxOffsetX, 0 &lt;= dy &lt;= maxOffsetY on a lattice of hx x hy cells, between two
    /// parallel layers separationM apart (0 for a sheet with itself): the 1/|x - y| of Neumann's form becomes
    /// 1/sqrt(|x - y|^2 + z^2), and the dipole form's in-plane field -1/r^3 becomes (3 z^2 - R^2)/R^5.
    /// </summary>
    public static ReactionKernel Build(double hx, double hy, int maxOffsetX, int maxOffsetY, double separationM = 0)
    {
        if (!(hx > 0) || !(hy > 0)) throw new ArgumentOutOfRangeException(nameof(hx), "cell sizes must be positive");
        if (!(separationM >= 0)) throw new ArgumentOutOfRangeException(nameof(separationM), "the layer separation must be >= 0");
        var value = new double[(maxOffsetX + 1) * (maxOffsetY + 1)];
        double far = FarFieldRadiusCells * Math.Max(hx, hy);
        var near = NearTable.For(hy / hx, separationM / hx);
        for (int dy = 0; dy <= maxOffsetY; dy++)
            for (int dx = 0; dx <= maxOffsetX; dx++)
            {
                double distance = Math.Sqrt(dx * hx * dx * hx + dy * hy * dy * hy + separationM * separationM);
                double r = distance >= far ? FarField(hx, hy, dx, dy, separationM) : hx * near.At(dx, dy);
                if (!double.IsFinite(r)) throw new NumericalFailureException($"reaction kernel is not finite at offset ({dx}, {dy}) (cells {hx} m x {hy} m, separation {separationM} m)");
                value[dy * (maxOffsetX + 1) + dx] = r;
            }
        return new ReactionKernel(hx, hy, maxOffsetX, maxOffsetY, value);
    }

    /// <summary>
    /// The near-field values for cells of unit width: every length in Neumann's form scales with hx, so
    /// NearField(hx, hy, dx, dy, z) = hx NearField(1, hy / hx, dx, dy, z / hx), and one table serves every lattice with the same cell
    /// aspect and layer gap in cells (a run's fine and coarse lattices, its plates and thicknesses). Each table is computed once a
    /// process (the quadrature: 2,300 points an offset, some 450 offsets for square cells), its entries on first use; the values do not
    /// depend on which lattice asked first, so results stay reproducible. At most <see cref="MaxTables"/> tables are kept.
    /// </summary>
    private sealed class NearTable
    {
        private const int MaxTables = 64;
        private static readonly ConcurrentDictionary<(double Aspect, double Gap), NearTable> Tables = new();
        private readonly double _aspect, _gap;
        private readonly ConcurrentDictionary<(int Dx, int Dy), double> _values = new();

        private NearTable(double aspect, double gap) { _aspect = aspect; _gap = gap; }

        public static NearTable For(double aspect, double gap)
        {
            if (Tables.Count >= MaxTables) Tables.Clear();
            return Tables.GetOrAdd((aspect, gap), key => new NearTable(key.Aspect, key.Gap));
        }

        /// <summary>NearField(1, aspect, dx, dy, gap).</summary>
        public double At(int dx, int dy) => _values.GetOrAdd((dx, dy), key => NearField(1, _aspect, key.Dx, key.Dy, _gap));
    }

    /// <summary>Neumann form: (mu0/4pi) hx hy sum over unit sub-squares of integral c(s) / sqrt(|D - u(s)|^2 + z^2) ds.</summary>
    internal static double NearField(double hx, double hy, int dx, int dy, double z = 0)
    {
        var (nodes, weights) = Quadrature.GaussLegendre01(GaussPoints);
        double sum = 0;
        for (int a = -2; a < 2; a++)
            for (int b = -2; b < 2; b++)
            {
                bool corner = (dx == a || dx == a + 1) && (dy == b || dy == b + 1);
                if (!corner)
                {
                    for (int p = 0; p < GaussPoints; p++)
                        for (int q = 0; q < GaussPoints; q++)
                        {
                            double sx = a + nodes[p], sy = b + nodes[q];
                            double r = Distance(hx, hy, dx - sx, dy - sy);
                            sum += weights[p] * weights[q] * Correlation(hx, hy, sx, sy) / Math.Sqrt(r * r + z * z);
                        }
                    continue;
                }
                // Duffy: two triangles with their apex at the (near-)singular corner P = (dx, dy); the edges not through P
                double ox = dx == a ? a + 1 : a, oy = dy == b ? b + 1 : b;   // the corner opposite P
                sum += DuffyTriangle(hx, hy, z, dx, dy, ox, dy, ox, oy, nodes, weights);
                sum += DuffyTriangle(hx, hy, z, dx, dy, dx, oy, ox, oy, nodes, weights);
            }
        return Validity.Mu0 / (4 * Math.PI) * hx * hy * sum;
    }

    /// <summary>
    /// Integral over the triangle (P, Q1, Q2) of c(s)/sqrt(|P - s|^2 + z^2) with s = P + t (Q1 - P + sigma (Q2 - Q1)):
    /// the Jacobian's t makes the integrand t / sqrt(t^2 E^2 + z^2), bounded; for z &gt; 0 its knee at t = z/E is
    /// resolved by Gauss panels graded geometrically (x4) from z/E up to 1.
    /// </summary>
    private static double DuffyTriangle(double hx, double hy, double z, double px, double py, double q1x, double q1y, double q2x, double q2y, double[] nodes, double[] weights)
    {
        double e1x = q1x - px, e1y = q1y - py, fx = q2x - q1x, fy = q2y - q1y;
        double jac = Math.Abs(e1x * fy - e1y * fx);
        double sum = 0;
        Span<double> breaks = stackalloc double[32];
        for (int p = 0; p < nodes.Length; p++)
        {
            double ex = e1x + nodes[p] * fx, ey = e1y + nodes[p] * fy;
            double e = Distance(hx, hy, ex, ey);
            int count = 0;
            breaks[count++] = 0;
            for (double knee = z / e; knee > 0 && knee < 1 && count < breaks.Length - 1; knee *= 4) breaks[count++] = knee;
            breaks[count++] = 1;
            for (int panel = 0; panel + 1 < count; panel++)
            {
                double t0 = breaks[panel], dt = breaks[panel + 1] - t0;
                for (int q = 0; q < nodes.Length; q++)
                {
                    double t = t0 + dt * nodes[q];
                    sum += weights[p] * weights[q] * dt * Correlation(hx, hy, px + t * ex, py + t * ey) * t / Math.Sqrt(t * t * e * e + z * z);
                }
            }
        }
        return jac * sum;
    }

    /// <summary>
    /// Dipole form R = (mu0/4pi) integral w(u) q(D - u) du, q = (3 z^2 - R^2)/R^5 = 3 z^2 R^-5 - R^-3 (the normal field
    /// of a normal dipole, R^2 = x^2 + y^2 + z^2), expanded in the moments of w = phi * phi = hx hy B3(sx) B3(sy):
    /// &lt;ux^2&gt; = hx^2/3, &lt;ux^4&gt; = 0.3 hx^4, &lt;ux^2 uy^2&gt; = hx^2 hy^2 / 9.
    /// </summary>
    internal static double FarField(double hx, double hy, int dx, int dy, double z = 0)
    {
        double x = dx * hx, y = dy * hy;
        double moment = 3 * z * z * MomentSum(5, x, y, z, hx, hy) - MomentSum(3, x, y, z, hx, hy);
        return Validity.Mu0 / (4 * Math.PI) * hx * hy * hx * hy * moment;
    }

    /// <summary>
    /// f + (sx^2 fxx + sy^2 fyy)/2 + (mx4 fxxxx + 6 sx^2 sy^2 fxxyy + my4 fyyyy)/24 for f = R^-n, with
    /// fxx = -n R^-(n+2) + n(n+2) x^2 R^-(n+4), fxxxx = 3n(n+2) R^-(n+4) - 6n(n+2)(n+4) x^2 R^-(n+6) + n(n+2)(n+4)(n+6) x^4 R^-(n+8),
    /// fxxyy = n(n+2) R^-(n+4) - n(n+2)(n+4)(x^2 + y^2) R^-(n+6) + n(n+2)(n+4)(n+6) x^2 y^2 R^-(n+8) (derived here by repeated differentiation).
    /// </summary>
    private static double MomentSum(int n, double x, double y, double z, double hx, double hy)
    {
        double r2 = x * x + y * y + z * z;
        double Pow(int m) => Math.Pow(r2, -m / 2.0);
        double a = n, b = n * (n + 2.0), c = b * (n + 4), d = c * (n + 6);
        double f = Pow(n);
        double fxx = -a * Pow(n + 2) + b * x * x * Pow(n + 4), fyy = -a * Pow(n + 2) + b * y * y * Pow(n + 4);
        double fxxxx = 3 * b * Pow(n + 4) - 6 * c * x * x * Pow(n + 6) + d * x * x * x * x * Pow(n + 8);
        double fyyyy = 3 * b * Pow(n + 4) - 6 * c * y * y * Pow(n + 6) + d * y * y * y * y * Pow(n + 8);
        double fxxyy = b * Pow(n + 4) - c * (x * x + y * y) * Pow(n + 6) + d * x * x * y * y * Pow(n + 8);
        double sx2 = hx * hx / 3, sy2 = hy * hy / 3, mx4 = 0.3 * hx * hx * hx * hx, my4 = 0.3 * hy * hy * hy * hy;
        return f + 0.5 * (sx2 * fxx + sy2 * fyy) + (mx4 * fxxxx + 6 * sx2 * sy2 * fxxyy + my4 * fyyyy) / 24;
    }

    private static double Distance(double hx, double hy, double tx, double ty) => Math.Sqrt(tx * hx * tx * hx + ty * hy * ty * hy);

    /// <summary>c(s) = -(hy/hx) B3''(sx) B3(sy) - (hx/hy) B3(sx) B3''(sy): the autocorrelation of grad(phi) (per unit area of s).</summary>
    private static double Correlation(double hx, double hy, double sx, double sy) =>
        -(hy / hx) * CubicBSplineSecond(sx) * CubicBSpline(sy) - (hx / hy) * CubicBSpline(sx) * CubicBSplineSecond(sy);

    /// <summary>Centred cubic B-spline (hat * hat), support [-2, 2], unit integral.</summary>
    internal static double CubicBSpline(double s)
    {
        s = Math.Abs(s);
        if (s >= 2) return 0;
        if (s >= 1) { double t = 2 - s; return t * t * t / 6; }
        return 2.0 / 3 - s * s + s * s * s / 2;
    }

    private static double CubicBSplineSecond(double s)
    {
        s = Math.Abs(s);
        if (s >= 2) return 0;
        return s >= 1 ? 2 - s : 3 * s - 2;
    }
}
