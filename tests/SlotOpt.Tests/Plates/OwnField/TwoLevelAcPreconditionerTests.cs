using System.Numerics;
using SlotOpt.Numerics;
using SlotOpt.Plates.Conductors;
using SlotOpt.Plates.Geometry;
using SlotOpt.Plates.Grid;
using SlotOpt.Plates.OwnField;
using SlotOpt.Plates.Sources;

namespace SlotOpt.Tests.Plates.OwnField;

/// <summary>
/// The AC solve's two-grid preconditioner (<see cref="TwoLevelAcPreconditioner"/>): its transfer against its definition (bilinear
/// interpolation reproduces a linear field; the restriction is its transpose), and the solve it preconditions against the V-cycle-only
/// path on a slotted plate (the comb of the reaction bench at 128 x 128 cells). Against MathNet's dense LU see
/// <see cref="ReactionDenseReferenceTests"/>.
/// </summary>
public class TwoLevelAcPreconditionerTests
{
    private static SheetModel SlottedPlate(int cells)
    {
        var plate = PlateGeometry.Rectangle(1, 1);
        plate.AddPattern(SlotPatterns.Comb(plate.Outline, PlateEdge.Bottom, 0.1, 0.7, 0.02));
        return SheetModel.Build(plate, new GridOptions { CellSizeM = 1.0 / cells });
    }

    /// <summary>
    /// Bilinear interpolation is exact for a field linear in x and y (the definition of the bilinear hat basis), at every fine node whose
    /// coarse cell has all four corners on the plate; rounding only (measured 9e-16 for values up to 5), so 5e-12 is allowed. P^T is the
    /// transpose of P: x_H . (P^T y) = (P x_H) . y for random vectors, a sum rearranged, so 1e-12 relative; the weighted mean
    /// (P^T z) / (P^T 1) formed in the same pass returns a constant z unchanged (its definition; rounding only, 1e-12).
    /// </summary>
    [Fact]
    public void Transfer_reproduces_linear_fields_and_restricts_by_its_transpose()
    {
        var fine = SlottedPlate(128);
        var level = CoarseOwnFieldLevel.Build(fine, 4)!;
        var coarse = level.Model;
        var lc = coarse.Lattice; var lf = fine.Lattice;
        static double Linear(double x, double y) => 0.3 + 2 * x - 5 * y;
        var xH = new Complex[coarse.Unknowns];
        var mapC = coarse.Regions.NodeUnknown;
        for (int n = 0; n < mapC.Length; n++)
            if (mapC[n] >= 0 && !coarse.Regions.IsMerged[mapC[n]]) xH[mapC[n]] = Linear(lc.NodeX(n % lc.NodesX), lc.NodeY(n / lc.NodesX));
        var xhRe = new double[fine.Unknowns]; var xhIm = new double[fine.Unknowns];
        level.Transfer.ProlongAdd(xH, xhRe, xhIm);
        var mapF = fine.Regions.NodeUnknown;
        int checkedNodes = 0;
        double worst = 0;
        for (int n = 0; n < mapF.Length; n++)
        {
            if (mapF[n] < 0 || fine.Regions.IsMerged[mapF[n]]) continue;
            double x = lf.NodeX(n % lf.NodesX), y = lf.NodeY(n / lf.NodesX);
            int i0 = Math.Min((int)Math.Floor((x - lc.X0) / lc.Hx), lc.Nx - 1), j0 = Math.Min((int)Math.Floor((y - lc.Y0) / lc.Hy), lc.Ny - 1);
            bool inside = true;
            for (int q = 0; q < 4; q++)
                if (mapC[(j0 + (q >> 1)) * lc.NodesX + i0 + (q & 1)] is var u && (u < 0 || coarse.Regions.IsMerged[u])) inside = false;
            if (!inside) continue;
            checkedNodes++;
            worst = Math.Max(worst, Math.Abs(xhRe[mapF[n]] - Linear(x, y)));
        }
        Assert.True(checkedNodes > fine.Unknowns / 2, $"only {checkedNodes} nodes checked");
        Assert.True(worst < 1e-12 * 5, $"bilinear interpolation of a linear field: {worst:E2}");

        var random = new Random(7);
        var a = Enumerable.Range(0, coarse.Unknowns).Select(_ => new Complex(random.NextDouble() - 0.5, random.NextDouble() - 0.5)).ToArray();
        var b = Enumerable.Range(0, fine.Unknowns).Select(_ => new Complex(random.NextDouble() - 0.5, random.NextDouble() - 0.5)).ToArray();
        var paRe = new double[fine.Unknowns]; var paIm = new double[fine.Unknowns];
        level.Transfer.ProlongAdd(a, paRe, paIm);
        var ptb = new Complex[coarse.Unknowns];
        var mean = new Complex[coarse.Unknowns];
        var ones = Enumerable.Repeat(1.0, fine.Unknowns).ToArray();
        level.Transfer.RestrictAndAverage(b.Select(q => q.Real).ToArray(), b.Select(q => q.Imaginary).ToArray(), ones, new double[fine.Unknowns], ptb, mean);
        // the weighted mean of a constant is that constant wherever a fine node reaches (rounding only)
        Assert.All(mean, m => Assert.True(m == Complex.Zero || (m - 1).Magnitude < 1e-12, $"mean of ones: {m}"));
        Assert.True(mean.Count(m => m != Complex.Zero) > coarse.Unknowns / 2);
        Complex left = Enumerable.Range(0, fine.Unknowns).Aggregate(Complex.Zero, (s, i) => s + new Complex(paRe[i], paIm[i]) * b[i]);
        Complex right = Enumerable.Range(0, coarse.Unknowns).Aggregate(Complex.Zero, (s, i) => s + a[i] * ptb[i]);
        Assert.True((left - right).Magnitude < 1e-12 * left.Magnitude, $"(P a).b = {left}, a.(P^T b) = {right}");
    }

    /// <summary>
    /// The reaction bench's plate (1 m, comb of slots, 3 mm Al at 50 Hz) at 128 x 128 cells: the solver's path (two-grid preconditioner)
    /// against GMRES with the V-cycle alone from the same start, both to a relative residual of 1e-10. Their solutions then differ by at
    /// most cond(K) x 2e-10 relative; measured 2.3e-11, so the check allows 1e-9 for u and the loss. The two-grid path must take fewer
    /// outer iterations (measured 10 against 18 at this tolerance) and give the same numbers with 1 and 2 FFT workers.
    /// </summary>
    [Fact]
    public void Two_grid_solve_matches_the_V_cycle_path_on_the_slotted_plate_in_fewer_iterations()
    {
        var model = SlottedPlate(128);
        var reaction = ReactionOperator.Build(model);
        Assert.NotNull(reaction.CoarseLevel);
        IAcFieldSource source = new UniformAcField(0.01, 50);
        var conductor = new ConductingSheet(35.38e6, 3e-3);
        var criterion = new ConvergenceCriterion { RelativeResidual = 1e-10 };
        var twoGrid = ReactionSolver.SolveAc(reaction, source, conductor, criterion);

        var l = model.Lattice;
        var re = new double[l.NodeCount]; var im = new double[l.NodeCount];
        source.Integrate(l, re, im);
        var bRe = model.RightHandSide(re); var bIm = model.RightHandSide(im);
        var u0Re = new double[model.Unknowns]; var u0Im = new double[model.Unknowns];
        model.Solve(bRe, u0Re, ConvergenceCriterion.Default);
        model.Solve(bIm, u0Im, ConvergenceCriterion.Default);
        var b = bRe.Select((v, i) => new Complex(v, bIm[i])).ToArray();
        var u = u0Re.Select((v, i) => new Complex(v, u0Im[i])).ToArray();
        var op = CoupledOperator.Ac(model, reaction, 2 * Math.PI * 50, conductor.SheetConductanceS);
        var vCycleOnly = ComplexGmres.Solve(op.Apply, op.Precondition, b, u, criterion);

        double difference = Math.Sqrt(u.Zip(twoGrid.U, (p, q) => (p - q).Magnitude * (p - q).Magnitude).Sum() / u.Sum(q => q.Magnitude * q.Magnitude));
        Assert.True(difference < 1e-9, $"two-grid against V-cycle-only solution: {difference:E2}");
        double loss = 0.5 * conductor.SheetConductanceS * (model.LossPerSiemens(u.Select(c => c.Real).ToArray()) + model.LossPerSiemens(u.Select(c => c.Imaginary).ToArray()));
        Assert.Equal(loss, twoGrid.LossW, loss * 1e-9);
        Assert.True(twoGrid.Iterations < vCycleOnly.Iterations, $"two-grid {twoGrid.Iterations} against V-cycle {vCycleOnly.Iterations} iterations");

        var twoWorkers = ReactionSolver.SolveAc(ReactionOperator.Build(model, 2), source, conductor, criterion);
        Assert.Equal(twoGrid.U, twoWorkers.U);
        Assert.Equal(twoGrid.LossW, twoWorkers.LossW);
    }
}
