using SlotOpt.Tables;
using System.Numerics;
using SlotOpt.Numerics;
using SlotOpt.Plates.Conductors;
using SlotOpt.Plates.Grid;
using SlotOpt.Plates.OwnField;
using SlotOpt.Plates.Sources;

namespace SlotOpt.Plates.Thick;

/// <summary>
/// Thick plates in an AC field: L thin layers coupled through their mutual inductance
/// (<see cref="LayeredReactionOperator"/>). Per layer l:  (A + j omega g R^(0)) u_l + j omega g sum_{m != l} R^(|l-m|) u_m = -s_l,
/// g = sigma t / L, s_l the source's dBz/dt integrals at the layer's depth. GMRES preconditioned by the
/// resistance-limited multigrid on every layer. The layer count follows from t/delta
/// (<see cref="LayerCount"/>), and <see cref="SolveAcConverged"/> checks it: it solves with L and L/2 layers
/// and doubles L until the estimated layer error is below the wanted accuracy.
/// </summary>
public static class ThickPlateSolver
{
    /// <summary>Starting layers per skin depth; the convergence check doubles the count as needed (the thick-plate tests needed 8 per delta for 0.5 %).</summary>
    public const double LayersPerSkinDepth = 4;
    public const int MaxLayers = 48;

    /// <summary>L = 4 t/delta rounded up to an even number (so L/2 is a layer count for the check), clamped to 2..48; delta = sqrt(2 / (omega mu0 mu_r sigma)).</summary>
    public static int LayerCount(ConductingSheet conductor, double frequencyHz)
    {
        double delta = Math.Sqrt(2 / (2 * Math.PI * frequencyHz * Validity.Mu0 * conductor.RelativePermeability * conductor.ConductivitySPerM));
        return Math.Clamp(2 * (int)Math.Ceiling(LayersPerSkinDepth * conductor.ThicknessM / delta / 2), 2, MaxLayers);
    }

    public static bool TrySolveAc(LayeredReactionOperator stack, IDepthAcFieldSource source, ConductingSheet conductor, ConvergenceCriterion? criterion,
        out ThickPlateAcSolution? solution, out string failure)
    {
        criterion ??= ConvergenceCriterion.Default;
        solution = null;
        if (Math.Abs(stack.ThicknessM / conductor.ThicknessM - 1) > 1e-12) throw new InputException($"the layered operator is for a {stack.ThicknessM} m plate, the conductor is {conductor.ThicknessM} m thick");
        var model = stack.Model;
        var l = model.Lattice;
        int n = model.Unknowns, layers = stack.Layers;
        double g = conductor.ConductivitySPerM * stack.LayerThicknessM, omega = 2 * Math.PI * source.FrequencyHz;
        var b = new Complex[layers * n];
        var u = new Complex[layers * n];
        var re = new double[l.NodeCount];
        var im = new double[l.NodeCount];
        var xRe = new double[n];
        var xIm = new double[n];
        double lossLow = 0;
        for (int layer = 0; layer < layers; layer++)
        {
            source.Integrate(l, (layer + 0.5) * stack.LayerThicknessM, re, im);
            var bRe = model.RightHandSide(re);
            var bIm = model.RightHandSide(im);
            Array.Clear(xRe); Array.Clear(xIm);
            if (!model.TrySolve(bRe, xRe, criterion, out var r0) || !model.TrySolve(bIm, xIm, criterion, out r0))
            {
                failure = $"layer {layer}, resistance-limited start: {r0.Description}";
                return false;
            }
            lossLow += 0.5 * g * (model.LossPerSiemens(xRe) + model.LossPerSiemens(xIm));
            for (int i = 0; i < n; i++) { b[layer * n + i] = new Complex(bRe[i], bIm[i]); u[layer * n + i] = new Complex(xRe[i], xIm[i]); }
        }
        var work = new Complex[layers * n];
        var a = model.Operator.Matrix;
        var coefficient = new Complex(0, omega * g);
        void Apply(Complex[] x, Complex[] y)
        {
            stack.Apply(x, work);
            for (int layer = 0; layer < layers; layer++)
            {
                int o = layer * n;
                for (int i = 0; i < n; i++)
                {
                    double sr = 0, si = 0;
                    for (int k = a.RowStart[i], e = a.RowStart[i + 1]; k < e; k++) { var xc = x[o + a.ColumnIndex[k]]; sr += a.Value[k] * xc.Real; si += a.Value[k] * xc.Imaginary; }
                    y[o + i] = new Complex(sr, si) + coefficient * work[o + i];
                }
            }
        }
        var pr = new double[n]; var pi = new double[n]; var zr = new double[n]; var zi = new double[n];
        void Precondition(Complex[] r, Complex[] z)
        {
            for (int layer = 0; layer < layers; layer++)
            {
                int o = layer * n;
                for (int i = 0; i < n; i++) { pr[i] = r[o + i].Real; pi[i] = r[o + i].Imaginary; }
                model.Multigrid.Apply(pr, zr);
                model.Multigrid.Apply(pi, zi);
                for (int i = 0; i < n; i++) z[o + i] = new Complex(zr[i], zi[i]);
            }
        }
        if (!ComplexGmres.TrySolve(Apply, Precondition, b, u, criterion, ComplexGmres.DefaultRestart, out var report))
        {
            failure = $"coupled thick-plate solve ({layers} layers): {report.Description}";
            return false;
        }
        double loss = 0;
        for (int layer = 0; layer < layers; layer++)
        {
            for (int i = 0; i < n; i++) { xRe[i] = u[layer * n + i].Real; xIm[i] = u[layer * n + i].Imaginary; }
            loss += 0.5 * g * (model.LossPerSiemens(xRe) + model.LossPerSiemens(xIm));   // <P> = (g/2) Re(u^H A u) per layer
        }
        if (!double.IsFinite(loss)) { failure = "the thick-plate loss is not finite"; return false; }
        solution = new ThickPlateAcSolution(model, layers, u, g, source.FrequencyHz, loss, lossLow, double.NaN, report.Iterations, report.RelativeResidual);
        failure = "";
        return true;
    }

    public static ThickPlateAcSolution SolveAc(LayeredReactionOperator stack, IDepthAcFieldSource source, ConductingSheet conductor, ConvergenceCriterion? criterion = null) =>
        TrySolveAc(stack, source, conductor, criterion, out var s, out var failure) ? s! : throw new NumericalFailureException(failure);

    /// <summary>
    /// Layer count from t/delta, then checked: solve with L and L/2 layers; while the estimated layer error
    /// |P(L) - P(L/2)| / (3 P(L)) exceeds accuracy, double L (up to <see cref="MaxLayers"/>, beyond which it fails).
    /// </summary>
    public static bool TrySolveAcConverged(SheetModel model, IDepthAcFieldSource source, ConductingSheet conductor, double accuracy, ConvergenceCriterion? criterion,
        out ThickPlateAcSolution? solution, out string failure)
    {
        var plane = ReactionOperator.Build(model);
        int layers = LayerCount(conductor, source.FrequencyHz);
        solution = null;
        if (!TrySolveAc(LayeredReactionOperator.Build(model, layers / 2, conductor.ThicknessM, plane), source, conductor, criterion, out var half, out failure)) return false;
        while (true)
        {
            if (!TrySolveAc(LayeredReactionOperator.Build(model, layers, conductor.ThicknessM, plane), source, conductor, criterion, out var full, out failure)) return false;
            double error = Math.Abs(full!.LossW - half!.LossW) / (3 * full.LossW);
            if (error <= accuracy || full.LossW == 0) { solution = full with { LayerError = error }; return true; }
            if (2 * layers > MaxLayers) { failure = $"layer count not converged: estimated error {Numbers.Percent(error)} with {layers} layers (limit {MaxLayers})"; return false; }
            half = full;
            layers *= 2;
        }
    }

    public static ThickPlateAcSolution SolveAcConverged(SheetModel model, IDepthAcFieldSource source, ConductingSheet conductor, double accuracy = 0.01, ConvergenceCriterion? criterion = null) =>
        TrySolveAcConverged(model, source, conductor, accuracy, criterion, out var s, out var failure) ? s! : throw new NumericalFailureException(failure);
}
