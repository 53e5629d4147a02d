using MathNet.Numerics.Integration;
using SlotOpt.Plates.Geometry;
using SlotOpt.Plates.Grid;
using SlotOpt.Plates.ResistanceLimited;
using SlotOpt.Plates.Sources;
using Xunit.Abstractions;

namespace SlotOpt.Tests.Plates;

/// <summary>Sharp pole edges placed by their sub-cell position, with the energy the grid misses added back: drag independent of where the edge falls in a cell.</summary>
public class PoleEdgeTests(ITestOutputHelper output)
{
    private static double Drag(PlateGeometry plate, double cellM, Pole pole, double offsetXM)
    {
        var model = SheetModel.Build(plate, new GridOptions { CellSizeM = cellM });
        return ResistanceLimitedSolver.SolveMoving(model, new MovingPoles(new[] { pole }, 1), new[] { offsetXM }).DragN(1)[0];
    }

    // A 40 x 60 mm pole in the middle of a 600 x 100 mm plate on 2 mm cells (20 cells per pole width), shifted
    // in 0.2 mm steps across one cell. The plate's ends are 280 mm away, so the true drag changes by less than
    // e^(-pi 280/100) = 1.5e-4 (the slowest strip mode's decay; common practice, no source). Tolerance 0.5 %:
    // the issue's target for a sub-cell shift (it was 3 % for a 0.2 mm shift on 4 mm cells with the edges assigned
    // to the nearest node; without the energy correction it is 8.7 % here at 10 cells per pole width). Measured: 1.0 % at 10 cells per
    // pole width, the remainder an end effect of the edges (the correction assumes a locally 1-D kink), falling as h^2.
    [Fact]
    public void Drag_does_not_depend_on_where_the_pole_edge_falls_in_a_cell()
    {
        var plate = PlateGeometry.Rectangle(0.6, 0.1);
        var pole = new Pole(PoleFace.Rectangle(0.04, 0.06), new Vec2(0.3, 0.05), 0.3);
        var drag = Enumerable.Range(0, 11).Select(k => Drag(plate, 0.002, pole, 0.0002 * k)).ToArray();
        output.WriteLine(string.Join(", ", drag.Select(d => d.ToString("G6"))));
        Assert.InRange((drag.Max() - drag.Min()) / drag.Average(), 0, 0.005);
    }

    /// <summary>
    /// Finite-sheet factor for a circular pole of radius R at the centre of a square sheet of half-side c, resistance-limited:
    /// F / F_Heald = 1 - R^2 dh/dx(0), with h harmonic in the square and h = x / r^2 on its edge [D, derived here:
    /// outside the pole the infinite-sheet stream function is the 2-D dipole a R^2 x / r^2; the sheet's edge (psi = 0)
    /// adds the harmonic -a R^2 h, whose cos(theta) part on the pole's circle is -a R^2 R dh/dx(0) (mean-value
    /// property), and the drag is proportional to the cos(theta) part there. For a disc of radius b, h = x / b^2
    /// gives 1 - R^2/b^2, the m -> 0 limit of Smythe's disc brake, W. R. Smythe, Trans. AIEE 61:681-684, 1942.]
    /// h by separation of variables on the square: the x = +-c edges in cos((2k+1) pi y / 2c) sinh modes, the
    /// y = +-c edges in sin(k pi x / c) cosh modes; both decay like e^(-k pi/2), 60 terms are exact to rounding.
    /// </summary>
    private static double SquareSheetFactor(double radiusM, double halfSideM)
    {
        double c = halfSideM, dhdx = 0;
        for (int k = 0; k < 60; k++)
        {
            double beta = (2 * k + 1) * Math.PI / (2 * c);
            double a = GaussLegendreRule.Integrate(y => c / (c * c + y * y) * Math.Cos(beta * y), -c, c, 256) / c;     // x = +-c edges
            dhdx += a * beta / Math.Sinh(beta * c);
            int m = k + 1;
            double b = GaussLegendreRule.Integrate(x => x / (x * x + c * c) * Math.Sin(m * Math.PI * x / c), -c, c, 256) / c;   // y = +-c edges
            dhdx += b * (m * Math.PI / c) / Math.Cosh(m * Math.PI);
        }
        return 1 - radiusM * radiusM * dhdx;
    }

    // Heald, "Magnetic braking: improved theory", Am. J. Phys. 56(6):521-522, 1988: uniform B in a circle of radius R
    // on an infinite sheet, low speed: F = 1/2 sigma t v B^2 pi R^2; times the square-sheet factor above (R = 25 mm,
    // 200 mm square). Grids of R/h = 5, 10, 14, 20, 28, 40 (5 to 0.625 mm); the square's edges lie on lattice lines, so the
    // pole's circle is the only cut through cells. Measured errors, with the sub-cell edge energy: -0.129 %, -0.0152 %,
    // -0.0177 %, -0.0028 %, -0.0063 %, -0.0029 % (least-squares order 1.76; R/h = 10 -> 20 falls 5.4-fold, 14 -> 28 2.8-fold:
    // the remainder, 2e-4 and below, wavers with where the circle's slanted arcs cut the lattice, where the offset average
    // of MovingPoles.SubCellEdgeLossPerSiemens holds only on average). Without it (psi^T A psi alone): -6.81 %, -3.52 %,
    // -2.57 %, -1.81 %, -1.32 %, -0.93 % (order 0.96). With the earlier rows-and-columns-only edge energy: -2.02 %, -0.95 %,
    // -0.68 %, -0.47 %, -0.34 %, -0.23 % (first order; the 5-point grid misses more at a slanted edge than rows and columns
    // account for). Tolerances: the issue's target, the error falls at least 3-fold from R/h = 10 to 20 (second order gives
    // 4, first order 2) and R/h = 20 within 0.3 %; every grid from R/h = 10 within 0.05 % (a regression to first order
    // fails it); and the uncorrected grid is first order (ratio 1.5 to 3), so the check sees the correction do the work.
    [Fact]
    public void Circular_pole_converges_to_Heald_on_a_finite_sheet_at_second_order()
    {
        const double r = 0.025, side = 0.2, b = 0.3, sigmaT = 1;
        double reference = 0.5 * sigmaT * b * b * Math.PI * r * r * SquareSheetFactor(r, side / 2);
        var source = new MovingPoles(new[] { new Pole(PoleFace.Circle(r), new Vec2(side / 2, side / 2), b) }, 1);
        var radiiPerCell = new[] { 5, 10, 14, 20, 28, 40 };
        var with = new double[radiiPerCell.Length];
        var without = new double[radiiPerCell.Length];
        for (int k = 0; k < radiiPerCell.Length; k++)
        {
            var model = SheetModel.Build(PlateGeometry.Rectangle(side, side), new GridOptions { CellSizeM = r / radiiPerCell[k] });
            double drag = ResistanceLimitedSolver.SolveMoving(model, source, new[] { 0.0 }).DragN(sigmaT)[0];
            with[k] = drag / reference - 1;
            without[k] = (drag - sigmaT * source.SubCellEdgeLossPerSiemens(model.Grid, 0)) / reference - 1;
        }
        output.WriteLine($"factor {SquareSheetFactor(r, side / 2):G8}; with {string.Join(", ", with.Select(e => e.ToString("E3")))}; without {string.Join(", ", without.Select(e => e.ToString("E3")))}");
        var logH = radiiPerCell.Select(n => -Math.Log(n)).ToArray();
        double order = MathNet.Numerics.Fit.Line(logH, with.Select(e => Math.Log(Math.Abs(e))).ToArray()).B;
        double orderWithout = MathNet.Numerics.Fit.Line(logH, without.Select(e => Math.Log(Math.Abs(e))).ToArray()).B;
        output.WriteLine($"observed order {order:F2} (without the edge energy {orderWithout:F2})");
        int at10 = Array.IndexOf(radiiPerCell, 10), at20 = Array.IndexOf(radiiPerCell, 20);
        Assert.True(with[at10] / with[at20] >= 3, $"error ratio R/h 10 -> 20: {with[at10] / with[at20]:F2} ({with[at10]:E2}, {with[at20]:E2})");
        Assert.InRange(with[at20], -0.003, 0.003);
        for (int k = 1; k < radiiPerCell.Length; k++) Assert.InRange(with[k], -5e-4, 5e-4);
        Assert.InRange(without[at10] / without[at20], 1.5, 3);
    }

    // The mean energy the 5-point grid misses per unit length of a slanted line source (MovingPoles.MeanKinkEnergy, a
    // Fourier integral) against a dense reference. Along a lattice line it is the mean of theta (1 - theta) h over the offset,
    // 1/6 (G. Strang and G. J. Fix, An Analysis of the Finite Element Method, 1973, section 1.10: the 1-D kink). At 45 degrees
    // the lattice is invariant along the line, so a pair of opposite unit line sources D apart reduces to a 1-D chain over
    // the diagonals s = i - j: loads sqrt 2 B3(s - c) (the bilinear hat integrated along the line: the cubic B-spline of the
    // hat's self-convolution), operator 2 (2 u_s - u_s+1 - u_s-1); the exact energy per unit length is D (slope 1 between the
    // lines [D, derived here]), so each line misses (D - F^T K^-1 F / sqrt 2) / 2, averaged over 64 offsets c (MathNet's dense LU).
    // Measured: 0.2012. Tolerance 1e-6: quadrature and the offset mean are both spectrally accurate.
    [Fact]
    public void Mean_edge_energy_of_a_slanted_line_matches_a_dense_lattice_sum()
    {
        Assert.InRange(MovingPoles.MeanKinkEnergy(0) - 1.0 / 6, -1e-6, 1e-6);
        const int first = -10, last = 40, offsets = 64;
        double d = 10, sum = 0;
        static double CubicBSpline(double x) { x = Math.Abs(x); return x < 1 ? 2.0 / 3 - x * x + x * x * x / 2 : x < 2 ? (2 - x) * (2 - x) * (2 - x) / 6 : 0; }
        int n = last - first;                                        // u = 0 at s = first (its row dropped), a free end at s = last
        var k = MathNet.Numerics.LinearAlgebra.Matrix<double>.Build.Dense(n, n);
        for (int r = 0; r < n; r++)
        {
            k[r, r] = r == n - 1 ? 2 : 4;
            if (r > 0) k[r, r - 1] = -2;
            if (r < n - 1) k[r, r + 1] = -2;
        }
        var lu = k.LU();
        for (int o = 0; o < offsets; o++)
        {
            double c = (o + 0.5) / offsets;
            var f = MathNet.Numerics.LinearAlgebra.Vector<double>.Build.Dense(n, r =>
            {
                int sIndex = first + 1 + r;
                return Math.Sqrt(2) * (CubicBSpline(sIndex - c) - CubicBSpline(sIndex - c - d * Math.Sqrt(2)));
            });
            double energy = f.DotProduct(lu.Solve(f)) / Math.Sqrt(2);
            sum += (d - energy) / 2;
        }
        double direct = sum / offsets;
        output.WriteLine($"45 degrees: Fourier {MovingPoles.MeanKinkEnergy(Math.PI / 4):G8}, lattice sum {direct:G8}");
        Assert.InRange(MovingPoles.MeanKinkEnergy(Math.PI / 4) / direct - 1, -1e-6, 1e-6);
    }

    // A 300 x 60 mm strip with 3 mm slots 20 mm apart from its lower edge, 40 mm deep, on the automatic grid for the
    // plate and the pole (cells across the strips and the pole, GridOptions), under a 20 x 20 mm pole over the slotted part.
    // (On 4 mm cells the 3 mm slots' merged centre lines fall on the nodes of edges 0.5 mm beside them: drag 0 at 18 mm.) At every
    // position one pole edge at least lies over metal (the pole is a whole pitch wide, so when one edge is in a slot
    // the other is in the next one only if both sit in slots, which the loop skips). Each such position must give
    // drag: at least 20 % of the 1 mm grid's value there (the coarse grid's error on a 3 mm slot is large, but
    // losing the source altogether, the defect, gives 0). Tolerance from the physics: a line source over metal drives current.
    [Fact]
    public void A_pole_edge_over_metal_always_gives_drag_on_a_slotted_strip()
    {
        var plate = PlateGeometry.Rectangle(0.3, 0.06);
        plate.AddPattern(SlotPatterns.Comb(plate.Outline, PlateEdge.Bottom, 0.02, 0.04, 0.003));
        var slotCentres = plate.Slots.Select(s => s.Start.X).ToArray();
        var pole = new Pole(PoleFace.Rectangle(0.02, 0.02), new Vec2(0.14, 0.015), 0.3);
        var offsets = Enumerable.Range(0, 40).Select(k => 0.0005 * k).ToArray();
        var source = new MovingPoles(new[] { pole }, 1);
        var coarse = SheetModel.Build(plate, new GridOptions { SourceFeatures = source.GridFeatures });
        var fine = SheetModel.Build(plate, new GridOptions { CellSizeM = 0.001 });
        var dragCoarse = ResistanceLimitedSolver.SolveMoving(coarse, source, offsets).DragN(1);
        var dragFine = ResistanceLimitedSolver.SolveMoving(fine, source, offsets).DragN(1);
        output.WriteLine(string.Join(", ", dragCoarse.Zip(dragFine, (c, f) => (c / f).ToString("F3"))));
        for (int k = 0; k < offsets.Length; k++)
        {
            double left = 0.13 + offsets[k], right = 0.15 + offsets[k];
            bool InSlot(double x) => slotCentres.Any(c => Math.Abs(x - c) <= 0.0015);
            if (InSlot(left) && InSlot(right)) continue;
            Assert.True(dragCoarse[k] >= 0.2 * dragFine[k], $"offset {offsets[k] * 1e3} mm: drag {dragCoarse[k]:E3} N on {coarse.Lattice.Hx * 1e3:G3} mm cells against {dragFine[k]:E3} N on 1 mm cells");
        }
    }
}
