using SlotOpt.Numerics;
using SlotOpt.Plates.Grid;
using SlotOpt.Plates.Sources;
using SlotOpt.Tables;

namespace SlotOpt.Plates.ResistanceLimited;

/// <summary>
/// Entry points of the thin-plate solver. Every solve is at unit reference sheet conductance and
/// returns a solution that scales to any thickness and material. Each comes as TrySolve (false
/// with the reason on non-convergence) and Solve (throws <see cref="NumericalFailureException"/>).
/// </summary>
public static class ResistanceLimitedSolver
{
    /// <summary>AC source: the operator is real, so the real and imaginary parts are two real solves sharing the hierarchy.</summary>
    public static bool TrySolveAc(SheetModel model, IAcFieldSource source, ConvergenceCriterion? criterion, out UnitConductanceSolution? solution, out string failure)
    {
        criterion ??= ConvergenceCriterion.Default;
        var l = model.Lattice;
        var re = new double[l.NodeCount];
        var im = new double[l.NodeCount];
        source.Integrate(l, re, im);
        var bRe = model.RightHandSide(re);
        var bIm = model.RightHandSide(im);
        var psiRe = new double[model.Unknowns];
        var psiIm = new double[model.Unknowns];
        solution = null;
        SolveReport r1, r2;
        if (UniformPhase(bRe, bIm, out bool baseIsRe, out double ratio))
        {
            // one real solve: the other part is ratio times it (the operator is real)
            var (b, psi, other) = baseIsRe ? (bRe, psiRe, psiIm) : (bIm, psiIm, psiRe);
            if (!model.TrySolve(b, psi, criterion, out r1)) { failure = Describe(r1); return false; }
            for (int i = 0; i < psi.Length; i++) other[i] = ratio * psi[i];
            r2 = new SolveReport(SolveStatus.Converged, 0, r1.RelativeResidual);   // scaled from the other part
        }
        else
        {
            if (!model.TrySolve(bRe, psiRe, criterion, out r1)) { failure = Describe(r1); return false; }
            if (!model.TrySolve(bIm, psiIm, criterion, out r2)) { failure = Describe(r2); return false; }
        }
        double loss = 0.5 * (model.LossPerSiemens(psiRe) + model.LossPerSiemens(psiIm));   // time average of |K̂|^2/G over a cycle
        if (!double.IsFinite(loss)) { failure = "the loss is not finite"; return false; }
        var notes = new List<string>();
        if (loss == 0) notes.Add("the field does not reach the conducting part of the plate: zero loss");
        solution = new UnitConductanceSolution(model, SourceKind.Ac, psiRe, psiIm, loss, source.FrequencyHz, 0, 0,
            r1.Iterations + r2.Iterations, Math.Max(r1.RelativeResidual, r2.RelativeResidual), notes);
        failure = "";
        return true;
    }

    public static UnitConductanceSolution SolveAc(SheetModel model, IAcFieldSource source, ConvergenceCriterion? criterion = null) =>
        TrySolveAc(model, source, criterion, out var s, out var failure) ? s! : throw new NumericalFailureException(failure);

    /// <summary>
    /// Moving source at each travel offset. The hierarchy is reused and each solve starts from the
    /// previous offset's solution (warm start).
    /// </summary>
    public static bool TrySolveMoving(SheetModel model, IMovingSheetSource source, IReadOnlyList<double> offsetsXM, ConvergenceCriterion? criterion,
        out MovingSweepSolution? sweep, out string failure)
    {
        criterion ??= ConvergenceCriterion.Default;
        sweep = null;
        if (offsetsXM.Count == 0) throw new InputException("a moving source needs at least one position");
        var l = model.Lattice;
        var node = new double[l.NodeCount];
        var psi = new double[model.Unknowns];
        var losses = new double[offsetsXM.Count];
        var iterations = new int[offsetsXM.Count];
        double[]? peakPsi = null;
        int peakIndex = 0;
        double peakResidual = 0;
        int offPlate = 0;
        for (int k = 0; k < offsetsXM.Count; k++)
        {
            source.IntegrateRate(l, offsetsXM[k], node);
            var b = model.RightHandSide(node);
            if (!model.TrySolve(b, psi, criterion, out var report)) { failure = $"at offset {Numbers.Of(offsetsXM[k] * 1e3, "mm")}: {Describe(report)}"; return false; }
            losses[k] = model.LossPerSiemens(psi) + source.SubCellEdgeLossPerSiemens(model.Grid, offsetsXM[k]);
            if (!double.IsFinite(losses[k])) { failure = $"at offset {Numbers.Of(offsetsXM[k] * 1e3, "mm")}: the loss is not finite"; return false; }
            if (losses[k] == 0) offPlate++;
            iterations[k] = report.Iterations;
            if (peakPsi is null || losses[k] > losses[peakIndex])
            {
                peakPsi = (double[])psi.Clone();
                peakIndex = k;
                peakResidual = report.RelativeResidual;
            }
        }
        var notes = new List<string>();
        if (offPlate == offsetsXM.Count) notes.Add("no pole overlaps the conducting plate at any position: zero loss and drag");
        else if (offPlate > 0) notes.Add($"{offPlate} of {offsetsXM.Count} positions have no pole over the conducting plate (zero loss there)");
        var peak = new UnitConductanceSolution(model, SourceKind.Moving, peakPsi!, null, losses[peakIndex], 0, source.SpeedMPerS, offsetsXM[peakIndex],
            iterations[peakIndex], peakResidual, notes);
        sweep = new MovingSweepSolution(offsetsXM.ToArray(), losses, iterations, source.SpeedMPerS, peak, notes);
        failure = "";
        return true;
    }

    public static MovingSweepSolution SolveMoving(SheetModel model, IMovingSheetSource source, IReadOnlyList<double> offsetsXM, ConvergenceCriterion? criterion = null) =>
        TrySolveMoving(model, source, offsetsXM, criterion, out var s, out var failure) ? s! : throw new NumericalFailureException(failure);

    /// <summary>True when one part is a scalar multiple of the other to rounding (a source of uniform phase): other = ratio * base.</summary>
    private static bool UniformPhase(double[] re, double[] im, out bool baseIsRe, out double ratio)
    {
        double rr = ConjugateGradient.Dot(re, re), ii = ConjugateGradient.Dot(im, im);
        baseIsRe = rr >= ii;
        var (b, o) = baseIsRe ? (re, im) : (im, re);
        double bb = Math.Max(rr, ii);
        ratio = bb > 0 ? ConjugateGradient.Dot(b, o) / bb : 0;
        double misfit = 0;
        for (int i = 0; i < b.Length; i++) { double d = o[i] - ratio * b[i]; misfit += d * d; }
        return misfit <= 1e-24 * bb;
    }

    private static string Describe(SolveReport r) => $"sheet solver: {r.Description}";
}
