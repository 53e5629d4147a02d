using SlotOpt.Tables;
using SlotOpt.Numerics;
using SlotOpt.Plates.Geometry;
using SlotOpt.Plates.Sources.Magnets;

namespace SlotOpt.Plates.Sources.Rotation;

/// <summary>
/// A ring of equal magnets fixed over a turning disc: Count magnets at RadiusM from the axis, PitchRad apart (the first at angle 0,
/// +x), each magnetised along its height (normal to the disc), its length along the path (tangential) and its width radial, its near
/// face GapM above the disc; polarity alternating or all the same. The field is the closed form of each magnet
/// (<see cref="IPermanentMagnet"/>); only Bz at the disc's top surface enters the sheet equation. Edge moments by an
/// <see cref="LineQuadratureOrder"/>-point Gauss-Legendre rule per dual-cell edge (Abramowitz and Stegun 25.4.29), as in
/// <see cref="MagnetArray"/>: the field is analytic below the magnets with length scale the gap.
/// </summary>
public sealed class RotatingMagnets : RotatingSource
{
    public RotatingMagnets(IPermanentMagnet magnet, double radiusM, int count, double pitchRad, MagnetPolarity polarity, double gapM, Vec2 axis,
        double angularSpeedRadPerS, int lineQuadratureOrder = 4) : base(axis, angularSpeedRadPerS)
    {
        if (!(radiusM >= 0) || !double.IsFinite(radiusM)) throw new InputException($"the magnets' radius on the disc must be zero or positive (got {radiusM} m)");
        if (count < 1) throw new InputException($"a magnet ring needs at least one magnet (got {count})");
        if (count > 1 && !(pitchRad * radiusM >= 2 * magnet.HalfLengthXM)) throw new InputException($"the magnets' pitch ({pitchRad * radiusM} m of arc) is shorter than a magnet's length ({2 * magnet.HalfLengthXM} m): magnets would overlap");
        if (count > 1 && !(pitchRad * (count - 1) < 2 * Math.PI + 1e-12)) throw new InputException($"{count} magnets {pitchRad} rad apart go round more than once");
        if (!(gapM > 0) || !double.IsFinite(gapM)) throw new InputException($"the gap between the magnets and the disc must be positive (got {gapM} m)");
        if (lineQuadratureOrder < 1) throw new ArgumentOutOfRangeException(nameof(lineQuadratureOrder), "at least one Gauss point per edge");
        Magnet = magnet;
        RadiusM = radiusM;
        Count = count;
        PitchRad = pitchRad;
        Polarity = polarity;
        GapM = gapM;
        LineQuadratureOrder = lineQuadratureOrder;
    }

    public IPermanentMagnet Magnet { get; }
    public double RadiusM { get; }
    public int Count { get; }
    public double PitchRad { get; }
    public MagnetPolarity Polarity { get; }
    public double GapM { get; }
    public int LineQuadratureOrder { get; }

    public override double SourceRadiusM => RadiusM;
    public override double LoopLengthM => 2 * Magnet.HalfLengthXM;

    /// <summary>As for sliding magnets: the magnet's length and width (8 cells across) and the field's edge at the disc, twice the gap (4 cells across); common practice, no source.</summary>
    public override IReadOnlyList<GridFeature> GridFeatures =>
    [
        new(GridFeatureKind.Pole, "the magnet's length along its path", 2 * Magnet.HalfLengthXM),
        new(GridFeatureKind.Pole, "the magnet's radial width", 2 * Magnet.HalfWidthYM),
        new(GridFeatureKind.PoleGap, "the field's edge at the disc (twice the magnets' gap)", 2 * GapM),
    ];

    public override RotatingSource AtSpeed(double angularSpeedRadPerS) =>
        SharingRates(new RotatingMagnets(Magnet, RadiusM, Count, PitchRad, Polarity, GapM, Axis, angularSpeedRadPerS, LineQuadratureOrder));

    public override string Words =>
        $"{Count} magnet{(Count == 1 ? "" : "s")} at {Numbers.Of(RadiusM * 1e3, "mm")} radius, {Numbers.Of(GapM * 1e3, "mm")} gap";

    protected override IEdgeMoments TurnedBy(double angleRad) => new TurnedRing(this, angleRad);

    /// <summary>
    /// The ring turned by one angle: each magnet's cos, sin and sign, the Gauss-Legendre table and the disc's surface height in the
    /// magnets' frame, computed once for all the lattice's edges. Read-only, so the edges may be integrated on several threads.
    /// </summary>
    private sealed class TurnedRing : IEdgeMoments
    {
        private readonly IPermanentMagnet _magnet;
        private readonly double _radiusM, _surfaceZ;
        private readonly double[] _cos, _sin, _sign, _t, _w;

        public TurnedRing(RotatingMagnets ring, double angleRad)
        {
            _magnet = ring.Magnet;
            _radiusM = ring.RadiusM;
            _surfaceZ = -(ring.GapM + ring.Magnet.HeightM / 2);
            _cos = new double[ring.Count];
            _sin = new double[ring.Count];
            _sign = new double[ring.Count];
            for (int k = 0; k < ring.Count; k++)
            {
                double phi = angleRad + k * ring.PitchRad;
                _cos[k] = Math.Cos(phi);
                _sin[k] = Math.Sin(phi);
                _sign[k] = ring.Polarity == MagnetPolarity.Alternating && k % 2 == 1 ? -1 : 1;
            }
            (_t, _w) = Quadrature.GaussLegendre01(ring.LineQuadratureOrder);
        }

        /// <summary>Bz at the disc's top surface at (x, y) from the axis.</summary>
        private double FieldZ(double xM, double yM)
        {
            double sum = 0;
            for (int k = 0; k < _cos.Length; k++)
            {
                double c = _cos[k], s = _sin[k];
                double radial = xM * c + yM * s - _radiusM, tangential = -xM * s + yM * c;    // the point in the magnet's frame (rotated by -phi)
                sum += _sign[k] * _magnet.FluxDensityZAt(tangential, radial, _surfaceZ);     // the magnet's length (its x) lies along the path
            }
            return sum;
        }

        public double MomentAlongX(double yM, double x0M, double x1M)
        {
            double sum = 0, d = x1M - x0M;
            for (int q = 0; q < _t.Length; q++) { double x = x0M + _t[q] * d; sum += _w[q] * x * FieldZ(x, yM); }
            return sum * d;
        }

        public double MomentAlongY(double xM, double y0M, double y1M)
        {
            double sum = 0, d = y1M - y0M;
            for (int q = 0; q < _t.Length; q++) { double y = y0M + _t[q] * d; sum += _w[q] * y * FieldZ(xM, y); }
            return sum * d;
        }
    }
}
