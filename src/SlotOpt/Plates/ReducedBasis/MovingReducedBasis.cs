using MathNet.Numerics.LinearAlgebra;
using SlotOpt.Numerics;
using SlotOpt.Plates.Conductors;
using SlotOpt.Plates.Grid;
using SlotOpt.Plates.OwnField;
using SlotOpt.Plates.Sources;
using SlotOpt.Tables;

namespace SlotOpt.Plates.ReducedBasis;

/// <summary>
/// The coupled moving problem of <see cref="ReactionSolver.SolveMoving"/>, (A - c S) u = -s with S = Dx R and c = v G, for every
/// sheet conductance G and speed v of one geometry and source from one Krylov basis per travel position. In the A-inner product
/// M = A^-1 S is skew-adjoint (A symmetric positive definite, S skew-symmetric: the odd kernel of <see cref="ReactionOperator.ApplyDxR"/>
/// restricted to the plate), so (I - c M) u = u0 with u0 = -A^-1 s is solved by projection onto the Krylov space of M from u0,
/// built once by Arnoldi in the A-inner product (Y. Saad, Iterative Methods for Sparse Linear Systems, 2nd ed., SIAM 2003, Alg. 6.1; the
/// shift-invariance of Krylov spaces, K_m(I - c M, u0) = K_m(M, u0), section 6.1): every c then costs one small m x m solve.
/// The source's rate s scales with its speed (a translating field: dBz/dt = -v dBz/dx), so one basis also serves every speed.
/// Stopping: the Arnoldi relation gives the residual of the projected solution exactly, (I - c M) V y - u0 = -c h(m+1,m) y_m v(m+1), and
/// |(I - c M) e|_A &gt;= |e|_A for skew-adjoint M, so the A-norm error of u is at most |c h(m+1,m) y_m| |u0|_A; the basis grows until that
/// is below the criterion's relative residual times |u|_A; for loss and drag alone, until the loss's adjoint-weighted bound (the product of that
/// bound and the adjoint problem's, <see cref="ArnoldiPosition.RelativeLossError"/>) is below the criterion. Each step costs one application of S (by FFT) and one multigrid solve with A. Not thread-safe (the reaction operator is not): one per thread.
/// </summary>
public sealed class MovingReducedBasis
{
    /// <summary>Basis vectors per travel position before the solve is a failure (the convergence rate falls as c |M| grows; 5 w needs about 100 at 1e-8).</summary>
    public const int MaxSteps = 400;

    private readonly ReactionOperator _reaction;
    private readonly SheetModel _model;
    private readonly ConvergenceCriterion _criterion;
    private readonly ArnoldiPosition[] _positions;
    private readonly double[] _applied;

    public SheetModel Model => _model;
    public ReactionOperator Reaction => _reaction;
    public IMovingSheetSource Source { get; }
    public IReadOnlyList<double> OffsetsXM { get; }

    /// <summary>Basis vectors built so far, summed over the positions (the work done: one S application and one A solve each).</summary>
    public int Steps => _positions.Sum(p => p.V.Count - 1);

    private MovingReducedBasis(ReactionOperator reaction, IMovingSheetSource source, IReadOnlyList<double> offsetsXM, ConvergenceCriterion criterion, ArnoldiPosition[] positions)
    {
        _reaction = reaction;
        _model = reaction.Model;
        Source = source;
        OffsetsXM = offsetsXM.ToArray();
        _criterion = criterion;
        _positions = positions;
        _applied = new double[_model.Unknowns];
    }

    /// <summary>The resistance-limited start u0 = -A^-1 s at each offset (the first basis vector); the basis grows as solves ask for it.</summary>
    public static MovingReducedBasis Start(ReactionOperator reaction, IMovingSheetSource source, IReadOnlyList<double> offsetsXM, ConvergenceCriterion? criterion = null)
    {
        if (offsetsXM.Count == 0) throw new InputException("a moving source needs at least one position");
        criterion ??= ConvergenceCriterion.Default;
        var model = reaction.Model;
        var l = model.Lattice;
        var node = new double[l.NodeCount];
        var positions = new ArnoldiPosition[offsetsXM.Count];
        for (int k = 0; k < offsetsXM.Count; k++)
        {
            source.IntegrateRate(l, offsetsXM[k], node);
            var rhs = model.RightHandSide(node);
            var u0 = new double[model.Unknowns];
            if (!model.TrySolve(rhs, u0, criterion, out var report))
                throw new NumericalFailureException($"at offset {Numbers.Of(offsetsXM[k] * 1e3, "mm")}, resistance-limited start: {report.Description}");
            positions[k] = new ArnoldiPosition(model, u0, source.SubCellEdgeLossPerSiemens(model.Grid, offsetsXM[k]));
        }
        return new MovingReducedBasis(reaction, source, offsetsXM, criterion, positions);
    }

    /// <param name="withLift">false: loss and drag only (the lift is left 0, saving one FFT convolution a position the first time, and the bases stop on
    /// the loss's error bound instead of the solution's, which takes about half the steps)</param>
    public ReactionMovingSolution Solve(ConductingSheet conductor, double speedMPerS, bool withLift = true) =>
        TrySolve(conductor, speedMPerS, out var s, out var failure, withLift) ? s! : throw new NumericalFailureException(failure);

    /// <summary>
    /// Loss, drag and lift at every offset for one conductor and speed; the bases grow until the error bound meets the criterion: the
    /// solution's A-norm bound (the lift is linear in u), or without the lift the loss's own bound (<see cref="ArnoldiPosition.RelativeLossError"/>,
    /// about the square of the solution's, so about half the steps). MaxRelativeResidual reports the bound that stopped it.
    /// </summary>
    public bool TrySolve(ConductingSheet conductor, double speedMPerS, out ReactionMovingSolution? solution, out string failure, bool withLift = true)
    {
        solution = null;
        if (!(speedMPerS > 0) || !double.IsFinite(speedMPerS)) throw new InputException($"the speed must be positive (got {speedMPerS} m/s)");
        double g = conductor.SheetConductanceS, c = speedMPerS * g, scale = speedMPerS / Source.SpeedMPerS;   // s, u0 and y scale with v
        var projected = new RealProjection?[_positions.Length];
        var error = new double[_positions.Length];     // the stopping quantity: the solution's bound, or with withLift false the loss's
        while (true)
        {
            var growing = new List<ArnoldiPosition>();
            for (int k = 0; k < _positions.Length; k++)
            {
                projected[k] = _positions[k].Project(c);
                error[k] = withLift ? projected[k]!.RelativeError : _positions[k].RelativeLossError(c, projected[k]!);
                if (error[k] > _criterion.RelativeResidual && !_positions[k].Exhausted) growing.Add(_positions[k]);
            }
            if (growing.Count == 0) break;
            if (growing.Any(p => p.V.Count > MaxSteps))
            {
                failure = $"the reduced basis did not converge in {MaxSteps} steps at c = v G = {c:G4} (error bound {error.Max():E2})";
                return false;
            }
            _criterion.ThrowIfCancelled();
            if (!Grow(growing, out failure)) return false;
        }
        int n = _positions.Length;
        double[] loss = new double[n], drag = new double[n], lift = new double[n], dragLow = new double[n];
        int[] steps = new int[n];
        double worst = 0;
        for (int k = 0; k < n; k++)
        {
            var p = _positions[k];
            var y = projected[k]!.Y;
            double edge = scale * scale * p.EdgeLossPerSiemens;                      // the edge kink's loss scales with q^2 = (v B n)^2
            double beta = scale * p.Beta;
            loss[k] = g * (beta * beta * y.DotProduct(y) + edge);                    // P = G u^T A u, u = beta V y (A-orthonormal V)
            drag[k] = loss[k] / speedMPerS;                                          // F_D v = P in the steady state
            if (withLift) lift[k] = -g * beta * y.DotProduct(p.LiftProjection(_reaction, Source, OffsetsXM[k], y.Count));   // lift on the source = -G integral u dBz/dz dA
            dragLow[k] = g * (beta * beta + edge) / speedMPerS;
            steps[k] = p.V.Count - 1;
            worst = Math.Max(worst, error[k]);
            if (!double.IsFinite(loss[k]) || !double.IsFinite(lift[k])) { failure = $"at offset {OffsetsXM[k]} m: the force is not finite"; return false; }
        }
        var notes = new List<string>();
        if (loss.All(x => x == 0)) notes.Add("the source does not reach the conducting part of the plate: zero drag and lift");
        solution = new ReactionMovingSolution(_model, g, speedMPerS, OffsetsXM.ToArray(), loss, drag, lift, dragLow, steps, worst,
            _positions[^1].Expand(projected[^1]!.Y, scale), _positions[0].Expand(projected[0]!.Y, scale), notes);
        failure = "";
        return true;
    }

    /// <summary>
    /// Rigorous bounds of the mean loss (W) for one conductor and speed from two basis vectors a position, for screening before the full solve.
    /// |u|_A^2 = u0^T (I + c^2 N)^-1 u0 with N = -M^2 = M M* (symmetric positive semi-definite in the A-inner product, M skew-adjoint), a
    /// Stieltjes integral of the completely monotone g(x) = 1/(1 + c^2 x) over the spectral measure of u0, whose first moments are
    /// mu1 = h21^2 and mu2 = h21^2 (h21^2 + h32^2) (Arnoldi of a skew-adjoint M: h11 = h22 = 0, h12 = -h21). The one-node Gauss rule is a lower
    /// bound, and the two-node Gauss-Radau rule with a node fixed at x = 0 an upper bound, of such an integral (G. H. Golub and G. Meurant,
    /// Matrices, Moments and Quadrature with Applications, Princeton 2010, Theorems 6.3 and 6.4): 1/(1 + c^2 mu1) &lt;= |u|^2/|u0|^2 &lt;= 1 - mu1^2/mu2 + (mu1^2/mu2)/(1 + c^2 mu2/mu1).
    /// </summary>
    public (double LowerW, double UpperW) LossBounds(ConductingSheet conductor, double speedMPerS)
    {
        if (!(speedMPerS > 0) || !double.IsFinite(speedMPerS)) throw new InputException($"the speed must be positive (got {speedMPerS} m/s)");
        while (_positions.Where(p => !p.Exhausted && p.V.Count < 3).ToList() is { Count: > 0 } growing)
        {
            _criterion.ThrowIfCancelled();
            if (!Grow(growing, out var failure)) throw new NumericalFailureException(failure);
        }
        double g = conductor.SheetConductanceS, c = speedMPerS * g, scale = speedMPerS / Source.SpeedMPerS, c2 = c * c;
        double lower = 0, upper = 0;
        foreach (var p in _positions)
        {
            double h21 = p.Subdiagonal(0), h32 = p.Subdiagonal(1);
            double mu1 = h21 * h21, mu2 = mu1 * (mu1 + h32 * h32);
            double gauss = 1 / (1 + c2 * mu1);                                                          // one-node Gauss: lower bound
            double radau = mu1 == 0 ? 1 : 1 - mu1 * mu1 / mu2 + mu1 * mu1 / mu2 / (1 + c2 * mu2 / mu1);  // Gauss-Radau, node at 0: upper bound
            double beta2 = scale * scale * p.Beta * p.Beta, edge = scale * scale * p.EdgeLossPerSiemens;
            lower += g * (beta2 * gauss + edge);
            upper += g * (beta2 * radau + edge);
        }
        return (lower / _positions.Length, upper / _positions.Length);
    }

    /// <summary>One Arnoldi step on each growing position: S by FFT, then A^-1 by multigrid CG.</summary>
    private bool Grow(List<ArnoldiPosition> growing, out string failure)
    {
        foreach (var position in growing)
        {
            _reaction.ApplyDxR(position.V[^1], _applied);
            if (!position.Extend(_applied, _criterion, out failure)) return false;
        }
        failure = "";
        return true;
    }

    /// <summary>
    /// Integral of dBz/dz over each unknown's basis (Wb/m), as <see cref="ReactionSolver"/> takes it for the lift: a plane field b gives
    /// dBz/dz = |k| Bz, whose integral over basis m is (2/mu0)(R b)_m; a normal gradient is summed per unknown.
    /// </summary>
    internal static double[] LiftGradient(ReactionOperator reaction, IMovingSheetSource source, double offsetXM)
    {
        var model = reaction.Model;
        var node = new double[model.Lattice.NodeCount];
        var perUnknown = new double[model.Unknowns];
        if (source.IntegrateLiftField(model.Lattice, offsetXM, node) == LiftField.PlaneField)
        {
            reaction.ApplyRToNodeField(node, perUnknown);
            for (int u = 0; u < perUnknown.Length; u++) perUnknown[u] *= 2 / Validity.Mu0;
            return perUnknown;
        }
        var map = model.Regions.NodeUnknown;
        for (int i = 0; i < map.Length; i++)
            if (map[i] >= 0) perUnknown[map[i]] += node[i];
        return perUnknown;
    }
}
