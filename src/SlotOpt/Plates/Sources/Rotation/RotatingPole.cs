using SlotOpt.Tables;
using SlotOpt.Plates.Geometry;

namespace SlotOpt.Plates.Sources.Rotation;

/// <summary>
/// A uniform circular pole (Bz = B inside a circle of PoleRadiusM, zero outside: an iron pole face close to the disc) centred at
/// SourceRadiusM from the disc's axis, at angle 0 (+x) when not turned. Its edge moments are exact: along a lattice line the
/// pole is one chord, and the integral of x over a chord [a, b] is (b^2 - a^2) / 2.
/// </summary>
public sealed class RotatingPole : RotatingSource
{
    public RotatingPole(Vec2 axis, double sourceRadiusM, double poleRadiusM, double fluxDensityT, double angularSpeedRadPerS) : base(axis, angularSpeedRadPerS)
    {
        if (!(poleRadiusM > 0) || !double.IsFinite(poleRadiusM)) throw new InputException($"a pole's radius must be positive (got {poleRadiusM} m)");
        if (!(sourceRadiusM >= 0) || !double.IsFinite(sourceRadiusM)) throw new InputException($"the pole's radius on the disc must be zero or positive (got {sourceRadiusM} m)");
        if (!double.IsFinite(fluxDensityT)) throw new InputException("the pole's flux density is not finite");
        SourceRadiusM = sourceRadiusM;
        PoleRadiusM = poleRadiusM;
        FluxDensityT = fluxDensityT;
    }

    public override double SourceRadiusM { get; }
    public double PoleRadiusM { get; }
    public double FluxDensityT { get; }
    public override double LoopLengthM => 2 * PoleRadiusM;

    public override IReadOnlyList<GridFeature> GridFeatures => [new(GridFeatureKind.Pole, "the pole's diameter", 2 * PoleRadiusM)];

    public override RotatingSource AtSpeed(double angularSpeedRadPerS) => SharingRates(new RotatingPole(Axis, SourceRadiusM, PoleRadiusM, FluxDensityT, angularSpeedRadPerS));

    public override string Words => $"a pole {Numbers.Of(2 * PoleRadiusM * 1e3, "mm")} across at {Numbers.Of(SourceRadiusM * 1e3, "mm")} radius";

    protected override IEdgeMoments TurnedBy(double angleRad) => new TurnedPole(this, SourceRadiusM * Math.Cos(angleRad), SourceRadiusM * Math.Sin(angleRad));

    /// <summary>The pole turned by one angle: its centre (cx, cy) from the axis, computed once for all the lattice's edges.</summary>
    private sealed class TurnedPole(RotatingPole pole, double cx, double cy) : IEdgeMoments
    {
        public double MomentAlongX(double yM, double x0M, double x1M) => pole.Chord(yM - cy, cx, x0M, x1M);
        public double MomentAlongY(double xM, double y0M, double y1M) => pole.Chord(xM - cx, cy, y0M, y1M);
    }

    /// <summary>B times the integral of s ds over the part of [s0, s1] inside the circle, on a line at distance d from its centre c along the line.</summary>
    private double Chord(double d, double c, double s0, double s1)
    {
        double h2 = PoleRadiusM * PoleRadiusM - d * d;
        if (h2 <= 0) return 0;
        double h = Math.Sqrt(h2), a = Math.Max(s0, c - h), b = Math.Min(s1, c + h);
        return b > a ? FluxDensityT * (b * b - a * a) / 2 : 0;
    }
}
