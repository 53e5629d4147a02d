using System.Numerics;

namespace SlotOpt.Sheets;

/// <summary>
/// The coupled thin-sheet system at unit reference conductance, u = psi / G:
/// AC, e^{j omega t}:   (A + j omega G R) u = -s      (Faraday around each dual cell with the eddy field's flux added)
/// moving, source frame: (A - v G Dx R) u = -s        (plate-frame d/dt = -v d/dx acting on the eddy field)
/// with A the resistance-limited operator of <see cref="SheetOperator"/> (real, SPD), R the reaction
/// operator (<see cref="ReactionOperator"/>, henry), G = sigma t. In Fourier space the two are
/// k^2 + j omega G (mu0/2)|k| and k^2 - j v G (mu0/2)|k| kx: the moving case is AC with omega = -kx v.
/// The preconditioner is the resistance-limited multigrid V-cycle (an approximate A^-1) applied to the
/// real and imaginary parts: the preconditioned spectrum is 1 + j beta mu with mu real, bounded by
/// omega G mu0/(2 k_min) (AC) or v/w (moving, w = 2/(mu0 G)).
/// </summary>
internal sealed class CoupledOperator
{
    private readonly SheetModel _model;
    private readonly ReactionOperator _reaction;
    private readonly Complex _coefficient;
    private readonly bool _convected;
    private readonly Complex[] _work;
    private readonly double[] _re, _im, _zRe, _zIm;

    private CoupledOperator(SheetModel model, ReactionOperator reaction, Complex coefficient, bool convected)
    {
        _model = model;
        _reaction = reaction;
        _coefficient = coefficient;
        _convected = convected;
        int n = model.Unknowns;
        _work = new Complex[n];
        _re = new double[n]; _im = new double[n]; _zRe = new double[n]; _zIm = new double[n];
    }

    /// <summary>A + j omega G R.</summary>
    public static CoupledOperator Ac(SheetModel model, ReactionOperator reaction, double omega, double sheetConductanceS) =>
        new(model, reaction, new Complex(0, omega * sheetConductanceS), convected: false);

    /// <summary>A - v G Dx R.</summary>
    public static CoupledOperator Moving(SheetModel model, ReactionOperator reaction, double speedMPerS, double sheetConductanceS) =>
        new(model, reaction, -speedMPerS * sheetConductanceS, convected: true);

    public void Apply(Complex[] x, Complex[] y)
    {
        if (_convected) _reaction.ApplyDxR(x, _work); else _reaction.ApplyR(x, _work);
        var a = _model.Operator.Matrix;
        var rs = a.RowStart; var ci = a.ColumnIndex; var v = a.Value;
        for (int i = 0; i < a.Rows; i++)
        {
            double sr = 0, si = 0;
            for (int k = rs[i], e = rs[i + 1]; k < e; k++) { var xc = x[ci[k]]; sr += v[k] * xc.Real; si += v[k] * xc.Imaginary; }
            y[i] = new Complex(sr, si) + _coefficient * _work[i];
        }
    }

    /// <summary>z = M^-1 r with M^-1 one multigrid V-cycle of A on each of the real and imaginary parts.</summary>
    public void Precondition(Complex[] r, Complex[] z)
    {
        for (int i = 0; i < r.Length; i++) { _re[i] = r[i].Real; _im[i] = r[i].Imaginary; }
        _model.Multigrid.Apply(_re, _zRe);
        _model.Multigrid.Apply(_im, _zIm);
        for (int i = 0; i < r.Length; i++) z[i] = new Complex(_zRe[i], _zIm[i]);
    }
}
