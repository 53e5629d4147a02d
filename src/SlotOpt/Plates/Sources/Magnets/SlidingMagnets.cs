using System.Globalization;
using SlotOpt.Plates.Geometry;
using SlotOpt.Plates.Grid;

namespace SlotOpt.Plates.Sources.Magnets;

/// <summary>
/// A magnet array moving along +x at SpeedMPerS over a stationary plate: in the plate's frame the field
/// pattern translates, dBz/dt = -v dBz/dx (Faraday's law in the plate's frame), integrated per dual cell
/// from the closed-form field (<see cref="MagnetArray.IntegrateSlope"/>). For the lift it gives the
/// closed-form dBz/dz at the sheet (<see cref="LiftField.NormalGradient"/>). IntegrateRate with a depth
/// gives the same below the top surface, for layered (thick-plate) solvers.
/// </summary>
public sealed class SlidingMagnets : ITravellingSource
{
    public SlidingMagnets(MagnetArray magnets, double speedMPerS)
    {
        if (!(speedMPerS > 0) || !double.IsFinite(speedMPerS)) throw new InputException($"the speed must be positive (got {speedMPerS} m/s)");
        Magnets = magnets;
        SpeedMPerS = speedMPerS;
    }

    public MagnetArray Magnets { get; }
    public double SpeedMPerS { get; }

    public (double MinXM, double MaxXM) ExtentX => Magnets.ExtentX;
    public double LoopLengthXM => Magnets.SmallestLengthXM;

    /// <summary>
    /// The magnet's length and width (8 cells across, as a pole) and the width of the field's edge at the plate, about twice the gap
    /// (4 cells across, as a pole gap): under a magnet's edge Bz falls from its inner to its outer value over about +-gap (common practice, no source).
    /// </summary>
    public IReadOnlyList<GridFeature> GridFeatures =>
    [
        new(GridFeatureKind.Pole, "the magnet's length along the travel", Magnets.SmallestLengthXM),
        new(GridFeatureKind.Pole, "the magnet's width across the travel", 2 * Magnets.Magnets.Min(m => m.Magnet.HalfWidthYM)),
        new(GridFeatureKind.PoleGap, "the field's edge at the plate (twice the magnets' gap)", 2 * Magnets.GapM),
    ];

    public ITravellingSource AtSpeed(double speedMPerS) => new SlidingMagnets(Magnets, speedMPerS);

    public string Words => string.Create(CultureInfo.InvariantCulture,
        $"{Magnets.Magnets.Count} magnet{(Magnets.Magnets.Count == 1 ? "" : "s")} at a {Magnets.GapM * 1e3:0.##} mm gap");

    public void IntegrateRate(CellLattice lattice, double offsetXM, double[] node) => IntegrateRate(lattice, offsetXM, 0, node);

    /// <summary>Per node, the dual-cell integral of dBz/dt = -v dBz/dx (volts) at depthM below the plate's top surface.</summary>
    public void IntegrateRate(CellLattice lattice, double offsetXM, double depthM, double[] node)
    {
        Magnets.IntegrateSlope(lattice, offsetXM, depthM, node);
        for (int n = 0; n < node.Length; n++) node[n] *= -SpeedMPerS;
    }

    public LiftField IntegrateLiftField(CellLattice lattice, double offsetXM, double[] node)
    {
        Magnets.IntegrateNormalGradient(lattice, offsetXM, 0, node);
        return LiftField.NormalGradient;
    }
}
