using SlotOpt.Numerics;
using SlotOpt.Plates.Grid;
using SlotOpt.Plates.OwnField;

namespace SlotOpt.Plates.Sources;

/// <summary>
/// The solver's pole rows (<see cref="MovingPoles"/>: uniform Bz inside each face, zero outside, given
/// in the sheet's plane) as a source for the coupled solver. The rate term is the poles' own exact
/// line-source integral. For the lift, dBz/dz at the sheet follows from the in-plane field alone when
/// the sources lie above the sheet: Bz(k, z) = Bz(k, 0) e^{|k| z} below them, so dBz/dz = |k| Bz, and
/// its integral over basis m is (2/mu0)(R b)_m with b the dual-cell means of Bz at the nodes and R
/// the reaction operator (whose kernel is (mu0/2) &lt;phi_m, |k| phi_n&gt;).
/// </summary>
public sealed class MovingPoleField : IMovingSheetSource
{
    private const int AreaPoints = 8;

    public MovingPoleField(MovingPoles poles) => Poles = poles;

    public MovingPoles Poles { get; }
    public double SpeedMPerS => Poles.SpeedMPerS;

    public void IntegrateRate(CellLattice lattice, double offsetXM, double[] node) => Poles.Integrate(lattice, offsetXM, node);

    public void IntegrateNormalGradient(ReactionOperator reaction, double offsetXM, double[] perUnknown)
    {
        var l = reaction.Model.Lattice;
        var mean = new double[l.NodeCount];
        var (t, w) = Quadrature.GaussLegendre01(AreaPoints);
        foreach (var pole in Poles.Poles)
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
                    mean[j * l.NodesX + i] += pole.FluxDensityT * chord / l.Hy;   // B x (area fraction of the dual cell)
                }
        }
        reaction.ApplyRToNodeField(mean, perUnknown);
        double f = 2 / Validity.Mu0;
        for (int u = 0; u < perUnknown.Length; u++) perUnknown[u] *= f;
    }
}
