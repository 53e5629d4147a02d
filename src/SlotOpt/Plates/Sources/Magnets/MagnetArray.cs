using SlotOpt.Numerics;
using SlotOpt.Plates.Geometry;
using SlotOpt.Plates.Grid;

namespace SlotOpt.Plates.Sources.Magnets;

/// <summary>
/// Permanent magnets over a plate, every near face at the same gap above the plate's top surface
/// (z = 0; the plate lies at z &lt;= 0, depth d is z = -d). Gives the field anywhere outside the magnets and the
/// dual-cell integrals the sheet solvers take, reduced to line integrals along the dual-cell edges so
/// neighbouring cells share them exactly (the sum over the plate telescopes, as for <see cref="MovingPoles"/>):
/// integral of dBz/dx over [x0, x1] x [y0, y1] = integral over y of Bz(x1, y) - Bz(x0, y) (exact), and, since
/// div B = 0 below the magnets, integral of dBz/dz = -(integral of Bx(x1, y) - Bx(x0, y) dy + integral of
/// By(x, y1) - By(x, y0) dx) (Gauss's theorem on the cell). Each edge integral is an
/// <see cref="LineQuadratureOrder"/>-point Gauss-Legendre rule (Abramowitz and Stegun 25.4.29): the field is
/// analytic below the magnets with length scale the gap d, so the error falls as h^(2n); at n = 4 and
/// h = d it is 2e-6 of the largest node value (measured in MagnetArrayTests against n = 12).
/// </summary>
public sealed class MagnetArray
{
    public MagnetArray(IEnumerable<MagnetPlacement> magnets, double gapM, int lineQuadratureOrder = 4)
    {
        if (lineQuadratureOrder < 1) throw new ArgumentOutOfRangeException(nameof(lineQuadratureOrder), "at least one Gauss point per edge");
        LineQuadratureOrder = lineQuadratureOrder;
        Magnets = magnets.ToList();
        if (Magnets.Count == 0) throw new InputException("a magnet source needs at least one magnet");
        if (!(gapM > 0) || !double.IsFinite(gapM)) throw new InputException($"the gap between the magnets and the plate must be positive (got {gapM} m)");
        GapM = gapM;
    }

    public IReadOnlyList<MagnetPlacement> Magnets { get; }
    /// <summary>From each magnet's near face to the plate's top surface (metres).</summary>
    public double GapM { get; }
    /// <summary>Gauss-Legendre points per dual-cell edge (see the class comment for the error).</summary>
    public int LineQuadratureOrder { get; }

    /// <summary>The same magnets with another number of Gauss points per dual-cell edge.</summary>
    public MagnetArray WithLineQuadratureOrder(int order) => new(Magnets, GapM, order);

    /// <summary>
    /// A row of count equal magnets along x, pitch apart (centre to centre), the first centred at firstCentre,
    /// polarity alternating (starting as built) or all the same.
    /// </summary>
    public static MagnetArray Row(IPermanentMagnet magnet, Vec2 firstCentre, int count, double pitchM, MagnetPolarity polarity, double gapM)
    {
        if (count < 1) throw new InputException($"a magnet row needs at least one magnet (got {count})");
        if (count > 1 && !(pitchM >= 2 * magnet.HalfLengthXM)) throw new InputException($"the magnet pitch ({pitchM} m) is smaller than a magnet's length ({2 * magnet.HalfLengthXM} m): magnets would overlap");
        return new MagnetArray(Enumerable.Range(0, count).Select(k =>
            new MagnetPlacement(magnet, new Vec2(firstCentre.X + k * pitchM, firstCentre.Y), polarity == MagnetPolarity.Alternating && k % 2 == 1 ? -1 : 1)), gapM);
    }

    /// <summary>The shortest magnet's length along the travel: the loop length of the moving magnetic Reynolds number, as a pole's size for poles.</summary>
    public double SmallestLengthXM => 2 * Magnets.Min(m => m.Magnet.HalfLengthXM);

    /// <summary>Extent in x of the magnets' footprints at offset zero (their fringing field reaches a few gaps further).</summary>
    public (double MinXM, double MaxXM) ExtentX => (Magnets.Min(m => m.Centre.X - m.Magnet.HalfLengthXM), Magnets.Max(m => m.Centre.X + m.Magnet.HalfLengthXM));

    /// <summary>Height of a magnet's centre above the plate's top surface.</summary>
    public double CentreHeightM(MagnetPlacement m) => GapM + m.Magnet.HeightM / 2;

    /// <summary>The flux density at (x, y, z) with the magnets displaced by offsetXM along x; z from the plate's top surface, negative inside the plate.</summary>
    public FluxDensityVector FluxDensityAt(double x, double y, double z, double offsetXM = 0)
    {
        var sum = new FluxDensityVector(0, 0, 0);
        foreach (var m in Magnets)
            sum += m.Sign * m.Magnet.FluxDensityAt(x - m.Centre.X - offsetXM, y - m.Centre.Y, z - CentreHeightM(m));
        return sum;
    }

    /// <summary>Bz alone at (x, y, z) (as <see cref="FluxDensityAt"/>, bit for bit its Z), for the integrals that use only Bz.</summary>
    public double FluxDensityZAt(double x, double y, double z, double offsetXM = 0)
    {
        double sum = 0;
        foreach (var m in Magnets)
            sum += m.Sign * m.Magnet.FluxDensityZAt(x - m.Centre.X - offsetXM, y - m.Centre.Y, z - CentreHeightM(m));
        return sum;
    }

    /// <summary>Per lattice node, the integral of dBz/dx over its dual cell at the given depth (T m = Wb/m), magnets displaced by offsetXM.</summary>
    public void IntegrateSlope(CellLattice lattice, double offsetXM, double depthM, double[] node)
    {
        CheckDepth(depthM);
        var verticalZ = VerticalEdgeIntegrals(lattice, (x, y) => FluxDensityZAt(x, y, -depthM, offsetXM));
        int n = lattice.NodesX;
        for (int j = 0; j < lattice.NodesY; j++)
            for (int i = 0; i < n; i++)
                node[j * n + i] = verticalZ[j * (n + 1) + i + 1] - verticalZ[j * (n + 1) + i];
    }

    /// <summary>Per lattice node, the integral of dBz/dz over its dual cell at the given depth (Wb/m), magnets displaced by offsetXM.</summary>
    public void IntegrateNormalGradient(CellLattice lattice, double offsetXM, double depthM, double[] node)
    {
        CheckDepth(depthM);
        var verticalX = VerticalEdgeIntegrals(lattice, (x, y) => FluxDensityAt(x, y, -depthM, offsetXM).X);
        var horizontalY = HorizontalEdgeIntegralsOfBy(lattice, offsetXM, -depthM);
        int n = lattice.NodesX;
        for (int j = 0; j < lattice.NodesY; j++)
            for (int i = 0; i < n; i++)
                node[j * n + i] = -(verticalX[j * (n + 1) + i + 1] - verticalX[j * (n + 1) + i] + horizontalY[(j + 1) * n + i] - horizontalY[j * n + i]);
    }

    private static void CheckDepth(double depthM)
    {
        if (!(depthM >= 0) || !double.IsFinite(depthM)) throw new InputException($"a depth below the plate's top surface must be zero or positive (got {depthM} m)");
    }

    /// <summary>
    /// Integrals over y of one field component along the vertical dual-cell edges x = x_k - hx/2 (k = 0..NodesX), one per node row j
    /// from y_j - hy/2 to y_j + hy/2; index j (NodesX + 1) + k.
    /// </summary>
    private double[] VerticalEdgeIntegrals(CellLattice l, Func<double, double, double> component)
    {
        var (t, w) = Quadrature.GaussLegendre01(LineQuadratureOrder);
        int lines = l.NodesX + 1;
        var integrals = new double[lines * l.NodesY];
        for (int j = 0; j < l.NodesY; j++)
        {
            double y0 = l.NodeY(j) - l.Hy / 2;
            for (int k = 0; k < lines; k++)
            {
                double x = l.NodeX(k) - l.Hx / 2, s = 0;
                for (int q = 0; q < t.Length; q++) s += w[q] * component(x, y0 + t[q] * l.Hy);
                integrals[j * lines + k] = s * l.Hy;
            }
        }
        return integrals;
    }

    /// <summary>Integrals over x of By along the horizontal dual-cell edges y = y_j - hy/2 (j = 0..NodesY), one per node column i; index j NodesX + i.</summary>
    private double[] HorizontalEdgeIntegralsOfBy(CellLattice l, double offsetXM, double z)
    {
        var (t, w) = Quadrature.GaussLegendre01(LineQuadratureOrder);
        var iy = new double[l.NodesX * (l.NodesY + 1)];
        for (int j = 0; j <= l.NodesY; j++)
        {
            double y = l.NodeY(j) - l.Hy / 2;
            for (int i = 0; i < l.NodesX; i++)
            {
                double x0 = l.NodeX(i) - l.Hx / 2, s = 0;
                for (int q = 0; q < t.Length; q++) s += w[q] * FluxDensityAt(x0 + t[q] * l.Hx, y, z, offsetXM).Y;
                iy[j * l.NodesX + i] = s * l.Hx;
            }
        }
        return iy;
    }
}
