using SlotOpt.Numerics;
using SlotOpt.Plates.Geometry;
using SlotOpt.Plates.Grid;

namespace SlotOpt.Plates.Sources;

/// <summary>
/// Poles moving along +x at SpeedMPerS over a stationary plate. In the plate's frame, with the
/// poles displaced by X, dBz/dt = -v dB/dx (a field pattern translating at v: Faraday's law in the plate's frame). A uniform pole
/// makes dB/dx a line source on the face's edge, spread to the nodes by its sub-cell position (see
/// <see cref="IntegrateRate"/>) with the energy the grid still misses added back (<see cref="SubCellEdgeLossPerSiemens"/>). For the lift the poles give their field in the
/// sheet's plane (uniform Bz inside each face, zero outside): <see cref="LiftField.PlaneField"/>.
/// </summary>
public sealed class MovingPoles : ITravellingSource
{
    private const int AreaPoints = 8;

    public MovingPoles(IEnumerable<Pole> poles, double speedMPerS)
    {
        Poles = poles.ToList();
        if (Poles.Count == 0) throw new InputException("a moving source needs at least one pole");
        if (!(speedMPerS > 0) || !double.IsFinite(speedMPerS)) throw new InputException($"the speed must be positive (got {speedMPerS} m/s)");
        foreach (var p in Poles) if (!double.IsFinite(p.FluxDensityT)) throw new InputException("a pole's flux density is not finite");
        SpeedMPerS = speedMPerS;
    }

    public IReadOnlyList<Pole> Poles { get; }
    public double SpeedMPerS { get; }

    /// <summary>A row of count poles along x, pole pitch apart, polarity alternating from +B, the first centred at firstCentre.</summary>
    public static MovingPoles Row(PoleFace face, Vec2 firstCentre, int count, double polePitchM, double fluxDensityT, double speedMPerS)
    {
        if (count < 1) throw new InputException($"a pole row needs at least one pole (got {count})");
        if (count > 1 && !(polePitchM >= 2 * face.HalfWidthXM)) throw new InputException($"the pole pitch ({polePitchM} m) is smaller than a pole's width ({2 * face.HalfWidthXM} m): poles would overlap");
        return new MovingPoles(Enumerable.Range(0, count).Select(k =>
            new Pole(face, new Vec2(firstCentre.X + k * polePitchM, firstCentre.Y), k % 2 == 0 ? fluxDensityT : -fluxDensityT)), speedMPerS);
    }

    /// <summary>The smallest pole's size along the travel: the length scale of the moving skin depth.</summary>
    public double LoopLengthXM => 2 * Poles.Min(p => p.Face.HalfWidthXM);

    public ITravellingSource AtSpeed(double speedMPerS) => new MovingPoles(Poles, speedMPerS);

    public string Words => Poles.Count == 1 ? "1 pole" : $"{Poles.Count} poles";

    /// <summary>The widths the grid must resolve: the smallest pole's width along and across the travel, and the narrowest gap between poles side by side along x.</summary>
    public IReadOnlyList<GridFeature> GridFeatures
    {
        get
        {
            var features = new List<GridFeature>
            {
                new(GridFeatureKind.Pole, "the pole's width along the travel", 2 * Poles.Min(p => p.Face.HalfWidthXM)),
                new(GridFeatureKind.Pole, "the pole's width across the travel", 2 * Poles.Min(p => p.Face.HalfHeightYM)),
            };
            double gap = double.MaxValue;
            for (int i = 0; i < Poles.Count; i++)
                for (int j = i + 1; j < Poles.Count; j++)
                {
                    Pole a = Poles[i], b = Poles[j];
                    bool sideBySide = Math.Abs(a.Centre.Y - b.Centre.Y) < a.Face.HalfHeightYM + b.Face.HalfHeightYM;
                    double g = Math.Abs(a.Centre.X - b.Centre.X) - a.Face.HalfWidthXM - b.Face.HalfWidthXM;
                    if (sideBySide && g > 0) gap = Math.Min(gap, g);
                }
            if (gap < double.MaxValue) features.Add(new GridFeature(GridFeatureKind.PoleGap, "the gap between poles", gap));
            return features;
        }
    }

    /// <summary>Extent in x of the row at offset zero.</summary>
    public (double MinXM, double MaxXM) ExtentX => (Poles.Min(p => p.Centre.X - p.Face.HalfWidthXM), Poles.Max(p => p.Centre.X + p.Face.HalfWidthXM));

    /// <summary>
    /// Writes the bilinear-hat (Galerkin) integrals of dBz/dt (volts) with the poles displaced by offsetXM:
    /// for a uniform face, integral phi (-v dB/dx) dA = v B (closed integral of phi n_x ds) over its edge
    /// (divergence theorem), integrated exactly on the face's edge polygon (split at every lattice line, 2-point
    /// Gauss on each piece: the bilinear hats are then at most quadratic along it). An edge between two nodes
    /// loads both by its sub-cell position, so the discrete solution carries the edge's kink between them
    /// (exact at the nodes for a straight edge along a lattice line, the 1-D linear-element result).
    /// </summary>
    public void IntegrateRate(CellLattice lattice, double offsetXM, double[] node)
    {
        Array.Clear(node);
        foreach (var pole in Poles)
            foreach (var e in EdgePoints(pole, lattice, offsetXM))
            {
                double q = SpeedMPerS * pole.FluxDensityT * e.NormalX * e.LengthM;   // v B n_x ds
                if (q == 0 || !Locate(lattice, e.Point, out int i, out int j, out double tx, out double ty)) continue;
                int n = j * lattice.NodesX + i;
                node[n] += q * (1 - tx) * (1 - ty);
                node[n + 1] += q * tx * (1 - ty);
                node[n + lattice.NodesX] += q * (1 - tx) * ty;
                node[n + lattice.NodesX + 1] += q * tx * ty;
            }
    }

    /// <summary>
    /// The loss (W per S of reference conductance) the discrete solution misses at the poles' edges, to add to psi^T A psi.
    /// A kink of slope jump J at fraction theta of a cell h is interpolated linearly between the nodes; the
    /// missing energy per unit length of a 1-D kink is theta (1 - theta) h J^2 / G (the energy of the tent
    /// u - u_h of height theta (1 - theta) h J; linear elements are nodally exact for a point load in 1-D,
    /// G. Strang and G. J. Fix, An Analysis of the Finite Element Method, 1973, section 1.10). At a pole edge
    /// J = G q n with q = v B n_x the line source, so a straight edge along y misses theta (1 - theta) h G q^2
    /// per unit length: exact for the rectangle. An edge at angle phi to the lattice sweeps the sub-cell offsets,
    /// and the 5-point grid misses, averaged over them, h G q^2 C(phi) per unit length (<see cref="KinkEnergyRatio"/>,
    /// C(0) = 1/6, C(pi/4) = 0.2012: a 45-degree edge misses 21 % more than one along a lattice line); the row-by-row, column-by-column offsets
    /// theta_x (1 - theta_x) h_x |n_x|^3 + theta_y (1 - theta_y) h_y |n_y|^3 are scaled so that their mean is that C(phi).
    /// </summary>
    public double SubCellEdgeLossPerSiemens(PlateGrid grid, double offsetXM, double[]? perCell = null)
    {
        var lattice = grid.Lattice;
        double loss = 0;
        foreach (var pole in Poles)
            foreach (var e in EdgePoints(pole, lattice, offsetXM))
            {
                double q = SpeedMPerS * pole.FluxDensityT * e.NormalX;
                if (q == 0 || !Locate(lattice, e.Point, out int i, out int j, out double tx, out double ty)) continue;
                int cell = j * lattice.Nx + i;
                double g = grid.Conductance[cell];
                double ax = Math.Abs(e.NormalX), ay = Math.Abs(e.NormalY);
                double rowsAndColumns = ax * ax * ax + ay * ay * ay;                  // the mean of the offsets' weights, times 6
                double share = e.LengthM * g * q * q * (tx * (1 - tx) * lattice.Hx * ax * ax * ax + ty * (1 - ty) * lattice.Hy * ay * ay * ay)
                    * KinkEnergyRatio(ax, ay) / rowsAndColumns;
                loss += share;
                if (perCell is not null) perCell[cell] += share;
            }
        return loss;
    }

    private const int KinkTableSteps = 64;

    /// <summary>6 C(phi) at phi = k (pi/4) / KinkTableSteps, divided by its value at phi = 0 (so an edge along a lattice line keeps exactly theta (1 - theta)).</summary>
    private static readonly double[] KinkEnergyTable = BuildKinkEnergyTable();

    /// <summary>C(phi) / C(0) for an edge with unit normal components |n_x| = ax, |n_y| = ay (symmetric under x &lt;-&gt; y): linear in a 64-step table over [0, pi/4].</summary>
    private static double KinkEnergyRatio(double ax, double ay)
    {
        double f = Math.Atan2(Math.Min(ax, ay), Math.Max(ax, ay)) / (Math.PI / 4) * KinkTableSteps;
        int k = Math.Min((int)f, KinkTableSteps - 1);
        return KinkEnergyTable[k] + (f - k) * (KinkEnergyTable[k + 1] - KinkEnergyTable[k]);
    }

    private static double[] BuildKinkEnergyTable()
    {
        var table = new double[KinkTableSteps + 1];
        for (int k = 0; k <= KinkTableSteps; k++) table[k] = MeanKinkEnergy(k * Math.PI / 4 / KinkTableSteps);
        double atZero = table[0];
        for (int k = 0; k <= KinkTableSteps; k++) table[k] /= atZero;
        return table;
    }

    /// <summary>
    /// C(phi): the energy per unit length (h = G = q = 1) a unit line source with normal (cos phi, sin phi) has beyond its
    /// 5-point discrete energy F^T K^-1 F, the load F its bilinear-hat integrals, averaged over the line's offset:
    /// C = (1/pi) int_0^inf [1/k^2 - phihat(k n)^2 / K(k n)] dk, phihat(k) = sinc^2(k_x/2) sinc^2(k_y/2) the hat's transform and
    /// K(k) = 4 sin^2(k_x/2) + 4 sin^2(k_y/2) the 5-point symbol [D, derived here: Parseval and Poisson summation; at an
    /// irrational slope the line's aliases never overlap, so the offset-averaged lattice energy is that integral]. C(0) = 1/6, the mean of
    /// theta (1 - theta). Composite 8-point Gauss-Legendre on steps of 1/2 to k = 1000, the tail of 1/k^2 added exactly (the rest is below 1e-8).
    /// </summary>
    internal static double MeanKinkEnergy(double phi)
    {
        const double step = 0.5, kMax = 1000;
        double nx = Math.Cos(phi), ny = Math.Sin(phi), sum = 0;
        var (t, w) = Quadrature.GaussLegendre01(8);
        for (double k0 = 0; k0 < kMax; k0 += step)
            for (int p = 0; p < t.Length; p++)
            {
                double k = k0 + t[p] * step, sx = Math.Sin(k * nx / 2), sy = Math.Sin(k * ny / 2);
                double hat = Sinc(k * nx / 2) * Sinc(k * nx / 2) * Sinc(k * ny / 2) * Sinc(k * ny / 2);
                double symbol = 4 * sx * sx + 4 * sy * sy;                          // zero only where the hat's transform is too
                sum += w[p] * step * (1 / (k * k) - (symbol > 0 ? hat * hat / symbol : 0));
            }
        return (sum + 1 / kMax) / Math.PI;
    }

    private static double Sinc(double x) => x == 0 ? 1 : Math.Sin(x) / x;

    private readonly record struct EdgePoint(Vec2 Point, double NormalX, double NormalY, double LengthM);

    /// <summary>Gauss points on the face's edge polygon (counter-clockwise, outward normal), each piece between lattice lines.</summary>
    private static IEnumerable<EdgePoint> EdgePoints(Pole pole, CellLattice lattice, double offsetXM)
    {
        var centre = new Vec2(pole.Centre.X + offsetXM, pole.Centre.Y);
        var v = pole.Face.EdgePolygon;
        double g = 0.5 / Math.Sqrt(3);                                             // 2-point Gauss-Legendre on [0, 1]: 1/2 -+ 1/(2 sqrt 3)
        var cuts = new List<double>();
        for (int k = 0; k < v.Count; k++)
        {
            Vec2 a = centre + v[k], b = centre + v[(k + 1) % v.Count], d = b - a;
            double len = d.Length;
            if (len == 0) continue;
            double nx = d.Y / len, ny = -d.X / len;                                // outward normal of a counter-clockwise polygon
            cuts.Clear();
            cuts.Add(0);
            cuts.Add(1);
            AddCrossings(a.X, d.X, lattice.X0, lattice.Hx, cuts);
            AddCrossings(a.Y, d.Y, lattice.Y0, lattice.Hy, cuts);
            cuts.Sort();
            for (int c = 0; c + 1 < cuts.Count; c++)
            {
                double t0 = cuts[c], t1 = cuts[c + 1], dt = t1 - t0;
                if (dt <= 0) continue;
                foreach (double t in new[] { t0 + (0.5 - g) * dt, t0 + (0.5 + g) * dt })
                    yield return new EdgePoint(a + t * d, nx, ny, 0.5 * dt * len);
            }
        }
    }

    /// <summary>Parameters t in (0, 1) where a + t d crosses the lattice lines origin + k h.</summary>
    private static void AddCrossings(double a, double d, double origin, double h, List<double> cuts)
    {
        if (d == 0) return;
        double f0 = (a - origin) / h, f1 = (a + d - origin) / h;
        for (double k = Math.Ceiling(Math.Min(f0, f1)); k <= Math.Floor(Math.Max(f0, f1)); k++)
        {
            double t = (origin + k * h - a) / d;
            if (t > 0 && t < 1) cuts.Add(t);
        }
    }

    /// <summary>The cell (i, j) holding point p and its fractions (tx, ty) across it; false outside the lattice.</summary>
    private static bool Locate(CellLattice l, Vec2 p, out int i, out int j, out double tx, out double ty)
    {
        double fx = (p.X - l.X0) / l.Hx, fy = (p.Y - l.Y0) / l.Hy;
        i = j = 0; tx = ty = 0;
        if (!(fx >= 0 && fx <= l.Nx && fy >= 0 && fy <= l.Ny)) return false;
        i = Math.Min((int)Math.Floor(fx), l.Nx - 1);
        j = Math.Min((int)Math.Floor(fy), l.Ny - 1);
        tx = fx - i;
        ty = fy - j;
        return true;
    }

    /// <summary>Writes the dual-cell means of Bz (tesla) with the poles displaced by offsetXM: B times the area fraction of the dual cell inside each face.</summary>
    public LiftField IntegrateLiftField(CellLattice lattice, double offsetXM, double[] node)
    {
        Array.Clear(node);
        var l = lattice;
        var (t, w) = Quadrature.GaussLegendre01(AreaPoints);
        foreach (var pole in Poles)
        {
            double cx = pole.Centre.X + offsetXM, cy = pole.Centre.Y;
            double hw = pole.Face.HalfWidthXM, hh = pole.Face.HalfHeightYM;
            int i0 = Math.Max(0, (int)Math.Floor((cx - hw - l.X0) / l.Hx - 1)), i1 = Math.Min(l.Nx, (int)Math.Ceiling((cx + hw - l.X0) / l.Hx + 1));
            int j0 = Math.Max(0, (int)Math.Floor((cy - hh - l.Y0) / l.Hy - 1)), j1 = Math.Min(l.Ny, (int)Math.Ceiling((cy + hh - l.Y0) / l.Hy + 1));
            for (int j = j0; j <= j1; j++)
                for (int i = i0; i <= i1; i++)
                {
                    // mean chord over the dual cell's x-range (Gauss-Legendre in x) = (area inside the face) / hx
                    double x0 = l.NodeX(i) - l.Hx / 2 - cx, y0 = l.NodeY(j) - l.Hy / 2 - cy, chord = 0;
                    for (int q = 0; q < AreaPoints; q++) chord += w[q] * pole.Face.ChordLength(x0 + t[q] * l.Hx, y0, y0 + l.Hy);
                    node[j * l.NodesX + i] += pole.FluxDensityT * chord / l.Hy;   // B x (area fraction of the dual cell)
                }
        }
        return LiftField.PlaneField;
    }
}
