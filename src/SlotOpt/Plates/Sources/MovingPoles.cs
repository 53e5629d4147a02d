using SlotOpt.Numerics;
using SlotOpt.Plates.Geometry;
using SlotOpt.Plates.Grid;

namespace SlotOpt.Plates.Sources;

/// <summary>
/// Poles moving along +x at SpeedMPerS over a stationary plate. In the plate's frame, with the
/// poles displaced by X, dBz/dt = -v dB/dx (a field pattern translating at v: Faraday's law in the plate's frame). A uniform pole
/// makes dB/dx a line source on the face's edge, integrated exactly over each dual cell:
/// the integral of -v dB/dx over [x0, x1] x [y0, y1] is -v B (c(x1) - c(x0)), with c(x) the length of
/// the line x, y0..y1 inside the face (no smoothing). For the lift the poles give their field in the
/// sheet's plane (uniform Bz inside each face, zero outside): <see cref="LiftField.PlaneField"/>.
/// </summary>
public sealed class MovingPoles : IMovingSheetSource
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
    public double PoleSizeXM => 2 * Poles.Min(p => p.Face.HalfWidthXM);

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

    /// <summary>Writes the dual-cell integrals of dBz/dt (volts) with the poles displaced by offsetXM.</summary>
    public void IntegrateRate(CellLattice lattice, double offsetXM, double[] node)
    {
        Array.Clear(node);
        double v = SpeedMPerS;
        foreach (var pole in Poles)
        {
            double cx = pole.Centre.X + offsetXM, cy = pole.Centre.Y;
            double hw = pole.Face.HalfWidthXM, hh = pole.Face.HalfHeightYM;
            // nodes whose dual cell can touch the face's edges
            int i0 = Math.Max(0, (int)Math.Floor((cx - hw - lattice.X0) / lattice.Hx - 0.5));
            int i1 = Math.Min(lattice.Nx, (int)Math.Ceiling((cx + hw - lattice.X0) / lattice.Hx + 0.5));
            int j0 = Math.Max(0, (int)Math.Floor((cy - hh - lattice.Y0) / lattice.Hy - 0.5));
            int j1 = Math.Min(lattice.Ny, (int)Math.Ceiling((cy + hh - lattice.Y0) / lattice.Hy + 0.5));
            if (i1 < i0 || j1 < j0) continue;
            // dual-cell boundary lines, computed once so neighbouring cells share them exactly and the
            // line sources telescope (a face edge on a boundary line goes wholly to one side)
            var xs = new double[i1 - i0 + 2];
            for (int i = i0; i <= i1 + 1; i++) xs[i - i0] = lattice.NodeX(i) - lattice.Hx / 2 - cx;
            var chord = new double[xs.Length];
            for (int j = j0; j <= j1; j++)
            {
                double y0 = lattice.NodeY(j) - lattice.Hy / 2 - cy, y1 = lattice.NodeY(j + 1) - lattice.Hy / 2 - cy;
                for (int k = 0; k < xs.Length; k++) chord[k] = pole.Face.ChordLength(xs[k], y0, y1);
                for (int i = i0; i <= i1; i++)
                {
                    double s = -v * pole.FluxDensityT * (chord[i - i0 + 1] - chord[i - i0]);
                    node[j * lattice.NodesX + i] += s;
                }
            }
        }
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
