using System.Numerics;
using System.Runtime.CompilerServices;
using SlotOpt.Numerics;
using SlotOpt.Plates.Grid;

namespace SlotOpt.Plates.OwnField;

/// <summary>
/// Two-grid preconditioner for the coupled AC operator K = A + c R, c = j omega G (see <see cref="CoupledOperator"/>): the
/// multigrid V-cycle of A smooths, and the own field, which acts on the smooth modes only (its symbol falls as 1/|k| against
/// A's |k|^2), is handled on a lattice <see cref="CoarseOwnFieldLevel.Factor"/> times coarser, where K_H = A_H + c R_H is solved by
/// inner GMRES to <see cref="InnerResidual"/>. One application (a multiplicative two-grid cycle, W. Hackbusch, "Multi-Grid Methods
/// and Applications", Springer, 1985, ch. 2; U. Trottenberg, C. W. Oosterlee and A. Schueller, "Multigrid", Academic Press, 2001, sec. 2.2):
///   z1 = V r;   g = P^T (r - A z1) - c R_H z1_H;   y = K_H^-1 g;   z2 = z1 + P y;   z = z2 + V (r - A z2 - c s P R_H (z1_H + y))
/// with P the bilinear transfer (<see cref="LatticeTransfer"/>), z1_H the coarse weighted mean of z1 and s the fine over coarse
/// cell area. The fine own-field residual c R z is replaced by its coarse estimate (R z is smooth: the flux of a smooth field
/// through a fine hat is s times that through a coarse hat at the same place), so an application costs two V-cycles, two fine
/// residuals with A, two coarse reaction products and the inner solve, and no FFT on the fine lattice: per outer iteration the
/// fine FFT is the operator's own. The fine vectors stay split into real and imaginary parts through the cycle (the form the
/// V-cycle and the sheet operator take), so r is split once and z joined once. The cycle is not a fixed linear map (inner iterations, estimated residual), which
/// <see cref="ComplexGmres"/> allows (it keeps z_j = M^-1 v_j: flexible GMRES), and it changes only the iteration count, not
/// the answer, which the outer true residual decides. Measured on the slotted bench plate (56 075 unknowns): 16 outer
/// iterations with the V-cycle alone, 7 with this cycle; the exact fine residual in both smoothing steps (two more fine FFTs
/// an application) also gives 7.
/// </summary>
internal sealed class TwoLevelAcPreconditioner
{
    /// <summary>Relative residual of the inner coarse solve: looser costs outer iterations, tighter costs inner ones (measured on the bench plate, 256 x 256: 1e-1 gives 8 outer iterations, 1e-2 and 3e-3 give 7, 1e-2 at the least CPU).</summary>
    public const double InnerResidual = 1e-2;
    private const int InnerMaxIterations = 60;

    private readonly SheetModel _fine;
    private readonly CoarseOwnFieldLevel _level;
    private readonly CoupledOperator _coarse;
    private readonly Complex _coefficient;
    private readonly ConvergenceCriterion _inner = new() { RelativeResidual = InnerResidual, MaxIterations = InnerMaxIterations };
    private readonly double[] _rRe, _rIm, _zRe, _zIm, _residualRe, _residualIm, _smoothedRe, _smoothedIm;
    private readonly Complex[] _coarseRhs, _coarseMean, _coarseSolution, _coarseFlux;

    /// <param name="fine">the fine plate (its multigrid V-cycle smooths, its sheet operator forms the residuals)</param>
    public TwoLevelAcPreconditioner(SheetModel fine, CoarseOwnFieldLevel level, double omega, double sheetConductanceS)
    {
        _fine = fine;
        _level = level;
        _coefficient = new Complex(0, omega * sheetConductanceS);
        _coarse = CoupledOperator.Ac(level.Model, level.Reaction, omega, sheetConductanceS);
        int n = level.Transfer.FineUnknowns, m = level.Transfer.CoarseUnknowns;
        _rRe = new double[n]; _rIm = new double[n]; _zRe = new double[n]; _zIm = new double[n];
        _residualRe = new double[n]; _residualIm = new double[n]; _smoothedRe = new double[n]; _smoothedIm = new double[n];
        _coarseRhs = new Complex[m]; _coarseMean = new Complex[m]; _coarseSolution = new Complex[m]; _coarseFlux = new Complex[m];
    }

    /// <summary>Iterations of the inner coarse solves so far.</summary>
    public int InnerIterations { get; private set; }

    /// <summary>z = M^-1 r (the cycle above).</summary>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public void Apply(Complex[] r, Complex[] z)
    {
        var transfer = _level.Transfer;
        var multigrid = _fine.Multigrid;
        var a = multigrid.Operator;
        for (int i = 0; i < r.Length; i++) { _rRe[i] = r[i].Real; _rIm[i] = r[i].Imaginary; }
        multigrid.Apply(_rRe, _zRe);                                      // z1 = V r
        multigrid.Apply(_rIm, _zIm);
        a.Residual(_rRe, _zRe, _residualRe);                              // r - A z1
        a.Residual(_rIm, _zIm, _residualIm);
        transfer.RestrictAndAverage(_residualRe, _residualIm, _zRe, _zIm, _coarseRhs, _coarseMean);
        _level.Reaction.ApplyR(_coarseMean, _coarseFlux);
        for (int i = 0; i < _coarseRhs.Length; i++) _coarseRhs[i] -= _coefficient * _coarseFlux[i];   // g = P^T (r - A z1) - c R_H z1_H
        Array.Clear(_coarseSolution);
        // a partial inner solve is still a preconditioner (flexible GMRES); NaN or Inf reaches the outer residual, which reports it
        ComplexGmres.TrySolve(_coarse.Apply, _coarse.Precondition, _coarseRhs, _coarseSolution, _inner, ComplexGmres.DefaultRestart, out var report);
        InnerIterations += report.Iterations;
        transfer.ProlongAdd(_coarseSolution, _zRe, _zIm);                 // z2 = z1 + P y
        for (int i = 0; i < _coarseMean.Length; i++) _coarseMean[i] += _coarseSolution[i];
        _level.Reaction.ApplyR(_coarseMean, _coarseFlux);
        a.Residual(_rRe, _zRe, _residualRe);
        a.Residual(_rIm, _zIm, _residualIm);
        transfer.ProlongFluxAdd(_coarseFlux, _residualRe, _residualIm, -_coefficient * _level.FluxScale);   // r - A z2 - c s P R_H (z1_H + y)
        multigrid.Apply(_residualRe, _smoothedRe);
        multigrid.Apply(_residualIm, _smoothedIm);
        for (int i = 0; i < z.Length; i++) z[i] = new Complex(_zRe[i] + _smoothedRe[i], _zIm[i] + _smoothedIm[i]);
    }
}
