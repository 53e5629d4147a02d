using System.Numerics;
using SlotOpt.Numerics;
using SlotOpt.Plates.Conductors;
using SlotOpt.Plates.Grid;
using SlotOpt.Plates.Sources;
using SlotOpt.Tables;

namespace SlotOpt.Plates.OwnField;

/// <summary>
/// Entry points of the coupled thin-sheet solver (the eddy currents' own field included; see
/// <see cref="CoupledOperator"/> for the equations). Each solve is for one conductor G = sigma t, by
/// right-preconditioned GMRES (<see cref="ComplexGmres"/>) with the resistance-limited multigrid as
/// preconditioner, started from the resistance-limited solution (AC with the two-grid cycle: from zero). TrySolve returns false with the
/// reason; Solve throws <see cref="NumericalFailureException"/>. Reuse one <see cref="ReactionOperator"/>
/// per <see cref="SheetModel"/> (its kernel and FFT spectrum are the setup cost).
/// </summary>
public static class ReactionSolver
{
    public static bool TrySolveAc(ReactionOperator reaction, IAcFieldSource source, ConductingSheet conductor, ConvergenceCriterion? criterion,
        out ReactionAcSolution? solution, out string failure) =>
        TrySolveAc(reaction, source, conductor, criterion, null, out solution, out failure);

    /// <summary>
    /// The preconditioner is the two-grid cycle of <see cref="TwoLevelAcPreconditioner"/> on lattices of 64 cells a side or more
    /// (the coarse level built on the operator's first AC solve and kept), the V-cycle of A alone below.
    /// </summary>
    /// <param name="initialGuess">
    /// u = psi / G to start the coupled iteration from (one per unknown of the reaction operator's model), e.g. the
    /// <see cref="ReactionAcSolution.U"/> of the same plate at a nearby conductivity, thickness or frequency; null starts
    /// from zero with the two-grid cycle (its first step holds the resistance-limited answer) and from the resistance-limited
    /// solution with the V-cycle alone. The answer is the same to the solver tolerance either way; a close guess saves iterations.
    /// </param>
    public static bool TrySolveAc(ReactionOperator reaction, IAcFieldSource source, ConductingSheet conductor, ConvergenceCriterion? criterion,
        Complex[]? initialGuess, out ReactionAcSolution? solution, out string failure)
    {
        criterion ??= ConvergenceCriterion.Default;
        solution = null;
        var model = reaction.Model;
        var l = model.Lattice;
        var re = new double[l.NodeCount];
        var im = new double[l.NodeCount];
        source.Integrate(l, re, im);
        var bRe = model.RightHandSide(re);
        var bIm = model.RightHandSide(im);
        double g = conductor.SheetConductanceS;
        // resistance-limited solution A u0 = -s (two real solves): the loss without the own field, and the start on small lattices
        var u0Re = new double[model.Unknowns];
        var u0Im = new double[model.Unknowns];
        if (!model.TrySolve(bRe, u0Re, criterion, out var r0) || !model.TrySolve(bIm, u0Im, criterion, out r0))
        {
            failure = $"resistance-limited start: {r0.Description}";
            return false;
        }
        double lossLow = 0.5 * g * (model.LossPerSiemens(u0Re) + model.LossPerSiemens(u0Im));
        var b = new Complex[model.Unknowns];
        var u = new Complex[model.Unknowns];
        CheckGuess(initialGuess?.Length, model);
        double omega = 2 * Math.PI * source.FrequencyHz;
        var op = CoupledOperator.Ac(model, reaction, omega, g);
        var coarse = reaction.CoarseLevel;
        // with the two-grid cycle an unguided solve starts from zero: r0 = b needs no fine FFT, and M^-1 b already holds the
        // resistance-limited answer to a V-cycle's accuracy plus the own field's coarse correction (bench plate: 7 iterations from
        // zero or from the resistance-limited solution); with the V-cycle alone it starts from the resistance-limited solution
        bool fromResistanceLimited = initialGuess is null && coarse is null;
        for (int i = 0; i < b.Length; i++)
        {
            b[i] = new Complex(bRe[i], bIm[i]);
            u[i] = initialGuess?[i] ?? (fromResistanceLimited ? new Complex(u0Re[i], u0Im[i]) : Complex.Zero);
        }
        ComplexMap precondition = coarse is not null ? new TwoLevelAcPreconditioner(model, coarse, omega, g).Apply : op.Precondition;
        if (!ComplexGmres.TrySolve(op.Apply, precondition, b, u, criterion, ComplexGmres.DefaultRestart, out var report))
        {
            failure = $"coupled AC solve: {report.Description}";
            return false;
        }
        double loss = 0.5 * g * HermitianForm(model, u);   // <P> = (1/2) Re(psi^H A psi) / G, psi = G u
        if (!double.IsFinite(loss)) { failure = "the coupled loss is not finite"; return false; }
        var notes = new List<string>();
        if (lossLow == 0) notes.Add("the field does not reach the conducting part of the plate: zero loss");
        solution = new ReactionAcSolution(model, u, g, source.FrequencyHz, loss, lossLow, report.Iterations, report.RelativeResidual, notes);
        failure = "";
        return true;
    }

    public static ReactionAcSolution SolveAc(ReactionOperator reaction, IAcFieldSource source, ConductingSheet conductor, ConvergenceCriterion? criterion = null,
        Complex[]? initialGuess = null) =>
        TrySolveAc(reaction, source, conductor, criterion, initialGuess, out var s, out var failure) ? s! : throw new NumericalFailureException(failure);

    /// <summary>
    /// Source-frame steady state at each offset (the plate long in x, psi = 0 at its ends: make the plate
    /// reach well behind the source, where the wake trails). Each offset starts from the previous solution (and its image
    /// under the coupled operator, kept from the previous solve's final residual).
    /// The system is real (<see cref="ConvectedOperator"/>): real GMRES (<see cref="Gmres"/>).
    /// </summary>
    public static bool TrySolveMoving(ReactionOperator reaction, IMovingSheetSource source, ConductingSheet conductor, IReadOnlyList<double> offsetsXM,
        ConvergenceCriterion? criterion, out ReactionMovingSolution? solution, out string failure) =>
        TrySolveMoving(reaction, source, conductor, offsetsXM, criterion, null, out solution, out failure);

    /// <param name="initialGuess">
    /// u = psi / G to start the first offset from (one per unknown of the reaction operator's model), e.g. the
    /// <see cref="ReactionMovingSolution.FirstU"/> of the same offsets at a nearby speed or conductivity; null starts
    /// from the resistance-limited solution. The answer is the same to the solver tolerance either way.
    /// </param>
    public static bool TrySolveMoving(ReactionOperator reaction, IMovingSheetSource source, ConductingSheet conductor, IReadOnlyList<double> offsetsXM,
        ConvergenceCriterion? criterion, double[]? initialGuess, out ReactionMovingSolution? solution, out string failure)
    {
        criterion ??= ConvergenceCriterion.Default;
        solution = null;
        if (offsetsXM.Count == 0) throw new InputException("a moving source needs at least one position");
        var model = reaction.Model;
        CheckGuess(initialGuess?.Length, model);
        var l = model.Lattice;
        double g = conductor.SheetConductanceS, v = source.SpeedMPerS;
        var op = CoupledOperator.Moving(model, reaction, v, g);
        int n = model.Unknowns;
        var node = new double[l.NodeCount];
        var liftNode = new double[l.NodeCount];
        var gradient = new double[n];
        var low = new double[n];
        var u = new double[n];
        var image = new double[n];      // op u of the last solution: the next offset's first residual without an application of op
        double[]? first = null;
        var loss = new double[offsetsXM.Count];
        var drag = new double[offsetsXM.Count];
        var lift = new double[offsetsXM.Count];
        var dragLow = new double[offsetsXM.Count];
        var iterations = new int[offsetsXM.Count];
        double worst = 0;
        for (int k = 0; k < offsetsXM.Count; k++)
        {
            source.IntegrateRate(l, offsetsXM[k], node);
            var rhs = model.RightHandSide(node);
            if (!model.TrySolve(rhs, low, criterion, out var r0))
            {
                failure = $"at offset {Numbers.Of(offsetsXM[k] * 1e3, "mm")}, resistance-limited start: {r0.Description}";
                return false;
            }
            // the edges' sub-cell loss (a kink of the same strength G q: the eddy currents' own field is smooth at a pole edge)
            double edgeLoss = source.SubCellEdgeLossPerSiemens(model.Grid, offsetsXM[k]);
            dragLow[k] = g * (model.LossPerSiemens(low) + edgeLoss) / v;
            if (k == 0) Array.Copy(initialGuess ?? low, u, n);
            if (!Gmres.TrySolve(op.Apply, op.Precondition, rhs, u, image, imageHoldsGuess: k > 0, criterion, ComplexGmres.DefaultRestart, out var report))
            {
                failure = $"at offset {Numbers.Of(offsetsXM[k] * 1e3, "mm")}, coupled moving solve: {report.Description}";
                return false;
            }
            if (k == 0) first = (double[])u.Clone();
            iterations[k] = report.Iterations;
            worst = Math.Max(worst, report.RelativeResidual);
            loss[k] = g * (model.LossPerSiemens(u) + edgeLoss);    // P = psi^T A psi / G
            drag[k] = loss[k] / v;                                  // F_D v = P in the steady state
            NormalGradient(reaction, source.IntegrateLiftField(l, offsetsXM[k], liftNode), liftNode, gradient);
            double f = 0;
            for (int i = 0; i < n; i++) f += u[i] * gradient[i];
            lift[k] = -g * f;                                       // lift on the source = -integral psi dBz/dz dA
            if (!double.IsFinite(loss[k]) || !double.IsFinite(lift[k])) { failure = $"at offset {Numbers.Of(offsetsXM[k] * 1e3, "mm")}: the force is not finite"; return false; }
        }
        var notes = new List<string>();
        if (loss.All(p => p == 0)) notes.Add("the source does not reach the conducting part of the plate: zero drag and lift");
        solution = new ReactionMovingSolution(model, g, v, offsetsXM.ToArray(), loss, drag, lift, dragLow, iterations, worst, u, first!, notes);
        failure = "";
        return true;
    }

    public static ReactionMovingSolution SolveMoving(ReactionOperator reaction, IMovingSheetSource source, ConductingSheet conductor, IReadOnlyList<double> offsetsXM,
        ConvergenceCriterion? criterion = null, double[]? initialGuess = null) =>
        TrySolveMoving(reaction, source, conductor, offsetsXM, criterion, initialGuess, out var s, out var failure) ? s! : throw new NumericalFailureException(failure);

    private static void CheckGuess(int? length, SheetModel model)
    {
        if (length is int n && n != model.Unknowns)
            throw new ArgumentException($"the initial guess has {n} values for a model of {model.Unknowns} unknowns", "initialGuess");
    }

    /// <summary>
    /// Integral of dBz/dz at the sheet over each unknown's basis (Wb/m) from what the source wrote per node:
    /// node integrals are summed per unknown; a plane field b (dual-cell means of Bz, source above the sheet)
    /// gives dBz/dz = |k| Bz, whose integral over basis m is (2/mu0)(R b)_m, R's kernel being (mu0/2) &lt;phi_m, |k| phi_n&gt;.
    /// </summary>
    private static void NormalGradient(ReactionOperator reaction, LiftField kind, double[] node, double[] perUnknown)
    {
        if (kind == LiftField.PlaneField)
        {
            reaction.ApplyRToNodeField(node, perUnknown);
            double f = 2 / Validity.Mu0;
            for (int u = 0; u < perUnknown.Length; u++) perUnknown[u] *= f;
            return;
        }
        var map = reaction.Model.Regions.NodeUnknown;
        Array.Clear(perUnknown);
        for (int i = 0; i < map.Length; i++)
            if (map[i] >= 0) perUnknown[map[i]] += node[i];
    }

    /// <summary>Re(u^H A u) for the real SPD resistance operator A.</summary>
    private static double HermitianForm(SheetModel model, Complex[] u)
    {
        var re = u.Select(c => c.Real).ToArray();
        var im = u.Select(c => c.Imaginary).ToArray();
        return model.LossPerSiemens(re) + model.LossPerSiemens(im);
    }
}
