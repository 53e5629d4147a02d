namespace SlotOpt.Sheets;

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

    /// <summary>Tabulates R for 0 &lt;= dx &lt;= maxOffsetX, 0 &lt;= dy &lt;= maxOffsetY on a lattice of hx x hy cells.</summary>
    public static ReactionKernel Build(double hx, double hy, int maxOffsetX, int maxOffsetY)
    {
        if (!(hx > 0) || !(hy > 0)) throw new ArgumentOutOfRangeException(nameof(hx), "cell sizes must be positive");
        var value = new double[(maxOffsetX + 1) * (maxOffsetY + 1)];
        double hmax = Math.Max(hx, hy);
        double far = FarFieldRadiusCells * hmax;
        for (int dy = 0; dy <= maxOffsetY; dy++)
            for (int dx = 0; dx <= maxOffsetX; dx++)
            {
                double distance = Math.Sqrt(dx * hx * dx * hx + dy * hy * dy * hy);
                value[dy * (maxOffsetX + 1) + dx] = distance >= far ? FarField(hx, hy, dx, dy) : NearField(hx, hy, dx, dy);
            }
        return new ReactionKernel(hx, hy, maxOffsetX, maxOffsetY, value);
    }

    /// <summary>Neumann form: (mu0/4pi) hx hy sum over unit sub-squares of integral c(s) / |D - u(s)| ds.</summary>
    internal static double NearField(double hx, double hy, int dx, int dy)
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
                            sum += weights[p] * weights[q] * Correlation(hx, hy, sx, sy) / Distance(hx, hy, dx - sx, dy - sy);
                        }
                    continue;
                }
                // Duffy: two triangles with their apex at the singular corner P = (dx, dy); the edges not through P
                double ox = dx == a ? a + 1 : a, oy = dy == b ? b + 1 : b;   // the corner opposite P
                sum += DuffyTriangle(hx, hy, dx, dy, ox, dy, ox, oy, nodes, weights);
                sum += DuffyTriangle(hx, hy, dx, dy, dx, oy, ox, oy, nodes, weights);
            }
        return Validity.Mu0 / (4 * Math.PI) * hx * hy * sum;
    }

    /// <summary>Integral over the triangle (P, Q1, Q2) of c(s)/|P - s| with s = P + t (Q1 - P + sigma (Q2 - Q1)): the t of the Jacobian cancels the 1/r.</summary>
    private static double DuffyTriangle(double hx, double hy, double px, double py, double q1x, double q1y, double q2x, double q2y, double[] nodes, double[] weights)
    {
        double e1x = q1x - px, e1y = q1y - py, fx = q2x - q1x, fy = q2y - q1y;
        double jac = Math.Abs(e1x * fy - e1y * fx);
        double sum = 0;
        for (int p = 0; p < nodes.Length; p++)
        {
            double ex = e1x + nodes[p] * fx, ey = e1y + nodes[p] * fy;
            double inv = 1 / Distance(hx, hy, ex, ey);
            for (int q = 0; q < nodes.Length; q++)
            {
                double t = nodes[q];
                sum += weights[p] * weights[q] * Correlation(hx, hy, px + t * ex, py + t * ey) * inv;
            }
        }
        return jac * sum;
    }

    /// <summary>Dipole form expanded in the moments of w = phi * phi = hx hy B3(sx) B3(sy): &lt;ux^2&gt; = hx^2/3, &lt;ux^4&gt; = 0.3 hx^4, &lt;ux^2 uy^2&gt; = hx^2 hy^2 / 9.</summary>
    internal static double FarField(double hx, double hy, int dx, int dy)
    {
        double x = dx * hx, y = dy * hy;
        double r2 = x * x + y * y;
        double r = Math.Sqrt(r2);
        double r3 = r2 * r, r5 = r3 * r2, r7 = r5 * r2, r9 = r7 * r2, r11 = r9 * r2;
        double f = 1 / r3;
        double fxx = -3 / r5 + 15 * x * x / r7, fyy = -3 / r5 + 15 * y * y / r7;
        double fxxxx = 45 / r7 - 630 * x * x / r9 + 945 * x * x * x * x / r11;
        double fyyyy = 45 / r7 - 630 * y * y / r9 + 945 * y * y * y * y / r11;
        double fxxyy = -90 / r7 + 945 * x * x * y * y / r11;
        double sx2 = hx * hx / 3, sy2 = hy * hy / 3, mx4 = 0.3 * hx * hx * hx * hx, my4 = 0.3 * hy * hy * hy * hy;
        double moment = f + 0.5 * (sx2 * fxx + sy2 * fyy) + (mx4 * fxxxx + 6 * sx2 * sy2 * fxxyy + my4 * fyyyy) / 24;
        return -Validity.Mu0 / (4 * Math.PI) * hx * hy * hx * hy * moment;   // the in-plane field of a dipole is -mu0 m / (4 pi r^3)
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
